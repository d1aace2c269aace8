// What other features may know of members, read in batches (one query for any number of ids):
// the name others see, where to mail them, and who asked for the weekly digest. Features never
// read the member table themselves.
import { and, asc, eq, gt, inArray, isNotNull } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { nameOf } from '../../club/names';
import { users } from './schema';

/** The name each member is shown under (nameOf: their display name, or "A member"), by id. */
export async function names(ids: string[], context: Context = {}): Promise<Map<string, string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, unique));
	return new Map(rows.map((r) => [r.id, nameOf(r.displayName)]));
}

export interface Contact {
	id: string;
	/** Null for a member whose address is gone (nothing may be sent). */
	email: string | null;
	name: string;
}

/** Where to mail each member, and their name, by id. */
export async function contacts(ids: string[], context: Context = {}): Promise<Map<string, Contact>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const { db } = resolve(context);
	const rows = await db.select({ id: users.id, email: users.email, displayName: users.displayName }).from(users).where(inArray(users.id, unique));
	return new Map(rows.map((r) => [r.id, { id: r.id, email: r.email, name: nameOf(r.displayName) }]));
}

export interface DigestReader {
	id: string;
	email: string;
	displayName: string | null;
	unsubscribeToken: string;
}

/** Members who asked for the weekly digest and have an address, in id order after `afterId`, `limit` at a time. */
export async function weeklyDigestReaders(page: { afterId?: string; limit: number }, context: Context = {}): Promise<DigestReader[]> {
	const { db } = resolve(context);
	const rows = await db
		.select({ id: users.id, email: users.email, displayName: users.displayName, unsubscribeToken: users.unsubscribeToken })
		.from(users)
		.where(and(eq(users.weeklyDigest, true), isNotNull(users.email), page.afterId === undefined ? undefined : gt(users.id, page.afterId)))
		.orderBy(asc(users.id))
		.limit(page.limit);
	return rows.map((r) => ({ ...r, email: r.email! }));
}
