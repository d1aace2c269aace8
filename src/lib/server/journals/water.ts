// Water tests of a tank: logged by its keeper, read by whoever may see the tank.
import { and, desc, eq, inArray } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import type { Viewer } from '../club/users';
import { buildSeries, type Series, type WaterTestInput } from '../../journals/water-tests';
import type { UnitSystem } from '../../journals/calc';
import { tanks as tankTable, waterTests, type TankRow, type WaterTestRow } from './schema';
import * as tanks from './tanks';
import * as upkeep from './upkeep';

export type { WaterTestRow };

/** Tests a chart draws at most (the newest ones). */
export const SERIES_LIMIT = 120;

export async function create(viewer: Viewer, tankId: number, input: WaterTestInput, database: DbOrTx = appDb, now = new Date()): Promise<number> {
	return database.transaction(async (tx) => {
		const [tank] = await tx.select().from(tankTable).where(eq(tankTable.id, tankId)).for('update');
		if (!tank || tank.ownerId !== viewer.id) throw new tanks.TankNotFound();
		const [result] = await tx.insert(waterTests).values({ ...input, tankId, createdAt: now });
		await upkeep.recompute(tx, tankId, now);
		await tanks.touch(tx, tankId, now);
		return result.insertId;
	});
}

export async function remove(viewer: Viewer, tankId: number, testId: number, database: DbOrTx = appDb, now = new Date()): Promise<void> {
	await database.transaction(async (tx) => {
		const [tank] = await tx.select().from(tankTable).where(eq(tankTable.id, tankId)).for('update');
		if (!tank || tank.ownerId !== viewer.id) throw new tanks.TankNotFound();
		const [result] = await tx.delete(waterTests).where(and(eq(waterTests.id, testId), eq(waterTests.tankId, tankId)));
		if (result.affectedRows === 0) throw new tanks.TankNotFound();
		await upkeep.recompute(tx, tankId, now);
	});
}

/** The newest tests of a tank, newest first (the caller has checked visibility). */
export async function latestOf(tankId: number, limit = SERIES_LIMIT, tx: DbOrTx = appDb): Promise<WaterTestRow[]> {
	return tx
		.select()
		.from(waterTests)
		.where(eq(waterTests.tankId, tankId))
		.orderBy(desc(waterTests.testedOn), desc(waterTests.createdAt), desc(waterTests.id))
		.limit(limit);
}

export async function many(tankId: number, ids: number[], tx: DbOrTx = appDb): Promise<WaterTestRow[]> {
	if (!ids.length) return [];
	return tx
		.select()
		.from(waterTests)
		.where(and(eq(waterTests.tankId, tankId), inArray(waterTests.id, ids)));
}

export interface TankSeries {
	tank: Pick<TankRow, 'id' | 'name'>;
	units: UnitSystem;
	series: Series[];
}

/** The chart data of a tank the viewer may see, in the viewer's units; null when not visible. */
export async function seriesFor(viewer: Viewer | null, tankId: number, tx: DbOrTx = appDb): Promise<TankSeries | null> {
	const tank = await tanks.findVisible(viewer, tankId, tx);
	if (!tank) return null;
	const units = viewer?.units ?? 'metric';
	return { tank: { id: tank.id, name: tank.name }, units, series: buildSeries(await latestOf(tankId, SERIES_LIMIT, tx), units) };
}
