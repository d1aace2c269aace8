import { asc, eq } from 'drizzle-orm';
import { db, type DbOrTx } from '../db';
import { roundToKilometre, type LatLng } from '../../club/location';
import { clubAreas, users } from './schema';
import { auditLog } from '../audit/schema';
import type { Viewer } from './users';

export type Area = typeof clubAreas.$inferSelect;

export async function list(tx: DbOrTx = db): Promise<Area[]> {
	return tx.select().from(clubAreas).orderBy(asc(clubAreas.name));
}

export async function get(id: number, tx: DbOrTx = db): Promise<Area | undefined> {
	const [row] = await tx.select().from(clubAreas).where(eq(clubAreas.id, id)).limit(1);
	return row;
}

export async function create(actor: Viewer, name: string, centre: LatLng): Promise<void> {
	const point = roundToKilometre(centre);
	await db.transaction(async (tx) => {
		const [result] = await tx.insert(clubAreas).values({ name, lat: point.lat, lng: point.lng });
		await tx
			.insert(auditLog)
			.values({ actorId: actor.id, action: 'area.create', subjectType: 'club_area', subjectId: String(result.insertId), detail: { name } });
	});
}

export async function rename(actor: Viewer, id: number, name: string): Promise<void> {
	await db.transaction(async (tx) => {
		const [before] = await tx.select().from(clubAreas).where(eq(clubAreas.id, id)).for('update');
		if (!before) return;
		await tx.update(clubAreas).set({ name }).where(eq(clubAreas.id, id));
		await tx
			.insert(auditLog)
			.values({ actorId: actor.id, action: 'area.rename', subjectType: 'club_area', subjectId: String(id), detail: { from: before.name, to: name } });
	});
}

export async function remove(actor: Viewer, id: number): Promise<void> {
	await db.transaction(async (tx) => {
		await tx.update(users).set({ homeAreaId: null }).where(eq(users.homeAreaId, id));
		await tx.delete(clubAreas).where(eq(clubAreas.id, id));
		await tx.insert(auditLog).values({ actorId: actor.id, action: 'area.delete', subjectType: 'club_area', subjectId: String(id) });
	});
}
