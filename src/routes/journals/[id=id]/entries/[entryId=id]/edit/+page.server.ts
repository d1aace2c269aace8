import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/entries';
import { MediaError } from '$lib/server/media';
import { eventDraftFrom, type EntryDraft } from '$lib/journals/entry-form';
import { photosAgain, readEntryForm } from '../../form.server';
import type { Actions, PageServerLoad } from './$types';

async function ownEntry(event: { locals: App.Locals; url: URL; params: { id: string; entryId: string } }) {
	const viewer = requireUser(event);
	const tank = await tanks.getOwn(viewer, Number(event.params.id));
	const found = tank ? await entries.get(viewer, tank.id, Number(event.params.entryId)) : null;
	if (!tank || !found) error(404, 'We could not find that entry.');
	return { viewer, tank, entry: found.entry };
}

export const load = (async (event) => {
	const { tank, entry } = await ownEntry(event);
	const draft: EntryDraft = { entryOn: entry.entryOn, title: entry.title, body: entry.body, events: entry.events.map(eventDraftFrom) };
	return {
		tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn },
		entryId: entry.id,
		plants: tank.plants.filter((p) => !p.removedOn).map((p) => ({ id: p.id, name: p.name })),
		livestock: tank.livestock.filter((a) => !a.removedOn).map((a) => ({ id: a.id, name: a.name, count: a.count })),
		draft,
		photos: entry.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls })),
		today: new Date().toISOString().slice(0, 10)
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { viewer, tank, entry } = await ownEntry(event);
		const read = await readEntryForm(event.request, viewer, tank, entry.id);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		try {
			await entries.update(viewer, tank.id, entry.id, read.input, read.photos);
		} catch (e) {
			if (e instanceof entries.EntryInputError)
				return fail(400, { errors: e.errors, draft: read.draft, photos: await photosAgain(viewer, read.fields, entry.id) });
			if (e instanceof MediaError)
				return fail(400, { errors: { photos: e.message }, draft: read.draft, photos: await photosAgain(viewer, read.fields, entry.id) });
			throw e;
		}
		redirect(303, `/journals/${tank.id}/entries/${entry.id}`);
	}
} satisfies Actions;
