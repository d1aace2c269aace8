import { fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import { MediaError } from '$lib/server/media';
import { emptyDraft } from '$lib/journals/tank-form';
import { readTankForm } from '../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	return { draft: emptyDraft(viewer.units), units: viewer.units };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const read = await readTankForm(event.request, viewer, null);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, cover: read.cover });
		let id: number;
		try {
			id = await tanks.create(viewer, read.input, read.cover);
		} catch (error) {
			if (error instanceof MediaError) return fail(400, { errors: { cover: error.message }, draft: null, cover: [] });
			throw error;
		}
		redirect(303, `/journals/${id}`);
	}
} satisfies Actions;
