// The upkeep schedule of each tank: its tasks, when each was last done (worked out from the
// events and tests logged), what is due across a member's tanks, and "done today".
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import type { Viewer } from '../club/users';
import { scheduleAll, type ScheduledTask, type MaintenanceTask } from '../../journals/calc';
import { asMaintenanceTask, doneEventKind, lastDoneOn, type LoggedUpkeep, type TaskDraft } from '../../journals/schedule';
import { journalEvents, maintenanceTasks, tanks as tankTable, waterTests, type TaskRow } from './schema';
import * as tanks from './tanks';

export type { TaskRow };

/** Most tasks one tank's schedule holds. */
export const SCHEDULE_MAX = 20;

export const todayOf = (now: Date) => now.toISOString().slice(0, 10);

export async function listForTank(tankId: number, tx: DbOrTx = appDb): Promise<TaskRow[]> {
	return tx.select().from(maintenanceTasks).where(eq(maintenanceTasks.tankId, tankId)).orderBy(asc(maintenanceTasks.position), asc(maintenanceTasks.id));
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
export async function recompute(tx: DbOrTx, tankId: number, now = new Date()): Promise<void> {
	const tasks = await listForTank(tankId, tx);
	if (!tasks.length) return;
	const logged = await loggedFor(tx, tankId);
	const today = todayOf(now);
	for (const task of tasks) {
		const last = lastDoneOn(task, logged, today);
		if (last !== task.lastDoneOn) await tx.update(maintenanceTasks).set({ lastDoneOn: last }).where(eq(maintenanceTasks.id, task.id));
	}
}

export class ScheduleError extends Error {
	constructor(readonly errors: Record<string, string>) {
		super('The schedule has mistakes.');
	}
}

/**
 * Replaces the owner's schedule of a tank with `tasks` (in order). Rows carrying the id of a task
 * of this tank are updated, so events logged "done today" for them still point at them.
 */
export async function saveSchedule(
	viewer: Viewer,
	tankId: number,
	tasks: (TaskDraft & { id?: number })[],
	database: DbOrTx = appDb,
	now = new Date()
): Promise<void> {
	if (tasks.length > SCHEDULE_MAX) throw new ScheduleError({ tasks: `Keep the schedule to ${SCHEDULE_MAX} tasks.` });
	await database.transaction(async (tx) => {
		const [tank] = await tx.select().from(tankTable).where(eq(tankTable.id, tankId)).for('update');
		if (!tank || tank.ownerId !== viewer.id) throw new tanks.TankNotFound();
		const existing = new Set((await listForTank(tankId, tx)).map((t) => t.id));
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
		await recompute(tx, tankId, now);
	});
}

export interface DueTask extends MaintenanceTask {
	taskId: number;
	tankIdNumber: number;
	tankName: string;
	kind: TaskRow['kind'];
}

/** The schedule of every running tank of the viewer, the most overdue first. */
export async function scheduleOf(viewer: Pick<Viewer, 'id'>, now = new Date(), tx: DbOrTx = appDb): Promise<ScheduledTask<DueTask>[]> {
	const rows = await tx
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
	return scheduleAll(tasks, now);
}

/** Tasks due within `days` days (0: due today or overdue). */
export const dueWithin = <T extends MaintenanceTask>(scheduled: ScheduledTask<T>[], days: number) =>
	scheduled.filter((s) => s.status.kind !== 'due-in' || s.status.days <= days);

/** The schedule of one tank for its page. */
export async function scheduleOfTank(tankId: number, now = new Date(), tx: DbOrTx = appDb) {
	const rows = await listForTank(tankId, tx);
	return scheduleAll(
		rows.map((t) => ({ ...asMaintenanceTask(t), taskId: t.id, kind: t.kind, filterPart: t.filterPart })),
		now
	).sort((a, b) => a.nextDueOn.localeCompare(b.nextDueOn) || Number(a.task.id) - Number(b.task.id));
}

/**
 * "Done today": logs an event for the task on the owner's tank (not tied to an entry) and resets
 * it. Returns the tank's id; TankNotFound when the task is not the viewer's.
 */
export async function markDone(viewer: Viewer, taskId: number, now = new Date(), database: DbOrTx = appDb): Promise<number> {
	return database.transaction(async (tx) => {
		const [row] = await tx
			.select({ task: maintenanceTasks, ownerId: tankTable.ownerId })
			.from(maintenanceTasks)
			.innerJoin(tankTable, eq(tankTable.id, maintenanceTasks.tankId))
			.where(eq(maintenanceTasks.id, taskId))
			.for('update');
		if (!row || row.ownerId !== viewer.id) throw new tanks.TankNotFound();
		const { task } = row;
		const kind = doneEventKind(task.kind);
		await tx.insert(journalEvents).values({
			tankId: task.tankId,
			entryId: null,
			kind,
			occurredOn: todayOf(now),
			filterPart: kind === 'filter-clean' ? task.filterPart : null,
			what: kind === 'upkeep' ? task.label : '',
			taskId: task.id
		});
		await recompute(tx, task.tankId, now);
		await tanks.touch(tx, task.tankId, now);
		return task.tankId;
	});
}

/** Takes back an event logged on its own ("done today" by mistake); events of entries go with their entry. */
export async function removeLoggedEvent(viewer: Viewer, tankId: number, eventId: number, database: DbOrTx = appDb, now = new Date()): Promise<void> {
	await database.transaction(async (tx) => {
		const [tank] = await tx.select().from(tankTable).where(eq(tankTable.id, tankId)).for('update');
		if (!tank || tank.ownerId !== viewer.id) throw new tanks.TankNotFound();
		const [result] = await tx.delete(journalEvents).where(and(eq(journalEvents.id, eventId), eq(journalEvents.tankId, tankId), isNull(journalEvents.entryId)));
		if (result.affectedRows === 0) throw new tanks.TankNotFound();
		await recompute(tx, tankId, now);
	});
}
