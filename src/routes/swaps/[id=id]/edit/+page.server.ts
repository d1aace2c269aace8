import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as listings from '$lib/server/swaps/listings';
import { draftOf, failed, formChoices, readListingForm } from '../../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const listing = await listings.getOwn(viewer, Number(event.params.id));
	if (!listing) error(404, 'We could not find that listing.');
	if (listing.state === 'handed-over' || listing.state === 'withdrawn') redirect(303, `/swaps/${listing.id}`);
	return {
		...(await formChoices(viewer)),
		listing: { id: listing.id, title: listing.title, state: listing.state },
		draft: draftOf(listing),
		photos: listing.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls }))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const id = Number(event.params.id);
		if (!(await listings.getOwn(viewer, id))) error(404, 'We could not find that listing.');
		const read = await readListingForm(event.request, viewer, id);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		try {
			await listings.update(viewer, id, read.input, read.photos);
		} catch (e) {
			return failed(e, viewer, read, id);
		}
		redirect(303, `/swaps/${id}?saved=1`);
	}
} satisfies Actions;
