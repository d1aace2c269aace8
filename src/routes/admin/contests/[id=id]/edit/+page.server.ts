import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import { ContestError } from '$lib/server/contests/errors';
import { draftFromForm, parseContestDraft } from '$lib/contests/contest-form';
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
	default: async (event) => {
		const viewer = requireRole(event, 'admin');
		const id = Number(event.params.id);
		const contest = await contests.get(viewer, id);
		if (!contest) error(404, 'We could not find that contest.');
		const draft = draftFromForm(await event.request.formData());
		const parsed = parseContestDraft(draft, { locked: contest.state !== 'draft' });
		if (!parsed.ok) return fail(400, { errors: parsed.errors, draft });
		try {
			await contests.update(viewer, id, parsed.input);
		} catch (e) {
			if (e instanceof ContestError) return fail(e.status, { errors: { form: e.message }, draft });
			throw e;
		}
		redirect(303, `/admin/contests/${id}?saved=1`);
	}
} satisfies Actions;
