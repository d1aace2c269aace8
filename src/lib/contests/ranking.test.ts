import jStat from 'jstat';
import { describe, expect, test } from 'vitest';
import { comparableScore, placesForGroups, rankCategory, SCORE_DECIMALS, type RankableEntry, type RankingStyle } from './ranking';

/** Places of plain scores in input order, ranked by rankCategory without tie-breaks. */
function rankValues(scores: readonly number[], style: RankingStyle, decimals?: number): (number | null)[] {
	const id = (i: number) => String(i).padStart(3, '0');
	const ranked = rankCategory(
		scores.map((score, i) => ({ entryId: id(i), score, criteria: {} })),
		[],
		{ style, ...(decimals === undefined ? {} : { decimals }) }
	);
	const place = new Map(ranked.map((r) => [r.entryId, r.place]));
	return scores.map((_, i) => place.get(id(i)) ?? null);
}

describe('ranking styles', () => {
	// "Ranking" article of a general encyclopaedia (Wikipedia): A ranks ahead of B and C, which
	// compare equal, and both rank ahead of D — competition "1224", modified competition "1334",
	// dense "1223", fractional "1 2.5 2.5 4".
	const scores = [90, 80, 80, 70];
	test('standard competition ranking "1224"', () => expect(rankValues(scores, 'competition')).toEqual([1, 2, 2, 4]));
	test('modified competition ranking "1334"', () => expect(rankValues(scores, 'modified-competition')).toEqual([1, 3, 3, 4]));
	test('dense ranking "1223"', () => expect(rankValues(scores, 'dense')).toEqual([1, 2, 2, 3]));
	test('fractional ranking "1 2.5 2.5 4"', () => expect(rankValues(scores, 'fractional')).toEqual([1, 2.5, 2.5, 4]));

	test('fractional ranks are average ranks: agree with jstat.rank (1 = lowest) on reversed values', () => {
		let seed = 9;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		for (let trial = 0; trial < 100; trial++) {
			const values = Array.from({ length: 1 + Math.floor(next() * 15) }, () => Math.floor(next() * 8) * 5);
			expect(rankValues(values, 'fractional')).toEqual(jStat.rank(values.map((v) => -v)));
		}
	});

	test('groups of three and two', () => {
		expect(placesForGroups([1, 3, 2, 1], 'competition')).toEqual([1, 2, 5, 7]);
		expect(placesForGroups([1, 3, 2, 1], 'modified-competition')).toEqual([1, 4, 6, 7]);
		expect(placesForGroups([1, 3, 2, 1], 'dense')).toEqual([1, 2, 3, 4]);
		expect(placesForGroups([1, 3, 2, 1], 'fractional')).toEqual([1, 3, 5.5, 7]);
	});

	test('floating-point noise does not split a tie, a real difference does', () => {
		expect(0.1 + 0.2).not.toBe(0.3);
		expect(rankValues([0.1 + 0.2, 0.3], 'competition')).toEqual([1, 1]);
		expect(rankValues([(43 / 55) * 100, (86 / 110) * 100], 'competition')).toEqual([1, 1]);
		expect(rankValues([80.000001, 80], 'competition')).toEqual([1, 2]);
		expect(SCORE_DECIMALS).toBe(9);
		expect(comparableScore(-1e-12)).toBe(0);
		expect(Object.is(comparableScore(-1e-12), -0)).toBe(false);
	});

	test('ranking at display precision when asked', () => {
		expect(rankValues([85.004, 84.996], 'competition', 2)).toEqual([1, 1]);
		expect(rankValues([85.004, 84.996], 'competition')).toEqual([1, 2]);
	});
});

describe('rankCategory', () => {
	const entry = (entryId: string, score: number | null, criteria: Record<string, number | null> = {}): RankableEntry => ({ entryId, score, criteria });
	const order = ['arrangement', 'condition'];

	test('ties on score are broken by the criteria in the admin’s order, then shared (competition style)', () => {
		const ranked = rankCategory(
			[
				entry('e-low', 60, { arrangement: 9, condition: 9 }),
				entry('e-b', 80, { arrangement: 7, condition: 6 }),
				entry('e-a', 80, { arrangement: 8, condition: 2 }),
				entry('e-c', 80, { arrangement: 7, condition: 6 }),
				entry('e-d', 80, { arrangement: 7, condition: 4 }),
				entry('e-top', 95, { arrangement: 1, condition: 1 })
			],
			order
		);
		expect(ranked.map((r) => [r.entryId, r.place])).toEqual([
			['e-top', 1],
			['e-a', 2], // best arrangement among the 80s
			['e-b', 3], // b and c equal on both criteria: they share 3rd
			['e-c', 3],
			['e-d', 5], // competition ranking skips 4th
			['e-low', 6]
		]);
		const by = Object.fromEntries(ranked.map((r) => [r.entryId, r]));
		expect(by['e-b']!.sharedWith).toEqual(['e-c']);
		expect(by['e-a']!.levelOnScoreWith).toEqual(['e-b', 'e-c', 'e-d']);
		expect(by['e-a']!.separatedFromAbove).toBeNull(); // e-top is above on score alone
		expect(by['e-b']!.separatedFromAbove).toEqual({ entryId: 'e-a', criterionId: 'arrangement' });
		expect(by['e-c']!.separatedFromAbove).toBeNull(); // shares the place with e-b
		expect(by['e-d']!.separatedFromAbove).toEqual({ entryId: 'e-c', criterionId: 'condition' });
	});

	test('other styles over the same tie groups', () => {
		const entries = [entry('a', 90), entry('b', 80), entry('c', 80), entry('d', 70)];
		expect(rankCategory(entries, [], { style: 'dense' }).map((r) => r.place)).toEqual([1, 2, 2, 3]);
		expect(rankCategory(entries, [], { style: 'modified-competition' }).map((r) => r.place)).toEqual([1, 3, 3, 4]);
		expect(rankCategory(entries, [], { style: 'fractional' }).map((r) => r.place)).toEqual([1, 2.5, 2.5, 4]);
	});

	test('a missing criterion score counts below any score; unscored entries come last without a place', () => {
		const ranked = rankCategory(
			[entry('z-none', null), entry('b', 70, { arrangement: null }), entry('a', 70, { arrangement: 0 }), entry('y-none', null)],
			order
		);
		expect(ranked.map((r) => [r.entryId, r.place])).toEqual([
			['a', 1],
			['b', 2],
			['y-none', null],
			['z-none', null]
		]);
	});

	test('the input order does not change the result', () => {
		const entries = [entry('a', 70, { arrangement: 5 }), entry('b', 70, { arrangement: 5 }), entry('c', 71), entry('d', 70, { arrangement: 6 })];
		expect(rankCategory([...entries].reverse(), order)).toEqual(rankCategory(entries, order));
	});
});
