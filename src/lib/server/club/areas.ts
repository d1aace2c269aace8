// Club areas: neighbourhoods the admins name, each with a rough centre point. Members pick one
// as where they live; the swap board names pickups by area and measures from its centre.
import { and, asc, eq, ne } from 'drizzle-orm';
import { assertRole } from '../../club/roles';
import { roundToKilometre, type LatLng } from '../../club/location';
import type { Viewer } from '../../club/viewer';
import { invalid, notFound } from '../../errors';
import { resolve, within, type Context } from '../context';
import * as audit from '../audit';
import { clubAreas, users } from './schema';

export type Area = typeof clubAreas.$inferSelect;

const GONE = 'That area no longer exists.';

export async function list(context: Context = {}): Promise<Area[]> {
	const { db } = resolve(context);
	return db.select().from(clubAreas).orderBy(asc(clubAreas.name));
}

export async function get(id: number, context: Context = {}): Promise<Area | undefined> {
	const { db } = resolve(context);
	const [row] = await db.select().from(clubAreas).where(eq(clubAreas.id, id)).limit(1);
	return row;
}

/** Refuses a name another area has (names compare without regard to case, as the column's collation does). */
async function assertNameFree(name: string, except: number | null, context: Context) {
	const { db } = resolve(context);
	const [taken] = await db
		.select({ id: clubAreas.id })
		.from(clubAreas)
		.where(and(eq(clubAreas.name, name), except === null ? undefined : ne(clubAreas.id, except)))
		.limit(1);
	if (taken) throw invalid({ name: 'There is already an area with that name.' });
}

export async function create(actor: Viewer, input: { name: string } & LatLng, context: Context = {}): Promise<void> {
	assertRole(actor, 'admin');
	const { db } = resolve(context);
	const point = roundToKilometre(input);
	await db.transaction(async (tx) => {
		await assertNameFree(input.name, null, within(context, tx));
		const [result] = await tx.insert(clubAreas).values({ name: input.name, lat: point.lat, lng: point.lng });
		await audit.record(
			{ actorId: actor.id, action: 'area.create', subject: { type: 'club_area', id: result.insertId }, detail: { name: input.name } },
			within(context, tx)
		);
	});
}

export async function rename(actor: Viewer, id: number, name: string, context: Context = {}): Promise<void> {
	assertRole(actor, 'admin');
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const [before] = await tx.select().from(clubAreas).where(eq(clubAreas.id, id)).for('update');
		if (!before) throw notFound(GONE);
		await assertNameFree(name, id, within(context, tx));
		await tx.update(clubAreas).set({ name }).where(eq(clubAreas.id, id));
		await audit.record(
			{ actorId: actor.id, action: 'area.rename', subject: { type: 'club_area', id }, detail: { from: before.name, to: name } },
			within(context, tx)
		);
	});
}

/** Removes an area; members who had chosen it keep its rough point as a point of their own. Returns its name. */
export async function remove(actor: Viewer, id: number, context: Context = {}): Promise<string> {
	assertRole(actor, 'admin');
	const { db } = resolve(context);
	return db.transaction(async (tx) => {
		const [area] = await tx.select().from(clubAreas).where(eq(clubAreas.id, id)).for('update');
		if (!area) throw notFound(GONE);
		await tx.update(users).set({ homeAreaId: null }).where(eq(users.homeAreaId, id));
		await tx.delete(clubAreas).where(eq(clubAreas.id, id));
		await audit.record({ actorId: actor.id, action: 'area.delete', subject: { type: 'club_area', id } }, within(context, tx));
		return area.name;
	});
}
