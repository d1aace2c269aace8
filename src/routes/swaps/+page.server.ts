import { requireUser } from '$lib/server/club/guards';
import * as board from '$lib/server/swaps/board';
import { parseBoardQuery } from '$lib/swaps/board';
import type { PageServerLoad } from './$types';

// The same query as /api/swaps/listings, rendered on the server: the board works without JavaScript.
export const load = (async (event) => {
	const viewer = requireUser(event);
	const filter = parseBoardQuery(event.url.searchParams);
	return { filter, result: await board.search(viewer, filter) };
}) satisfies PageServerLoad;
