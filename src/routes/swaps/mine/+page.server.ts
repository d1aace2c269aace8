import { fail } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as listings from '$lib/server/swaps/listings';
import * as threads from '$lib/server/swaps/threads';
import * as blocks from '$lib/server/swaps/blocks';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const now = new Date();
	const [own, requests, blocked, completed] = await Promise.all([
		listings.listOwn(viewer, { now }),
		threads.listRequests(viewer, { now }),
		blocks.listBlocked(viewer),
		listings.completedSwaps(viewer.id)
	]);
	return { own, requests, blocked, completed };
}) satisfies PageServerLoad;

export const actions = {
	unblock: async (event) => {
		const viewer = requireUser(event);
		const memberId = String((await event.request.formData()).get('memberId') ?? '');
		if (!memberId) return fail(400, { error: 'Choose a member.' });
		await blocks.unblock(viewer, memberId);
		return { unblocked: true };
	}
} satisfies Actions;
