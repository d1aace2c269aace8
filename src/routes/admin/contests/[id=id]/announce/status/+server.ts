import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as announce from '$lib/server/contests/announce';
import type { RequestHandler } from './$types';

/** How the results mails are getting on, for the announcement page to poll while any wait. */
export const GET: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'admin');
	return json(await announce.deliveryCounts(viewer, Number(event.params.id)));
});
