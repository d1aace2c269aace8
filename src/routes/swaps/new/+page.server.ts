import { redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as edits from '$lib/server/swaps/listing-edits';
import { emptyDraft } from '$lib/swaps/listing-form';
import { LISTING_CATEGORIES, type ListingCategory } from '$lib/swaps/listing';
import { formChoices, listingFormAction } from '../form.server';
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
	default: listingFormAction(
		async () => null,
		async (viewer, input, photos) => {
			const id = await edits.create(viewer, input, photos);
			redirect(303, `/swaps/${id}`);
		}
	)
} satisfies Actions;
