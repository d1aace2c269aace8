import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import * as contestEntries from '$lib/server/contests/contest-entries';
import { readContestEntryForm } from '$lib/contests/contest-entry-form';
import { entryChoices, entryFormAgain } from '../contest-entry-form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const contest = await contests.get(viewer, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const mine = await contestEntries.listOwn(viewer, contest.id);
	return {
		contest: { id: contest.id, title: contest.title, entryClosesOn: contest.entryClosesOn, entriesPerMember: contest.entriesPerMember },
		accepting: contests.acceptingEntries(contest),
		full: mine.length >= contest.entriesPerMember,
		...(await entryChoices(viewer, contest)),
		draft: { categoryId: contest.categories.length === 1 ? String(contest.categories[0]!.id) : '', tankId: '', statement: '' }
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const contestId = Number(event.params.id);
			const id = await contestEntries.create(viewer, contestId, readContestEntryForm(data));
			redirect(303, `/contests/${contestId}/entries/${id}?entered=1`);
		},
		{ values: entryFormAgain(() => null) }
	)
} satisfies Actions;
