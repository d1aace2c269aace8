// Members blocking members. A block works both ways for writing (no requests, no messages, no
// accepting), and hides the blocked member's listings from the blocker's board and profile pages.
import { and, eq, or } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as users from '../club/users';
import * as directory from '../club/directory';
import { nameOf } from '../../club/names';
import { forbidden, invalid, notFound, type DomainError } from '../../errors';
import { memberBlocks } from './schema';

export async function block(viewer: Pick<Viewer, 'id'>, otherId: string, context: Context = {}): Promise<void> {
	if (otherId === viewer.id) throw invalid({}, 'You cannot block yourself.', 'self');
	const { db } = resolve(context);
	if (!(await users.getById(otherId, { db }))) throw notFound('We could not find that member.');
	await db
		.insert(memberBlocks)
		.values({ blockerId: viewer.id, blockedId: otherId })
		.onDuplicateKeyUpdate({ set: { blockerId: viewer.id } });
}

export async function unblock(viewer: Pick<Viewer, 'id'>, otherId: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.delete(memberBlocks).where(and(eq(memberBlocks.blockerId, viewer.id), eq(memberBlocks.blockedId, otherId)));
}

/** How two members stand: whether `a` blocked `b`, and whether `b` blocked `a`. */
export async function between(a: string, b: string, context: Context = {}): Promise<{ aBlockedB: boolean; bBlockedA: boolean }> {
	const { db } = resolve(context);
	const rows = await db
		.select({ blockerId: memberBlocks.blockerId })
		.from(memberBlocks)
		.where(or(and(eq(memberBlocks.blockerId, a), eq(memberBlocks.blockedId, b)), and(eq(memberBlocks.blockerId, b), eq(memberBlocks.blockedId, a))));
	return { aBlockedB: rows.some((r) => r.blockerId === a), bBlockedA: rows.some((r) => r.blockerId === b) };
}

/** The refusal of writing from `writerId` to `otherId` when either has blocked the other; its message depends on who did. */
async function refusalOf(writerId: string, otherId: string, context: Context): Promise<DomainError | null> {
	const { aBlockedB, bBlockedA } = await between(writerId, otherId, context);
	if (aBlockedB) return forbidden('You have blocked this member. Unblock them on their profile page to write to them again.', 'you-blocked');
	if (bBlockedA) return forbidden('This member is not taking requests or messages from you.', 'blocked');
	return null;
}

/** Why `writerId` may not write to `otherId`, or null when they may. */
export async function writeBlock(writerId: string, otherId: string, context: Context = {}): Promise<string | null> {
	return (await refusalOf(writerId, otherId, context))?.message ?? null;
}

/** Refuses writing between two members when either has blocked the other. */
export async function assertMayWrite(writerId: string, otherId: string, context: Context = {}): Promise<void> {
	const refusal = await refusalOf(writerId, otherId, context);
	if (refusal) throw refusal;
}

export interface BlockedMember {
	id: string;
	displayName: string;
	blockedAt: Date;
}

/** The members the viewer has blocked, by name. */
export async function listBlocked(viewer: Pick<Viewer, 'id'>, context: Context = {}): Promise<BlockedMember[]> {
	const { db } = resolve(context);
	const rows = await db
		.select({ id: memberBlocks.blockedId, blockedAt: memberBlocks.createdAt })
		.from(memberBlocks)
		.where(eq(memberBlocks.blockerId, viewer.id));
	const names = await directory.names(
		rows.map((r) => r.id),
		{ db }
	);
	return rows
		.filter((r) => names.has(r.id))
		.map((r) => ({ id: r.id, displayName: nameOf(names.get(r.id)), blockedAt: r.blockedAt }))
		.sort((a, b) => a.displayName.localeCompare(b.displayName, 'en', { sensitivity: 'base' }));
}
