// Swap listings. Every read takes the viewer and goes through canView, so who may see a listing
// (and its photos, see ../media/access.ts) is decided here and nowhere else: any signed-in member,
// and once withdrawn its owner only. State changes go through the pure state machine in
// $lib/swaps/listing-state and are recorded in listing_event with who and when.
import { and, asc, count, desc, eq, inArray, lte, or, sql } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { clubAreas, users } from '../club/schema';
import { auditLog } from '../audit/schema';
import type { Viewer } from '../club/users';
import * as areas from '../club/areas';
import * as media from '../media';
import type { Photo, Purge } from '../media';
import * as tanks from '../journals/tanks';
import { species } from '../species/schema';
import type { PhotoField } from '../../media/form';
import {
	effectiveState,
	transition,
	type Actor,
	type Listing,
	type ListingAction,
	type ListingEvent,
	type ListingState,
	type TransitionResult
} from '../../swaps/listing-state';
import { CATEGORY_CAUTIONS, type ListingCategory, type ListingKind } from '../../swaps/listing';
import { formatQuantity, type Quantity } from '../../swaps/quantity';
import { describeTerms, type ListingTerms } from '../../swaps/terms';
import { hasSpecies, LISTING_PHOTOS_MAX, speciesKindFor, type ListingInput } from '../../swaps/listing-form';
import { conversationStatus, moderatorWithdraw as moderatorTransition } from '../../swaps/conversation';
import { nearestArea, pickupLabel } from '../../swaps/places';
import { refusalMessage, type Assessment } from '../../swaps/restrictions';
import type { DistanceLabel } from '../../swaps/display';
import { listingEvents, listings, swapMessages, swapThreads, type ListingRow, type ThreadRow } from './schema';
import * as restricted from './restricted';
import * as blocks from './blocks';
import { displayName, queueNotice } from './notifications';
import { noticeMail, type NoticeKind } from './mail';
import { notFound, SwapError } from './errors';

export type { ListingRow };

interface Options {
	now?: Date;
	database?: DbOrTx;
}

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

export const isOwner = (viewer: Pick<Viewer, 'id'> | null | undefined, row: Pick<ListingRow, 'ownerId'>) => !!viewer && viewer.id === row.ownerId;

async function rowOf(id: number, tx: DbOrTx, lock = false): Promise<ListingRow | undefined> {
	const query = tx.select().from(listings).where(eq(listings.id, id));
	const [row] = lock ? await query.for('update') : await query;
	return row;
}

/** What a list (the board, My swaps, a profile) shows of a listing. */
export interface ListingCard {
	id: number;
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesName: string;
	commonName: string | null;
	quantityText: string;
	termsText: string;
	pickupLabel: string;
	state: ListingState;
	availableUntil: Date;
	createdAt: Date;
	ownerId: string;
	ownerName: string;
	mine: boolean;
	photo: { url: string; alt: string } | null;
	restriction: 'banned' | 'cautioned' | null;
	/** Only on the board, for a viewer with a location. */
	distance?: DistanceLabel | null;
}

/** Columns a card needs; join `users` (owner), `clubAreas` (pickup area) and `species` to use them. */
export const cardColumns = {
	id: listings.id,
	kind: listings.kind,
	category: listings.category,
	title: listings.title,
	speciesId: listings.speciesId,
	speciesName: listings.speciesName,
	commonName: species.commonName,
	quantityAmount: listings.quantityAmount,
	quantityUnit: listings.quantityUnit,
	terms: listings.terms,
	termsNote: listings.termsNote,
	areaName: clubAreas.name,
	pickupNear: listings.pickupNear,
	state: listings.state,
	availableUntil: listings.availableUntil,
	createdAt: listings.createdAt,
	ownerId: listings.ownerId,
	ownerName: users.displayName
};

export interface CardRow {
	id: number;
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesId: number | null;
	speciesName: string;
	commonName: string | null;
	quantityAmount: number;
	quantityUnit: Quantity['unit'];
	terms: ListingTerms;
	termsNote: string;
	areaName: string | null;
	pickupNear: boolean;
	state: ListingState;
	availableUntil: Date;
	createdAt: Date;
	ownerId: string;
	ownerName: string | null;
}

