// A contest's states and the admin actions that move it between them. The dates of the entry
// and judging windows never move a contest on their own: they limit what members and judges may
// do, and when one has passed without the state moving, the admins are reminded.

import { dayOf } from '../dates';
import { validateRubric, type Rubric } from './rubric';

export const CONTEST_STATES = ['draft', 'open', 'judging', 'published', 'archived'] as const;
export type ContestState = (typeof CONTEST_STATES)[number];

export const STATE_LABELS: Record<ContestState, string> = {
	draft: 'In preparation',
	open: 'Taking entries',
	judging: 'Being judged',
	published: 'Results out',
	archived: 'Archived'
};

export const STATE_HINTS: Record<ContestState, string> = {
	draft: 'Only admins see it. Rubric, categories and rules can still change.',
	open: 'Members can enter their tanks. The rubric and categories are fixed.',
	judging: 'Judges score the entries by number; nobody else sees the scores.',
	published: 'Results, names and the judges’ comments for entrants are public; cards are locked.',
	archived: 'Kept for the record; nothing changes any more.'
};

export const TRANSITION_NAMES = ['open-entries', 'start-judging', 'publish', 'archive'] as const;
export type TransitionName = (typeof TRANSITION_NAMES)[number];

export interface Transition {
	name: TransitionName;
	from: ContestState;
	to: ContestState;
	/** The button. */
	label: string;
	/** What happens, shown in the confirmation step before the admin commits. */
	consequences: string[];
}

export const TRANSITIONS: Record<TransitionName, Transition> = {
	'open-entries': {
		name: 'open-entries',
		from: 'draft',
		to: 'open',
		label: 'Open for entries',
		consequences: [
			'Members can enter their tanks from now on, until the entry window closes.',
			'The rubric, the categories, the aggregation method and the entry limit are locked for good.'
		]
	},
	'start-judging': {
		name: 'start-judging',
		from: 'open',
		to: 'judging',
		label: 'Close entries and start judging',
		consequences: [
			'No more entries, changes or withdrawals.',
			'Each entry gets a number drawn at random; judges see entries only by that number.',
			'Assigned judges can start scoring.'
		]
	},
	publish: {
		name: 'publish',
		from: 'judging',
		to: 'published',
		label: 'Publish the results',
		consequences: [
			'Every card is locked; judges can no longer change or reopen them.',
			'Places, scores, entrants’ names and the judges’ comments for entrants become public.',
			'Later corrections are possible only for admins, with a reason, and are shown with the results.'
		]
	},
	archive: {
		name: 'archive',
		from: 'published',
		to: 'archived',
		label: 'Archive',
		consequences: ['The results stay public; no further corrections are possible.']
	}
};

/** What the admin is told once a step is taken: one whole sentence or two per step. */
export const STEP_DONE: Record<TransitionName, string> = {
	'open-entries': 'The contest is open for entries. Members can enter their tanks until the entry window closes.',
	'start-judging': 'Entries are closed and judging has started. Judges score the entries by number; nobody else sees the scores.',
	publish: 'The results are published. Send the announcement from the Announcement tab when you are ready.',
	archive: 'The contest is archived. Its results stay public and nothing changes any more.'
};

/**
 * The message for `?step=<name>` on an admin page, only while the contest is in the state that step
 * leads to (an old address kept in the history says nothing about a later state).
 */
export function stepDoneMessage(step: string | null, state: ContestState): string | null {
	const t = (TRANSITION_NAMES as readonly string[]).includes(step ?? '') ? TRANSITIONS[step as TransitionName] : null;
	return t && t.to === state ? STEP_DONE[t.name] : null;
}

/** The one transition an admin can take from a state, if any. */
export const nextTransition = (state: ContestState): Transition | null => Object.values(TRANSITIONS).find((t) => t.from === state) ?? null;

// ---- Windows -------------------------------------------------------------------------------

/** Calendar days (UTC) 'YYYY-MM-DD'. A window opens at the start of its first day and closes at the end of its last. */
export interface ContestWindows {
	entryOpensOn: string;
	entryClosesOn: string;
	judgingOpensOn: string;
	judgingClosesOn: string;
}

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const DAY_MS = 86_400_000;

export function isCalendarDay(value: string): boolean {
	if (!ISO_DAY.test(value)) return false;
	const d = new Date(`${value}T00:00:00Z`);
	return !Number.isNaN(d.getTime()) && dayOf(d) === value;
}

/** The instant a window day starts (00:00 UTC). */
export const startOfDay = (day: string) => new Date(`${day}T00:00:00Z`);
/** The instant a window's last day ends: 00:00 UTC of the next day, exclusive. */
export const endOfDay = (day: string) => new Date(startOfDay(day).getTime() + DAY_MS);
/** The calendar day `days` after `day` (before it when negative). */
export const addDays = (day: string, days: number) => dayOf(new Date(startOfDay(day).getTime() + days * DAY_MS));

/** Problems with the windows, keyed by field. */
export function validateWindows(w: ContestWindows): Partial<Record<keyof ContestWindows, string>> {
	const errors: Partial<Record<keyof ContestWindows, string>> = {};
	for (const key of ['entryOpensOn', 'entryClosesOn', 'judgingOpensOn', 'judgingClosesOn'] as const) {
		if (!isCalendarDay(w[key])) errors[key] = 'Give a day as YYYY-MM-DD.';
	}
	if (Object.keys(errors).length) return errors;
	if (w.entryClosesOn < w.entryOpensOn) errors.entryClosesOn = 'Entries cannot close before they open.';
	if (w.judgingOpensOn < w.entryClosesOn) errors.judgingOpensOn = 'Judging starts on the last day of entries at the earliest.';
	if (w.judgingClosesOn < w.judgingOpensOn) errors.judgingClosesOn = 'Judging cannot close before it opens.';
	return errors;
}

