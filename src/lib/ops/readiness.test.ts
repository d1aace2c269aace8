import { describe, expect, test } from 'vitest';
import { migrationCheck, summarise, workerCheck, type JournalEntry } from './readiness';

const journal: JournalEntry[] = [
	{ idx: 0, tag: '0000_foundation', when: 1000 },
	{ idx: 1, tag: '0001_jobs', when: 2000 },
	{ idx: 2, tag: '0002_media', when: 3000 }
];

describe('migrationCheck', () => {
	test('current when the newest applied migration is the build’s newest', () => {
		expect(migrationCheck(journal, 3000)).toEqual({ ok: true, detail: '3 applied' });
	});
	test('not ready with migrations pending, naming the first', () => {
		expect(migrationCheck(journal, 1000)).toEqual({ ok: false, detail: '2 migrations not applied (first: 0001_jobs)' });
		expect(migrationCheck(journal, null)).toEqual({ ok: false, detail: '3 migrations not applied (first: 0000_foundation)' });
	});
	test('a database migrated by a newer release stays ready', () => {
		expect(migrationCheck(journal, 4000)).toEqual({ ok: true, detail: 'database has newer migrations than this build' });
	});
});

describe('workerCheck', () => {
	const base = { runsHere: true, startedAt: 0, lastTickAt: null, now: 0, staleAfterMs: 120_000 };
	test('a recent round is fine', () => {
		expect(workerCheck({ ...base, lastTickAt: 50_000, now: 60_000 })).toEqual({ ok: true, detail: 'this instance: last round 10 s ago' });
		expect(workerCheck({ ...base, runsHere: false, startedAt: null, lastTickAt: 50_000, now: 60_000 }).ok).toBe(true);
	});
	test('a worker that just started has until the limit for its first round', () => {
		expect(workerCheck({ ...base, now: 119_000 })).toEqual({ ok: true, detail: 'this instance: starting' });
		expect(workerCheck({ ...base, now: 121_000 })).toEqual({ ok: false, detail: 'this instance: no round recorded' });
	});
	test('a stale round is not ready, here or anywhere', () => {
		expect(workerCheck({ ...base, lastTickAt: 0, now: 200_000 })).toEqual({ ok: false, detail: 'this instance: last round 200 s ago' });
		expect(workerCheck({ ...base, runsHere: false, startedAt: null, now: 5_000 })).toEqual({ ok: false, detail: 'any instance: no round recorded' });
	});
});

test('summarise: ready only when every check is', () => {
	expect(summarise({ a: { ok: true }, b: { ok: true } }).status).toBe('ready');
	expect(summarise({ a: { ok: true }, b: { ok: false, detail: 'x' } }).status).toBe('not-ready');
});
