// Members blocking members. A block works both ways for writing (no requests, no messages, no
// accepting), and hides the blocked member's listings from the blocker's board and profile pages.
import { and, asc, eq, or } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';
import type { Viewer } from '../club/users';
import { memberBlocks } from './schema';
import { SwapError } from './errors';

export async function block(viewer: Pick<Viewer, 'id'>, otherId: string, database: DbOrTx = appDb): Promise<void> {
	if (otherId === viewer.id) throw new SwapError(400, 'self', 'You cannot block yourself.');
	const [other] = await database.select({ id: users.id }).from(users).where(eq(users.id, otherId));
	if (!other) throw new SwapError(404, 'not-found', 'We could not find that member.');
	await database
		.insert(memberBlocks)
		.values({ blockerId: viewer.id, blockedId: otherId })
		.onDuplicateKeyUpdate({ set: { blockerId: viewer.id } });
}

export async function unblock(viewer: Pick<Viewer, 'id'>, otherId: string, database: DbOrTx = appDb): Promise<void> {
	await database.delete(memberBlocks).where(and(eq(memberBlocks.blockerId, viewer.id), eq(memberBlocks.blockedId, otherId)));
}

/** How two members stand: whether `a` blocked `b`, and whether `b` blocked `a`. */
export async function between(a: string, b: string, database: DbOrTx = appDb): Promise<{ aBlockedB: boolean; bBlockedA: boolean }> {
	const rows = await database
		.select({ blockerId: memberBlocks.blockerId })
		.from(memberBlocks)
		.where(or(and(eq(memberBlocks.blockerId, a), eq(memberBlocks.blockedId, b)), and(eq(memberBlocks.blockerId, b), eq(memberBlocks.blockedId, a))));
	return { aBlockedB: rows.some((r) => r.blockerId === a), bBlockedA: rows.some((r) => r.blockerId === b) };
}

/** Refuses writing between two members when either has blocked the other; the message depends on who did. */
export async function assertMayWrite(writerId: string, otherId: string, database: DbOrTx = appDb): Promise<void> {
	const { aBlockedB, bBlockedA } = await between(writerId, otherId, database);
	if (aBlockedB) throw new SwapError(403, 'you-blocked', 'You have blocked this member. Unblock them on their profile page to write to them again.');
	if (bBlockedA) throw new SwapError(403, 'blocked', 'This member is not taking requests or messages from you.');
}

/** The members the viewer has blocked, by name. */
export async function listBlocked(viewer: Pick<Viewer, 'id'>, database: DbOrTx = appDb) {
	return database
		.select({ id: users.id, displayName: users.displayName, blockedAt: memberBlocks.createdAt })
		.from(memberBlocks)
		.innerJoin(users, eq(users.id, memberBlocks.blockedId))
		.where(eq(memberBlocks.blockerId, viewer.id))
		.orderBy(asc(users.displayName));
}