/** Turns selected rows into cards, with their first photo and how the club's restrictions see them. */
export async function toCards(rows: CardRow[], viewer: Pick<Viewer, 'id'>, now: Date, tx: DbOrTx = appDb): Promise<ListingCard[]> {
	const [photos, assessed] = await Promise.all([
		media.listForMany(
			'listing',
			rows.map((r) => r.id),
			tx
		),
		restricted.assessMany(
			rows.flatMap((r) => (r.speciesId === null ? [] : [r.speciesId])),
			tx
		)
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
			commonName: r.commonName || null,
			quantityText: formatQuantity({ amount: r.quantityAmount, unit: r.quantityUnit }),
			termsText: describeTerms(r.terms, r.termsNote),
			pickupLabel: pickupLabel(r.areaName, r.pickupNear),
			state: effectiveState({ state: r.state, availableUntil: r.availableUntil } as Listing, now),
			availableUntil: r.availableUntil,
			createdAt: r.createdAt,
			ownerId: r.ownerId,
			ownerName: r.ownerName ?? 'A member',
			mine: r.ownerId === viewer.id,
			photo: photo ? { url: photo.urls.thumb, alt: photo.alt } : null,
			restriction: a?.banned.length ? 'banned' : a?.cautioned.length ? 'cautioned' : null
		};
	});
}

const cardQuery = (tx: DbOrTx) =>
	tx
		.select(cardColumns)
		.from(listings)
		.innerJoin(users, eq(users.id, listings.ownerId))
		.leftJoin(clubAreas, eq(clubAreas.id, listings.pickupAreaId))
		.leftJoin(species, eq(species.id, listings.speciesId));

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
	terms: ListingTerms;
	termsNote: string;
	termsText: string;
	pickupAreaId: number | null;
	pickupLabel: string;
	tank: { id: number; name: string } | null;
	tankId: number | null;
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

async function detail(viewer: Viewer | null, row: ListingRow, now: Date, tx: DbOrTx): Promise<ListingDetail> {
	const [ownerRow, areaRow, speciesRow, requesterRow, photos, restrictions] = await Promise.all([
		tx.select({ displayName: users.displayName }).from(users).where(eq(users.id, row.ownerId)),
		row.pickupAreaId === null ? [] : tx.select({ name: clubAreas.name }).from(clubAreas).where(eq(clubAreas.id, row.pickupAreaId)),
		row.speciesId === null ? [] : tx.select({ commonName: species.commonName }).from(species).where(eq(species.id, row.speciesId)),
		row.reservedRequesterId === null ? [] : tx.select({ displayName: users.displayName }).from(users).where(eq(users.id, row.reservedRequesterId)),
		media.listFor('listing', row.id, tx),
		restricted.assessOne(row.speciesId, tx)
	]);
	const tank = row.tankId !== null ? await tanks.get(viewer, row.tankId, tx) : null;
	const pure = toPure(row);
	return {
		id: row.id,
		ownerId: row.ownerId,
		ownerName: displayName(ownerRow[0]),
		kind: row.kind,
		category: row.category,
		title: row.title,
		speciesId: row.speciesId,
		speciesName: row.speciesName,
		commonName: speciesRow[0]?.commonName || null,
		quantity: { amount: row.quantityAmount, unit: row.quantityUnit },
		quantityText: formatQuantity({ amount: row.quantityAmount, unit: row.quantityUnit }),
		conditionNote: row.conditionNote,
		description: row.description ?? '',
		terms: row.terms,
		termsNote: row.termsNote,
		termsText: describeTerms(row.terms, row.termsNote),
		pickupAreaId: row.pickupAreaId,
		pickupLabel: pickupLabel(areaRow[0]?.name ?? null, row.pickupNear),
		tank: tank ? { id: tank.id, name: tank.name } : null,
		tankId: row.tankId,
		state: effectiveState(pure, now),
		availableUntil: row.availableUntil,
		createdAt: row.createdAt,
		updatedAt: row.updatedAt,
		reservedRequesterId: row.reservedRequesterId,
		reservedRequesterName: requesterRow[0] ? displayName(requesterRow[0]) : null,
		ownerConfirmedAt: row.ownerConfirmedAt,
		requesterConfirmedAt: row.requesterConfirmedAt,
		photos,
		restrictions,
		cautions: CATEGORY_CAUTIONS[row.category],
		pure
	};
}

