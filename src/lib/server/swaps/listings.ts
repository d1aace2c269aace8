// A swap listing's stored row, who may see it, and how a change of its state is written. Every
// read of a listing takes the viewer and goes through canView, so who may see a listing (and its
// photos) is decided here and nowhere else: any signed-in member, and once withdrawn its owner
// only. State changes go through the pure state machine in $lib/swaps/listing-state and are
// recorded in listing_event with who and when (saveTransition).
//
// The listing's jobs live beside this file: listing-cards (lists), listing-detail (its page),
// listing-edits (create, change), listing-transitions (the members' steps), listing-notices (what
// members are told), moderation (admins), expiry (the periodic job), nearby (the board's search).
import { eq } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import type { Listing, ListingEvent, TransitionResult } from '../../swaps/listing-state';
import { listingEvents, listings, type ListingRow } from './schema';

export type { ListingRow };

/** The stored row as the pure state machine sees it. */
export function toPure(row: ListingRow): Listing {
	return {
		id: String(row.id),
		ownerId: row.ownerId,
		kind: row.kind,
		category: row.category,
		state: row.state,
		availableUntil: row.availableUntil,
		reservation:
			row.reservedThreadId !== null && row.reservedRequesterId !== null && row.reservedAt !== null
				? {
						requestId: String(row.reservedThreadId),
						requesterId: row.reservedRequesterId,
						acceptedAt: row.reservedAt,
						ownerConfirmedAt: row.ownerConfirmedAt,
						requesterConfirmedAt: row.requesterConfirmedAt
					}
				: null
	};
}

/** Who may see a listing: signed-in members; once withdrawn, its owner only. */
export function canView(viewer: Pick<Viewer, 'id'> | null | undefined, row: Pick<ListingRow, 'ownerId' | 'state'>): boolean {
	if (!viewer) return false;
	return row.state !== 'withdrawn' || row.ownerId === viewer.id;
}

/** The stored row, whoever asks (callers decide visibility with canView). */
export async function rowOf(id: number, context: Context = {}): Promise<ListingRow | undefined> {
	const { db } = resolve(context);
	const [row] = await db.select().from(listings).where(eq(listings.id, id));
	return row;
}

/** The stored row, locked for a change until the caller's transaction ends. */
export async function lockedRowOf(id: number, context: Context = {}): Promise<ListingRow | undefined> {
	const { db } = resolve(context);
	const [row] = await db.select().from(listings).where(eq(listings.id, id)).for('update');
	return row;
}

/** Writes a transition's new state and its event, with a note such as an admin's reason. */
export async function saveTransition(result: Extract<TransitionResult, { ok: true }>, note: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const l = result.listing;
	await db
		.update(listings)
		.set({
			state: l.state,
			availableUntil: l.availableUntil,
			reservedThreadId: l.reservation ? Number(l.reservation.requestId) : null,
			reservedRequesterId: l.reservation?.requesterId ?? null,
			reservedAt: l.reservation?.acceptedAt ?? null,
			ownerConfirmedAt: l.reservation?.ownerConfirmedAt ?? null,
			requesterConfirmedAt: l.reservation?.requesterConfirmedAt ?? null,
			updatedAt: result.event.at
		})
		.where(eq(listings.id, Number(l.id)));
	const event: ListingEvent = result.event;
	await db.insert(listingEvents).values({
		listingId: Number(event.listingId),
		action: event.action,
		actorId: event.actorId,
		fromState: event.from,
		toState: event.to,
		requesterId: event.requesterId,
		note,
		at: event.at
	});
}

/** Media access for scope 'listing': the listing's own visibility. */
export async function photoAudience(viewer: Viewer | null, listingId: number, context: Context = {}): Promise<'public' | 'restricted' | null> {
	const row = await rowOf(listingId, context);
	if (!row || !canView(viewer, row)) return null;
	return 'restricted';
}
