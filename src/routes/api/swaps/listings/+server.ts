import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as nearby from '$lib/server/swaps/nearby';
import { parseBoardQuery } from '$lib/swaps/board-filter';
import type { RequestHandler } from './$types';

/**
 * The board as JSON, for the board page's script: GET /api/swaps/listings?q=&category=&kind=
 * &species=&radius=2|5|10|25|50&page=. Distances come as coarse labels only; no point is sent.
 */
export const GET: RequestHandler = endpoint(async (event) => {
	const viewer = requireUser(event);
	const filter = parseBoardQuery(event.url.searchParams);
	const result = await nearby.search(viewer, filter);
	return json({ ...result, filter }, { headers: { 'cache-control': 'private, no-store' } });
});
