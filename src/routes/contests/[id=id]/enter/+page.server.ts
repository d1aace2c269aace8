import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import * as entries from '$lib/server/contests/entries';
import { entriesAccepted } from '$lib/contests/lifecycle';
import { entryChoices, readEntryForm, refused } from '../entry-form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const contest = await contests.get(viewer, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const mine = await entries.listOwn(viewer, contest.id);
	return {
		contest: { id: contest.id, title: contest.title, entryClosesOn: contest.entryClosesOn, entriesPerMember: contest.entriesPerMember },
		accepting: entriesAccepted(contest.state, contests.windowsOf(contest), new Date()),
		full: mine.length >= contest.entriesPerMember,
		...(await entryChoices(viewer, contest)),
		draft: { categoryId: contest.categories.length === 1 ? String(contest.categories[0]!.id) : '', tankId: '', statement: '' }
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const contestId = Number(event.params.id);
		const read = await readEntryForm(event.request, viewer, null);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		let id: number;
		try {
			id = await entries.create(viewer, contestId, read.input);
		} catch (e) {
			return refused(e, viewer, read, null);
		}
		redirect(303, `/contests/${contestId}/entries/${id}?entered=1`);
	}
} satisfies Actions;
