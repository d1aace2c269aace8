import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import * as entries from '$lib/server/contests/entries';
import { entriesAccepted } from '$lib/contests/lifecycle';
import { entryChoices, readEntryForm, refused } from '../../../entry-form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const found = await entries.getOwn(viewer, Number(event.params.entry));
	if (!found || found.entry.entrantId !== viewer.id || found.contest.id !== Number(event.params.id)) error(404, 'We could not find that entry.');
	const { entry, contest } = found;
	return {
		contest: { id: contest.id, title: contest.title, entryClosesOn: contest.entryClosesOn },
		entryId: entry.id,
		accepting: entriesAccepted(contest.state, contests.windowsOf(contest), new Date()),
		...(await entryChoices(viewer, contest)),
		draft: { categoryId: String(entry.categoryId), tankId: entry.tankId ? String(entry.tankId) : '', statement: entry.statement },
		photos: entry.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls }))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const entryId = Number(event.params.entry);
		const found = await entries.getOwn(viewer, entryId);
		if (!found || found.entry.entrantId !== viewer.id || found.contest.id !== Number(event.params.id)) error(404, 'We could not find that entry.');
		const read = await readEntryForm(event.request, viewer, entryId);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		try {
			await entries.update(viewer, entryId, read.input);
		} catch (e) {
			return refused(e, viewer, read, entryId);
		}
		redirect(303, `/contests/${event.params.id}/entries/${entryId}?saved=1`);
	}
} satisfies Actions;
