// Cards far from what the other judges gave the same entry, flagged for the contest admin to look
// at (a misread entry number, a slip of the keyboard, a judge who read the rubric differently).
// A flag is a prompt to check, never a reason to drop a card automatically.

import { mean, sampleStandardDeviation } from './stats';

export interface ReviewableCard {
	cardId: string;
	entryId: string;
	judgeId: string;
	total: number;
}

/** A card is flagged when it is more than this many standard deviations from the others' mean. */
export const OUTLIER_THRESHOLD_SDS = 2;

/**
 * Other cards needed before a card is judged at all: the sample standard deviation needs two
 * values. With only two others the estimate is rough, hence the floor below.
 */
export const OUTLIER_MIN_OTHER_CARDS = 2;

/**
 * The others' standard deviation is taken as at least this many percentage points (our choice,
 * no source). Without a floor, two judges who agree to the half point (or exactly: zero spread,
 * where any difference is infinitely many SDs) would flag a third card a point or two away.
 * With the default threshold of 2 SDs, a card must then be more than 5 points from the others'
 * mean to be flagged. Pass 0 for the plain rule; zero spread then flags any card that differs.
 */
export const OUTLIER_MIN_SPREAD = 2.5;

export interface OutlierOptions {
	thresholdSds?: number;
	minOtherCards?: number;
	minSpread?: number;
}

export type OutlierStatus = 'outlier' | 'within' | 'too-few-others';

export interface OutlierCheck extends ReviewableCard {
	status: OutlierStatus;
	/** Other cards of the same entry. */
	otherCards: number;
	othersMean: number | null;
	/** Sample SD (n − 1) of the other cards: they are a few judges standing for the panel's view. */
	othersSd: number | null;
	/** The SD actually divided by: max(othersSd, minSpread). */
	spreadUsed: number | null;
	/**
	 * (total − othersMean) / spreadUsed, signed (positive: this card is higher). ±Infinity only when
	 * minSpread is 0 and the others agree exactly but this card differs.
	 */
	deviationSds: number | null;
}

const NOISE = 1e-9;

/** One check per card, in input order; compare each card with the other cards of its entry. */
export function findOutlierCards(cards: readonly ReviewableCard[], options: OutlierOptions = {}): OutlierCheck[] {
	const threshold = options.thresholdSds ?? OUTLIER_THRESHOLD_SDS;
	const minOthers = Math.max(2, options.minOtherCards ?? OUTLIER_MIN_OTHER_CARDS);
	const minSpread = options.minSpread ?? OUTLIER_MIN_SPREAD;
	return cards.map((card) => {
		const others = cards.filter((c) => c.entryId === card.entryId && c.cardId !== card.cardId).map((c) => c.total);
		if (others.length < minOthers) {
			return { ...card, status: 'too-few-others', otherCards: others.length, othersMean: null, othersSd: null, spreadUsed: null, deviationSds: null };
		}
		const othersMean = mean(others);
		const rawSd = sampleStandardDeviation(others);
		const othersSd = rawSd < NOISE ? 0 : rawSd;
		const spreadUsed = Math.max(othersSd, minSpread);
		const gap = card.total - othersMean;
		const deviationSds = spreadUsed > 0 ? gap / spreadUsed : Math.abs(gap) < NOISE ? 0 : Math.sign(gap) * Infinity;
		return {
			...card,
			status: Math.abs(deviationSds) > threshold ? 'outlier' : 'within',
			otherCards: others.length,
			othersMean,
			othersSd,
			spreadUsed,
			deviationSds
		};
	});
}
