import jStat from 'jstat';
import { describe, expect, test } from 'vitest';
import { averageRanks, concordanceForCategory, kendallW, tieTerm } from './concordance';
import type { JudgedTotal } from './standardise';

/**
 * Friedman's statistic by its own textbook formula, χ²_r = 12/(m·n(n+1)) ΣRⱼ² − 3m(n+1), with the
 * usual tie correction (divide by 1 − Σ(t³ − t)/(m(n³ − n))), written independently of kendallW.
 * No general-purpose npm statistics library with a Friedman test was found (simple-statistics,
 * jstat and @stdlib/stats have none), so this is the independent computation.
 */
function friedman(table: number[][]): number {
	const m = table.length;
	const n = table[0]!.length;
	const ranks = table.map((row) => jStat.rank(row));
	const sums = Array.from({ length: n }, (_, i) => ranks.reduce((acc, r) => acc + r[i]!, 0));
	const chi = (12 / (m * n * (n + 1))) * sums.reduce((a, r) => a + r * r, 0) - 3 * m * (n + 1);
	let ties = 0;
	for (const row of table) {
		const counts = new Map<number, number>();
		row.forEach((v) => counts.set(v, (counts.get(v) ?? 0) + 1));
		counts.forEach((t) => (ties += t ** 3 - t));
	}
	return chi / (1 - ties / (m * (n ** 3 - n)));
}

describe('averageRanks and ties', () => {
	test('agree with jstat.rank on random data with ties', () => {
		let seed = 21;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		for (let trial = 0; trial < 100; trial++) {
			const values = Array.from({ length: 1 + Math.floor(next() * 12) }, () => Math.floor(next() * 6));
			expect(averageRanks(values)).toEqual(jStat.rank(values));
			expect(averageRanks(values, 'descending')).toEqual(jStat.rank(values.map((v) => -v)));
		}
	});
	test('tie term Σ(t³ − t): a pair gives 6, a triple 24', () => {
		expect(tieTerm([1, 2, 3])).toBe(0);
		expect(tieTerm([5, 5, 7, 7, 7])).toBe(6 + 24);
	});
});

describe('kendallW', () => {
	test('published example: NAG Library routine G08DAF example program (3 comparisons of 10 objects, with ties) gives W = 0.828, significance 0.008', () => {
		const table = [
			[1.0, 4.5, 2.0, 4.5, 3.0, 7.5, 6.0, 9.0, 7.5, 10.0],
			[2.5, 1.0, 2.5, 4.5, 4.5, 8.0, 9.0, 6.5, 10.0, 6.5],
			[2.0, 1.0, 4.5, 4.5, 4.5, 4.5, 8.0, 8.0, 8.0, 10.0]
		];
		const result = kendallW(table);
		expect(result.m).toBe(3);
		expect(result.n).toBe(10);
		// NAG applies the tie correction; its printed value is rounded to three decimals.
		expect(result.wTieCorrected!).toBeCloseTo(0.828, 3);
		expect(result.w).toBeLessThan(result.wTieCorrected!);
		// Its significance is the χ² approximation with n − 1 degrees of freedom of m(n − 1)W:
		const p = 1 - jStat.chisquare.cdf(result.friedmanChiSquare!, result.degreesOfFreedom);
		expect(p).toBeCloseTo(0.008, 3);
		// And the identity W = χ²_Friedman / (m(n − 1)) against the independent Friedman computation:
		expect(result.wTieCorrected!).toBeCloseTo(friedman(table) / (3 * 9), 12);
	});

	test('Siegel (1956) executives example, 3 judges × 6 applicants without ties: Rⱼ = 8, 14, 11, 11, 11, 8, S = 25.5, W ≈ 0.16 (data and value from memory)', () => {
		// Rank 1 = best here; kendallW ranks the highest score first, so pass 7 − rank as a score.
		const ranks = [
			[1, 6, 3, 2, 5, 4],
			[1, 5, 6, 4, 2, 3],
			[6, 3, 2, 5, 4, 1]
		];
		const result = kendallW(ranks.map((row) => row.map((r) => 7 - r)));
		expect(result.rankSums).toEqual([8, 14, 11, 11, 11, 8]);
		expect(result.s).toBe(25.5);
		expect(result.w).toBeCloseTo(0.16, 2);
		expect(result.w).toBeCloseTo((12 * 25.5) / (9 * (216 - 6)), 12);
		expect(result.wTieCorrected).toBe(result.w); // no ties, no correction
	});

	test('hand-checkable: identical orders give 1, two judges in reverse give 0', () => {
		expect(
			kendallW([
				[90, 80, 70],
				[60, 55, 50],
				[9, 8, 7]
			]).w
		).toBe(1);
		const reversed = kendallW([
			[90, 80, 70],
			[70, 80, 90]
		]);
		expect(reversed.rankSums).toEqual([4, 4, 4]);
		expect(reversed.w).toBe(0);
	});

	test('hand-checkable with a tie: judges give (3, 2, 1), (3, 1.5, 1.5) as ranks', () => {
		// Judge 1 scores 90, 80, 70 → ranks 1, 2, 3. Judge 2 scores 90, 60, 60 → ranks 1, 2.5, 2.5.
		// Rⱼ = 2, 4.5, 5.5; mean m(n+1)/2 = 4; S = 4 + 0.25 + 2.25 = 6.5. Σ(t³ − t) = 6.
		// W = 12·6.5 / (4·24) = 0.8125; corrected W = 78 / (96 − 2·6) = 78/84.
		const result = kendallW([
			[90, 80, 70],
			[90, 60, 60]
		]);
		expect(result.rankSums).toEqual([2, 4.5, 5.5]);
		expect(result.s).toBe(6.5);
		expect(result.tieSum).toBe(6);
		expect(result.w).toBeCloseTo(0.8125, 12);
		expect(result.wTieCorrected).toBeCloseTo(78 / 84, 12);
	});

	test('W = χ²_Friedman / (m(n − 1)) on random tables with ties', () => {
		let seed = 13;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		for (let trial = 0; trial < 200; trial++) {
			const m = 2 + Math.floor(next() * 5);
			const n = 2 + Math.floor(next() * 8);
			const table = Array.from({ length: m }, () => Array.from({ length: n }, () => Math.floor(next() * 5)));
			const result = kendallW(table);
			if (result.wTieCorrected === null) continue;
			expect(result.wTieCorrected).toBeCloseTo(friedman(table) / (m * (n - 1)), 9);
			expect(result.w).toBeGreaterThanOrEqual(-1e-12);
			expect(result.wTieCorrected).toBeLessThanOrEqual(1 + 1e-12);
		}
	});

	test('every judge tying every entry leaves the corrected W undefined', () => {
		const result = kendallW([
			[5, 5, 5],
			[7, 7, 7]
		]);
		expect(result.w).toBe(0);
		expect(result.wTieCorrected).toBeNull();
		expect(result.friedmanChiSquare).toBeNull();
	});

	test('refuses incomplete tables', () => {
		expect(() => kendallW([[1, 2, 3]])).toThrow(RangeError);
		expect(() => kendallW([[1], [2]])).toThrow(RangeError);
		expect(() =>
			kendallW([
				[1, 2],
				[1, 2, 3]
			])
		).toThrow(RangeError);
	});
});