/** A listing with everything its page shows, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, options: Options = {}): Promise<ListingDetail | null> {
	const tx = options.database ?? appDb;
	const row = await rowOf(id, tx);
	if (!row || !canView(viewer, row)) return null;
	return detail(viewer, row, options.now ?? new Date(), tx);
}

/** The listing for its owner's edit form; null for anyone else. */
export async function getOwn(viewer: Viewer, id: number, options: Options = {}): Promise<ListingDetail | null> {
	const tx = options.database ?? appDb;
	const row = await rowOf(id, tx);
	if (!row || row.ownerId !== viewer.id) return null;
	return detail(viewer, row, options.now ?? new Date(), tx);
}

/**
 * Where a listing is: the owner's rounded point, or the pickup area's centre when they have not
 * set one; and the area to name it by (the chosen one, else their home area, else the nearest).
 */
async function placeFor(tx: DbOrTx, ownerId: string, pickupAreaId: number | null) {
	const [owner] = await tx.select({ homeLat: users.homeLat, homeLng: users.homeLng, homeAreaId: users.homeAreaId }).from(users).where(eq(users.id, ownerId));
	const all = await areas.list({ db: tx });
	const home = owner && owner.homeLat !== null && owner.homeLng !== null ? { lat: owner.homeLat, lng: owner.homeLng } : null;
	let area = pickupAreaId !== null ? all.find((a) => a.id === pickupAreaId) : undefined;
	if (pickupAreaId !== null && !area) throw new SwapError(400, 'no-area', 'That area no longer exists; choose another.', 'pickupAreaId');
	if (!area && owner?.homeAreaId) area = all.find((a) => a.id === owner.homeAreaId);
	if (!area && home) area = nearestArea(home, all) ?? undefined;
	const point = home ?? (area ? { lat: area.lat, lng: area.lng } : null);
	if (!point) throw new SwapError(400, 'no-place', 'Choose a pickup area, or set where you are on your account page.', 'pickupAreaId');
	return { point, pickupAreaId: area?.id ?? null, pickupNear: !!area && owner?.homeAreaId !== area.id };
}

/** The species a listing names, checked against the club's restricted list: banned ones are refused. */
async function checkedSpecies(tx: DbOrTx, input: ListingInput): Promise<{ speciesId: number | null; speciesName: string }> {
	if (!hasSpecies(input.category)) return { speciesId: null, speciesName: '' };
	const resolved = await restricted.resolveSpecies(input, speciesKindFor(input.category), tx);
	const assessment = await restricted.assessOne(resolved.speciesId, tx);
	if (assessment.banned.length) throw new SwapError(400, 'banned', assessment.banned.map(refusalMessage).join(' '), 'speciesName');
	return resolved;
}

async function checkedTank(viewer: Viewer, input: ListingInput, tx: DbOrTx): Promise<number | null> {
	if (input.kind !== 'offer' || input.tankId === null) return null;
	const tank = await tanks.getOwn(viewer, input.tankId, tx);
	if (!tank) throw new SwapError(400, 'no-tank', 'Choose one of your own tanks.', 'tankId');
	return tank.id;
}

function contentColumns(input: ListingInput, checked: { speciesId: number | null; speciesName: string }) {
	return {
		kind: input.kind,
		category: input.category,
		title: input.title,
		speciesId: checked.speciesId,
		speciesName: checked.speciesName,
		quantityAmount: input.quantity.amount,
		quantityUnit: input.quantity.unit,
		conditionNote: input.condition,
		description: input.description || null,
		terms: input.terms,
		termsNote: input.termsNote
	};
}

