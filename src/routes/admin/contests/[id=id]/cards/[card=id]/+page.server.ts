import { error, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import { amendCard, cardToCorrect } from '$lib/server/contests/review';
import { notFound } from '$lib/errors';
import { readCardCorrection } from '$lib/contests/card';
import type { Actions, PageServerLoad } from './$types';

const criteriaOf = (found: NonNullable<Awaited<ReturnType<typeof cardToCorrect>>>) =>
	found.contest.criteria.map((k) => ({ id: String(k.id), label: k.label, maxPoints: k.maxPoints }));

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const found = await cardToCorrect(viewer, Number(event.params.id), Number(event.params.card));
	if (!found) error(404, 'We could not find that card.');
	return {
		contest: { id: found.contest.id, title: found.contest.title, state: found.contest.state },
		card: { id: found.card.id, status: found.card.status, judge: found.judge, number: found.number, entrant: found.entrant },
		criteria: criteriaOf(found),
		fields: found.fields
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event, data) => {
		const viewer = requireRole(event, 'admin');
		const found = await cardToCorrect(viewer, Number(event.params.id), Number(event.params.card));
		if (!found) throw notFound('We could not find that card.');
		await amendCard(viewer, found.card.id, readCardCorrection(criteriaOf(found), data), String(data.get('reason') ?? ''));
		redirect(303, `/admin/contests/${found.contest.id}/results?amended=1`);
	})
} satisfies Actions;
