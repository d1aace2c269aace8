// Posting a listing and changing it: where it is, which species it names (banned ones refused),
// the tank it came from, and its photos.
import { eq } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as users from '../club/users';
import * as areas from '../club/areas';
import * as media from '../media';
import type { Purge } from '../media';
import * as tanks from '../journals/tanks';
import * as matching from '../species/matching';
import * as catalogue from '../species/catalogue';
import type { PhotoField } from '../../media/form';
import { conflict, DomainError, invalid, isDomainError, notFound } from '../../errors';
import { renderMarkdown } from '../markdown';
import { effectiveState, transition } from '../../swaps/listing-state';
import { hasSpecies, LISTING_PHOTOS_MAX, speciesKindFor, type ListingInput } from '../../swaps/listing-form';
import { nearestArea } from '../../swaps/places';
import { checkQuantity, quantityFieldOf } from '../../swaps/quantity';
import { refusalMessage } from '../../swaps/restrictions';
import { listingEvents, listings } from './schema';
import { lockedRowOf, saveTransition, toPure } from './listings';
import * as restricted from './restricted';

/**
 * Where a listing is: the owner's rounded point, or the pickup area's centre when they have not
 * set one; and the area to name it by (the chosen one, else their home area, else the nearest).
 */
async function placeFor(ownerId: string, pickupAreaId: number | null, context: Context) {
	const { db } = resolve(context);
	const [owner, all] = await Promise.all([users.getById(ownerId, { db }), areas.list({ db })]);
	const home = owner && owner.homeLat !== null && owner.homeLng !== null ? { lat: owner.homeLat, lng: owner.homeLng } : null;
	let area = pickupAreaId !== null ? all.find((a) => a.id === pickupAreaId) : undefined;
	if (pickupAreaId !== null && !area) throw invalid({ pickupAreaId: 'That area no longer exists; choose another.' }, undefined, 'no-area');
	if (!area && owner?.homeAreaId) area = all.find((a) => a.id === owner.homeAreaId);
	if (!area && home) area = nearestArea(home, all) ?? undefined;
	const point = home ?? (area ? { lat: area.lat, lng: area.lng } : null);
	if (!point) throw invalid({ pickupAreaId: 'Choose a pickup area, or set where you are on your account page.' }, undefined, 'no-place');
	return { point, pickupAreaId: area?.id ?? null, pickupNear: !!area && owner?.homeAreaId !== area.id };
}

/**
 * The species a listing names, checked against the club's restricted list (banned ones are
 * refused), and its quantity: a unit of its category and, for a plant the catalogue knows, one that
 * fits the way it grows.
 */
async function checkedSpecies(input: ListingInput, context: Context): Promise<{ speciesId: number | null; speciesName: string }> {
	const resolved = hasSpecies(input.category)
		? await matching.resolveName(input, speciesKindFor(input.category), context)
		: { speciesId: null, speciesName: '' };
	if (resolved.speciesId !== null) {
		const assessment = await restricted.assessOne(resolved.speciesId, context);
		if (assessment.banned.length) throw invalid({ speciesName: assessment.banned.map(refusalMessage).join(' ') }, undefined, 'banned');
	}
	const known = resolved.speciesId !== null ? await catalogue.get(resolved.speciesId, context) : undefined;
	const unitProblem = checkQuantity(input.category, input.quantity, known?.kind === 'plant' ? known.growthHabit : null);
	if (unitProblem) {
		const field = quantityFieldOf(unitProblem);
		throw invalid({ [field]: unitProblem }, undefined, field === 'unit' ? 'unit-does-not-fit' : 'bad-amount');
	}
	return resolved;
}

async function checkedTank(viewer: Viewer, input: ListingInput, context: Context): Promise<number | null> {
	if (input.kind !== 'offer' || input.tankId === null) return null;
	const tank = await tanks.getOwn(viewer, input.tankId, context);
	if (!tank) throw invalid({ tankId: 'Choose one of your own tanks.' }, undefined, 'no-tank');
	return tank.id;
}

/** The listing's photos; a refusal of the photo store is shown at the form's photo field. */
async function savePhotos(viewer: Viewer, id: number, photos: PhotoField[], context: Context): Promise<Purge> {
	const { db, now } = resolve(context);
	try {
		return await media.setPhotos(viewer.id, 'listing', id, photos, { max: LISTING_PHOTOS_MAX }, { db, now });
	} catch (e) {
		if (isDomainError(e)) throw invalid({ photos: e.message }, e.message, e.code);
		throw e;
	}
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
		descriptionHtml: input.description ? renderMarkdown(input.description) : null,
		terms: input.terms,
		termsNote: input.termsNote
	};
}

/** Creates a listing for the viewer with its photos (pending uploads of theirs). */
export async function create(viewer: Viewer, input: ListingInput, photos: PhotoField[] = [], context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const place = await placeFor(viewer.id, input.pickupAreaId, inTx);
		const checked = await checkedSpecies(input, inTx);
		const tankId = await checkedTank(viewer, input, inTx);
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
		await savePhotos(viewer, id, photos, inTx);
		return id;
	});
}

/**
 * Saves the owner's changes. A new "available until" goes through the state machine as an
 * extension (so an expired listing opens again, recorded as such).
 */
export async function update(viewer: Viewer, id: number, input: ListingInput, photos: PhotoField[], context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const purge: Purge = await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const row = await lockedRowOf(id, inTx);
		if (!row || row.ownerId !== viewer.id) throw notFound('We could not find that listing.');
		const state = effectiveState(row, now);
		if (state === 'handed-over') throw conflict('closed', 'This listing has been handed over; it can no longer be changed.');
		if (state === 'withdrawn') throw conflict('closed', 'This listing has been withdrawn; it can no longer be changed.');
		if (input.kind !== row.kind && state === 'reserved') {
			const message = 'A reserved listing cannot change between an offer and a wanted post.';
			throw new DomainError(409, 'reserved', message, { kind: message });
		}
		const place = await placeFor(viewer.id, input.pickupAreaId, inTx);
		const checked = await checkedSpecies(input, inTx);
		const tankId = await checkedTank(viewer, input, inTx);
		await tx
			.update(listings)
			.set({ ...contentColumns(input, checked), pickupAreaId: place.pickupAreaId, pickupNear: place.pickupNear, tankId, updatedAt: now })
			.where(eq(listings.id, id));
		if (input.availableUntil.getTime() !== row.availableUntil.getTime()) {
			const result = transition(toPure(row), { type: 'extend', availableUntil: input.availableUntil }, { kind: 'member', userId: viewer.id }, now);
			if (!result.ok)
				throw new DomainError(result.error.code === 'bad-date' ? 400 : 409, result.error.code, result.error.message, { availableUntil: result.error.message });
			await saveTransition(result, '', inTx);
		}
		return savePhotos(viewer, id, photos, inTx);
	});
	await media.purgeAfterCommit(purge, { listingId: id, what: 'replaced photos' });
}
