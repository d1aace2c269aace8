// The upkeep schedule of each tank: its tasks, when each was last done (worked out from the
// events and tests logged), what is due across a member's tanks, and "done today".
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import { invalid, notFound } from '../../errors';
import { today } from '../../dates';
import { zoneOf } from '../../club/viewer';
import { SALTS, roundTo, scheduleAll, type MaintenanceTask, type SaltId, type ScheduledTask } from '../../journals/calc';
import { asMaintenanceTask, doneEventKind, lastDoneOn, type LoggedUpkeep, type TaskDraft } from '../../journals/schedule';
import { journalEvents, maintenanceTasks, tanks as tankTable, waterTests, type TaskRow } from './schema';
import * as tanks from './tanks';

export type { TaskRow };

/** Most tasks one tank's schedule holds. */
export const SCHEDULE_MAX = 20;

/** The tasks of a tank's schedule, in the keeper's order. */
export async function listForTank(tankId: number, context: Context = {}): Promise<TaskRow[]> {
	return resolve(context)
		.db.select()
		.from(maintenanceTasks)
		.where(eq(maintenanceTasks.tankId, tankId))
		.orderBy(asc(maintenanceTasks.position), asc(maintenanceTasks.id));
}

/** The top-ups logged for a tank (day and litres), for the evaporation estimate of away care. */
export async function topUpsOf(tankId: number, context: Context = {}): Promise<{ on: string; litres: number }[]> {
	const rows = await resolve(context)
		.db.select({ on: journalEvents.occurredOn, litres: journalEvents.amount })
		.from(journalEvents)
		.where(and(eq(journalEvents.tankId, tankId), eq(journalEvents.kind, 'top-up')));
	return rows.flatMap((r) => (r.litres === null ? [] : [{ on: r.on, litres: r.litres }]));
}

/** Everything logged for a tank that can count as doing a task. */
async function loggedFor(tx: DbOrTx, tankId: number): Promise<LoggedUpkeep[]> {
	const [events, tests] = await Promise.all([
		tx
			.select({ kind: journalEvents.kind, on: journalEvents.occurredOn, filterPart: journalEvents.filterPart, taskId: journalEvents.taskId })
			.from(journalEvents)
			.where(eq(journalEvents.tankId, tankId)),
		tx.select({ on: waterTests.testedOn }).from(waterTests).where(eq(waterTests.tankId, tankId))
	]);
	return [...events, ...tests.map((t) => ({ kind: 'water-test' as const, on: t.on }))];
}

/**
 * Works out again when each task of a tank was last done. Call it in the transaction of anything
 * that adds, changes or removes events or tests, and after the schedule changes.
 */
export async function recompute(tankId: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const tasks = await listForTank(tankId, context);
	if (!tasks.length) return;
	const logged = await loggedFor(db, tankId);
	// Events dated up to today somewhere on earth count: the owner's own today may be ahead of
	// UTC's (UTC+14 is the furthest ahead any clock is).
	const day = today('Etc/GMT-14', now);
	for (const task of tasks) {
		const last = lastDoneOn(task, logged, day);
		if (last !== task.lastDoneOn) await db.update(maintenanceTasks).set({ lastDoneOn: last }).where(eq(maintenanceTasks.id, task.id));
	}
}

/**
 * Replaces the owner's schedule of a tank with `tasks` (in order). Rows carrying the id of a task
 * of this tank are updated, so events logged "done today" for them still point at them.
 */
