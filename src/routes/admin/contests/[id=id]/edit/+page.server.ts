import { error, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import { notFound } from '$lib/errors';
import { draftFromForm, readContestForm } from '$lib/contests/contest-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const contest = await contests.get(viewer, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	return {
		contest: { id: contest.id, title: contest.title, state: contest.state },
		draft: contests.draftOf(contest),
		locked: contest.state !== 'draft',
		criteria: contest.criteria.map((c) => ({ id: c.id, label: c.label, maxPoints: c.maxPoints, weight: c.weight })),
		categories: contest.categories.map((c) => ({ id: c.id, name: c.name }))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const viewer = requireRole(event, 'admin');
			const id = Number(event.params.id);
			const contest = await contests.get(viewer, id);
			if (!contest) throw notFound('We could not find that contest.');
			await contests.update(viewer, id, readContestForm(data, { locked: contest.state !== 'draft' }));
			redirect(303, `/admin/contests/${id}?saved=1`);
		},
		{ values: draftFromForm }
	)
} satisfies Actions;
