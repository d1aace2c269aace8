// From a contest's rubric, entries, panel, conflicts and cards to everything the review and the
// results pages show: per category the entries' aggregated scores, the per-judge standardised
// scores, places (raw and standardised), the judges' agreement and the outlier cards; overall
// the publication readiness. Only the composition lives here: each computation is one of the
// tested functions of this folder.

import { aggregateEntry, type AggregationMethod, type EntryAggregate, type SubmittedCard } from './aggregate';
import { concordanceForCategory, type ConcordanceResult } from './concordance';
import { findOutlierCards, type OutlierCheck } from './outliers';
import { rankCategory, type RankedEntry } from './ranking';
import { judgingDuties, publicationReadiness, type CardStatus, type Conflict, type JudgingDuties, type Readiness } from './readiness';
import type { Rubric } from './rubric';
import { validateScorecard, type CompleteScoreSheet, type ScoreSheet } from './scoring';
import { standardiseByJudge, type JudgeScale } from './standardise';

export type RankBasis = 'raw' | 'standardised';
export const RANK_BASES = ['raw', 'standardised'] as const;

/**
 * Places are decided on the scores as shown: card percentages to two decimals, standardised
 * scores to three. Two entries the page shows as equal therefore share a place (or are split by
 * a named criterion), never split by a digit nobody can see.
 */
export const RAW_DECIMALS = 2;
export const Z_DECIMALS = 3;

export interface CardInput {
	cardId: string;
	entryId: string;
	judgeId: string;
	status: 'draft' | 'submitted';
	scores: ScoreSheet;
}

export interface ResultsInput {
	rubric: Rubric;
	/** Criterion ids in the order ties are broken; every criterion once. */
	tieBreakOrder: readonly string[];
	method: AggregationMethod;
	rankBy: RankBasis;
	categoryIds: readonly string[];
	entries: readonly { entryId: string; categoryId: string; entrantId: string }[];
	/** The current panel. Cards of judges no longer on it are ignored. */
	judgeIds: readonly string[];
	conflicts: readonly Conflict[];
	cards: readonly CardInput[];
}

export interface CardResult {
	cardId: string;
	judgeId: string;
	/** Weighted percentage. */
	total: number;
	/** The judge's z-score for this card within the category; null for a judge with one card there. */
	z: number | null;
	/** Left out of the entry's score by the trimmed mean. */
	dropped: 'low' | 'high' | null;
	outlier: OutlierCheck | null;
}

export interface EntryResult {
	entryId: string;
	/** The place by the contest's ranking basis. */
	place: number | null;
	placeRaw: number | null;
	placeStandardised: number | null;
	sharedWith: string[];
	separatedFromAbove: RankedEntry['separatedFromAbove'];
	/** Aggregate of the card totals by the contest's method; null without a submitted card. */
	score: number | null;
	standardised: number | null;
	aggregate: EntryAggregate | null;
	cards: CardResult[];
}

export interface CategoryResults {
	categoryId: string;
	/** In the order of the official ranking; unscored entries last. */
	entries: EntryResult[];
	/** Some entry of the category was not scored by every judge who scored in it. */
	unevenPanel: boolean;
	concordance: ConcordanceResult;
	judges: JudgeScale[];
	flaggedCards: OutlierCheck[];
}

export interface ResultsReport {
	duties: JudgingDuties;
	readiness: Readiness;
	categories: CategoryResults[];
	/** Any category with an uneven panel: standardisation is worth offering. */
	unevenPanel: boolean;
	/** Submitted cards that do not fit the rubric (should not happen: submission validates). */
	invalidCardIds: string[];
}

export function computeResults(input: ResultsInput): ResultsReport {
	const panel = new Set(input.judgeIds);
	const duties = judgingDuties(input.entries, [...panel], input.conflicts);
	const owed = new Set(duties.duties.map((d) => JSON.stringify([d.entryId, d.judgeId])));
	const dutyCards = input.cards.filter((c) => owed.has(JSON.stringify([c.entryId, c.judgeId])));
	const statuses: CardStatus[] = dutyCards.map((c) => ({ entryId: c.entryId, judgeId: c.judgeId, state: c.status }));
	const readiness = publicationReadiness(
		input.entries.map((e) => e.entryId),
		duties.duties,
		statuses
	);

	const invalidCardIds: string[] = [];
	const submitted = dutyCards.filter((c) => {
		if (c.status !== 'submitted') return false;
		if (!validateScorecard(input.rubric, c.scores).submittable) {
			invalidCardIds.push(c.cardId);
			return false;
		}
		return true;
	});

	const categories = input.categoryIds.map((categoryId) => categoryResults(input, categoryId, submitted));
	return { duties, readiness, categories, unevenPanel: categories.some((c) => c.unevenPanel), invalidCardIds };
}