export async function saveSchedule(viewer: Pick<Viewer, 'id'>, tankId: number, tasks: (TaskDraft & { id?: number })[], context: Context = {}): Promise<void> {
	if (tasks.length > SCHEDULE_MAX) throw invalid({ tasks: `Keep the schedule to ${SCHEDULE_MAX} tasks.` });
	await resolve(context).db.transaction(async (tx) => {
		const inTx = within(context, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const existing = new Set((await listForTank(tankId, inTx)).map((t) => t.id));
		const kept: number[] = [];
		for (const [position, task] of tasks.entries()) {
			const values = {
				kind: task.kind,
				filterPart: task.kind === 'filter-clean' ? task.filterPart : null,
				label: task.label,
				intervalDays: task.intervalDays,
				position
			};
			if (task.id !== undefined && existing.has(task.id)) {
				await tx.update(maintenanceTasks).set(values).where(eq(maintenanceTasks.id, task.id));
				kept.push(task.id);
			} else {
				const [result] = await tx.insert(maintenanceTasks).values({ ...values, tankId });
				kept.push(result.insertId);
			}
		}
		const dropped = [...existing].filter((id) => !kept.includes(id));
		if (dropped.length) await tx.delete(maintenanceTasks).where(inArray(maintenanceTasks.id, dropped));
		await recompute(tankId, inTx);
	});
}

export interface DueTask extends MaintenanceTask {
	taskId: number;
	tankIdNumber: number;
	tankName: string;
	kind: TaskRow['kind'];
}

/** The schedule of every running tank of the viewer, the most overdue first. */
export async function scheduleOf(viewer: Pick<Viewer, 'id' | 'timeZone'>, context: Context = {}): Promise<ScheduledTask<DueTask>[]> {
	const { db, now } = resolve(context);
	const rows = await db
		.select({ task: maintenanceTasks, tankName: tankTable.name })
		.from(maintenanceTasks)
		.innerJoin(tankTable, eq(tankTable.id, maintenanceTasks.tankId))
		.where(and(eq(tankTable.ownerId, viewer.id), isNull(tankTable.retiredOn)));
	const tasks: DueTask[] = rows.map(({ task, tankName }) => ({
		...asMaintenanceTask(task),
		taskId: task.id,
		tankIdNumber: task.tankId,
		tankName,
		kind: task.kind
	}));
	return scheduleAll(tasks, today(zoneOf(viewer), now));
}

export { dueWithin } from '../../journals/schedule';

/** The schedule of one tank for its page, on the owner's day in `timeZone`. */
export async function scheduleOfTank(tankId: number, timeZone: string, context: Context = {}) {
	const { now } = resolve(context);
	const rows = await listForTank(tankId, context);
	return scheduleAll(
		rows.map((t) => ({ ...asMaintenanceTask(t), taskId: t.id, kind: t.kind, filterPart: t.filterPart })),
		today(timeZone, now)
	).sort((a, b) => a.nextDueOn.localeCompare(b.nextDueOn) || Number(a.task.id) - Number(b.task.id));
}

/**
 * "Done today": logs an event for the task on the owner's tank (not tied to an entry) and resets
 * it. Returns the tank's id; "not found" when the task is not the viewer's.
 */
/** What "done today" logged: the task's label and the event, so the page can say which and offer to take it back. */
export interface LoggedDone {
	tankId: number;
	tankName: string;
	eventId: number;
	label: string;
}

export async function markDone(viewer: Pick<Viewer, 'id' | 'timeZone'>, taskId: number, context: Context = {}): Promise<LoggedDone> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const [row] = await tx
			.select({ task: maintenanceTasks, ownerId: tankTable.ownerId, tankName: tankTable.name })
			.from(maintenanceTasks)
			.innerJoin(tankTable, eq(tankTable.id, maintenanceTasks.tankId))
			.where(eq(maintenanceTasks.id, taskId))
			.for('update');
		if (!row || row.ownerId !== viewer.id) throw notFound('We could not find that task.');
		const { task } = row;
		const kind = doneEventKind(task.kind);
		const [inserted] = await tx.insert(journalEvents).values({
			tankId: task.tankId,
			entryId: null,
			kind,
			occurredOn: today(zoneOf(viewer), now),
			filterPart: kind === 'filter-clean' ? task.filterPart : null,
			what: kind === 'upkeep' ? task.label : '',
			taskId: task.id
		});
		await recompute(task.tankId, inTx);
		await tanks.touch(task.tankId, inTx);
		return { tankId: task.tankId, tankName: row.tankName, eventId: inserted.insertId, label: task.label };
	});
}

/**
 * Logs a dose worked out by the dose calculator on the viewer's own tank, today, as a journal
 * event of its own (like "done today": it can be taken back from the journal).
 */
export async function logDose(viewer: Pick<Viewer, 'id'>, tankId: number, dose: { saltId: SaltId; grams: number }, context: Context = {}): Promise<LoggedDone> {
	const { db, now } = resolve(context);
	if (!(dose.grams < 10_000_000 && roundTo(dose.grams, 3) > 0)) throw invalid({ grams: 'That dose is too small or too large to log (to the milligram).' });
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const tank = await tanks.lockOwn(viewer, tankId, inTx);
		const label = SALTS[dose.saltId].name;
		const [inserted] = await tx.insert(journalEvents).values({
			tankId,
			entryId: null,
			kind: 'dose',
			occurredOn: today('UTC', now),
			what: label,
			amount: roundTo(dose.grams, 3),
			amountUnit: 'g',
			saltId: dose.saltId
		});
		await recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
		return { tankId, tankName: tank.name, eventId: inserted.insertId, label };
	});
}

/** Takes back an event logged on its own ("done today" by mistake); events of entries go with their entry. */
export async function removeLoggedEvent(viewer: Pick<Viewer, 'id'>, tankId: number, eventId: number, context: Context = {}): Promise<void> {
	const eventNotFound = () => notFound('We could not find that event.');
	await resolve(context).db.transaction(async (tx) => {
		const inTx = within(context, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [result] = await tx.delete(journalEvents).where(and(eq(journalEvents.id, eventId), eq(journalEvents.tankId, tankId), isNull(journalEvents.entryId)));
		if (result.affectedRows === 0) throw eventNotFound();
		await recompute(tankId, inTx);
	});
}
