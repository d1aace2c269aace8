// What the swap board keeps of a member who deletes their account. Their messages are deleted;
// the other member's side of each conversation stays, so a listing of theirs that anyone asked
// about stays as the conversations' context: withdrawn, with its description and notes blanked
// (its photos go with all of the member's photos). Listings nobody asked about are deleted. A listing
// of someone else that was reserved for them is released. Their reports, blocks either way and
// summary state are deleted. A tombstone of the member keeps their id, so listing events and
// conversations still hold an opaque id and show "Former member".
import { and, eq, inArray, ne, or } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { transition } from '../../swaps/listing-state';
import { listings, memberBlocks, swapMailState, swapMessages, swapReports, swapThreads } from './schema';
import { saveTransition, toPure } from './listings';

const LEFT = 'The member left the club.';

/** Deletes or blanks every swap row of the member. Call it inside the deletion's transaction. */
export async function forget(memberId: string, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.delete(swapMessages).where(eq(swapMessages.senderId, memberId));
	await db.delete(swapReports).where(eq(swapReports.reporterId, memberId));
	await db.delete(memberBlocks).where(or(eq(memberBlocks.blockerId, memberId), eq(memberBlocks.blockedId, memberId)));
	await db.delete(swapMailState).where(eq(swapMailState.userId, memberId));

	// Someone else's listing reserved for the member goes back on the board; the event has no actor.
	const reserved = await db
		.select()
		.from(listings)
		.where(and(eq(listings.reservedRequesterId, memberId), eq(listings.state, 'reserved'), ne(listings.ownerId, memberId)))
		.for('update');
	for (const row of reserved) {
		const result = transition(toPure(row), { type: 'release' }, { kind: 'member', userId: row.ownerId }, now);
		if (result.ok) await saveTransition({ ...result, event: { ...result.event, actorId: null } }, LEFT, context);
	}

	const own = await db.select().from(listings).where(eq(listings.ownerId, memberId)).for('update');
	const withThreads = own.length
		? new Set(
				(
					await db
						.selectDistinct({ id: swapThreads.listingId })
						.from(swapThreads)
						.where(
							inArray(
								swapThreads.listingId,
								own.map((l) => l.id)
							)
						)
				).map((r) => r.id)
			)
		: new Set<number>();
	const unasked = own.filter((l) => !withThreads.has(l.id)).map((l) => l.id);
	if (unasked.length) await db.delete(listings).where(inArray(listings.id, unasked));
	for (const row of own.filter((l) => withThreads.has(l.id))) {
		const result = transition(toPure(row), { type: 'withdraw' }, { kind: 'member', userId: memberId }, now);
		if (result.ok) await saveTransition(result, LEFT, context);
		await db.update(listings).set({ description: null, conditionNote: '', termsNote: '', tankId: null }).where(eq(listings.id, row.id));
	}
}
