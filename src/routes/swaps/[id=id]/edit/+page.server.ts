import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as detail from '$lib/server/swaps/listing-detail';
import * as edits from '$lib/server/swaps/listing-edits';
import { draftOf, formChoices, listingFormAction } from '../../form.server';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const NOT_FOUND = 'We could not find that listing.';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const listing = await detail.getOwn(viewer, Number(event.params.id));
	if (!listing) error(404, NOT_FOUND);
	if (listing.state === 'handed-over' || listing.state === 'withdrawn') redirect(303, `/swaps/${listing.id}`);
	return {
		...(await formChoices(viewer)),
		listing: { id: listing.id, title: listing.title, state: listing.state },
		draft: draftOf(listing),
		photos: listing.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls }))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: listingFormAction(
		async (viewer, event: RequestEvent) => {
			const id = Number(event.params.id);
			if (!(await detail.getOwn(viewer, id))) error(404, NOT_FOUND);
			return id;
		},
		async (viewer, input, photos, id) => {
			await edits.update(viewer, id!, input, photos);
			redirect(303, `/swaps/${id}?saved=1`);
		}
	)
} satisfies Actions;
