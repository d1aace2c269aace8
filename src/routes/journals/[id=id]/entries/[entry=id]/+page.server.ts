import { redirect } from '@sveltejs/kit';
import { notFoundOrSignIn, requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import * as journalEntries from '$lib/server/journals/journal-entries';
import { notFound } from '$lib/errors';
import type { Actions, PageServerLoad } from './$types';

/** The comment named by the form's `commentId`; a value that is no id is a comment that does not exist. */
function commentIdOf(data: FormData): number {
	const id = String(data.get('commentId') ?? '');
	if (!/^[1-9]\d{0,14}$/.test(id)) throw notFound('We could not find that comment.');
	return Number(id);
}

export const load = (async (event) => {
	const viewer = event.locals.user;
	const found = await journalEntries.get(viewer, Number(event.params.id), Number(event.params.entry));
	if (!found) notFoundOrSignIn(event, 'We could not find that entry.');
	const { tank, entry } = found;
	return {
		tank: { id: tank.id, name: tank.name, visibility: tank.visibility, volumeLitres: tank.volumeLitres },
		entry: journalEntries.shown(entry),
		comments: await journalEntries.comments(viewer, tank, entry.id),
		isOwner: tanks.isOwner(viewer, tank)
	};
}) satisfies PageServerLoad;

export const actions = {
	comment: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await journalEntries.addComment(viewer, Number(event.params.id), Number(event.params.entry), String(data.get('comment') ?? ''));
			return { commented: true };
		},
		{ id: 'comment' }
	),
	reply: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const parentId = commentIdOf(data);
			await journalEntries.reply(viewer, Number(event.params.id), Number(event.params.entry), parentId, String(data.get('reply') ?? ''));
			return { replied: parentId };
		},
		{ id: 'reply' }
	),
	editComment: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const id = commentIdOf(data);
			await journalEntries.editComment(viewer, Number(event.params.id), id, String(data.get('body') ?? ''));
			return { edited: id };
		},
		{ id: 'editComment' }
	),
	removeComment: formAction(async (event, data) => {
		const viewer = requireUser(event);
		await journalEntries.removeComment(viewer, Number(event.params.id), commentIdOf(data));
		return { commentRemoved: true };
	}),
	delete: formAction(async (event) => {
		const viewer = requireUser(event);
		await journalEntries.remove(viewer, Number(event.params.id), Number(event.params.entry));
		redirect(303, `/journals/${event.params.id}?entryDeleted=1`);
	})
} satisfies Actions;
