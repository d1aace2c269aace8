// Per-judge standardisation. When judges did not all score the same entries (conflicts, self-
// entries), a strict judge's entries would lose against a lenient judge's. Replacing each card
// total by its z-score within that judge's own cards, z = (total − judge's mean) / judge's SD,
// and averaging the z-scores per entry removes each judge's level and spread.

import { aggregate, type AggregateResult, type AggregationMethod } from './aggregate';
import { mean, populationStandardDeviation } from './stats';

/** A submitted card reduced to what standardisation needs. */
export interface JudgedTotal {
	judgeId: string;
	entryId: string;
	/** Card total, a weighted percentage (see cardTotal). */
	total: number;
}

/**
 * Cards per judge below which their mean and SD say little; the method is still applied, the
 * judge is flagged so the results page can say so (the handout cited in the tests asks for at
 * least five papers per judge).
 */
export const STANDARDISE_RECOMMENDED_MIN_CARDS = 5;

/** Spreads below this (percentage points) count as none: float noise, not a judge's opinion. */
export const NO_SPREAD_EPSILON = 1e-9;

export type JudgeScaleStatus = 'ok' | 'single-card' | 'no-spread';

export interface JudgeScale {
	judgeId: string;
	cards: number;
	mean: number;
	/** Population SD of this judge's totals (divides by n): see standardiseByJudge. */
	standardDeviation: number;
	/**
	 * 'single-card': one card says nothing about the judge's scale, so it gets no z-score and is
	 * left out of the standardised mean. 'no-spread': every card had the same total; the judge
	 * preferred no entry, so each card gets z = 0 (at the judge's own average) and still counts.
	 */
	status: JudgeScaleStatus;
	/** Fewer than STANDARDISE_RECOMMENDED_MIN_CARDS cards. */
	fewCards: boolean;
}

export interface StandardisedCard extends JudgedTotal {
	/** null for a judge with a single card. */
	z: number | null;
}

export interface StandardisedEntry {
	entryId: string;
	/** The contest's own aggregate of the raw totals, for showing beside the standardised score. */
	raw: AggregateResult;
	/** Mean z over the cards that have one; null when none has (every judge had a single card). */
	standardised: number | null;
	/** Cards that went into `standardised`. */
	zCount: number;
	cards: StandardisedCard[];
}

export interface Standardisation {
	judges: JudgeScale[];
	entries: StandardisedEntry[];
}

const byId = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/**
 * z-scores per judge with the population standard deviation: the judge's cards are the whole set
 * being rescaled, not a sample from which to estimate anything, and with it every judge's z-scores
 * have mean 0 and SD exactly 1, as the method intends. (The sample SD would only scale every z of
 * a judge by √((n−1)/n), shrinking the weight of judges with few cards for no stated reason.)
 * Throws when one judge has two cards for one entry.
 */
export function standardiseByJudge(totals: readonly JudgedTotal[], method: AggregationMethod): Standardisation {
	const byJudge = new Map<string, JudgedTotal[]>();
	const seen = new Set<string>();
	for (const t of totals) {
		const key = JSON.stringify([t.judgeId, t.entryId]);
		if (seen.has(key)) throw new Error(`Judge ${t.judgeId} has two cards for entry ${t.entryId}.`);
		seen.add(key);
		byJudge.set(t.judgeId, [...(byJudge.get(t.judgeId) ?? []), t]);
	}

	const judges: JudgeScale[] = [];
	const zOf = new Map<string, number | null>();
	for (const judgeId of [...byJudge.keys()].sort(byId)) {
		const cards = byJudge.get(judgeId)!;
		const values = cards.map((c) => c.total);
		const m = mean(values);
		const sd = populationStandardDeviation(values);
		const status: JudgeScaleStatus = cards.length === 1 ? 'single-card' : sd < NO_SPREAD_EPSILON ? 'no-spread' : 'ok';
		judges.push({ judgeId, cards: cards.length, mean: m, standardDeviation: sd, status, fewCards: cards.length < STANDARDISE_RECOMMENDED_MIN_CARDS });
		for (const c of cards) {
			const z = status === 'single-card' ? null : status === 'no-spread' ? 0 : (c.total - m) / sd;
			zOf.set(JSON.stringify([c.judgeId, c.entryId]), z);
		}
	}

	const byEntry = new Map<string, StandardisedCard[]>();
	for (const t of totals) {
		const card: StandardisedCard = { ...t, z: zOf.get(JSON.stringify([t.judgeId, t.entryId]))! };
		byEntry.set(t.entryId, [...(byEntry.get(t.entryId) ?? []), card]);
	}
	const entries: StandardisedEntry[] = [...byEntry.keys()].sort(byId).map((entryId) => {
		const cards = byEntry.get(entryId)!.sort((a, b) => byId(a.judgeId, b.judgeId));
		const zs = cards.map((c) => c.z).filter((z): z is number => z !== null);
		return {
			entryId,
			raw: aggregate(
				cards.map((c) => c.total),
				method
			),
			standardised: zs.length > 0 ? mean(zs) : null,
			zCount: zs.length,
			cards
		};
	});
	return { judges, entries };
}