describe('concordanceForCategory', () => {
	const card = (judgeId: string, entryId: string, total: number): JudgedTotal => ({ judgeId, entryId, total });

	test('uses only the entries every judge scored and says which were left out', () => {
		const cards = [
			card('j1', 'e1', 90),
			card('j1', 'e2', 80),
			card('j1', 'e3', 70),
			card('j2', 'e1', 88),
			card('j2', 'e2', 79),
			card('j2', 'e3', 75),
			card('j3', 'e1', 85),
			card('j3', 'e2', 60)
			// j3 has a conflict with e3
		];
		const result = concordanceForCategory(cards);
		expect(result.ok).toBe(true);
		if (!result.ok) return;
		expect(result.judgeIds).toEqual(['j1', 'j2', 'j3']);
		expect(result.entryIds).toEqual(['e1', 'e2']);
		expect(result.excludedEntryIds).toEqual(['e3']);
		expect(result.w).toBe(1);
	});

	test('card totals that differ only by floating-point noise count as tied', () => {
		const result = concordanceForCategory([card('j1', 'e1', 0.1 + 0.2), card('j1', 'e2', 0.3), card('j2', 'e1', 1), card('j2', 'e2', 2)]);
		expect(result.ok && result.tieSum).toBe(6);
	});

	test('null with a reason when fewer than two judges or two common entries remain', () => {
		const one = concordanceForCategory([card('j1', 'e1', 90), card('j1', 'e2', 80)]);
		expect(one).toMatchObject({ ok: false, reason: 'too-few-judges', judgeIds: ['j1'] });
		const apart = concordanceForCategory([card('j1', 'e1', 90), card('j1', 'e2', 80), card('j2', 'e2', 70), card('j2', 'e3', 60)]);
		expect(apart).toMatchObject({
			ok: false,
			reason: 'too-few-common-entries',
			entryIds: ['e2'],
			excludedEntryIds: ['e1', 'e3'],
			message: 'Agreement needs at least two entries scored by all 2 judges; only one is.'
		});
	});

	test('a category without submitted cards has nothing to compare, whatever the panel', () => {
		expect(concordanceForCategory([])).toMatchObject({ ok: false, reason: 'no-cards', entryIds: [] });
		expect(concordanceForCategory([], ['j1', 'j2'])).toMatchObject({ ok: false, reason: 'no-cards' });
	});

	test('an explicit judge set that includes a judge without cards leaves no common entries', () => {
		const result = concordanceForCategory([card('j1', 'e1', 90), card('j1', 'e2', 80), card('j2', 'e1', 70), card('j2', 'e2', 60)], ['j1', 'j2', 'j9']);
		expect(result).toMatchObject({ ok: false, reason: 'too-few-common-entries', entryIds: [] });
	});
});
