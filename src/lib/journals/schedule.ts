// Which logged events reset which upkeep tasks, when each was last done, and the schedule a tank
// starts with. The due dates themselves come from ./calc/maintenance (scheduleTask).
import { SUGGESTED_INTERVALS, dayNumber, isoDay, type MaintenanceTask, type ScheduledTask } from './calc';
import type { EventKind, FilterPart, TaskKind } from './journal-vocabulary';

export interface TaskRule {
	id: number;
	kind: TaskKind;
	filterPart: FilterPart | null;
}

/** What of a logged thing the rules look at: an event, or a water test (kind 'water-test'). */
export interface LoggedUpkeep {
	kind: EventKind | 'water-test';
	on: string;
	filterPart?: FilterPart | null;
	/** Set when the schedule's "done today" logged it for one task. */
	taskId?: number | null;
}

/**
 * Whether a logged event counts as doing a task. An event logged for a task counts for it; besides,
 * an event of the task's kind counts ('other' tasks only by name, through "done today"). A filter
 * task for one part is reset by a clean of that part or of the whole filter; a task for no part
 * by any clean.
 */
export function resets(task: TaskRule, logged: LoggedUpkeep): boolean {
	if (logged.taskId != null && logged.taskId === task.id) return true;
	if (task.kind === 'other' || task.kind !== logged.kind) return false;
	if (task.kind !== 'filter-clean' || task.filterPart === null) return true;
	return logged.filterPart === task.filterPart || logged.filterPart === 'whole';
}

/** The ids of the tasks one logged event resets. */

/**
 * The last day a task was done, from everything logged for the tank (entries may be edited or
 * deleted, so the day is worked out from what remains rather than kept as a running value).
 * Days after `today` (a wrongly dated event) are ignored.
 */
export function lastDoneOn(task: TaskRule, logged: readonly LoggedUpkeep[], today?: string): string | null {
	let latest: number | null = null;
	const limit = today ? dayNumber(today) : Infinity;
	for (const item of logged) {
		if (!resets(task, item)) continue;
		const day = dayNumber(item.on);
		if (day <= limit && (latest === null || day > latest)) latest = day;
	}
	return latest === null ? null : isoDay(latest);
}

/** The task kinds that "done today" records as an event of the same kind (the rest as 'upkeep'). */
export function doneEventKind(kind: TaskKind): EventKind {
	return kind === 'water-test' || kind === 'other' ? 'upkeep' : kind;
}

export interface TaskDraft {
	kind: TaskKind;
	filterPart: FilterPart | null;
	label: string;
	intervalDays: number;
}

/** How each suggestion of ./calc/maintenance is tracked. */
const SUGGESTION_KINDS: Record<string, { kind: TaskKind; filterPart: FilterPart | null; needsCo2?: boolean }> = {
	'Water change': { kind: 'water-change', filterPart: null },
	'Wipe the glass': { kind: 'glass', filterPart: null },
	'Trim plants': { kind: 'trim', filterPart: null },
	'Rinse filter media in tank water': { kind: 'filter-clean', filterPart: 'media' },
	'Check CO2 cylinder and joints for leaks': { kind: 'co2-check', filterPart: null, needsCo2: true }
};

/**
 * The schedule offered to a tank that has none: the calculator's suggested intervals (common
 * practice, no source), without the CO2 check when the tank has no gas cylinder.
 */
export function defaultSchedule(tank: { co2Method: 'none' | 'liquid' | 'pressurised' }): TaskDraft[] {
	return SUGGESTED_INTERVALS.flatMap((s) => {
		const how = SUGGESTION_KINDS[s.label];
		if (!how) throw new Error(`No task kind for the suggestion "${s.label}".`);
		if (how.needsCo2 && tank.co2Method !== 'pressurised') return [];
		return [{ kind: how.kind, filterPart: how.filterPart, label: s.label, intervalDays: s.intervalDays }];
	});
}

