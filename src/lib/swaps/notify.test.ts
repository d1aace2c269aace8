import { describe, expect, test } from 'vitest';
import { DIGEST_GAP_MS, gapPassed, MAIL_GAP_MS, onMessagePosted, planMails, type NotifySetting, type PendingThread } from './notify';

// The batching rule is ours (no source): at most one mail per conversation per hour per
// recipient, and a daily summary at most once a day. These tests replay message sequences.

const t0 = new Date('2031-06-01T10:00:00Z');
const at = (minutes: number) => new Date(t0.getTime() + minutes * 60_000);

/** Plays messages to one recipient through the two decisions, as the server does, and returns when mails went. */
function replay(setting: NotifySetting, messageMinutes: number[], jobEveryMinutes: number, until: number) {
	const mails: number[] = [];
	let lastMail: Date | null = null;
	let pending: number[] = [];
	let lastSummary: Date | null = null;
	const events = [
		...messageMinutes.map((m) => ({ m, kind: 'message' as const })),
		...Array.from({ length: Math.floor(until / jobEveryMinutes) }, (_, i) => ({ m: (i + 1) * jobEveryMinutes, kind: 'job' as const }))
	].sort((a, b) => a.m - b.m || (a.kind === 'message' ? -1 : 1));
	let id = 0;
	for (const e of events) {
		if (e.kind === 'message') {
			const decision = onMessagePosted(setting, lastMail, at(e.m));
			if (decision === 'mail-now') {
				mails.push(e.m);
				lastMail = at(e.m);
			} else if (decision === 'later') pending.push(++id);
		} else {
			const threads: PendingThread[] = [{ threadId: 1, messageIds: pending, lastMailAt: lastMail }];
			for (const mail of planMails(setting, threads, lastSummary, at(e.m))) {
				mails.push(e.m);
				if (mail.kind === 'summary') lastSummary = at(e.m);
				else lastMail = at(e.m);
				pending = [];
			}
		}
	}
	return mails;
}

describe('message mail batching', () => {
	test('gap of one hour', () => {
		expect(MAIL_GAP_MS).toBe(3_600_000);
		expect(gapPassed(null, t0)).toBe(true);
		expect(gapPassed(at(-59), t0)).toBe(false);
		expect(gapPassed(at(-60), t0)).toBe(true);
	});

	test('"immediately": two messages in quick succession give one mail; the second is mailed an hour later', () => {
		expect(onMessagePosted('immediately', null, t0)).toBe('mail-now');
		expect(onMessagePosted('immediately', t0, at(1))).toBe('later');
		expect(replay('immediately', [0, 1], 5, 50)).toEqual([0]);
		expect(replay('immediately', [0, 1], 5, 70)).toEqual([0, 60]);
	});

	test('"immediately": a busy conversation gets at most one mail an hour', () => {
		const messages = Array.from({ length: 40 }, (_, i) => i * 7); // every 7 minutes for 4.5 hours
		const mails = replay('immediately', messages, 5, 295);
		for (let i = 1; i < mails.length; i++) expect(mails[i]! - mails[i - 1]!).toBeGreaterThanOrEqual(60);
		expect(mails).toEqual([0, 60, 120, 180, 240]);
	});

	test('"daily": no mail at posting time; one summary a day at most, covering every conversation', () => {
		expect(DIGEST_GAP_MS).toBe(86_400_000);
		expect(onMessagePosted('daily', null, t0)).toBe('later');
		expect(replay('daily', [0, 1, 2], 5, 30)).toEqual([5]);
		expect(replay('daily', [0, 1, 30], 5, 70)).toEqual([5]);
		expect(replay('daily', [0, 1, 30], 5, 24 * 60 + 10)).toEqual([5, 24 * 60 + 5]);
		const plan = planMails(
			'daily',
			[
				{ threadId: 1, messageIds: [10, 11], lastMailAt: null },
				{ threadId: 2, messageIds: [12], lastMailAt: at(-5) },
				{ threadId: 3, messageIds: [], lastMailAt: null }
			],
			at(-24 * 60 - 1),
			t0
		);
		expect(plan).toEqual([
			{
				kind: 'summary',
				threads: [
					{ threadId: 1, messageIds: [10, 11] },
					{ threadId: 2, messageIds: [12] }
				]
			}
		]);
		expect(planMails('daily', [{ threadId: 1, messageIds: [1], lastMailAt: null }], at(-23 * 60), t0)).toEqual([]);
	});

	test('"off": never', () => {
		expect(onMessagePosted('off', null, t0)).toBe('none');
		expect(planMails('off', [{ threadId: 1, messageIds: [1], lastMailAt: null }], null, t0)).toEqual([]);
	});

	test('"immediately" in the job: only conversations past their gap', () => {
		const plan = planMails(
			'immediately',
			[
				{ threadId: 1, messageIds: [1], lastMailAt: at(-61) },
				{ threadId: 2, messageIds: [2], lastMailAt: at(-10) },
				{ threadId: 3, messageIds: [3, 4], lastMailAt: null }
			],
			null,
			t0
		);
		expect(plan).toEqual([
			{ kind: 'thread', threadId: 1, messageIds: [1] },
			{ kind: 'thread', threadId: 3, messageIds: [3, 4] }
		]);
	});
});
