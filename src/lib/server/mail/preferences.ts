// Which mail each member takes (the notification settings page, and the unsubscribe links at the
// foot of mail). The outbox asks here at enqueue, so a mail in a category the member turned off
// is never queued, whoever queues it.
import { and, asc, eq, gt, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { DEFAULT_PREFERENCES, type OptionalCategory, type Preferences, type PreferencesInput } from '../../mail/categories';
import { mailPreferences } from './schema';

const toPreferences = (row: typeof mailPreferences.$inferSelect | undefined): Preferences =>
	row
		? {
				swaps: row.swaps,
				comments: row.comments,
				follows: row.follows,
				upkeep: row.upkeep,
				news: row.news,
				results: row.results,
				judging: row.judging
			}
		: { ...DEFAULT_PREFERENCES };

/** One member's settings (the defaults when they never changed any). */
export async function of(memberId: string, context: Context = {}): Promise<Preferences> {
	const { db } = resolve(context);
	const [row] = await db.select().from(mailPreferences).where(eq(mailPreferences.userId, memberId)).limit(1);
	return toPreferences(row);
}

/** Many members' settings in one query, by id; every id asked for is in the map. */
export async function ofMembers(memberIds: Iterable<string>, context: Context = {}): Promise<Map<string, Preferences>> {
	const unique = [...new Set(memberIds)];
	const found = new Map<string, Preferences>();
	if (unique.length === 0) return found;
	const { db } = resolve(context);
	// Chunked so a club-wide mailing stays within a sensible statement size.
	for (let i = 0; i < unique.length; i += 1000) {
		const rows = await db
			.select()
			.from(mailPreferences)
			.where(inArray(mailPreferences.userId, unique.slice(i, i + 1000)));
		for (const row of rows) found.set(row.userId, toPreferences(row));
	}
	return new Map(unique.map((id) => [id, found.get(id) ?? { ...DEFAULT_PREFERENCES }]));
}

/** Changes some of a member's settings; the others keep their value. */
export async function save(memberId: string, input: PreferencesInput, context: Context = {}): Promise<Preferences> {
	const { db, now } = resolve(context);
	const changes = Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)) as Partial<Preferences>;
	await db
		.insert(mailPreferences)
		.values({ userId: memberId, ...changes, updatedAt: now })
		.onDuplicateKeyUpdate({ set: { ...changes, updatedAt: now } });
	return of(memberId, context);
}

/** Sets one category (an unsubscribe link's one-click "off", or its "subscribe again"). */
export async function setCategory<C extends OptionalCategory>(memberId: string, category: C, value: Preferences[C], context: Context = {}): Promise<void> {
	await save(memberId, { [category]: value } as PreferencesInput, context);
}

/** Members who chose `value` for a category whose default is something else (e.g. the weekly upkeep mail), in id order. */
export async function choosing<C extends OptionalCategory>(
	category: C,
	value: Preferences[C],
	page: { afterId?: string; limit: number },
	context: Context = {}
): Promise<string[]> {
	if (DEFAULT_PREFERENCES[category] === value) throw new Error('Members on the default have no row: ask ofMembers instead.');
	const { db } = resolve(context);
	const column = mailPreferences[category];
	const rows = await db
		.select({ id: mailPreferences.userId })
		.from(mailPreferences)
		.where(and(eq(column, value), page.afterId === undefined ? undefined : gt(mailPreferences.userId, page.afterId)))
		.orderBy(asc(mailPreferences.userId))
		.limit(page.limit);
	return rows.map((r) => r.id);
}

/** A deleted account keeps no settings. */
export async function forget(memberId: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.delete(mailPreferences).where(eq(mailPreferences.userId, memberId));
}
