import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as cards from '$lib/server/swaps/listing-cards';
import * as threads from '$lib/server/swaps/threads';
import * as blocks from '$lib/server/swaps/blocks';
import * as members from '$lib/server/swaps/members';
import { invalid } from '$lib/errors';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const now = new Date();
	const [own, requests, blocked, completed] = await Promise.all([
		cards.listOwn(viewer, { now }),
		threads.listRequests(viewer, { now }),
		blocks.listBlocked(viewer),
		members.completedSwaps(viewer.id)
	]);
	return { own, requests, blocked, completed };
}) satisfies PageServerLoad;

export const actions = {
	unblock: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const memberId = String(data.get('memberId') ?? '');
			if (!memberId) throw invalid({ memberId: 'Choose a member.' });
			await blocks.unblock(viewer, memberId);
			return { unblocked: true };
		},
		{ id: 'unblock' }
	)
} satisfies Actions;
