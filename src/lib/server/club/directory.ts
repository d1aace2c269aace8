// What other features may read of members and club areas, by id and in batches: the names a
// list shows (one query for any number of ids, so a page of cards costs the same query count as
// one card). Nothing here says where a member lives or how to reach them.
import { inArray } from 'drizzle-orm';
import { nameOf } from '../../club/names';
import { resolve, type Context } from '../context';
import { clubAreas, users } from './schema';

/** Members' names as others see them (`nameOf`), by id. An id of no member is not in the map. */
export async function names(ids: Iterable<string>, context: Context = {}): Promise<Map<string, string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, unique));
	return new Map(rows.map((r) => [r.id, nameOf(r.displayName)]));
}

/** Club areas' names, by id. An id of no area (e.g. one removed since) is not in the map. */
export async function areaNames(ids: Iterable<number>, context: Context = {}): Promise<Map<number, string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: clubAreas.id, name: clubAreas.name }).from(clubAreas).where(inArray(clubAreas.id, unique));
	return new Map(rows.map((r) => [r.id, r.name]));
}
