// Maintenance schedule. Each task repeats every so many days from when it was last done, so the
// list across a member's tanks can say what is due, and logging a task starts its interval again.

import { type DayInput, dayNumber, isoDay } from './age';
import { CalcInputError } from './validate';

export interface MaintenanceTask {
	id: string;
	tankId: string;
	label: string;
	intervalDays: number;
	/** The day last done, or null if never logged. */
	lastDoneOn: DayInput | null;
}

export type DueStatus = { kind: 'due-in'; days: number } | { kind: 'due-today' } | { kind: 'overdue'; days: number };

export interface ScheduledTask<T extends MaintenanceTask = MaintenanceTask> {
	task: T;
	/** 'YYYY-MM-DD' (the keeper's calendar day). */
	nextDueOn: string;
	status: DueStatus;
	statusLabel: string;
}

const plural = (n: number) => `${n} day${n === 1 ? '' : 's'}`;

export function describeDueStatus(status: DueStatus): string {
	switch (status.kind) {
		case 'due-today':
			return 'due today';
		case 'due-in':
			return status.days === 1 ? 'due tomorrow' : `due in ${plural(status.days)}`;
		case 'overdue':
			return `overdue by ${plural(status.days)}`;
	}
}

function checkInterval(task: MaintenanceTask): number {
	if (!Number.isInteger(task.intervalDays) || task.intervalDays < 1) {
		throw new CalcInputError('interval (days)', `the interval of "${task.label}" must be a whole number of days, at least 1 (got ${task.intervalDays})`);
	}
	return task.intervalDays;
}

/**
 * Next due day and status on `today` (the keeper's day, as YYYY-MM-DD from $lib/dates; a Date
 * counts as its UTC day). A task never logged is due today: the keeper has asked to be reminded
 * of it, and today is the first day it can be done.
 */
export function scheduleTask<T extends MaintenanceTask>(task: T, todayIs: DayInput): ScheduledTask<T> {
	const interval = checkInterval(task);
	const today = dayNumber(todayIs, 'today');
	const due = task.lastDoneOn === null ? today : dayNumber(task.lastDoneOn, 'last done') + interval;
	const delta = due - today;
	const status: DueStatus = delta > 0 ? { kind: 'due-in', days: delta } : delta === 0 ? { kind: 'due-today' } : { kind: 'overdue', days: -delta };
	return { task, nextDueOn: isoDay(due), status, statusLabel: describeDueStatus(status) };
}

/** Tasks of all tanks, the most overdue first; ties by tank then task name, so the order is stable. */
export function scheduleAll<T extends MaintenanceTask>(tasks: readonly T[], today: DayInput): ScheduledTask<T>[] {
	return tasks
		.map((task) => scheduleTask(task, today))
		.sort(
			(a, b) =>
				a.nextDueOn.localeCompare(b.nextDueOn) ||
				a.task.tankId.localeCompare(b.task.tankId) ||
				a.task.label.localeCompare(b.task.label, 'en') ||
				a.task.id.localeCompare(b.task.id)
		);
}

/** Starting intervals a member can pick from (common practice, no source), in days. */
export const SUGGESTED_INTERVALS: readonly { label: string; intervalDays: number }[] = [
	{ label: 'Water change', intervalDays: 7 },
	{ label: 'Wipe the glass', intervalDays: 7 },
	{ label: 'Trim plants', intervalDays: 14 },
	{ label: 'Rinse filter media in tank water', intervalDays: 30 },
	{ label: 'Check CO2 cylinder and joints for leaks', intervalDays: 30 }
];
