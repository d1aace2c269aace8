// What the journals keep of a member who deletes their account: nothing. Their tanks go with
// every list, entry, event, water test, task, admirer and follower (the tank's row cascades), and
// so does whatever others wrote under those entries; their comments under other members' entries,
// entries they wrote in someone else's journal, their admires, follows and digest records go too.
// Photos are the media service's: the account deletion removes all of the member's photos at once.
import { eq, inArray, or } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { entryComments, journalDigests, journalEntries, tankAdmires, tankFollows, tanks } from './schema';

/** Deletes every journal row of the member. Call it inside the deletion's transaction. */
export async function forget(memberId: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const own = (await db.select({ id: tanks.id }).from(tanks).where(eq(tanks.ownerId, memberId)).for('update')).map((t) => t.id);
	await db.delete(entryComments).where(eq(entryComments.authorId, memberId));
	const onOwnTanks = own.length ? inArray(journalEntries.tankId, own) : undefined;
	await db.delete(journalEntries).where(or(eq(journalEntries.authorId, memberId), onOwnTanks));
	await db.delete(tankAdmires).where(eq(tankAdmires.userId, memberId));
	await db.delete(tankFollows).where(eq(tankFollows.userId, memberId));
	await db.delete(journalDigests).where(eq(journalDigests.userId, memberId));
	if (own.length) await db.delete(tanks).where(inArray(tanks.id, own));
}
