import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { aggregate, aggregateEntry, TRIM_MIN_CARDS, type SubmittedCard } from './aggregate';
import type { Rubric } from './rubric';
import { cardTotal } from './scoring';

// Reference for the trimmed mean: its definition (drop the k smallest and k largest values, take the
// arithmetic mean of the rest), here with k = 1; means and medians from simple-statistics.

describe('aggregate', () => {
	test('mean and median agree with simple-statistics', () => {
		const values = [71.5, 80, 64.25, 90, 77];
		expect(aggregate(values, 'mean').value).toBeCloseTo(ss.mean(values), 12);
		expect(aggregate(values, 'median').value).toBe(ss.median(values));
		expect(aggregate([60, 70, 80, 95], 'median').value).toBe(75); // even count: mean of the middle two
	});
	test('trimmed mean from five cards drops one highest and one lowest', () => {
		const values = [80, 55, 72, 91, 68];
		const result = aggregate(values, 'trimmed-mean');
		expect(result.used).toBe('trimmed-mean');
		expect(result.value).toBeCloseTo(ss.mean([68, 72, 80]), 12);
		expect(result.dropped).toEqual({ low: 1, high: 3 });
		expect(result.note).toBeNull();
	});
	test('only one of several equal extremes is dropped', () => {
		const result = aggregate([70, 90, 80, 70, 90], 'trimmed-mean');
		expect(result.value).toBeCloseTo(80, 12); // mean of 70, 80, 90
		expect(result.dropped).toEqual({ low: 0, high: 4 });
	});
	test('below five cards the trimmed mean is the plain mean, and says so', () => {
		expect(TRIM_MIN_CARDS).toBe(5);
		const result = aggregate([80, 55, 72, 91], 'trimmed-mean');
		expect(result.requested).toBe('trimmed-mean');
		expect(result.used).toBe('mean');
		expect(result.value).toBeCloseTo(ss.mean([80, 55, 72, 91]), 12);
		expect(result.dropped).toBeNull();
		expect(result.note).toBe(
			'Only 4 judges scored this entry, so all their scores are averaged; the highest and the lowest are left out only when 5 or more judges score.'
		);
		expect(aggregate([80], 'trimmed-mean').note).toMatch(/^Only 1 judge scored/);
	});
	test('random data: trimmed mean matches its definition with simple-statistics', () => {
		let seed = 5;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		for (let trial = 0; trial < 200; trial++) {
			const values = Array.from({ length: 5 + Math.floor(next() * 8) }, () => Math.round(next() * 200) / 2);
			const sorted = [...values].sort((a, b) => a - b);
			expect(aggregate(values, 'trimmed-mean').value).toBeCloseTo(ss.mean(sorted.slice(1, -1)), 9);
		}
	});
	test('nothing to aggregate gives null', () => {
		for (const method of ['mean', 'median', 'trimmed-mean'] as const) {
			expect(aggregate([], method)).toMatchObject({ value: null, count: 0 });
		}
	});
});

describe('aggregateEntry', () => {
	const rubric: Rubric = [
		{ id: 'arrangement', label: 'Arrangement', maxPoints: 10, weight: 2 },
		{ id: 'condition', label: 'Plant condition', maxPoints: 5, weight: 1 }
	];
	const cards: SubmittedCard[] = [
		{ cardId: 'k3', judgeId: 'j3', scores: { arrangement: 9, condition: 2 } },
		{ cardId: 'k1', judgeId: 'j1', scores: { arrangement: 6, condition: 5 } },
		{ cardId: 'k5', judgeId: 'j5', scores: { arrangement: 10, condition: 4.5 } },
		{ cardId: 'k2', judgeId: 'j2', scores: { arrangement: 7, condition: 3 } },
		{ cardId: 'k4', judgeId: 'j4', scores: { arrangement: 3, condition: 4 } }
	];
	test('trims the total and each criterion separately, naming the dropped cards', () => {
		const result = aggregateEntry(rubric, cards, 'trimmed-mean');
		const totals = Object.fromEntries(result.cardTotals.map((c) => [c.cardId, c.total]));
		expect(totals.k1).toBeCloseTo(((2 * 6 + 5) / 25) * 100, 12); // 68
		expect(totals.k4).toBeCloseTo(((2 * 3 + 4) / 25) * 100, 12); // 40, lowest
		expect(totals.k5).toBeCloseTo(((2 * 10 + 4.5) / 25) * 100, 12); // 98, highest
		expect(result.droppedCardIds).toEqual({ low: 'k4', high: 'k5' });
		expect(result.total.value).toBeCloseTo(ss.mean([totals.k1!, totals.k2!, totals.k3!]), 12);
		// Arrangement scores 9, 6, 10, 7, 3 → keep 6, 7, 9; condition 2, 5, 4.5, 3, 4 → keep 3, 4, 4.5.
		expect(result.criteria.arrangement!.value).toBeCloseTo(22 / 3, 12);
		expect(result.criteria.condition!.value).toBeCloseTo(11.5 / 3, 12);
	});
	test('the order cards arrive in does not matter', () => {
		const a = aggregateEntry(rubric, cards, 'median');
		const b = aggregateEntry(rubric, [...cards].reverse(), 'median');
		expect(b).toEqual(a);
		expect(a.total.value).toBeCloseTo(cardTotal(rubric, { arrangement: 7, condition: 3 }), 12); // 68: middle of 40, 68, 68, 80, 98
	});
	test('with three cards the requested trim falls back to the mean, per criterion too', () => {
		const result = aggregateEntry(rubric, cards.slice(0, 3), 'trimmed-mean');
		expect(result.total.used).toBe('mean');
		expect(result.droppedCardIds).toBeNull();
		expect(result.criteria.arrangement).toMatchObject({ used: 'mean', value: 25 / 3 });
	});
});
