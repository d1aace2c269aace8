// What members are told when a listing changes: a note from the site in their conversation, and a
// mail at once (unless they turned swap mail off; the outbox drops it then). Both are written in the caller's transaction.
import { asc, eq } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { conversationStatus } from '../../swaps/conversation';
import type { Listing } from '../../swaps/listing-state';
import { swapMessages, swapThreads, type ListingRow, type ThreadRow } from './schema';
import { queueNotice } from './notifications';
import { noticeMail, type NoticeKind } from './mail';

/** A note from the site in a conversation, already settled for mail (the notice mail is separate). */
export async function note(thread: Pick<ThreadRow, 'id'>, senderId: string | null, recipientId: string, body: string, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.insert(swapMessages).values({ threadId: thread.id, senderId, recipientId, kind: 'event', body, createdAt: now, notifiedAt: now });
	await db.update(swapThreads).set({ lastMessageAt: now }).where(eq(swapThreads.id, thread.id));
}

/** A mail about the listing to one member. */
export async function tell(
	userId: string,
	kind: NoticeKind,
	o: { threadId: number | null; listing: ListingRow; actorName: string; reason?: string },
	context: Context = {}
): Promise<void> {
	await queueNotice(
		userId,
		(email) =>
			noticeMail(email, userId, { kind, threadId: o.threadId, listingId: o.listing.id, title: o.listing.title, actorName: o.actorName, reason: o.reason }),
		context
	);
}

/** The conversations about a listing, oldest first. */
export async function threadsOf(listingId: number, context: Context = {}): Promise<ThreadRow[]> {
	const { db } = resolve(context);
	return db.select().from(swapThreads).where(eq(swapThreads.listingId, listingId)).orderBy(asc(swapThreads.id));
}

/**
 * A listing is withdrawn: each member still waiting for an answer, or reserved through it (as the
 * listing stood `before`), gets `text` in their conversation and a `kind` mail.
 */
export async function tellThoseWaiting(
	before: Listing,
	listing: ListingRow,
	o: { senderId: string | null; text: string; kind: NoticeKind; actorName: string },
	context: Context = {}
): Promise<void> {
	const { now } = resolve(context);
	for (const t of await threadsOf(listing.id, context)) {
		const status = conversationStatus(before, String(t.id), now);
		if (status !== 'waiting' && status !== 'accepted') continue;
		await note(t, o.senderId, t.requesterId, o.text, context);
		await tell(t.requesterId, o.kind, { threadId: t.id, listing, actorName: o.actorName }, context);
	}
}
