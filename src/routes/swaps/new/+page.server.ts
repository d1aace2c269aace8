import { fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as listings from '$lib/server/swaps/listings';
import { emptyDraft } from '$lib/swaps/listing-form';
import { LISTING_CATEGORIES, type ListingCategory } from '$lib/swaps/listing';
import { failed, formChoices, readListingForm } from '../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const choices = await formChoices(viewer);
	const asked = event.url.searchParams.get('category');
	const category: ListingCategory = LISTING_CATEGORIES.find((c) => c === asked) ?? 'plants';
	const draft = emptyDraft(category, new Date(), choices.homeAreaId);
	if (event.url.searchParams.get('kind') === 'wanted') draft.kind = 'wanted';
	return { ...choices, draft };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireUser(event);
		const read = await readListingForm(event.request, viewer, null);
		if (!read.ok) return fail(400, { errors: read.errors, draft: read.draft, photos: read.photos });
		let id: number;
		try {
			id = await listings.create(viewer, read.input, read.photos);
		} catch (error) {
			return failed(error, viewer, read, null);
		}
		redirect(303, `/swaps/${id}`);
	}
} satisfies Actions;
