import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as judging from '$lib/server/contests/judging';
import type { RequestHandler } from './$types';

/** Reopens a submitted card while the judging window lasts. */
export const POST: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	return json(await judging.reopenCard(viewer, Number(event.params.contest), Number(event.params.number)));
});