const eventValues = (event: ListingEvent, note = '') => ({
	listingId: Number(event.listingId),
	action: event.action,
	actorId: event.actorId,
	fromState: event.from,
	toState: event.to,
	requesterId: event.requesterId,
	note,
	at: event.at
});

/** Creates a listing for the viewer with its photos (pending uploads of theirs). */
export async function create(viewer: Viewer, input: ListingInput, photos: PhotoField[] = [], options: Options = {}): Promise<number> {
	const now = options.now ?? new Date();
	return (options.database ?? appDb).transaction(async (tx) => {
		const place = await placeFor(tx, viewer.id, input.pickupAreaId);
		const checked = await checkedSpecies(tx, input);
		const tankId = await checkedTank(viewer, input, tx);
		const [result] = await tx.insert(listings).values({
			...contentColumns(input, checked),
			ownerId: viewer.id,
			pickupAreaId: place.pickupAreaId,
			pickupNear: place.pickupNear,
			lat: place.point.lat,
			lng: place.point.lng,
			tankId,
			state: 'open',
			availableUntil: input.availableUntil,
			createdAt: now,
			updatedAt: now
		});
		const id = result.insertId;
		await tx.insert(listingEvents).values({ listingId: id, action: 'create', actorId: viewer.id, fromState: null, toState: 'open', at: now });
		await media.setPhotos(tx, viewer.id, 'listing', id, photos, { max: LISTING_PHOTOS_MAX, now });
		return id;
	});
}

/**
 * Saves the owner's changes. A new "available until" goes through the state machine as an
 * extension (so an expired listing opens again, recorded as such).
 */
export async function update(viewer: Viewer, id: number, input: ListingInput, photos: PhotoField[], options: Options = {}): Promise<void> {
	const now = options.now ?? new Date();
	const purge: Purge = await (options.database ?? appDb).transaction(async (tx) => {
		const row = await rowOf(id, tx, true);
		if (!row || row.ownerId !== viewer.id) throw notFound();
		const state = effectiveState(toPure(row), now);
		if (state === 'handed-over' || state === 'withdrawn')
			throw new SwapError(
				409,
				'closed',
				state === 'handed-over'
					? 'This listing has been handed over; it can no longer be changed.'
					: 'This listing has been withdrawn; it can no longer be changed.'
			);
		if (input.kind !== row.kind && state === 'reserved')
			throw new SwapError(409, 'reserved', 'A reserved listing cannot change between an offer and a wanted post.', 'kind');
		const place = await placeFor(tx, viewer.id, input.pickupAreaId);
		const checked = await checkedSpecies(tx, input);
		const tankId = await checkedTank(viewer, input, tx);
		await tx
			.update(listings)
			.set({ ...contentColumns(input, checked), pickupAreaId: place.pickupAreaId, pickupNear: place.pickupNear, tankId, updatedAt: now })
			.where(eq(listings.id, id));
		if (input.availableUntil.getTime() !== row.availableUntil.getTime()) {
			const result = transition(toPure(row), { type: 'extend', availableUntil: input.availableUntil }, member(viewer), now);
			if (!result.ok) throw new SwapError(result.error.code === 'bad-date' ? 400 : 409, result.error.code, result.error.message, 'availableUntil');
			await save(tx, result);
		}
		return media.setPhotos(tx, viewer.id, 'listing', id, photos, { max: LISTING_PHOTOS_MAX, now });
	});
	await media.purge(purge).catch((error: unknown) => console.error(`[swaps] removing replaced photos of listing ${id} failed:`, error));
}

const member = (viewer: Pick<Viewer, 'id'>): Actor => ({ kind: 'member', userId: viewer.id });

/** Writes a transition's new state and its event. */
async function save(tx: DbOrTx, result: Extract<TransitionResult, { ok: true }>, note = ''): Promise<void> {
	const l = result.listing;
	await tx
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
	await tx.insert(listingEvents).values(eventValues(result.event, note));
}

