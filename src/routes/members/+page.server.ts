import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as directoryListing from '$lib/server/club/directory-listing';
import { formAction, parseForm } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	q: z.string().trim().max(60).catch(''),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const viewer = requireUser(event);
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	return { ...(await directoryListing.list(viewer, { q: params.q || undefined, page: params.page })), params };
}) satisfies PageServerLoad;

export const actions = {
	listing: formAction(async (event, data) => {
		const viewer = requireUser(event);
		const { listed } = parseForm(z.object({ listed: z.enum(['yes', 'no'], { message: 'Choose whether to appear.' }) }), data);
		await directoryListing.setListed(viewer, listed === 'yes');
		return { listed: listed === 'yes' };
	})
} satisfies Actions;
