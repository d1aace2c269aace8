import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as posts from '$lib/server/news/posts';
import type { RequestHandler } from './$types';

/** How a post's mails are getting on, for its admin page to poll while any wait. */
export const GET: RequestHandler = endpoint(async (event) => {
	const admin = requireRole(event, 'admin');
	return json(await posts.deliveryCounts(admin, Number(event.params.id)));
});
