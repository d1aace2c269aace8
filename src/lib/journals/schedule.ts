// Which logged events reset which upkeep tasks, and the schedule a tank starts with. The due
// dates themselves come from ./calc/maintenance (scheduleTask, logTask).
import { SUGGESTED_INTERVALS, dayNumber, isoDay, type MaintenanceTask } from './calc';
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
export const tasksResetBy = <T extends TaskRule>(tasks: readonly T[], logged: LoggedUpkeep): T[] => tasks.filter((t) => resets(t, logged));

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
