// Listings as lists show them (the board, My swaps, a member's profile): a card each, built for a
// whole page at once. The names a card shows (owner, pickup area, species) and its first photo
// come from their own domains in one batch per page, so a page costs the same queries as a card.
import { and, count, desc, eq, gt, inArray, isNull, sql } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as catalogue from '../species/catalogue';
import * as media from '../media';
import { nameOf } from '../../club/names';
import { effectiveState, isReservationOverdue, type ListingState } from '../../swaps/listing-state';
import type { ListingCategory, ListingKind } from '../../swaps/listing';
import type { ListingCard } from '../../swaps/listing-card';
import { formatQuantity, type Quantity } from '../../swaps/quantity';
import { describeTerms, type ListingTerms } from '../../swaps/terms';
import { pickupLabel } from '../../swaps/places';
import { listings, swapMessages, swapThreads } from './schema';
import * as restricted from './restricted';
import * as blocks from './blocks';

/** The listing's own columns a card is made of. */
export const cardColumns = {
	id: listings.id,
	kind: listings.kind,
	category: listings.category,
	title: listings.title,
	speciesId: listings.speciesId,
	speciesName: listings.speciesName,
	quantityAmount: listings.quantityAmount,
	quantityUnit: listings.quantityUnit,
	terms: listings.terms,
	termsNote: listings.termsNote,
	pickupAreaId: listings.pickupAreaId,
	pickupNear: listings.pickupNear,
	state: listings.state,
	availableUntil: listings.availableUntil,
	createdAt: listings.createdAt,
	ownerId: listings.ownerId
};

export interface CardRow {
	id: number;
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesId: number | null;
	speciesName: string;
	quantityAmount: number;
	quantityUnit: Quantity['unit'];
	terms: ListingTerms;
	termsNote: string;
	pickupAreaId: number | null;
	pickupNear: boolean;
	state: ListingState;
	availableUntil: Date;
	createdAt: Date;
	ownerId: string;
}

const ids = <T>(values: (T | null)[]) => values.filter((v): v is T => v !== null);

/** Cards for selected rows, in their order: names, first photo, and how the club's restrictions see them. */
export async function toCards(rows: CardRow[], viewer: Pick<Viewer, 'id'>, context: Context = {}): Promise<ListingCard[]> {
	if (rows.length === 0) return [];
	const { now } = resolve(context);
	const speciesIds = ids(rows.map((r) => r.speciesId));
	const [photos, assessed, owners, areas, species] = await Promise.all([
		media.listForMany(
			'listing',
			rows.map((r) => r.id),
			context
		),
		restricted.assessMany(speciesIds, context),
		directory.names(
			rows.map((r) => r.ownerId),
			context
		),
		directory.areaNames(ids(rows.map((r) => r.pickupAreaId)), context),
		catalogue.getMany(speciesIds, context)
	]);
	return rows.map((r) => {
		const photo = photos.get(r.id)?.[0];
		const a = r.speciesId === null ? undefined : assessed.get(r.speciesId);
		return {
			id: r.id,
			kind: r.kind,
			category: r.category,
			title: r.title,
			speciesName: r.speciesName,
			commonName: (r.speciesId !== null && species.get(r.speciesId)?.commonName) || null,
			quantityText: formatQuantity({ amount: r.quantityAmount, unit: r.quantityUnit }),
			termsText: describeTerms(r.terms, r.termsNote),
			pickupLabel: pickupLabel(r.pickupAreaId === null ? null : (areas.get(r.pickupAreaId) ?? null), r.pickupNear),
			state: effectiveState(r, now),
			availableUntil: r.availableUntil,
			createdAt: r.createdAt,
			ownerId: r.ownerId,
			ownerName: nameOf(owners.get(r.ownerId)),
			mine: r.ownerId === viewer.id,
			photo: photo ? { url: photo.urls.thumb, alt: photo.alt } : null,
			restriction: a?.banned.length ? 'banned' : a?.cautioned.length ? 'cautioned' : null
		};
	});
}

export interface OwnListing extends ListingCard {
	requests: number;
	unread: number;
	/** Reserved past its date: the owner should confirm the handover or release it. */
	overdue: boolean;
}

const STATE_ORDER = sql`CASE ${listings.state} WHEN 'reserved' THEN 0 WHEN 'open' THEN 1 ELSE 2 END`;

/** The viewer's own listings, reserved and open first, with how many requests and unread messages each has. */
export async function listOwn(viewer: Viewer, context: Context = {}): Promise<OwnListing[]> {
	const { db, now } = resolve(context);
	const rows = await db
		.select(cardColumns)
		.from(listings)
		.where(eq(listings.ownerId, viewer.id))
		.orderBy(STATE_ORDER, desc(listings.createdAt), desc(listings.id))
		.limit(200);
	const listingIds = rows.map((r) => r.id);
	const [requestCounts, unreadCounts, cards] = await Promise.all([
		listingIds.length
			? db
					.select({ listingId: swapThreads.listingId, n: count() })
					.from(swapThreads)
					.where(inArray(swapThreads.listingId, listingIds))
					.groupBy(swapThreads.listingId)
			: [],
		listingIds.length
			? db
					.select({ listingId: swapThreads.listingId, n: count() })
					.from(swapMessages)
					.innerJoin(swapThreads, eq(swapThreads.id, swapMessages.threadId))
					.where(and(inArray(swapThreads.listingId, listingIds), eq(swapMessages.recipientId, viewer.id), isNull(swapMessages.readAt)))
					.groupBy(swapThreads.listingId)
			: [],
		toCards(rows, viewer, { db, now })
	]);
	const requests = new Map(requestCounts.map((r) => [r.listingId, r.n]));
	const unread = new Map(unreadCounts.map((r) => [r.listingId, r.n]));
	return cards.map((c) => ({ ...c, requests: requests.get(c.id) ?? 0, unread: unread.get(c.id) ?? 0, overdue: isReservationOverdue(c, now) }));
}

/** Another member's listings open now, for their profile; none when the viewer has blocked them. */
export async function listOpenOf(viewer: Viewer, ownerId: string, context: Context = {}): Promise<ListingCard[]> {
	const { db, now } = resolve(context);
	if (ownerId !== viewer.id && (await blocks.between(viewer.id, ownerId, { db })).aBlockedB) return [];
	const rows = await db
		.select(cardColumns)
		.from(listings)
		.where(and(eq(listings.ownerId, ownerId), eq(listings.state, 'open'), gt(listings.availableUntil, now)))
		.orderBy(desc(listings.createdAt), desc(listings.id))
		.limit(50);
	return toCards(rows, viewer, { db, now });
}
