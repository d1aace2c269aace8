import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { findOutlierCards, OUTLIER_MIN_OTHER_CARDS, OUTLIER_MIN_SPREAD, OUTLIER_THRESHOLD_SDS, type ReviewableCard } from './outliers';

// Rule: flag a card more than two standard deviations from the mean of the other judges' cards
// for the same entry. Sample SD (n − 1) checked against simple-statistics sampleStandardDeviation.
// The 2.5-point floor on the SD is our own choice (no source), tested separately.

const cards = (entryId: string, totals: number[]): ReviewableCard[] =>
	totals.map((total, i) => ({ cardId: `${entryId}-k${i}`, entryId, judgeId: `j${i}`, total }));

describe('findOutlierCards', () => {
	test('defaults', () => {
		expect(OUTLIER_THRESHOLD_SDS).toBe(2);
		expect(OUTLIER_MIN_OTHER_CARDS).toBe(2);
		expect(OUTLIER_MIN_SPREAD).toBe(2.5);
	});

	test('the plain rule with a wide spread: others 60, 70, 80 have mean 70, sample SD 10', () => {
		const result = findOutlierCards(cards('e1', [60, 70, 80, 95]), { minSpread: 0 });
		const last = result[3]!;
		expect(last.othersMean).toBe(70);
		expect(last.othersSd).toBeCloseTo(ss.sampleStandardDeviation([60, 70, 80]), 12);
		expect(last.deviationSds).toBeCloseTo(2.5, 12);
		expect(last.status).toBe('outlier');
		const near = findOutlierCards(cards('e1', [60, 70, 80, 89]), { minSpread: 0 })[3]!;
		expect(near.deviationSds).toBeCloseTo(1.9, 12);
		expect(near.status).toBe('within');
	});

	test('exactly two SDs away is not "more than" two', () => {
		const result = findOutlierCards(cards('e1', [60, 70, 80, 90]), { minSpread: 0 });
		expect(result[3]!.deviationSds).toBeCloseTo(2, 12);
		expect(result[3]!.status).toBe('within');
	});

	test('each card is compared with the others only, and below-mean cards are negative', () => {
		const totals = [82, 84, 80, 60];
		const result = findOutlierCards(cards('e1', totals), { minSpread: 0 });
		result.forEach((r, i) => {
			const others = totals.filter((_, k) => k !== i);
			expect(r.othersMean).toBeCloseTo(ss.mean(others), 12);
			expect(r.othersSd).toBeCloseTo(ss.sampleStandardDeviation(others), 12);
		});
		expect(result[3]).toMatchObject({ status: 'outlier' });
		expect(result[3]!.deviationSds).toBeCloseTo(-11, 12); // (60 − 82) / 2
		expect(result.filter((r) => r.status === 'outlier').map((r) => r.cardId)).toEqual(['e1-k3']);
	});

	test('needs two other cards: an entry with two cards gets no verdict', () => {
		const result = findOutlierCards(cards('e1', [90, 20]));
		expect(result.map((r) => r.status)).toEqual(['too-few-others', 'too-few-others']);
		expect(result[0]).toMatchObject({ otherCards: 1, othersMean: null, deviationSds: null });
	});

	test('entries are kept apart', () => {
		const result = findOutlierCards([...cards('e1', [70, 70, 71]), ...cards('e2', [10, 95])]);
		expect(result.find((r) => r.cardId === 'e1-k0')!.otherCards).toBe(2);
		expect(result.find((r) => r.cardId === 'e2-k0')!.status).toBe('too-few-others');
	});

	test('the SD floor: two judges agreeing closely do not flag a card a few points away', () => {
		// Others 80, 80.5: sample SD ≈ 0.354, so 82 would be 5.7 SDs away under the plain rule.
		expect(findOutlierCards(cards('e1', [80, 80.5, 82]), { minSpread: 0 })[2]!.status).toBe('outlier');
		const floored = findOutlierCards(cards('e1', [80, 80.5, 82]))[2]!;
		expect(floored.spreadUsed).toBe(2.5);
		expect(floored.deviationSds).toBeCloseTo(1.75 / 2.5, 12);
		expect(floored.status).toBe('within');
		expect(findOutlierCards(cards('e1', [80, 80.5, 86]))[2]!.status).toBe('outlier'); // 5.75 points > 2 × 2.5
	});

	test('zero spread among the others: the floor decides; without a floor any difference is flagged', () => {
		const flat = findOutlierCards(cards('e1', [80, 80, 84]))[2]!;
		expect(flat).toMatchObject({ othersSd: 0, spreadUsed: 2.5, status: 'within' });
		expect(findOutlierCards(cards('e1', [80, 80, 85.5]))[2]!.status).toBe('outlier');
		const strict = findOutlierCards(cards('e1', [80, 80, 80.5]), { minSpread: 0 })[2]!;
		expect(strict.deviationSds).toBe(Infinity);
		expect(strict.status).toBe('outlier');
		expect(findOutlierCards(cards('e1', [80, 80, 80]), { minSpread: 0 })[2]).toMatchObject({ deviationSds: 0, status: 'within' });
	});
});
