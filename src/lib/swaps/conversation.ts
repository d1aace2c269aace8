// Where one conversation (a request, or an answer to a wanted post) stands, worked out from its
// listing rather than stored, so it can never disagree with the listing's state.
import { effectiveState, type Listing, type ListingEvent, type TransitionResult } from './listing-state';

export const CONVERSATION_STATUSES = ['waiting', 'accepted', 'handed-over', 'not-chosen', 'closed'] as const;
export type ConversationStatus = (typeof CONVERSATION_STATUSES)[number];

export function conversationStatus(listing: Listing, threadId: string, now: Date): ConversationStatus {
	const state = effectiveState(listing, now);
	const chosen = listing.reservation?.requestId === threadId;
	if (state === 'open') return 'waiting';
	if (state === 'reserved') return chosen ? 'accepted' : 'not-chosen';
	if (state === 'handed-over') return chosen ? 'handed-over' : 'not-chosen';
	return 'closed';
}

/** Who a note from the site (rather than from a member) is shown as coming from. */
export const SITE_SENDER = 'Riparia';

/** Whether the two members may still write: not once another request was chosen or the listing closed. */
export const canWrite = (status: ConversationStatus) => status === 'waiting' || status === 'accepted' || status === 'handed-over';

/** Pickup times are agreed only in the conversation whose request was accepted, while reserved. */
export const canArrangePickup = (status: ConversationStatus) => status === 'accepted';

export const CONVERSATION_STATUS_LABELS: Readonly<Record<ConversationStatus, string>> = {
	waiting: 'Waiting for an answer',
	accepted: 'Accepted: agree a pickup',
	'handed-over': 'Handed over',
	'not-chosen': 'Another request was accepted',
	closed: 'The listing has closed'
};

/**
 * The chips at the top of a conversation: the listing's state, then where this conversation stands,
 * leaving out the listing's when it says the same ("Handed over" twice).
 */
export function statusChips(listingStateLabel: string, status: ConversationStatus): string[] {
	const own = CONVERSATION_STATUS_LABELS[status];
	return listingStateLabel === own ? [own] : [listingStateLabel, own];
}

/**
 * An admin withdrawing a listing after a report. Outside the members' state machine (only owners
 * withdraw there): allowed unless the listing is already handed over or withdrawn, and recorded
 * with the admin as the actor. A reservation is cancelled with it.
 */
export function moderatorWithdraw(listing: Listing, adminId: string, now: Date): TransitionResult {
	if (listing.state === 'handed-over' || listing.state === 'withdrawn') {
		return {
			ok: false,
			error: { code: 'closed', message: listing.state === 'handed-over' ? 'This listing has already been handed over.' : 'This listing has been withdrawn.' }
		};
	}
	const event: ListingEvent = {
		listingId: listing.id,
		action: 'withdraw',
		actorId: adminId,
		at: now,
		from: effectiveState(listing, now),
		to: 'withdrawn',
		requesterId: listing.reservation?.requesterId ?? null
	};
	return { ok: true, listing: { ...listing, state: 'withdrawn', reservation: null }, event };
}
