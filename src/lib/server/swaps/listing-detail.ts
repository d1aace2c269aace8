// One listing with everything its page shows, and its history for the owner.
import { desc, eq } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as suspension from '../club/suspension';
import { hasRole } from '../../club/roles';
import * as catalogue from '../species/catalogue';
import * as tanks from '../journals/tanks';
import * as media from '../media';
import type { Photo } from '../media';
import { nameOf } from '../../club/names';
import { effectiveState, type Listing, type ListingState } from '../../swaps/listing-state';
import { CATEGORY_CAUTIONS, type ListingCategory, type ListingKind } from '../../swaps/listing';
import { formatQuantity, type Quantity } from '../../swaps/quantity';
import { describeTerms, type ListingTerms } from '../../swaps/terms';
import { pickupLabel } from '../../swaps/places';
import type { Assessment } from '../../swaps/restrictions';
import { listingEvents } from './schema';
import { canView, rowOf, toPure, type ListingRow } from './listings';
import * as restricted from './restricted';
import { storedHtml } from '../markdown';

export interface ListingDetail {
	id: number;
	ownerId: string;
	ownerName: string;
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesId: number | null;
	speciesName: string;
	commonName: string | null;
	quantity: Quantity;
	quantityText: string;
	conditionNote: string;
	description: string;
	/** The description rendered (stored when it was written). */
	descriptionHtml: string;
	terms: ListingTerms;
	termsNote: string;
	termsText: string;
	pickupAreaId: number | null;
	pickupLabel: string;
	/** The tank it came from, only when the viewer may see that tank (its owner always may). */
	tank: { id: number; name: string } | null;
	/** As members see it (a lapsed open listing is expired). */
	state: ListingState;
	availableUntil: Date;
	createdAt: Date;
	updatedAt: Date | null;
	reservedRequesterId: string | null;
	reservedRequesterName: string | null;
	ownerConfirmedAt: Date | null;
	requesterConfirmedAt: Date | null;
	photos: Photo[];
	restrictions: Assessment;
	cautions: readonly string[];
	pure: Listing;
}

async function detail(viewer: Viewer | null, row: ListingRow, context: Context): Promise<ListingDetail> {
	const { db, now } = resolve(context);
	const people = [row.ownerId, ...(row.reservedRequesterId === null ? [] : [row.reservedRequesterId])];
	const [names, areas, speciesRow, photos, restrictions, tank] = await Promise.all([
		directory.names(people, { db }),
		directory.areaNames(row.pickupAreaId === null ? [] : [row.pickupAreaId], { db }),
		row.speciesId === null ? undefined : catalogue.get(row.speciesId, { db }),
		media.listFor('listing', row.id, { db }),
		restricted.assessOne(row.speciesId, { db }),
		// The journals decide who may see the tank; anyone else learns nothing of it, not even its id.
		row.tankId === null ? null : tanks.get(viewer, row.tankId, { db })
	]);
	const pure = toPure(row);
	return {
		id: row.id,
		ownerId: row.ownerId,
		ownerName: nameOf(names.get(row.ownerId)),
		kind: row.kind,
		category: row.category,
		title: row.title,
		speciesId: row.speciesId,
		speciesName: row.speciesName,
		commonName: speciesRow?.commonName || null,
		quantity: { amount: row.quantityAmount, unit: row.quantityUnit },
		quantityText: formatQuantity({ amount: row.quantityAmount, unit: row.quantityUnit }),
		conditionNote: row.conditionNote,
		description: row.description ?? '',
		descriptionHtml: storedHtml(row.descriptionHtml, row.description),
		terms: row.terms,
		termsNote: row.termsNote,
		termsText: describeTerms(row.terms, row.termsNote),
		pickupAreaId: row.pickupAreaId,
		pickupLabel: pickupLabel(row.pickupAreaId === null ? null : (areas.get(row.pickupAreaId) ?? null), row.pickupNear),
		tank: tank ? { id: tank.id, name: tank.name } : null,
		state: effectiveState(pure, now),
		availableUntil: row.availableUntil,
		createdAt: row.createdAt,
		updatedAt: row.updatedAt,
		reservedRequesterId: row.reservedRequesterId,
		reservedRequesterName: row.reservedRequesterId === null ? null : nameOf(names.get(row.reservedRequesterId)),
		ownerConfirmedAt: row.ownerConfirmedAt,
		requesterConfirmedAt: row.requesterConfirmedAt,
		photos,
		restrictions,
		cautions: CATEGORY_CAUTIONS[row.category],
		pure
	};
}

/** A listing with everything its page shows, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, context: Context = {}): Promise<ListingDetail | null> {
	const row = await rowOf(id, context);
	if (!row || !canView(viewer, row)) return null;
	// A suspended member's listing is hidden from everyone but admins (and stays for reinstatement).
	if (!hasRole(viewer, 'admin') && (await suspension.suspendedAmong([row.ownerId], context)).size) return null;
	return detail(viewer, row, context);
}

/** The listing for its owner's edit form; null for anyone else. */
export async function getOwn(viewer: Viewer, id: number, context: Context = {}): Promise<ListingDetail | null> {
	const row = await rowOf(id, context);
	if (!row || row.ownerId !== viewer.id) return null;
	return detail(viewer, row, context);
}

export interface HistoryEvent {
	action: string;
	fromState: ListingState | null;
	toState: ListingState;
	at: Date;
	note: string;
	/** null for the expiry job. */
	actorId: string | null;
	actorName: string | null;
}

/** The events of a listing, newest first, for its owner's history. */
export async function history(viewer: Viewer, id: number, context: Context = {}): Promise<HistoryEvent[]> {
	const { db } = resolve(context);
	const row = await rowOf(id, { db });
	if (!row || row.ownerId !== viewer.id) return [];
	const events = await db
		.select({
			action: listingEvents.action,
			fromState: listingEvents.fromState,
			toState: listingEvents.toState,
			at: listingEvents.at,
			note: listingEvents.note,
			actorId: listingEvents.actorId
		})
		.from(listingEvents)
		.where(eq(listingEvents.listingId, id))
		.orderBy(desc(listingEvents.at), desc(listingEvents.id));
	const names = await directory.names(
		events.flatMap((e) => (e.actorId === null ? [] : [e.actorId])),
		{ db }
	);
	return events.map((e) => ({ ...e, actorName: e.actorId === null ? null : nameOf(names.get(e.actorId)) }));
}
