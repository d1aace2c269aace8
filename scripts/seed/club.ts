import { inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { clubAreas, users } from '../../src/lib/server/club/schema';
import { DEMO_AREAS, DEMO_PEOPLE } from './people';

/** The demo club's areas and members with their roles. */
export async function seedClub(db: DbOrTx): Promise<void> {
	await db.insert(clubAreas).values(DEMO_AREAS);
	const areaRows = await db.select().from(clubAreas);
	const areaId = new Map(areaRows.map((a) => [a.name, a]));
	const joined = new Date(Date.UTC(2026, 0, 10));
	await db.insert(users).values(
		DEMO_PEOPLE.map((p, i) => {
			const area = areaId.get(p.area)!;
			return {
				email: p.email,
				emailVerified: joined,
				displayName: p.displayName,
				role: p.role,
				units: p.units,
				homeAreaId: area.id,
				homeLat: area.lat,
				homeLng: area.lng,
				createdAt: new Date(joined.getTime() + i * 86_400_000 * 3)
			};
		})
	);
}

/** Looks up demo people by their key ("mara"), for the feature seeds. */
export async function demoUserIds(db: DbOrTx): Promise<Map<string, string>> {
	const emails = DEMO_PEOPLE.map((p) => p.email);
	const rows = await db.select({ id: users.id, email: users.email }).from(users).where(inArray(users.email, emails));
	const idOf = new Map(rows.map((r) => [r.email, r.id]));
	return new Map(DEMO_PEOPLE.flatMap((p) => (idOf.has(p.email) ? [[p.key, idOf.get(p.email)!] as const] : [])));
}
