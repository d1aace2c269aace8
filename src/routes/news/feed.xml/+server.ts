import * as feed from '$lib/server/news/feed';
import type { RequestHandler } from './$types';

/** Atom 1.0 feed of the club's public news posts. */
export const GET: RequestHandler = async () => {
	return new Response(await feed.atom(), { headers: { 'content-type': 'application/atom+xml; charset=utf-8', 'cache-control': 'public, max-age=300' } });
};
