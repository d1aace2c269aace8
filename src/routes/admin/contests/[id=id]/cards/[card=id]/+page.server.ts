import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { ContestError } from '$lib/server/contests/errors';
import { amendCard, loadData } from '$lib/server/contests/review';
import { assertAdmin } from '$lib/server/contests/contests';
import { normaliseFields, parseScoreText, type CardFields } from '$lib/contests/card';
import { rubricOf } from '$lib/server/contests/contests';
import type { Actions, PageServerLoad } from './$types';

async function cardOf(event: { params: { id: string; card: string } }) {
	const data = await loadData(Number(event.params.id));
	const card = data?.cards.find((c) => c.id === Number(event.params.card));
	if (!data || !card) error(404, 'We could not find that card.');
	return { data, card };
}

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	assertAdmin(viewer);
	const { data, card } = await cardOf(event);
	const entry = data.entries.find((e) => e.id === card.entryId)!;
	const fields = normaliseFields(rubricOf(data.contest.criteria), card.fields);
	return {
		contest: { id: data.contest.id, title: data.contest.title, state: data.contest.state },
		card: {
			id: card.id,
			status: card.status,
			judge: data.people.get(card.judgeId)?.displayName ?? '',
			number: entry.number,
			entrant: data.people.get(entry.entrantId)?.displayName ?? ''
		},
		criteria: data.contest.criteria.map((k) => ({ id: String(k.id), label: k.label, maxPoints: k.maxPoints })),
		fields
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireRole(event, 'admin');
		const { data, card } = await cardOf(event);
		const form = await event.request.formData();
		const errors: Record<string, string> = {};
		const fields: CardFields = { scores: {}, comments: {}, entrantComment: String(form.get('entrantComment') ?? ''), panelNote: '' };
		for (const k of data.contest.criteria) {
			const id = String(k.id);
			const read = parseScoreText(String(form.get(`score-${id}`) ?? ''), k.label, k.maxPoints);
			if (read.error) errors[`score-${id}`] = read.error;
			else if (read.value === null) errors[`score-${id}`] = `${k.label}: give a score.`;
			fields.scores[id] = read.value;
			fields.comments[id] = String(form.get(`comment-${id}`) ?? '');
		}
		const reason = String(form.get('reason') ?? '');
		if (Object.keys(errors).length) return fail(400, { errors, fields, reason });
		try {
			await amendCard(viewer, card.id, fields, reason);
		} catch (e) {
			if (e instanceof ContestError) return fail(e.status === 404 ? 404 : 400, { errors: { form: e.message, ...e.fields }, fields, reason });
			throw e;
		}
		redirect(303, `/admin/contests/${data.contest.id}/results?amended=1`);
	}
} satisfies Actions;
