import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { computeResults, ordinal, type CardInput, type ResultsInput } from './results';
import type { Rubric } from './rubric';

// A small invented contest worked by hand. Rubric: "Depth" out of 10 with weight 2 and "Finish"
// out of 5 with weight 1, so a card total is (2·depth + finish) / 25 × 100 %.
// Judges j1, j2, j3; j3 entered e3 (a self-entry, so j3 does not judge it); j2 declared a
// conflict on e2.
const rubric: Rubric = [
	{ id: 'depth', label: 'Depth', maxPoints: 10, weight: 2 },
	{ id: 'finish', label: 'Finish', maxPoints: 5, weight: 1 }
];
const card = (cardId: string, judgeId: string, entryId: string, depth: number, finish: number, status: CardInput['status'] = 'submitted'): CardInput => ({
	cardId,
	judgeId,
	entryId,
	status,
	scores: { depth, finish }
});
const base: ResultsInput = {
	rubric,
	tieBreakOrder: ['depth', 'finish'],
	method: 'mean',
	rankBy: 'raw',
	categoryIds: ['c1'],
	entries: [
		{ entryId: 'e1', categoryId: 'c1', entrantId: 'x' },
		{ entryId: 'e2', categoryId: 'c1', entrantId: 'y' },
		{ entryId: 'e3', categoryId: 'c1', entrantId: 'j3' }
	],
	judgeIds: ['j1', 'j2', 'j3'],
	conflicts: [{ entryId: 'e2', judgeId: 'j2' }],
	cards: [
		card('k1', 'j1', 'e1', 8, 4), // 80 %
		card('k2', 'j1', 'e2', 6, 3), // 60 %
		card('k3', 'j1', 'e3', 7, 5), // 76 %
		card('k4', 'j2', 'e1', 9, 4), // 88 %
		card('k5', 'j2', 'e3', 7, 3), // 68 %
		card('k6', 'j3', 'e1', 7, 3), // 68 %
		card('k7', 'j3', 'e2', 7, 4) // 72 %
	]
};

describe('computeResults on a hand-worked contest', () => {
	const report = computeResults(base);
	const cat = report.categories[0]!;
	const byId = (id: string) => cat.entries.find((e) => e.entryId === id)!;

	test('card totals and mean scores', () => {
		expect(byId('e1').cards.map((c) => c.total)).toEqual([80, 88, 68]);
		expect(byId('e1').score).toBeCloseTo((80 + 88 + 68) / 3, 12);
		expect(byId('e2').score).toBeCloseTo(66, 12);
		expect(byId('e3').score).toBeCloseTo(72, 12);
	});
	test('raw places 1, 2, 3 for e1, e3, e2', () => {
		expect(cat.entries.map((e) => [e.entryId, e.place])).toEqual([
			['e1', 1],
			['e3', 2],
			['e2', 3]
		]);
	});
	test('per-judge z-scores match simple-statistics (population SD) and reorder e2 and e3', () => {
		// j1's totals 80, 60, 76; j2's 88, 68; j3's 68, 72.
		const z = (x: number, xs: number[]) => ss.zScore(x, ss.mean(xs), ss.standardDeviation(xs));
		const e2 = (z(60, [80, 60, 76]) + z(72, [68, 72])) / 2;
		const e3 = (z(76, [80, 60, 76]) + z(68, [88, 68])) / 2;
		expect(byId('e2').standardised).toBeCloseTo(e2, 12);
		expect(byId('e3').standardised).toBeCloseTo(e3, 12);
		expect(e2).toBeGreaterThan(e3); // -0.194 against -0.269
		expect(byId('e2').placeStandardised).toBe(2);
		expect(byId('e3').placeStandardised).toBe(3);
		expect(cat.unevenPanel).toBe(true);
	});
	test('ranking by the standardised score when the admin chooses it', () => {
		const z = computeResults({ ...base, rankBy: 'standardised' }).categories[0]!;
		expect(z.entries.map((e) => e.entryId)).toEqual(['e1', 'e2', 'e3']);
		expect(z.entries.map((e) => e.placeRaw)).toEqual([1, 3, 2]);
	});
	test('agreement needs two entries every judge scored: here only e1 is', () => {
		expect(cat.concordance.ok).toBe(false);
		expect(cat.concordance.entryIds).toEqual(['e1']);
		expect(cat.concordance.excludedEntryIds).toEqual(['e2', 'e3']);
	});
	test('ready to publish: every owed card is in', () => {
		expect(report.readiness.ready).toBe(true);
		expect(report.duties.excluded).toEqual([
			{ entryId: 'e2', judgeId: 'j2', reason: 'conflict' },
			{ entryId: 'e3', judgeId: 'j3', reason: 'self-entry' }
		]);
	});
});

