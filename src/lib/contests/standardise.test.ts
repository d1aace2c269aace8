import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { STANDARDISE_RECOMMENDED_MIN_CARDS, standardiseByJudge, type JudgedTotal } from './standardise';

// Method: AEJMC Research Committee handout "How to Standardize Judges' Scores" — per judge,
// z = (raw score − that judge's mean) / that judge's standard deviation, then average the z-scores
// per paper; it asks for at least five papers per judge. z-scores checked against simple-statistics
// zScore with its (population) standardDeviation.

const card = (judgeId: string, entryId: string, total: number): JudgedTotal => ({ judgeId, entryId, total });

describe('standardiseByJudge', () => {
	test('hand-checked: totals 60, 70, 80 have mean 70, population SD √(200/3), z = ∓1.2247 and 0', () => {
		const result = standardiseByJudge([card('a', 'e1', 60), card('a', 'e2', 70), card('a', 'e3', 80)], 'mean');
		expect(result.judges[0]).toMatchObject({ judgeId: 'a', cards: 3, mean: 70, status: 'ok', fewCards: true });
		expect(result.judges[0]!.standardDeviation).toBeCloseTo(Math.sqrt(200 / 3), 12);
		expect(result.entries.map((e) => e.standardised)).toEqual([expect.closeTo(-Math.sqrt(1.5), 12), expect.closeTo(0, 12), expect.closeTo(Math.sqrt(1.5), 12)]);
	});

	test('a strict and a lenient judge who rank alike give equal standardised scores', () => {
		// Judge "strict" scores e1..e3 at 50, 60, 70; "lenient" scores e4..e6 at 80, 85, 90. Raw means
		// would put all of the lenient judge's entries first; standardised, e1 ties e4, e2 e5, e3 e6.
		const totals = [
			card('strict', 'e1', 50),
			card('strict', 'e2', 60),
			card('strict', 'e3', 70),
			card('lenient', 'e4', 80),
			card('lenient', 'e5', 85),
			card('lenient', 'e6', 90)
		];
		const result = standardiseByJudge(totals, 'mean');
		const z = Object.fromEntries(result.entries.map((e) => [e.entryId, e.standardised!]));
		expect(z.e1).toBeCloseTo(z.e4!, 12);
		expect(z.e2).toBeCloseTo(z.e5!, 12);
		expect(z.e3).toBeCloseTo(z.e6!, 12);
		const raw = Object.fromEntries(result.entries.map((e) => [e.entryId, e.raw.value!]));
		expect(raw.e3).toBeLessThan(raw.e4!); // both shown: the raw aggregate keeps the judges' levels
	});

	test('z-scores agree with simple-statistics zScore and have mean 0, population SD 1 per judge', () => {
		let seed = 3;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		const totals: JudgedTotal[] = [];
		for (const judge of ['p', 'q', 'r', 's']) {
			for (let e = 0; e < 9; e++) if (next() < 0.75) totals.push(card(judge, `e${e}`, Math.round(next() * 200) / 2));
		}
		const result = standardiseByJudge(totals, 'median');
		for (const judge of result.judges.filter((j) => j.status === 'ok')) {
			const mine = result.entries.flatMap((e) => e.cards).filter((c) => c.judgeId === judge.judgeId);
			const values = mine.map((c) => c.total);
			for (const c of mine) expect(c.z).toBeCloseTo(ss.zScore(c.total, ss.mean(values), ss.standardDeviation(values)), 12);
			const zs = mine.map((c) => c.z!);
			expect(ss.mean(zs)).toBeCloseTo(0, 12);
			expect(ss.standardDeviation(zs)).toBeCloseTo(1, 12);
		}
		for (const entry of result.entries) {
			expect(entry.raw.value).toBe(ss.median(entry.cards.map((c) => c.total)));
			const zs = entry.cards.map((c) => c.z).filter((z): z is number => z !== null);
			expect(entry.standardised).toBeCloseTo(ss.mean(zs), 12);
		}
	});

	test('a judge with one card gets no z-score; an entry judged only by such judges has no standardised score', () => {
		const result = standardiseByJudge([card('solo', 'e1', 88), card('a', 'e1', 70), card('a', 'e2', 60), card('solo2', 'e3', 50)], 'mean');
		expect(result.judges.find((j) => j.judgeId === 'solo')).toMatchObject({ status: 'single-card', cards: 1 });
		const e1 = result.entries.find((e) => e.entryId === 'e1')!;
		expect(e1.cards.find((c) => c.judgeId === 'solo')!.z).toBeNull();
		expect(e1.zCount).toBe(1);
		expect(e1.standardised).toBeCloseTo(1, 12); // judge a: 70 vs 60, population SD 5 → z = +1
		expect(e1.raw.value).toBe(79); // raw mean still counts the single card
		expect(result.entries.find((e) => e.entryId === 'e3')).toMatchObject({ standardised: null, zCount: 0 });
	});

	test('a judge who gave every card the same total is reported and counts as z = 0', () => {
		const result = standardiseByJudge([card('flat', 'e1', 75), card('flat', 'e2', 75), card('a', 'e1', 90), card('a', 'e2', 70)], 'mean');
		expect(result.judges.find((j) => j.judgeId === 'flat')).toMatchObject({ status: 'no-spread', standardDeviation: 0 });
		const [e1, e2] = result.entries;
		expect(e1!.cards.find((c) => c.judgeId === 'flat')!.z).toBe(0);
		expect(e1!.standardised).toBeCloseTo(0.5, 12); // (0 + 1) / 2
		expect(e2!.standardised).toBeCloseTo(-0.5, 12);
	});

	test('flags judges with fewer than five cards, as the handout advises', () => {
		expect(STANDARDISE_RECOMMENDED_MIN_CARDS).toBe(5);
		const five = ['e1', 'e2', 'e3', 'e4', 'e5'].map((e, i) => card('a', e, 60 + i));
		expect(standardiseByJudge(five, 'mean').judges[0]!.fewCards).toBe(false);
		expect(standardiseByJudge(five.slice(1), 'mean').judges[0]!.fewCards).toBe(true);
	});

	test('refuses two cards from one judge for one entry', () => {
		expect(() => standardiseByJudge([card('a', 'e1', 60), card('a', 'e1', 70)], 'mean')).toThrow(/two cards/);
	});
});
