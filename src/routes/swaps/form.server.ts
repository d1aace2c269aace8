// The listing form's action for the new and edit pages: reads the draft (kept on error, with the
// photos shown again), checks it, and hands the checked input to the domain; and the choices the
// form offers.
import type { RequestEvent } from '@sveltejs/kit';
import type { Viewer } from '$lib/server/club/users';
import * as areas from '$lib/server/club/areas';
import * as users from '$lib/server/club/users';
import * as media from '$lib/server/media';
import * as tanks from '$lib/server/journals/tanks';
import { formAction, refused } from '$lib/server/http/forms';
import type { ListingDetail } from '$lib/server/swaps/listing-detail';
import { dayOf } from '$lib/dates';
import { invalid } from '$lib/errors';
import { readPhotoFields, type PhotoField, type UploaderPhoto } from '$lib/media/form';
import { draftFromForm, LISTING_PHOTOS_MAX, parseListingDraft, type ListingDraft, type ListingInput } from '$lib/swaps/listing-form';
import { requireUser } from '$lib/server/club/guards';

/** What the form sent back after a refusal: the draft as typed and its photos, for the uploader. */
export type ListingValues = ListingDraft & { photos: UploaderPhoto[] };

/**
 * The new and edit pages' action. `target` names the listing being changed (null for a new one),
 * refusing anyone who may not change it before the form is read; `save` gets the checked input and
 * redirects. Any refusal, of the form's own checks or of the domain, answers `{ errors, values }`
 * with the draft as typed and its photos for the uploader.
 */
export function listingFormAction<E extends RequestEvent>(
	target: (viewer: Viewer, event: E) => Promise<number | null>,
	save: (viewer: Viewer, input: ListingInput, photos: PhotoField[], listingId: number | null) => Promise<void>
) {
	return formAction<E, Awaited<ReturnType<typeof refused<ListingValues>>> | undefined, ListingValues>(
		async (event: E, data) => {
			const viewer = requireUser(event);
			const listingId = await target(viewer, event);
			const draft = draftFromForm(data);
			const photos = readPhotoFields(data, 'photos', LISTING_PHOTOS_MAX);
			try {
				const parsed = parseListingDraft(draft, new Date());
				if (!parsed.ok || !photos.ok) throw invalid({ ...(parsed.ok ? {} : parsed.errors), ...(photos.ok ? {} : { photos: photos.error }) });
				await save(viewer, parsed.input, photos.photos, listingId);
			} catch (e) {
				// Shown again: the photos that are the member's own uploads or already the listing's.
				const again = await media.photosAgain(viewer.id, photos.ok ? photos.photos : [], listingId === null ? null : { scope: 'listing', id: listingId });
				return refused<ListingValues>(e, { ...draft, photos: again });
			}
		},
		{ values: (data) => ({ ...draftFromForm(data), photos: [] }) }
	);
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
		availableUntil: dayOf(listing.availableUntil),
		tankId: listing.tank ? String(listing.tank.id) : '',
		speciesHabit: listing.growthHabit ?? ''
	};
}
