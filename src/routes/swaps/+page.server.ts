import { requireUser } from '$lib/server/club/guards';
import * as nearby from '$lib/server/swaps/nearby';
import { parseBoardQuery } from '$lib/swaps/board-filter';
import { distanceUnitOf } from '$lib/journals/calc/units';
import type { PageServerLoad } from './$types';

// The same query as /api/swaps/listings, rendered on the server: the board works without JavaScript.
export const load = (async (event) => {
	const viewer = requireUser(event);
	const filter = parseBoardQuery(event.url.searchParams);
	return { filter, distanceUnit: distanceUnitOf(viewer.units), result: await nearby.search(viewer, filter) };
}) satisfies PageServerLoad;