function refused(result: Extract<TransitionResult, { ok: false }>): SwapError {
	// Someone who is not a party learns nothing more than that there is nothing here for them.
	if (result.error.code === 'not-owner' || result.error.code === 'not-a-party') return notFound();
	return new SwapError(result.error.code === 'bad-date' ? 400 : 409, result.error.code, result.error.message);
}

/** A note from the site in a conversation, already settled for mail (the notice mail is separate). */
export async function note(tx: DbOrTx, thread: Pick<ThreadRow, 'id'>, senderId: string | null, recipientId: string, body: string, now: Date): Promise<void> {
	await tx.insert(swapMessages).values({ threadId: thread.id, senderId, recipientId, kind: 'event', body, createdAt: now, notifiedAt: now });
	await tx.update(swapThreads).set({ lastMessageAt: now }).where(eq(swapThreads.id, thread.id));
}

async function tell(tx: DbOrTx, userId: string, kind: NoticeKind, o: { threadId: number | null; listing: ListingRow; actorName: string; reason?: string }) {
	await queueNotice(tx, userId, (email) =>
		noticeMail(email, { kind, threadId: o.threadId, listingId: o.listing.id, title: o.listing.title, actorName: o.actorName, reason: o.reason })
	);
}

const threadsOf = (tx: DbOrTx, listingId: number) => tx.select().from(swapThreads).where(eq(swapThreads.listingId, listingId)).orderBy(asc(swapThreads.id));

async function nameOf(tx: DbOrTx, id: string) {
	const [row] = await tx.select({ displayName: users.displayName }).from(users).where(eq(users.id, id));
	return displayName(row);
}

export type OwnerAction = Extract<ListingAction, { type: 'withdraw' | 'release' | 'confirm-handover' | 'extend' }>;

/**
 * An action of the owner (withdraw, release, extend) or of either member of the reserved swap
 * (confirm the handover), with the notes and mail it causes.
 */
export async function act(viewer: Viewer, id: number, action: OwnerAction, options: Options = {}): Promise<ListingState> {
	const now = options.now ?? new Date();
	return (options.database ?? appDb).transaction(async (tx) => {
		const row = await rowOf(id, tx, true);
		if (!row || !canView(viewer, row)) throw notFound();
		const before = toPure(row);
		const result = transition(before, action, member(viewer), now);
		if (!result.ok) throw refused(result);
		await save(tx, result);
		const actorName = await nameOf(tx, viewer.id);
		const threads = await threadsOf(tx, id);
		const reservedThread = threads.find((t) => String(t.id) === before.reservation?.requestId);
		if (action.type === 'withdraw') {
			for (const t of threads) {
				const status = conversationStatus(before, String(t.id), now);
				if (status !== 'waiting' && status !== 'accepted') continue;
				await note(tx, t, viewer.id, t.requesterId, `${actorName} withdrew this listing, so it will not go ahead.`, now);
				await tell(tx, t.requesterId, 'withdrawn', { threadId: t.id, listing: row, actorName });
			}
		} else if (action.type === 'release' && reservedThread) {
			await note(
				tx,
				reservedThread,
				viewer.id,
				reservedThread.requesterId,
				`${actorName} released the reservation; the listing is open for requests again.`,
				now
			);
			await tell(tx, reservedThread.requesterId, 'released', { threadId: reservedThread.id, listing: row, actorName });
			if (result.listing.state === 'open') {
				for (const t of threads) {
					if (t.id !== reservedThread.id) await note(tx, t, viewer.id, t.requesterId, 'The listing is open for requests again.', now);
				}
			}
		} else if (action.type === 'confirm-handover' && reservedThread) {
			const otherId = viewer.id === row.ownerId ? reservedThread.requesterId : row.ownerId;
			const done = result.listing.state === 'handed-over';
			await note(
				tx,
				reservedThread,
				viewer.id,
				otherId,
				done
					? `${actorName} confirmed the handover too: the swap is complete.`
					: `${actorName} confirmed the handover. Please confirm it too once it has changed hands.`,
				now
			);
			await tell(tx, otherId, done ? 'handed-over' : 'confirmed-by-other', { threadId: reservedThread.id, listing: row, actorName });
		}
		return result.listing.state;
	});
}

