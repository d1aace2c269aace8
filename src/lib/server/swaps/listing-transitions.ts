// The members' steps with a listing: the owner accepts a request, releases a reservation, extends
// or withdraws the listing; either member of the reserved swap confirms the handover. Each goes
// through the pure state machine, with the notes and mail it causes, in one transaction.
import { eq } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import { nameOf } from '../../club/names';
import { DomainError, notFound } from '../../errors';
import { transition, type Actor, type ListingAction, type ListingState, type TransitionResult } from '../../swaps/listing-state';
import { conversationStatus } from '../../swaps/conversation';
import { refusalMessage } from '../../swaps/restrictions';
import { swapThreads } from './schema';
import { canView, lockedRowOf, saveTransition, toPure } from './listings';
import { note, tell, tellThoseWaiting, threadsOf } from './listing-notices';
import * as restricted from './restricted';
import * as blocks from './blocks';

const LISTING_NOT_FOUND = 'We could not find that listing.';
const CONVERSATION_NOT_FOUND = 'We could not find that conversation.';

const member = (viewer: Pick<Viewer, 'id'>): Actor => ({ kind: 'member', userId: viewer.id });

function refused(result: Extract<TransitionResult, { ok: false }>): DomainError {
	// Someone who is not a party learns nothing more than that there is nothing here for them.
	if (result.error.code === 'not-owner' || result.error.code === 'not-a-party') return notFound(LISTING_NOT_FOUND);
	return new DomainError(result.error.code === 'bad-date' ? 400 : 409, result.error.code, result.error.message);
}

async function nameOfMember(id: string, context: Context): Promise<string> {
	return nameOf((await directory.names([id], context)).get(id));
}

export type OwnerAction = Extract<ListingAction, { type: 'withdraw' | 'release' | 'confirm-handover' | 'extend' }>;

/**
 * An action of the owner (withdraw, release, extend) or of either member of the reserved swap
 * (confirm the handover), with the notes and mail it causes.
 */
export async function act(viewer: Viewer, id: number, action: OwnerAction, context: Context = {}): Promise<ListingState> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const row = await lockedRowOf(id, inTx);
		if (!row || !canView(viewer, row)) throw notFound(LISTING_NOT_FOUND);
		const before = toPure(row);
		const result = transition(before, action, member(viewer), now);
		if (!result.ok) throw refused(result);
		await saveTransition(result, '', inTx);
		const actorName = await nameOfMember(viewer.id, inTx);
		if (action.type === 'withdraw') {
			await tellThoseWaiting(
				before,
				row,
				{ senderId: viewer.id, text: `${actorName} withdrew this listing, so it will not go ahead.`, kind: 'withdrawn', actorName },
				inTx
			);
			return result.listing.state;
		}
		const threads = await threadsOf(id, inTx);
		const reservedThread = threads.find((t) => String(t.id) === before.reservation?.requestId);
		if (action.type === 'release' && reservedThread) {
			await note(reservedThread, viewer.id, reservedThread.requesterId, `${actorName} released the reservation; the listing is open for requests again.`, inTx);
			await tell(reservedThread.requesterId, 'released', { threadId: reservedThread.id, listing: row, actorName }, inTx);
			if (result.listing.state === 'open') {
				for (const t of threads) {
					if (t.id !== reservedThread.id) await note(t, viewer.id, t.requesterId, 'The listing is open for requests again.', inTx);
				}
			}
		} else if (action.type === 'confirm-handover' && reservedThread) {
			const otherId = viewer.id === row.ownerId ? reservedThread.requesterId : row.ownerId;
			const done = result.listing.state === 'handed-over';
			const text = done
				? `${actorName} confirmed the handover too: the swap is complete.`
				: `${actorName} confirmed the handover. Please confirm it too once it has changed hands.`;
			await note(reservedThread, viewer.id, otherId, text, inTx);
			await tell(otherId, done ? 'handed-over' : 'confirmed-by-other', { threadId: reservedThread.id, listing: row, actorName }, inTx);
		}
		return result.listing.state;
	});
}

/**
 * The owner accepts one request: the listing is reserved for its member, who is told; every
 * other member waiting for an answer is told politely that it went to someone else.
 */
export async function accept(viewer: Viewer, threadId: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const [thread] = await tx.select().from(swapThreads).where(eq(swapThreads.id, threadId));
		if (!thread) throw notFound(CONVERSATION_NOT_FOUND);
		const row = await lockedRowOf(thread.listingId, inTx);
		if (!row || row.ownerId !== viewer.id) throw notFound(CONVERSATION_NOT_FOUND);
		await blocks.assertMayWrite(viewer.id, thread.requesterId, inTx);
		const assessment = await restricted.assessOne(row.speciesId, inTx);
		if (assessment.banned.length) throw new DomainError(409, 'banned', assessment.banned.map(refusalMessage).join(' '));
		const before = toPure(row);
		const result = transition(before, { type: 'accept', requestId: String(thread.id), requesterId: thread.requesterId }, member(viewer), now);
		if (!result.ok) throw refused(result);
		await saveTransition(result, '', inTx);
		const actorName = await nameOfMember(viewer.id, inTx);
		await note(thread, viewer.id, thread.requesterId, `${actorName} accepted this request. Agree a day, a time and a public meeting place below.`, inTx);
		await tell(thread.requesterId, 'accepted', { threadId: thread.id, listing: row, actorName }, inTx);
		for (const other of await threadsOf(row.id, inTx)) {
			if (other.id === thread.id || conversationStatus(before, String(other.id), now) !== 'waiting') continue;
			await note(other, viewer.id, other.requesterId, `${actorName} accepted another request this time. Thank you for asking.`, inTx);
			await tell(other.requesterId, 'not-chosen', { threadId: other.id, listing: row, actorName }, inTx);
		}
	});
}
