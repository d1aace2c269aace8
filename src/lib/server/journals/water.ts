// Water tests of a tank: logged by its keeper, read by whoever may see the tank.
import { and, desc, eq, inArray } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import { notFound } from '../../errors';
import { buildSeries, type Series, type WaterTestInput } from '../../journals/water-tests';
import type { UnitSystem } from '../../journals/calc';
import { waterTests, type TankRow, type WaterTestRow } from './schema';
import * as tanks from './tanks';
import * as upkeep from './upkeep';

export type { WaterTestRow };

/** Tests a chart draws at most (the newest ones). */
export const SERIES_LIMIT = 120;

const testNotFound = () => notFound('We could not find that test.');

/** Logs a test on the viewer's own tank. */
export async function create(viewer: Pick<Viewer, 'id'>, tankId: number, input: WaterTestInput, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [result] = await tx.insert(waterTests).values({ ...input, tankId, createdAt: now });
		await upkeep.recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
		return result.insertId;
	});
}

/** A test of the viewer's own tank, for its edit form; "not found" for anyone else's or none. */
export async function getOwn(viewer: Pick<Viewer, 'id'>, tankId: number, testId: number, context: Context = {}): Promise<WaterTestRow> {
	const tank = await tanks.findOwn(viewer, tankId, context);
	const [row] = tank ? await many(tank.id, [testId], context) : [];
	if (!row) throw testNotFound();
	return row;
}

/** Changes a test of the viewer's own tank (the whole test, as the form sends it) and marks it edited. */
export async function update(viewer: Pick<Viewer, 'id'>, tankId: number, testId: number, input: WaterTestInput, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [result] = await tx
			.update(waterTests)
			.set({ ...input, editedAt: now })
			.where(and(eq(waterTests.id, testId), eq(waterTests.tankId, tankId)));
		if (result.affectedRows === 0) throw testNotFound();
		// The day may have moved, so a schedule task's last test may have too.
		await upkeep.recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
	});
}

/** Deletes a test of the viewer's own tank. */
export async function remove(viewer: Pick<Viewer, 'id'>, tankId: number, testId: number, context: Context = {}): Promise<void> {
	await resolve(context).db.transaction(async (tx) => {
		const inTx = within(context, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [result] = await tx.delete(waterTests).where(and(eq(waterTests.id, testId), eq(waterTests.tankId, tankId)));
		if (result.affectedRows === 0) throw testNotFound();
		await upkeep.recompute(tankId, inTx);
	});
}

/** The newest tests of a tank, newest first (the caller has checked visibility). */
export async function latestOf(tankId: number, limit = SERIES_LIMIT, context: Context = {}): Promise<WaterTestRow[]> {
	return resolve(context)
		.db.select()
		.from(waterTests)
		.where(eq(waterTests.tankId, tankId))
		.orderBy(desc(waterTests.testedOn), desc(waterTests.createdAt), desc(waterTests.id))
		.limit(limit);
}

/** Tests of a tank by id (the caller has checked visibility). */
export async function many(tankId: number, ids: number[], context: Context = {}): Promise<WaterTestRow[]> {
	if (!ids.length) return [];
	return resolve(context)
		.db.select()
		.from(waterTests)
		.where(and(eq(waterTests.tankId, tankId), inArray(waterTests.id, ids)));
}

export interface TankSeries {
	tank: Pick<TankRow, 'id' | 'name'>;
	units: UnitSystem;
	series: Series[];
}

/** The chart data of a tank the viewer may see, in the viewer's units; null when not visible. */
export async function seriesFor(viewer: Pick<Viewer, 'id' | 'units'> | null, tankId: number, context: Context = {}): Promise<TankSeries | null> {
	const tank = await tanks.findVisible(viewer, tankId, context);
	if (!tank) return null;
	const units = viewer?.units ?? 'metric';
	return { tank: { id: tank.id, name: tank.name }, units, series: buildSeries(await latestOf(tankId, SERIES_LIMIT, context), units) };
}
