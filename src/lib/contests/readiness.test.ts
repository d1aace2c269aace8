import { describe, expect, test } from 'vitest';
import { judgingDuties, publicationReadiness, type CardStatus } from './readiness';

// Invented panel: judges ana, ben, cai; entries e1 (entered by ben), e2, e3.
const entries = [
	{ entryId: 'e1', entrantId: 'ben' },
	{ entryId: 'e2', entrantId: 'dee' },
	{ entryId: 'e3', entrantId: 'eli' }
];
const judges = ['ana', 'ben', 'cai'];

describe('judgingDuties', () => {
	test('every judge for every entry, except self-entries and declared conflicts', () => {
		const { duties, excluded } = judgingDuties(entries, judges, [{ entryId: 'e3', judgeId: 'cai' }]);
		expect(duties).toEqual([
			{ entryId: 'e1', judgeId: 'ana' },
			{ entryId: 'e1', judgeId: 'cai' },
			{ entryId: 'e2', judgeId: 'ana' },
			{ entryId: 'e2', judgeId: 'ben' },
			{ entryId: 'e2', judgeId: 'cai' },
			{ entryId: 'e3', judgeId: 'ana' },
			{ entryId: 'e3', judgeId: 'ben' }
		]);
		expect(excluded).toEqual([
			{ entryId: 'e1', judgeId: 'ben', reason: 'self-entry' },
			{ entryId: 'e3', judgeId: 'cai', reason: 'conflict' }
		]);
	});
	test('a judge listed twice is one judge', () => {
		expect(judgingDuties(entries.slice(1, 2), ['ana', 'ana'], []).duties).toHaveLength(1);
	});
});

describe('publicationReadiness', () => {
	const { duties } = judgingDuties(entries, judges, [{ entryId: 'e3', judgeId: 'cai' }]);
	const ids = entries.map((e) => e.entryId);
	const all = (state: CardStatus['state']): CardStatus[] => duties.map((a) => ({ ...a, state }));

	test('ready when every assigned card is submitted', () => {
		const r = publicationReadiness(ids, duties, all('submitted'));
		expect(r.ready).toBe(true);
		expect(r.missing).toEqual([]);
		expect(r.overall).toEqual({ expected: 7, submitted: 7, draft: 0, empty: 0, conflicted: 0 });
	});

	test('lists drafts and cards never started as missing, and counts them per judge and entry', () => {
		const cards: CardStatus[] = [
			{ entryId: 'e1', judgeId: 'ana', state: 'submitted' },
			{ entryId: 'e1', judgeId: 'cai', state: 'draft' },
			{ entryId: 'e2', judgeId: 'ana', state: 'submitted' },
			{ entryId: 'e2', judgeId: 'ben', state: 'submitted' },
			{ entryId: 'e2', judgeId: 'cai', state: 'conflicted' }, // declared on the card
			{ entryId: 'e3', judgeId: 'ana', state: 'empty' }
			// e3 × ben: no card row at all
		];
		const r = publicationReadiness(ids, duties, cards);
		expect(r.ready).toBe(false);
		expect(r.missing).toEqual([
			{ entryId: 'e1', judgeId: 'cai', state: 'draft' },
			{ entryId: 'e3', judgeId: 'ana', state: 'empty' },
			{ entryId: 'e3', judgeId: 'ben', state: 'empty' }
		]);
		expect(r.overall).toEqual({ expected: 6, submitted: 3, draft: 1, empty: 2, conflicted: 1 });
		expect(r.byJudge).toEqual([
			{ judgeId: 'ana', expected: 3, submitted: 2, draft: 0, empty: 1, conflicted: 0 },
			{ judgeId: 'ben', expected: 2, submitted: 1, draft: 0, empty: 1, conflicted: 0 },
			{ judgeId: 'cai', expected: 1, submitted: 0, draft: 1, empty: 0, conflicted: 1 }
		]);
		expect(r.byEntry.find((e) => e.entryId === 'e2')).toEqual({ entryId: 'e2', expected: 2, submitted: 2, draft: 0, empty: 0, conflicted: 1 });
	});

	test('an entry no judge may score blocks publication', () => {
		const { duties: few } = judgingDuties(entries, ['ben'], [{ entryId: 'e2', judgeId: 'ben' }]);
		const r = publicationReadiness(
			ids,
			few,
			few.map((a) => ({ ...a, state: 'submitted' as const }))
		);
		expect(r.missing).toEqual([]);
		expect(r.unjudgeableEntryIds).toEqual(['e1', 'e2']); // e1 is ben's own, e2 a conflict
		expect(r.ready).toBe(false);
	});

	test('an entry whose only judge declared a conflict on the card is unjudgeable too', () => {
		const only = [{ entryId: 'e2', judgeId: 'ana' }];
		const r = publicationReadiness(['e2'], only, [{ entryId: 'e2', judgeId: 'ana', state: 'conflicted' }]);
		expect(r).toMatchObject({ ready: false, unjudgeableEntryIds: ['e2'], missing: [] });
	});

	test('cards outside the duties are reported and do not count', () => {
		const cards = [...all('submitted'), { entryId: 'e1', judgeId: 'ben', state: 'submitted' as const }];
		const r = publicationReadiness(ids, duties, cards);
		expect(r.ready).toBe(true);
		expect(r.overall.submitted).toBe(7);
		expect(r.unexpectedCards).toEqual([{ entryId: 'e1', judgeId: 'ben', state: 'submitted' }]);
	});

	test('nothing to publish without entries', () => {
		expect(publicationReadiness([], [], []).ready).toBe(false);
	});
});