function categoryResults(input: ResultsInput, categoryId: string, submitted: CardInput[]): CategoryResults {
	const entryIds = input.entries.filter((e) => e.categoryId === categoryId).map((e) => e.entryId);
	const inCategory = new Set(entryIds);
	const cards = submitted.filter((c) => inCategory.has(c.entryId));

	const aggregates = new Map<string, EntryAggregate>();
	for (const entryId of entryIds) {
		const own: SubmittedCard[] = cards
			.filter((c) => c.entryId === entryId)
			.map((c) => ({ cardId: c.cardId, judgeId: c.judgeId, scores: c.scores as CompleteScoreSheet }));
		if (own.length) aggregates.set(entryId, aggregateEntry(input.rubric, own, input.method));
	}
	const totals = [...aggregates.entries()].flatMap(([entryId, agg]) => agg.cardTotals.map((t) => ({ ...t, entryId })));

	const standardisation = standardiseByJudge(
		totals.map((t) => ({ judgeId: t.judgeId, entryId: t.entryId, total: t.total })),
		input.method
	);
	const zOf = new Map(standardisation.entries.flatMap((e) => e.cards.map((c) => [JSON.stringify([c.judgeId, c.entryId]), c.z] as const)));
	const standardisedOf = new Map(standardisation.entries.map((e) => [e.entryId, e.standardised]));

	const outliers = findOutlierCards(totals.map((t) => ({ cardId: t.cardId, entryId: t.entryId, judgeId: t.judgeId, total: t.total })));
	const outlierOf = new Map(outliers.map((o) => [o.cardId, o]));

	const criteriaOf = (entryId: string) => {
		const agg = aggregates.get(entryId);
		return Object.fromEntries(input.rubric.map((c) => [c.id, agg?.criteria[c.id]?.value ?? null]));
	};
	const rankedRaw = rankCategory(
		entryIds.map((entryId) => ({ entryId, score: aggregates.get(entryId)?.total.value ?? null, criteria: criteriaOf(entryId) })),
		input.tieBreakOrder,
		{ decimals: RAW_DECIMALS }
	);
	const rankedZ = rankCategory(
		entryIds.map((entryId) => ({ entryId, score: standardisedOf.get(entryId) ?? null, criteria: criteriaOf(entryId) })),
		input.tieBreakOrder,
		{ decimals: Z_DECIMALS }
	);
	const rawPlace = new Map(rankedRaw.map((r) => [r.entryId, r]));
	const zPlace = new Map(rankedZ.map((r) => [r.entryId, r]));
	const official = input.rankBy === 'standardised' ? rankedZ : rankedRaw;

	const judgesInCategory = new Set(totals.map((t) => t.judgeId));
	const unevenPanel = entryIds.some((entryId) => {
		const scoredBy = new Set(totals.filter((t) => t.entryId === entryId).map((t) => t.judgeId));
		return [...judgesInCategory].some((j) => !scoredBy.has(j));
	});

	const entries: EntryResult[] = official.map((ranked) => {
		const agg = aggregates.get(ranked.entryId) ?? null;
		const dropped = agg?.droppedCardIds;
		return {
			entryId: ranked.entryId,
			place: ranked.place,
			placeRaw: rawPlace.get(ranked.entryId)?.place ?? null,
			placeStandardised: zPlace.get(ranked.entryId)?.place ?? null,
			sharedWith: ranked.sharedWith,
			separatedFromAbove: ranked.separatedFromAbove,
			score: agg?.total.value ?? null,
			standardised: standardisedOf.get(ranked.entryId) ?? null,
			aggregate: agg,
			cards: (agg?.cardTotals ?? []).map((t) => ({
				cardId: t.cardId,
				judgeId: t.judgeId,
				total: t.total,
				z: zOf.get(JSON.stringify([t.judgeId, ranked.entryId])) ?? null,
				dropped: dropped?.low === t.cardId ? 'low' : dropped?.high === t.cardId ? 'high' : null,
				outlier: outlierOf.get(t.cardId) ?? null
			}))
		};
	});

	return {
		categoryId,
		entries,
		unevenPanel,
		concordance: concordanceForCategory(totals.map((t) => ({ judgeId: t.judgeId, entryId: t.entryId, total: t.total }))),
		judges: standardisation.judges,
		flaggedCards: outliers.filter((o) => o.status === 'outlier')
	};
}

/** "1st", "2nd", "3rd", "4th", "11th", "21st". */
export function ordinal(n: number): string {
	const tens = n % 100;
	if (tens >= 11 && tens <= 13) return `${n}th`;
	return `${n}${n % 10 === 1 ? 'st' : n % 10 === 2 ? 'nd' : n % 10 === 3 ? 'rd' : 'th'}`;
}
