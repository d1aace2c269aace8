// Reading the listing form in the new and edit actions: the draft (kept on error), the checked
// input, and the photo fields from the PhotoUploader; and the choices the form offers.
import { fail } from '@sveltejs/kit';
import type { Viewer } from '$lib/server/club/users';
import * as areas from '$lib/server/club/areas';
import * as users from '$lib/server/club/users';
import * as media from '$lib/server/media';
import { MediaError } from '$lib/server/media';
import * as tanks from '$lib/server/journals/tanks';
import { SwapError } from '$lib/server/swaps/errors';
import type { ListingDetail } from '$lib/server/swaps/listings';
import { readPhotoFields, type PhotoField } from '$lib/media/form';
import { dateOnly, draftFromForm, LISTING_PHOTOS_MAX, parseListingDraft, type ListingDraft, type ListingInput } from '$lib/swaps/listing-form';
import type { UploaderPhoto } from '$lib/media/form';

export type ListingFormRead =
	| { ok: true; input: ListingInput; photos: PhotoField[]; draft: ListingDraft }
	| { ok: false; errors: Record<string, string>; draft: ListingDraft; photos: UploaderPhoto[] };

/** The photos the form named, as the uploader shows them again after an error. */
export async function photosAgain(viewer: Viewer, fields: PhotoField[], listingId: number | null): Promise<UploaderPhoto[]> {
	const ids = fields.map((f) => f.id);
	const known = new Map([...(await media.pendingOf(viewer.id, ids)), ...(listingId ? await media.listFor('listing', listingId) : [])].map((p) => [p.id, p]));
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}

export async function readListingForm(request: Request, viewer: Viewer, listingId: number | null, now = new Date()): Promise<ListingFormRead> {
	const form = await request.formData();
	const draft = draftFromForm(form);
	const photos = readPhotoFields(form, 'photos', LISTING_PHOTOS_MAX);
	const parsed = parseListingDraft(draft, now);
	const errors = parsed.ok ? {} : { ...parsed.errors };
	if (!photos.ok) errors.photos = photos.error;
	if (!parsed.ok || !photos.ok) return { ok: false, errors, draft, photos: await photosAgain(viewer, photos.ok ? photos.photos : [], listingId) };
	return { ok: true, input: parsed.input, photos: photos.photos, draft };
}

/** A refusal of the domain as the form shows it, next to its field. */
export async function failed(error: unknown, viewer: Viewer, read: Extract<ListingFormRead, { ok: true }>, listingId: number | null) {
	if (error instanceof SwapError && error.status !== 404) {
		return fail(error.status, {
			errors: { [error.field ?? 'form']: error.message },
			draft: read.draft,
			photos: await photosAgain(viewer, read.photos, listingId)
		});
	}
	if (error instanceof MediaError)
		return fail(400, { errors: { photos: error.message }, draft: read.draft, photos: await photosAgain(viewer, read.photos, listingId) });
	throw error;
}

/** What the form offers: the club's areas, the member's running tanks, and whether they have a location. */
export async function formChoices(viewer: Viewer) {
	const [areaList, own, row] = await Promise.all([areas.list(), tanks.listOwn(viewer, { retired: false }), users.getById(viewer.id)]);
	return {
		areas: areaList.map((a) => ({ id: a.id, name: a.name })),
		tanks: own.map((t) => ({ id: t.id, name: t.name })),
		homeAreaId: row?.homeAreaId ?? null,
		located: row ? row.homeLat !== null && row.homeLng !== null : false
	};
}

export function draftOf(listing: ListingDetail): ListingDraft {
	return {
		kind: listing.kind,
		category: listing.category,
		title: listing.title,
		speciesId: listing.speciesId === null ? '' : String(listing.speciesId),
		speciesName: listing.speciesName,
		amount: String(listing.quantity.amount),
		unit: listing.quantity.unit,
		condition: listing.conditionNote,
		description: listing.description,
		terms: listing.terms,
		termsNote: listing.termsNote,
		pickupAreaId: listing.pickupAreaId === null ? '' : String(listing.pickupAreaId),
		availableUntil: dateOnly(listing.availableUntil),
		tankId: listing.tank ? String(listing.tank.id) : ''
	};
}
