import { describe, expect, test } from 'vitest';
import {
	cardsReopenable,
	endOfDay,
	entriesAccepted,
	isCalendarDay,
	judgeReminderKind,
	nextTransition,
	overdueAdminReminder,
	stepDoneMessage,
	transitionProblems,
	validateWindows,
	type ContestWindows,
	type TransitionContext
} from './lifecycle';

// Invented contest calendar; the instants are worked out by hand from the rule "a window opens at
// 00:00 UTC of its first day and closes at 00:00 UTC after its last day".
const windows: ContestWindows = { entryOpensOn: '2026-03-01', entryClosesOn: '2026-03-31', judgingOpensOn: '2026-04-01', judgingClosesOn: '2026-04-14' };
const at = (iso: string) => new Date(iso);

describe('windows', () => {
	test('calendar days are checked for existence, not only shape', () => {
		expect(isCalendarDay('2026-02-28')).toBe(true);
		expect(isCalendarDay('2026-02-29')).toBe(false); // 2026 is not a leap year
		expect(isCalendarDay('2028-02-29')).toBe(true);
		expect(isCalendarDay('2026-3-1')).toBe(false);
	});
	test('a window day ends at midnight UTC after it', () => {
		expect(endOfDay('2026-03-31').toISOString()).toBe('2026-04-01T00:00:00.000Z');
	});
	test('order of the four days', () => {
		expect(validateWindows(windows)).toEqual({});
		expect(validateWindows({ ...windows, entryClosesOn: '2026-02-20' })).toHaveProperty('entryClosesOn');
		expect(validateWindows({ ...windows, judgingOpensOn: '2026-03-30' })).toHaveProperty('judgingOpensOn');
		expect(validateWindows({ ...windows, judgingOpensOn: '2026-03-31' })).toEqual({}); // same last day is allowed
		expect(validateWindows({ ...windows, judgingClosesOn: '2026-03-31' })).toHaveProperty('judgingClosesOn');
		expect(validateWindows({ ...windows, entryOpensOn: 'soon' })).toEqual({ entryOpensOn: 'Give a day as YYYY-MM-DD.' });
	});
	test('entries are taken while open and until the last entry day is over', () => {
		expect(entriesAccepted('open', windows, at('2026-03-31T23:59:59.999Z'))).toBe(true);
		expect(entriesAccepted('open', windows, at('2026-04-01T00:00:00.000Z'))).toBe(false);
		expect(entriesAccepted('draft', windows, at('2026-03-10T12:00:00Z'))).toBe(false);
		expect(entriesAccepted('judging', windows, at('2026-03-10T12:00:00Z'))).toBe(false);
		// The state authorises: an admin who opened early lets members enter before the planned day.
		expect(entriesAccepted('open', windows, at('2026-02-20T12:00:00Z'))).toBe(true);
	});
	test('submitted cards reopen only while judging and before the judging window ends', () => {
		expect(cardsReopenable('judging', windows, at('2026-04-14T20:00:00Z'))).toBe(true);
		expect(cardsReopenable('judging', windows, at('2026-04-15T00:00:00Z'))).toBe(false);
		expect(cardsReopenable('published', windows, at('2026-04-10T00:00:00Z'))).toBe(false);
	});
});

describe('reminders', () => {
	test('admins are told when a date passed and the state did not move', () => {
		expect(overdueAdminReminder('Spring', 'draft', windows, at('2026-02-28T23:00:00Z'))).toBeNull();
		expect(overdueAdminReminder('Spring', 'draft', windows, at('2026-03-01T00:00:00Z'))?.kind).toBe('open-overdue');
		expect(overdueAdminReminder('Spring', 'open', windows, at('2026-03-31T12:00:00Z'))).toBeNull();
		const closed = overdueAdminReminder('Spring', 'open', windows, at('2026-04-01T08:00:00Z'));
		expect(closed).toMatchObject({ kind: 'entries-overdue', day: '2026-03-31' });
		expect(closed!.text).toContain('start judging');
		expect(overdueAdminReminder('Spring', 'judging', windows, at('2026-04-15T00:00:00Z'))?.kind).toBe('judging-overdue');
		expect(overdueAdminReminder('Spring', 'published', windows, at('2026-09-01T00:00:00Z'))).toBeNull();
	});
	test('judges are reminded from 48 hours before judging closes, and after it if still open', () => {
		expect(judgeReminderKind('judging', windows, at('2026-04-12T23:59:59Z'))).toBeNull();
		expect(judgeReminderKind('judging', windows, at('2026-04-13T00:00:00Z'))).toBe('closing-soon');
		expect(judgeReminderKind('judging', windows, at('2026-04-15T00:00:00Z'))).toBe('overdue');
		expect(judgeReminderKind('open', windows, at('2026-04-13T10:00:00Z'))).toBeNull();
	});
});

describe('transitions', () => {
	const ctx: TransitionContext = {
		state: 'draft',
		title: 'Spring',
		windows,
		rubric: [{ id: '1', label: 'Depth', maxPoints: 10, weight: 1 }],
		categories: 1,
		entries: 0,
		judges: 0,
		judgingComplete: false
	};
	test('one way forward from each state, none from archived', () => {
		expect(nextTransition('draft')?.name).toBe('open-entries');
		expect(nextTransition('open')?.name).toBe('start-judging');
		expect(nextTransition('judging')?.name).toBe('publish');
		expect(nextTransition('published')?.name).toBe('archive');
		expect(nextTransition('archived')).toBeNull();
	});
	test('opening needs a valid rubric, a category and sound dates', () => {
		expect(transitionProblems('open-entries', ctx)).toEqual([]);
		expect(transitionProblems('open-entries', { ...ctx, rubric: [] })).toContain('Add at least one criterion.');
		expect(transitionProblems('open-entries', { ...ctx, categories: 0 })).toContain('Add at least one category.');
		expect(transitionProblems('open-entries', { ...ctx, windows: { ...windows, judgingClosesOn: '2026-01-01' } })[0]).toMatch(/^Check the dates/);
		expect(transitionProblems('start-judging', ctx)[0]).toMatch(/taken from “Taking entries”/);
	});
	test('judging needs entries and a judge', () => {
		const open = { ...ctx, state: 'open' as const };
		expect(transitionProblems('start-judging', open)).toEqual(['There are no entries to judge.', 'Assign at least one judge first.']);
		expect(transitionProblems('start-judging', { ...open, entries: 3, judges: 2 })).toEqual([]);
	});
	test('publishing with cards missing needs a reason of some length', () => {
		const judging = { ...ctx, state: 'judging' as const };
		expect(transitionProblems('publish', judging)[0]).toMatch(/cards are still missing/);
		expect(transitionProblems('publish', { ...judging, overrideReason: 'ill' })[0]).toMatch(/at least 10 characters/);
		expect(transitionProblems('publish', { ...judging, overrideReason: 'Judge withdrew through illness' })).toEqual([]);
		expect(transitionProblems('publish', { ...judging, judgingComplete: true })).toEqual([]);
	});
	test('a step is reported in its own sentence, only while the contest is in the state it led to', () => {
		expect(stepDoneMessage('start-judging', 'judging')).toBe(
			'Entries are closed and judging has started. Judges score the entries by number; nobody else sees the scores.'
		);
		expect(stepDoneMessage('open-entries', 'open')).toMatch(/^The contest is open for entries\./);
		expect(stepDoneMessage('open-entries', 'judging')).toBeNull();
		expect(stepDoneMessage('toString', 'open')).toBeNull();
		expect(stepDoneMessage(null, 'open')).toBeNull();
	});
});