/** Members may enter, change or withdraw entries: the contest is open and its entry window has not ended. */
export function entriesAccepted(state: ContestState, w: Pick<ContestWindows, 'entryClosesOn'>, now: Date): boolean {
	return state === 'open' && now.getTime() < endOfDay(w.entryClosesOn).getTime();
}

/**
 * A judge may reopen a submitted card: the contest is being judged and its judging window has
 * not ended. (Missing cards can still be written after the window while the contest is being
 * judged, so publication is never blocked by the calendar alone; the admins are reminded instead.)
 */
export function cardsReopenable(state: ContestState, w: Pick<ContestWindows, 'judgingClosesOn'>, now: Date): boolean {
	return state === 'judging' && now.getTime() < endOfDay(w.judgingClosesOn).getTime();
}

// ---- Reminders -----------------------------------------------------------------------------

export type AdminReminderKind = 'open-overdue' | 'entries-overdue' | 'judging-overdue';

export interface AdminReminder {
	kind: AdminReminderKind;
	/** The day that passed. */
	day: string;
	subject: string;
	text: string;
}

/**
 * What the admins should be told about a contest whose window date passed while its state did
 * not move: nothing (null) when the state is where the calendar says it should be.
 */
export function overdueAdminReminder(title: string, state: ContestState, w: ContestWindows, now: Date): AdminReminder | null {
	const t = now.getTime();
	if (state === 'draft' && t >= startOfDay(w.entryOpensOn).getTime()) {
		return {
			kind: 'open-overdue',
			day: w.entryOpensOn,
			subject: `“${title}” was to open for entries`,
			text: `The entry window of “${title}” was to open on ${w.entryOpensOn}, but the contest is still in preparation. Open it for entries, or move the dates.`
		};
	}
	if (state === 'open' && t >= endOfDay(w.entryClosesOn).getTime()) {
		return {
			kind: 'entries-overdue',
			day: w.entryClosesOn,
			subject: `Entries for “${title}” have closed`,
			text: `The entry window of “${title}” ended with ${w.entryClosesOn}. Members can no longer enter, but judging has not started: close entries and start judging, or extend the window.`
		};
	}
	if (state === 'judging' && t >= endOfDay(w.judgingClosesOn).getTime()) {
		return {
			kind: 'judging-overdue',
			day: w.judgingClosesOn,
			subject: `Judging of “${title}” was to close`,
			text: `The judging window of “${title}” ended with ${w.judgingClosesOn}, and the results are not published yet. Check the missing cards and publish, or extend the window.`
		};
	}
	return null;
}

/** Judges with open cards are reminded from this long before the judging window ends. */
export const JUDGE_REMINDER_LEAD_MS = 48 * 60 * 60_000;

export type JudgeReminderKind = 'closing-soon' | 'overdue';

/** Which reminder judges with open cards should get now, if any. */
export function judgeReminderKind(state: ContestState, w: Pick<ContestWindows, 'judgingClosesOn'>, now: Date): JudgeReminderKind | null {
	if (state !== 'judging') return null;
	const end = endOfDay(w.judgingClosesOn).getTime();
	const t = now.getTime();
	if (t >= end) return 'overdue';
	if (t >= end - JUDGE_REMINDER_LEAD_MS) return 'closing-soon';
	return null;
}

// ---- Transition checks ----------------------------------------------------------------------

export interface TransitionContext {
	state: ContestState;
	title: string;
	windows: ContestWindows;
	rubric: Rubric;
	categories: number;
	entries: number;
	judges: number;
	/** From publicationReadiness: every owed card is submitted. */
	judgingComplete: boolean;
	/** The reason an admin gave to publish with cards missing, if any. */
	overrideReason?: string | null;
}

/** The shortest reason an admin may give for a step kept in the log: publishing with cards missing, a correction after publication. */
export const AUDITED_REASON_MIN = 10;

/** Why a transition cannot be taken now; empty when it can. */
export function transitionProblems(name: TransitionName, ctx: TransitionContext): string[] {
	const t = TRANSITIONS[name];
	if (ctx.state !== t.from) return [`The contest is ${STATE_LABELS[ctx.state].toLowerCase()}; this step is taken from “${STATE_LABELS[t.from]}”.`];
	const problems: string[] = [];
	if (name === 'open-entries') {
		if (!ctx.title.trim()) problems.push('Give the contest a title.');
		problems.push(...validateRubric(ctx.rubric).map((p) => p.message));
		if (ctx.categories === 0) problems.push('Add at least one category.');
		const windowErrors = Object.values(validateWindows(ctx.windows));
		if (windowErrors.length) problems.push(`Check the dates: ${windowErrors.join(' ')}`);
	}
	if (name === 'start-judging') {
		if (ctx.entries === 0) problems.push('There are no entries to judge.');
		if (ctx.judges === 0) problems.push('Assign at least one judge first.');
	}
	if (name === 'publish' && !ctx.judgingComplete) {
		const reason = (ctx.overrideReason ?? '').trim();
		if (!reason) problems.push('Some cards are still missing. Wait for them, or publish anyway and give the reason.');
		else if (reason.length < AUDITED_REASON_MIN) problems.push(`Give a reason of at least ${AUDITED_REASON_MIN} characters for publishing with cards missing.`);
	}
	return problems;
}
