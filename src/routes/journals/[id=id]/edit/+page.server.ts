import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import { MediaError } from '$lib/server/media';
import { draftFromTank } from '$lib/journals/tank-form';
import { readTankForm } from '../../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const tank = await tanks.getOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return {
		tank: { id: tank.id, name: tank.name },
		draft: draftFromTank(tank, viewer.units),
		cover: tank.cover ? [{ id: tank.cover.id, alt: tank.cover.alt, caption: tank.cover.caption, urls: tank.cover.urls }] : [],
		units: viewer.units
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const id = Number(event.params.id);
		if (!(await tanks.getOwn(viewer, id))) error(404, 'We could not find that tank.');
		const read = await readTankForm(event.request, viewer, id);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, cover: read.cover });
		try {
			await tanks.update(viewer, id, read.input, read.cover);
		} catch (e) {
			if (e instanceof tanks.TankNotFound) error(404, 'We could not find that tank.');
			if (e instanceof MediaError) return fail(400, { errors: { cover: e.message }, draft: null, cover: null });
			throw e;
		}
		redirect(303, `/journals/${id}?saved=1`);
	}
} satisfies Actions;