describe('what counts', () => {
	test('drafts are missing cards and do not count; a card on a self-entry is ignored', () => {
		const cards = [...base.cards.filter((c) => c.cardId !== 'k7'), card('k7', 'j3', 'e2', 7, 4, 'draft'), card('k8', 'j3', 'e3', 10, 5)];
		const report = computeResults({ ...base, cards });
		expect(report.readiness.ready).toBe(false);
		expect(report.readiness.missing).toEqual([{ entryId: 'e2', judgeId: 'j3', state: 'draft' }]);
		const cat = report.categories[0]!;
		expect(cat.entries.find((e) => e.entryId === 'e2')!.score).toBe(60);
		expect(cat.entries.find((e) => e.entryId === 'e3')!.cards.map((c) => c.cardId)).toEqual(['k3', 'k5']);
	});
	test('cards of a judge taken off the panel are left out', () => {
		const report = computeResults({ ...base, judgeIds: ['j1', 'j2'] });
		expect(report.categories[0]!.entries.find((e) => e.entryId === 'e1')!.cards.map((c) => c.judgeId)).toEqual(['j1', 'j2']);
	});
	test('an entry without a submitted card is listed last without a place', () => {
		const report = computeResults({ ...base, cards: base.cards.filter((c) => c.entryId !== 'e2') });
		const last = report.categories[0]!.entries.at(-1)!;
		expect(last).toMatchObject({ entryId: 'e2', place: null, score: null, aggregate: null });
	});
});

describe('ties', () => {
	// "Balance" and "Growth", both out of 10 with weight 1: (8, 6) and (6, 8) both total 70 %.
	const flat: Rubric = [
		{ id: 'balance', label: 'Balance', maxPoints: 10, weight: 1 },
		{ id: 'growth', label: 'Growth', maxPoints: 10, weight: 1 }
	];
	const input = (tieBreakOrder: string[]): ResultsInput => ({
		rubric: flat,
		tieBreakOrder,
		method: 'mean',
		rankBy: 'raw',
		categoryIds: ['c'],
		entries: ['a', 'b', 'c', 'd'].map((entryId) => ({ entryId, categoryId: 'c', entrantId: `m-${entryId}` })),
		judgeIds: ['j'],
		conflicts: [],
		cards: [
			{ cardId: '1', judgeId: 'j', entryId: 'a', status: 'submitted', scores: { balance: 8, growth: 6 } },
			{ cardId: '2', judgeId: 'j', entryId: 'b', status: 'submitted', scores: { balance: 6, growth: 8 } },
			{ cardId: '3', judgeId: 'j', entryId: 'c', status: 'submitted', scores: { balance: 9, growth: 9 } },
			{ cardId: '4', judgeId: 'j', entryId: 'd', status: 'submitted', scores: { balance: 8, growth: 6 } }
		]
	});
	test('the first criterion of the admin’s order breaks the tie; entries still level share the place (1, 2, 2, 4)', () => {
		const entries = computeResults(input(['balance', 'growth'])).categories[0]!.entries;
		expect(entries.map((e) => [e.entryId, e.place])).toEqual([
			['c', 1],
			['a', 2],
			['d', 2],
			['b', 4]
		]);
		expect(entries.find((e) => e.entryId === 'b')!.separatedFromAbove).toEqual({ entryId: 'd', criterionId: 'balance' });
		expect(entries.find((e) => e.entryId === 'a')!.sharedWith).toEqual(['d']);
	});
	test('another order, another result', () => {
		const entries = computeResults(input(['growth', 'balance'])).categories[0]!.entries;
		expect(entries.map((e) => [e.entryId, e.place])).toEqual([
			['c', 1],
			['b', 2],
			['a', 3],
			['d', 3]
		]);
	});
});

test('ordinals', () => {
	expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 102, 111].map(ordinal)).toEqual([
		'1st',
		'2nd',
		'3rd',
		'4th',
		'11th',
		'12th',
		'13th',
		'21st',
		'22nd',
		'102nd',
		'111th'
	]);
});