/**
 * The owner accepts one request: the listing is reserved for its member, who is told; every
 * other member waiting for an answer is told politely that it went to someone else.
 */
export async function accept(viewer: Viewer, threadId: number, options: Options = {}): Promise<void> {
	const now = options.now ?? new Date();
	await (options.database ?? appDb).transaction(async (tx) => {
		const [thread] = await tx.select().from(swapThreads).where(eq(swapThreads.id, threadId));
		if (!thread) throw notFound('conversation');
		const row = await rowOf(thread.listingId, tx, true);
		if (!row || row.ownerId !== viewer.id) throw notFound('conversation');
		await blocks.assertMayWrite(viewer.id, thread.requesterId, tx);
		const assessment = await restricted.assessOne(row.speciesId, tx);
		if (assessment.banned.length) throw new SwapError(409, 'banned', assessment.banned.map(refusalMessage).join(' '));
		const before = toPure(row);
		const result = transition(before, { type: 'accept', requestId: String(thread.id), requesterId: thread.requesterId }, member(viewer), now);
		if (!result.ok) throw refused(result);
		await save(tx, result);
		const actorName = await nameOf(tx, viewer.id);
		await note(tx, thread, viewer.id, thread.requesterId, `${actorName} accepted this request. Agree a day, a time and a public meeting place below.`, now);
		await tell(tx, thread.requesterId, 'accepted', { threadId: thread.id, listing: row, actorName });
		for (const other of await threadsOf(tx, row.id)) {
			if (other.id === thread.id || conversationStatus(before, String(other.id), now) !== 'waiting') continue;
			await note(tx, other, viewer.id, other.requesterId, `${actorName} accepted another request this time. Thank you for asking.`, now);
			await tell(tx, other.requesterId, 'not-chosen', { threadId: other.id, listing: row, actorName });
		}
	});
}

/** An admin withdraws a listing after a report, with a reason, audited; both sides are told. */
export async function moderatorWithdraw(admin: Viewer, id: number, reason: string, tx: DbOrTx, now: Date): Promise<void> {
	const row = await rowOf(id, tx, true);
	if (!row) throw notFound();
	const before = toPure(row);
	const result = moderatorTransition(before, admin.id, now);
	if (!result.ok) throw new SwapError(409, result.error.code, result.error.message);
	await save(tx, result, reason);
	await tx
		.insert(auditLog)
		.values({ actorId: admin.id, action: 'listing.withdraw', subjectType: 'listing', subjectId: String(id), detail: { reason, from: result.event.from } });
	await tell(tx, row.ownerId, 'withdrawn-by-admin', { threadId: null, listing: row, actorName: 'The admins', reason });
	for (const t of await threadsOf(tx, id)) {
		const status = conversationStatus(before, String(t.id), now);
		if (status !== 'waiting' && status !== 'accepted') continue;
		await note(tx, t, null, t.requesterId, 'The club’s admins withdrew this listing.', now);
		await tell(tx, t.requesterId, 'withdrawn-by-admin', { threadId: t.id, listing: row, actorName: 'The admins' });
	}
}

/** The periodic job: records the expiry of open listings whose date has passed. Returns how many. */
export async function expireDue(now: Date = new Date(), database: DbOrTx = appDb): Promise<number> {
	const due = await database
		.select({ id: listings.id })
		.from(listings)
		.where(and(eq(listings.state, 'open'), lte(listings.availableUntil, now)))
		.limit(500);
	let expired = 0;
	for (const { id } of due) {
		await database.transaction(async (tx) => {
			const row = await rowOf(id, tx, true);
			if (!row) return;
			const result = transition(toPure(row), { type: 'expire' }, { kind: 'system' }, now);
			// Extended or reserved meanwhile: nothing to record.
			if (!result.ok) return;
			await save(tx, result);
			expired++;
		});
	}
	return expired;
}

