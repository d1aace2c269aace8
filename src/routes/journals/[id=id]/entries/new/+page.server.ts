import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/entries';
import { MediaError } from '$lib/server/media';
import { emptyEntryDraft } from '$lib/journals/entry-form';
import { photosAgain, readEntryForm } from '../form.server';
import type { Actions, PageServerLoad } from './$types';

async function ownTank(event: { locals: App.Locals; url: URL; params: { id: string } }) {
	const viewer = requireUser(event);
	const tank = await tanks.getOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}

export const load = (async (event) => {
	const { tank } = await ownTank(event);
	const today = new Date().toISOString().slice(0, 10);
	return {
		tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn },
		plants: tank.plants.filter((p) => !p.removedOn).map((p) => ({ id: p.id, name: p.name })),
		livestock: tank.livestock.filter((a) => !a.removedOn).map((a) => ({ id: a.id, name: a.name, count: a.count })),
		draft: emptyEntryDraft(today),
		today
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const read = await readEntryForm(event.request, viewer, tank, null);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		let id: number;
		try {
			id = await entries.create(viewer, tank.id, read.input, read.photos);
		} catch (e) {
			if (e instanceof entries.EntryInputError) return fail(400, { errors: e.errors, draft: read.draft, photos: await photosAgain(viewer, read.fields, null) });
			if (e instanceof MediaError) return fail(400, { errors: { photos: e.message }, draft: read.draft, photos: await photosAgain(viewer, read.fields, null) });
			throw e;
		}
		redirect(303, `/journals/${tank.id}/entries/${id}`);
	}
} satisfies Actions;
