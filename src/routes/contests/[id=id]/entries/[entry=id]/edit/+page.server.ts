import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import * as contestEntries from '$lib/server/contests/contest-entries';
import { readContestEntryForm } from '$lib/contests/contest-entry-form';
import { entryChoices, entryFormAgain } from '../../../contest-entry-form.server';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** The viewer's own entry of this contest, or 404. */
async function ownEntry(event: RequestEvent) {
	const viewer = requireUser(event);
	const found = await contestEntries.getOwn(viewer, Number(event.params.entry));
	if (!found || found.entry.entrantId !== viewer.id || found.contest.id !== Number(event.params.id)) error(404, 'We could not find that entry.');
	return { viewer, ...found };
}

export const load = (async (event) => {
	const { viewer, entry, contest } = await ownEntry(event);
	return {
		contest: { id: contest.id, title: contest.title, entryClosesOn: contest.entryClosesOn },
		entryId: entry.id,
		accepting: contests.acceptingEntries(contest),
		...(await entryChoices(viewer, contest)),
		draft: { categoryId: String(entry.categoryId), tankId: entry.tankId ? String(entry.tankId) : '', statement: entry.statement },
		photos: entry.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls }))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event: RequestEvent, data) => {
			const { viewer, entry } = await ownEntry(event);
			await contestEntries.update(viewer, entry.id, readContestEntryForm(data));
			redirect(303, `/contests/${event.params.id}/entries/${entry.id}?saved=1`);
		},
		{ values: entryFormAgain((event) => Number(event.params.entry)) }
	)
} satisfies Actions;
