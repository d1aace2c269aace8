import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/entries';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = event.locals.user;
	const found = await entries.get(viewer, Number(event.params.id), Number(event.params.entryId));
	if (!found) error(404, 'We could not find that entry.');
	const { tank, entry } = found;
	return {
		tank: { id: tank.id, name: tank.name, visibility: tank.visibility, volumeLitres: tank.volumeLitres },
		entry: entries.shown(entry),
		comments: await entries.comments(viewer, tank, entry.id),
		isOwner: tanks.isOwner(viewer, tank)
	};
}) satisfies PageServerLoad;

export const actions = {
	comment: async (event) => {
		const viewer = requireUser(event);
		const body = String((await event.request.formData()).get('comment') ?? '');
		try {
			await entries.addComment(viewer, Number(event.params.id), Number(event.params.entryId), body);
		} catch (e) {
			if (e instanceof entries.EntryNotFound) error(404, 'We could not find that entry.');
			if (e instanceof entries.EntryInputError) return fail(400, { commentError: e.errors.comment, comment: body });
			throw e;
		}
		return { commented: true };
	},
	removeComment: async (event) => {
		const viewer = requireUser(event);
		const id = String((await event.request.formData()).get('commentId') ?? '');
		if (!/^[1-9]\d{0,14}$/.test(id)) error(404, 'We could not find that comment.');
		try {
			await entries.removeComment(viewer, Number(event.params.id), Number(id));
		} catch (e) {
			if (e instanceof entries.EntryNotFound) error(404, 'We could not find that comment.');
			throw e;
		}
		return { commentRemoved: true };
	},
	delete: async (event) => {
		const viewer = requireUser(event);
		try {
			await entries.remove(viewer, Number(event.params.id), Number(event.params.entryId));
		} catch (e) {
			if (e instanceof tanks.TankNotFound || e instanceof entries.EntryNotFound) error(404, 'We could not find that entry.');
			throw e;
		}
		redirect(303, `/journals/${event.params.id}?entryDeleted=1`);
	}
} satisfies Actions;
