// The life of a listing:
//   open        → reserved (the owner accepts a request), withdrawn, or expired (its "available
//                 until" passes: no write needed, see effectiveState)
//   reserved    → handed-over (both sides confirm), open (the owner releases it; expired if the
//                 date has passed meanwhile), or withdrawn
//   expired     → open (the owner extends the date)
//   handed-over and withdrawn are final.
//
// Only the owner changes the state. The one thing the other side does is confirm the handover:
// it takes both confirmations, in either order, so neither can close the swap alone.

import { formatDate } from '../format';
import { checkAvailableUntil, type ListingCategory, type ListingKind } from './listing';

export const LISTING_STATES = ['open', 'reserved', 'handed-over', 'withdrawn', 'expired'] as const;
export type ListingState = (typeof LISTING_STATES)[number];

/** The accepted request while a listing is reserved, and each side's confirmation of the handover. */
export interface Reservation {
	requestId: string;
	requesterId: string;
	acceptedAt: Date;
	ownerConfirmedAt: Date | null;
	requesterConfirmedAt: Date | null;
}

export interface Listing {
	id: string;
	ownerId: string;
	kind: ListingKind;
	category: ListingCategory;
	/** As stored; read it through effectiveState, since expiry happens without a write. */
	state: ListingState;
	availableUntil: Date;
	/** Set while reserved; kept on a handed-over listing as the record of who received it. */
	reservation: Reservation | null;
}

export type ListingAction =
	| { type: 'accept'; requestId: string; requesterId: string }
	| { type: 'release' }
	| { type: 'confirm-handover' }
	| { type: 'withdraw' }
	| { type: 'extend'; availableUntil: Date }
	| { type: 'expire' };

export type ListingActionType = ListingAction['type'];

/** A signed-in member, or the scheduled job that records expiry. */
export type Actor = { kind: 'member'; userId: string } | { kind: 'system' };

export interface ListingEvent {
	listingId: string;
	action: ListingActionType;
	/** null for the system. */
	actorId: string | null;
	at: Date;
	from: ListingState;
	to: ListingState;
	/** The member whose request the event concerns (accepted, released, cancelled by withdrawal, confirmed). */
	requesterId: string | null;
}

export type TransitionErrorCode =
	'not-owner' | 'not-a-party' | 'system-only' | 'own-request' | 'already-reserved' | 'not-reserved' | 'closed' | 'already-confirmed' | 'not-due' | 'bad-date';

export interface TransitionError {
	code: TransitionErrorCode;
	/** A sentence for the member. */
	message: string;
}

export type TransitionResult = { ok: true; listing: Listing; event: ListingEvent } | { ok: false; error: TransitionError };

/**
 * The state as members see it. An open listing whose "available until" has passed is expired,
 * whether or not the expiry job has written that yet. A reserved listing does not expire: the
 * owner accepted a request and a pickup is agreed, and a date passing should not cancel that
 * behind both members' backs. The owner confirms the handover or releases the reservation, and a
 * released listing past its date becomes expired then.
 */
export function effectiveState(listing: Pick<Listing, 'state' | 'availableUntil'>, now: Date): ListingState {
	return listing.state === 'open' && now.getTime() >= listing.availableUntil.getTime() ? 'expired' : listing.state;
}

/** A reservation that has run past the listing's date: its owner is asked to settle it (confirm the handover or release it). */
export function isReservationOverdue(listing: Pick<Listing, 'state' | 'availableUntil'>, now: Date): boolean {
	return listing.state === 'reserved' && now.getTime() >= listing.availableUntil.getTime();
}

const fail = (code: TransitionErrorCode, message: string): TransitionResult => ({ ok: false, error: { code, message } });

function closedMessage(state: ListingState, listing: Listing): string {
	if (state === 'handed-over') return 'This listing has already been handed over.';
	if (state === 'withdrawn') return 'This listing has been withdrawn.';
	return `This listing expired on ${formatDate(listing.availableUntil)}.`;
}

const isClosed = (s: ListingState) => s === 'handed-over' || s === 'withdrawn' || s === 'expired';

/**
 * Whether `actor` may take an action of this type on the listing now, judged on who they are and
 * the listing's state alone (the action's own details, such as a date, are checked by transition).
 * Returns null when allowed.
 */
