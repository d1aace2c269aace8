import { error, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import { nameIn, review, setRankBy } from '$lib/server/contests/review';
import { RANK_BASES } from '$lib/contests/results';
import { TRANSITIONS } from '$lib/contests/lifecycle';
import { takeStep } from '../../transition.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const found = await review(viewer, Number(event.params.id));
	if (!found) error(404, 'We could not find that contest.');
	const { data, report } = found;
	const name = (id: string) => nameIn(data, id);
	const entryOf = (id: string) => data.entries.find((e) => String(e.id) === id)!;
	const cards = new Map(data.cards.map((c) => [String(c.id), c]));
	const c = data.contest;
	return {
		contest: { id: c.id, title: c.title, state: c.state, aggregation: c.aggregation, rankBy: c.rankBy, resultsRevision: c.resultsRevision },
		criteria: c.criteria.map((k) => ({ id: String(k.id), label: k.label, maxPoints: k.maxPoints })),
		tieBreak: [...c.criteria].sort((a, b) => a.tieBreakRank - b.tieBreakRank).map((k) => k.label),
		unevenPanel: report.unevenPanel,
		readiness: {
			ready: report.readiness.ready,
			overall: report.readiness.overall,
			missing: report.readiness.missing.map((m) => ({
				number: entryOf(m.entryId).number,
				entrant: name(entryOf(m.entryId).entrantId),
				judge: name(m.judgeId),
				state: m.state
			})),
			unjudgeable: report.readiness.unjudgeableEntryIds.map((id) => entryOf(id).number)
		},
		categories: c.categories.map((category, i) => {
			const cat = report.categories[i]!;
			return {
				id: category.id,
				name: category.name,
				unevenPanel: cat.unevenPanel,
				concordance: cat.concordance.ok
					? {
							ok: true as const,
							w: cat.concordance.w,
							wTieCorrected: cat.concordance.wTieCorrected,
							m: cat.concordance.m,
							n: cat.concordance.n,
							excluded: cat.concordance.excludedEntryIds.length,
							chi: cat.concordance.friedmanChiSquare,
							df: cat.concordance.degreesOfFreedom
						}
					: { ok: false as const, message: cat.concordance.message, excluded: cat.concordance.excludedEntryIds.length },
				judges: cat.judges.map((j) => ({
					name: name(j.judgeId),
					cards: j.cards,
					mean: j.mean,
					sd: j.standardDeviation,
					status: j.status,
					fewCards: j.fewCards
				})),
				flagged: cat.flaggedCards.map((o) => ({
					cardId: o.cardId,
					number: entryOf(o.entryId).number,
					judge: name(o.judgeId),
					total: o.total,
					othersMean: o.othersMean,
					deviationSds: o.deviationSds
				})),
				entries: cat.entries.map((e) => {
					const entry = entryOf(e.entryId);
					return {
						entryId: entry.id,
						number: entry.number,
						entrant: name(entry.entrantId),
						place: e.place,
						placeRaw: e.placeRaw,
						placeStandardised: e.placeStandardised,
						shared: e.sharedWith.length > 0,
						tieBrokenBy: e.separatedFromAbove ? (c.criteria.find((k) => String(k.id) === e.separatedFromAbove!.criterionId)?.label ?? null) : null,
						score: e.score,
						standardised: e.standardised,
						methodNote: e.aggregate?.total.note ?? null,
						criteria: Object.fromEntries(c.criteria.map((k) => [String(k.id), e.aggregate?.criteria[String(k.id)]?.value ?? null])),
						cards: e.cards.map((k) => ({
							cardId: Number(k.cardId),
							judge: name(k.judgeId),
							total: k.total,
							z: k.z,
							dropped: k.dropped,
							outlier: k.outlier?.status === 'outlier',
							deviationSds: k.outlier?.deviationSds ?? null,
							panelNote: cards.get(k.cardId)?.fields.panelNote ?? ''
						}))
					};
				})
			};
		}),
		publish: c.state === 'judging' ? TRANSITIONS.publish : null
	};
}) satisfies PageServerLoad;

const rankForm = z.object({
	rankBy: z.enum(RANK_BASES, { message: 'Choose how places are decided.' }),
	reason: z.string().trim().max(500, 'Keep the reason to 500 characters.').optional()
});

export const actions = {
	rankBy: formAction(
		async (event, data) => {
			const viewer = requireRole(event, 'admin');
			const input = parseForm(rankForm, data);
			await setRankBy(viewer, Number(event.params.id), input.rankBy, input.reason ?? null);
			redirect(303, `/admin/contests/${event.params.id}/results?ranked=1`);
		},
		{ id: 'rankBy' }
	),
	step: takeStep((id) => `/admin/contests/${id}/results`)
} satisfies Actions;
