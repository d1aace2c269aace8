import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import * as contestEntries from '$lib/server/contests/contest-entries';
import * as judging from '$lib/server/contests/judging';
import { feedback } from '$lib/server/contests/review';
import { invalid } from '$lib/errors';
import type { Actions, PageServerLoad } from './$types';

// The entrant's own entry (admins may look too): status, what was entered, feedback once published.
export const load = (async (event) => {
	const viewer = requireUser(event);
	const found = await contestEntries.getOwn(viewer, Number(event.params.entry));
	if (!found || found.contest.id !== Number(event.params.id)) error(404, 'We could not find that entry.');
	const { entry, contest } = found;
	return {
		contest: { id: contest.id, title: contest.title, state: contest.state, entryClosesOn: contest.entryClosesOn, judgingClosesOn: contest.judgingClosesOn },
		entry: {
			id: entry.id,
			number: entry.number,
			categoryName: entry.categoryName,
			tankName: entry.tankName,
			tankId: entry.entrantId === viewer.id ? entry.tankId : null,
			// What the judges read: the statement without pictures, the figures as the rule and bands.
			judged: judging.blindText(
				entry,
				contest.categories.find((c) => c.id === entry.categoryId)!,
				viewer.units
			),
			photos: entry.photos.map((p) => ({
				id: p.id,
				alt: p.alt,
				caption: p.caption,
				urls: p.urls,
				width: p.renditions.medium.width,
				height: p.renditions.medium.height,
				largeWidth: p.renditions.large.width,
				largeHeight: p.renditions.large.height
			}))
		},
		own: entry.entrantId === viewer.id,
		changeable: entry.entrantId === viewer.id && contests.acceptingEntries(contest),
		feedback: await feedback(viewer, entry.id)
	};
}) satisfies PageServerLoad;

export const actions = {
	withdraw: formAction(async (event, data) => {
		const viewer = requireUser(event);
		if (data.get('confirm') !== 'withdraw') throw invalid({ confirm: 'Tick the box to confirm that you withdraw this entry.' });
		const contestId = await contestEntries.withdraw(viewer, Number(event.params.entry));
		redirect(303, `/contests/${contestId}?withdrawn=1`);
	})
} satisfies Actions;