/** Media access for scope 'listing' (registered in ../media/access.ts): the listing's own visibility. */
export async function photoAudience(viewer: Viewer | null, listingId: number): Promise<'public' | 'restricted' | null> {
	const row = await rowOf(listingId, appDb);
	if (!row || !canView(viewer, row)) return null;
	return 'restricted';
}

export interface OwnListing extends ListingCard {
	requests: number;
	unread: number;
}

const STATE_ORDER = sql`CASE ${listings.state} WHEN 'reserved' THEN 0 WHEN 'open' THEN 1 ELSE 2 END`;

/** The viewer's own listings, reserved and open first, with how many requests and unread messages each has. */
export async function listOwn(viewer: Viewer, options: Options = {}): Promise<OwnListing[]> {
	const tx = options.database ?? appDb;
	const rows = await cardQuery(tx).where(eq(listings.ownerId, viewer.id)).orderBy(STATE_ORDER, desc(listings.createdAt), desc(listings.id)).limit(200);
	const ids = rows.map((r) => r.id);
	const [requestCounts, unreadCounts] = ids.length
		? await Promise.all([
				tx.select({ listingId: swapThreads.listingId, n: count() }).from(swapThreads).where(inArray(swapThreads.listingId, ids)).groupBy(swapThreads.listingId),
				tx
					.select({ listingId: swapThreads.listingId, n: count() })
					.from(swapMessages)
					.innerJoin(swapThreads, eq(swapThreads.id, swapMessages.threadId))
					.where(and(inArray(swapThreads.listingId, ids), eq(swapMessages.recipientId, viewer.id), sql`${swapMessages.readAt} IS NULL`))
					.groupBy(swapThreads.listingId)
			])
		: [[], []];
	const requests = new Map(requestCounts.map((r) => [r.listingId, r.n]));
	const unread = new Map(unreadCounts.map((r) => [r.listingId, r.n]));
	return (await toCards(rows, viewer, options.now ?? new Date(), tx)).map((c) => ({ ...c, requests: requests.get(c.id) ?? 0, unread: unread.get(c.id) ?? 0 }));
}

/** Another member's listings open now, for their profile; none when the viewer has blocked them. */
export async function listOpenOf(viewer: Viewer, ownerId: string, options: Options = {}): Promise<ListingCard[]> {
	const tx = options.database ?? appDb;
	const now = options.now ?? new Date();
	if (ownerId !== viewer.id && (await blocks.between(viewer.id, ownerId, tx)).aBlockedB) return [];
	const rows = await cardQuery(tx)
		.where(and(eq(listings.ownerId, ownerId), eq(listings.state, 'open'), sql`${listings.availableUntil} > ${now}`))
		.orderBy(desc(listings.createdAt), desc(listings.id))
		.limit(50);
	return toCards(rows, viewer, now, tx);
}

/** Swaps a member has completed, as giver or receiver. */
export async function completedSwaps(userId: string, database: DbOrTx = appDb): Promise<number> {
	const [row] = await database
		.select({ n: count() })
		.from(listings)
		.where(and(eq(listings.state, 'handed-over'), or(eq(listings.ownerId, userId), eq(listings.reservedRequesterId, userId))));
	return row?.n ?? 0;
}

/** The events of a listing, newest first, for its owner's history. */
export async function history(viewer: Viewer, id: number, database: DbOrTx = appDb) {
	const row = await rowOf(id, database);
	if (!row || row.ownerId !== viewer.id) return [];
	return database
		.select({
			action: listingEvents.action,
			fromState: listingEvents.fromState,
			toState: listingEvents.toState,
			at: listingEvents.at,
			note: listingEvents.note,
			actorId: listingEvents.actorId,
			actorName: users.displayName
		})
		.from(listingEvents)
		.leftJoin(users, eq(users.id, listingEvents.actorId))
		.where(eq(listingEvents.listingId, id))
		.orderBy(desc(listingEvents.at), desc(listingEvents.id));
}