export function checkAction(listing: Listing, type: ListingActionType, actor: Actor, now: Date): TransitionError | null {
	const state = effectiveState(listing, now);
	const actorId = actor.kind === 'member' ? actor.userId : null;
	const isOwner = actorId !== null && actorId === listing.ownerId;
	const error = (code: TransitionErrorCode, message: string): TransitionError => ({ code, message });
	const notOwner = error('not-owner', 'Only the member who posted this listing can do that.');
	const closed = error('closed', closedMessage(state, listing));
	switch (type) {
		case 'accept':
			if (!isOwner) return notOwner;
			if (state === 'reserved')
				return error('already-reserved', 'This listing is already reserved. Release that reservation before accepting another request.');
			return isClosed(state) ? closed : null;
		case 'release':
			if (!isOwner) return notOwner;
			if (state === 'open') return error('not-reserved', 'This listing is not reserved.');
			return isClosed(state) ? closed : null;
		case 'confirm-handover': {
			// The reservation stays on a handed-over listing, so its requester hears "closed", not "not a party".
			const isRequester = actorId !== null && listing.reservation?.requesterId === actorId;
			if (!isOwner && !isRequester) return error('not-a-party', 'Only the two members of this swap can confirm the handover.');
			if (state === 'open') return error('not-reserved', 'Nothing to confirm yet: no request has been accepted.');
			if (isClosed(state) || !listing.reservation) return closed;
			const field = isOwner ? 'ownerConfirmedAt' : 'requesterConfirmedAt';
			return listing.reservation[field] ? error('already-confirmed', 'You have already confirmed this handover.') : null;
		}
		case 'withdraw':
			if (!isOwner) return notOwner;
			return isClosed(state) ? closed : null;
		case 'extend':
			if (!isOwner) return notOwner;
			return state === 'handed-over' || state === 'withdrawn' ? closed : null;
		case 'expire':
			if (actor.kind !== 'system') return error('system-only', 'Listings expire by themselves when their date passes.');
			if (listing.state === 'reserved') return error('not-due', 'A reserved listing does not expire while a pickup is agreed.');
			if (listing.state !== 'open') return error('closed', closedMessage(listing.state, listing));
			return state === 'expired' ? null : error('not-due', `This listing is available until ${formatDate(listing.availableUntil)}.`);
	}
}

/**
 * Applies one action, returning the new listing and an event to store, or why it is refused.
 * Pure: `now` is passed in. The event's `from` is the effective state (so a lapsed open listing
 * reads as expired), except for 'expire', which records the write from the stored 'open'.
 */
export function transition(listing: Listing, action: ListingAction, actor: Actor, now: Date): TransitionResult {
	const refused = checkAction(listing, action.type, actor, now);
	if (refused) return { ok: false, error: refused };
	const state = effectiveState(listing, now);
	const actorId = actor.kind === 'member' ? actor.userId : null;
	const requesterId = listing.reservation?.requesterId ?? null;
	const done = (to: ListingState, changes: Partial<Listing>, concerns: string | null): TransitionResult => ({
		ok: true,
		listing: { ...listing, ...changes, state: to },
		event: { listingId: listing.id, action: action.type, actorId, at: now, from: action.type === 'expire' ? listing.state : state, to, requesterId: concerns }
	});

	switch (action.type) {
		case 'accept': {
			if (action.requesterId === listing.ownerId) return fail('own-request', 'You cannot accept a request from yourself.');
			const reservation: Reservation = {
				requestId: action.requestId,
				requesterId: action.requesterId,
				acceptedAt: now,
				ownerConfirmedAt: null,
				requesterConfirmedAt: null
			};
			return done('reserved', { reservation }, action.requesterId);
		}
		case 'release':
			return done(now.getTime() >= listing.availableUntil.getTime() ? 'expired' : 'open', { reservation: null }, requesterId);
		case 'confirm-handover': {
			const reservation = listing.reservation!;
			const field = actorId === listing.ownerId ? 'ownerConfirmedAt' : 'requesterConfirmedAt';
			const updated: Reservation = { ...reservation, [field]: now };
			const both = updated.ownerConfirmedAt !== null && updated.requesterConfirmedAt !== null;
			return done(both ? 'handed-over' : 'reserved', { reservation: updated }, requesterId);
		}
		case 'withdraw':
			// A reservation is cancelled with the listing; the event names the requester so they can be told.
			return done('withdrawn', { reservation: null }, requesterId);
		case 'extend': {
			const problem = checkAvailableUntil(action.availableUntil, now);
			if (problem) return fail('bad-date', problem);
			// Extending an expired listing puts it back on the board; a reserved one stays reserved.
			return done(state === 'reserved' ? 'reserved' : 'open', { availableUntil: action.availableUntil }, requesterId);
		}
		case 'expire':
			return done('expired', {}, null);
	}
}

/** The action types `actor` may take now, for showing only the buttons that will work. */
export function availableActions(listing: Listing, actor: Actor, now: Date): ListingActionType[] {
	const types: ListingActionType[] = ['accept', 'release', 'confirm-handover', 'withdraw', 'extend', 'expire'];
	return types.filter((t) => checkAction(listing, t, actor, now) === null);
}