/** A stored task in the shape the calculator schedules. */
export function asMaintenanceTask(task: { id: number; tankId: number; label: string; intervalDays: number; lastDoneOn: string | null }): MaintenanceTask {
	return { id: String(task.id), tankId: String(task.tankId), label: task.label, intervalDays: task.intervalDays, lastDoneOn: task.lastDoneOn };
}

/** Tasks overdue, due today or due within `days` days (the dashboard, the digest, a tank's page). */
export const dueWithin = <T extends MaintenanceTask>(scheduled: readonly ScheduledTask<T>[], days: number): ScheduledTask<T>[] =>
	scheduled.filter((s) => s.status.kind !== 'due-in' || s.status.days <= days);

export interface TaskFormRow {
	id: string;
	kind: string;
	filterPart: string;
	label: string;
	intervalDays: string;
}

export const TASK_FIELDS = ['id', 'kind', 'filterPart', 'label', 'intervalDays'] as const;
export const taskFieldName = (index: number, field: (typeof TASK_FIELDS)[number]) => `tasks[${index}][${field}]`;

/** The schedule form's rows, in index order; rows with neither a name nor a kind are skipped. */
export function taskRowsFrom(form: FormData): TaskFormRow[] {
	const indexes = new Set<number>();
	for (const key of form.keys()) {
		const match = /^tasks\[(\d{1,3})\]\[/.exec(key);
		if (match) indexes.add(Number(match[1]));
	}
	return [...indexes]
		.sort((a, b) => a - b)
		.map((i) => Object.fromEntries(TASK_FIELDS.map((f) => [f, String(form.get(taskFieldName(i, f)) ?? '').trim()])) as unknown as TaskFormRow)
		.filter((r) => r.label !== '' || r.kind !== '');
}

export const taskRowOf = (t: TaskDraft & { id?: number }): TaskFormRow => ({
	id: t.id ? String(t.id) : '',
	kind: t.kind,
	filterPart: t.filterPart ?? '',
	label: t.label,
	intervalDays: String(t.intervalDays)
});

/** The longest interval a task may have: a year (our own limit). */
export const MAX_INTERVAL_DAYS = 366;

export function parseScheduleRows(
	rows: TaskFormRow[],
	kinds: readonly TaskKind[],
	parts: readonly FilterPart[]
): { ok: true; tasks: (TaskDraft & { id?: number })[] } | { ok: false; errors: Record<string, string> } {
	const errors: Record<string, string> = {};
	const tasks = rows.map((r, i) => {
		const kind = (kinds as readonly string[]).includes(r.kind) ? (r.kind as TaskKind) : null;
		if (!kind) errors[`tasks.${i}.kind`] = 'Choose what the task is.';
		const filterPart =
			kind === 'filter-clean' && r.filterPart ? ((parts as readonly string[]).includes(r.filterPart) ? (r.filterPart as FilterPart) : null) : null;
		if (kind === 'filter-clean' && r.filterPart && !filterPart) errors[`tasks.${i}.filterPart`] = 'Choose a part of the filter.';
		const label = r.label.trim();
		if (!label) errors[`tasks.${i}.label`] = 'Give the task a name.';
		if (label.length > 80) errors[`tasks.${i}.label`] = 'Keep the name to 80 characters.';
		const interval = Number(r.intervalDays);
		if (!/^\d+$/.test(r.intervalDays) || interval < 1 || interval > MAX_INTERVAL_DAYS)
			errors[`tasks.${i}.intervalDays`] = `Enter a whole number of days from 1 to ${MAX_INTERVAL_DAYS}.`;
		const id = /^[1-9]\d{0,14}$/.test(r.id) ? Number(r.id) : undefined;
		return { id, kind: kind ?? 'other', filterPart, label, intervalDays: interval };
	});
	if (Object.keys(errors).length) return { ok: false, errors };
	return { ok: true, tasks };
}
