// From the submitted cards of one entry to the entry's score, by the method the contest chose.

import type { Rubric } from './rubric';
import { cardTotal, type CompleteScoreSheet } from './scoring';
import { mean, median } from './stats';

export type AggregationMethod = 'mean' | 'median' | 'trimmed-mean';

/**
 * Fewest cards for which the trimmed mean drops the single highest and lowest: with four or fewer,
 * dropping two would leave too little of the panel's opinion (and with three, only one card).
 */
export const TRIM_MIN_CARDS = 5;

export interface AggregateResult {
	/** null when there was nothing to aggregate. */
	value: number | null;
	requested: AggregationMethod;
	/** The method actually applied: a trimmed mean over fewer than TRIM_MIN_CARDS cards is a plain mean. */
	used: AggregationMethod;
	/** Values that went in, before any trimming. */
	count: number;
	/** Positions (in the input) of the dropped lowest and highest value, when trimmed. */
	dropped: { low: number; high: number } | null;
	/** Why `used` differs from `requested`, in words for the results page; null when it does not. */
	note: string | null;
}

/** Aggregates plain numbers (card totals, or one criterion's scores) by `method`. */
export function aggregate(values: readonly number[], method: AggregationMethod): AggregateResult {
	const base = { requested: method, count: values.length, dropped: null, note: null };
	if (values.length === 0) return { ...base, value: null, used: method };
	if (method === 'mean') return { ...base, value: mean(values), used: 'mean' };
	if (method === 'median') return { ...base, value: median(values), used: 'median' };
	if (values.length < TRIM_MIN_CARDS) {
		return {
			...base,
			value: mean(values),
			used: 'mean',
			note: `Only ${values.length} ${values.length === 1 ? 'judge' : 'judges'} scored this entry, so all their scores are averaged; the highest and the lowest are left out only when ${TRIM_MIN_CARDS} or more judges score.`
		};
	}
	// Sort positions by value (then position, so equal values drop deterministically).
	const order = values.map((_, i) => i).sort((a, b) => values[a]! - values[b]! || a - b);
	const low = order[0]!;
	const high = order[order.length - 1]!;
	const kept = order.slice(1, -1).map((i) => values[i]!);
	return { ...base, value: mean(kept), used: 'trimmed-mean', dropped: { low, high } };
}

export interface SubmittedCard {
	cardId: string;
	judgeId: string;
	scores: CompleteScoreSheet;
}

export interface EntryAggregate {
	/** Aggregate of the card totals (weighted percentages). */
	total: AggregateResult;
	/** Cards left out of the total by trimming, so the UI can show them struck through. */
	droppedCardIds: { low: string; high: string } | null;
	/** Per criterion, in points of that criterion; each criterion is trimmed on its own values. */
	criteria: Record<string, AggregateResult>;
	cardTotals: { cardId: string; judgeId: string; total: number }[];
}

/**
 * The entry's score and per-criterion breakdown. Cards are taken in card-id order so the same
 * cards always give the same result, whatever order the database returned them in.
 */
export function aggregateEntry(rubric: Rubric, cards: readonly SubmittedCard[], method: AggregationMethod): EntryAggregate {
	const sorted = [...cards].sort((a, b) => (a.cardId < b.cardId ? -1 : a.cardId > b.cardId ? 1 : 0));
	const cardTotals = sorted.map((c) => ({ cardId: c.cardId, judgeId: c.judgeId, total: cardTotal(rubric, c.scores) }));
	const total = aggregate(
		cardTotals.map((c) => c.total),
		method
	);
	const criteria: Record<string, AggregateResult> = {};
	for (const criterion of rubric) {
		criteria[criterion.id] = aggregate(
			sorted.map((c) => c.scores[criterion.id]!),
			method
		);
	}
	const droppedCardIds = total.dropped ? { low: cardTotals[total.dropped.low]!.cardId, high: cardTotals[total.dropped.high]!.cardId } : null;
	return { total, droppedCardIds, criteria, cardTotals };
}
