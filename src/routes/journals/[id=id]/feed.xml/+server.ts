import { error } from '@sveltejs/kit';
import * as feed from '$lib/server/journals/feed';
import type { RequestHandler } from './$types';

/** Atom 1.0 feed of a public tank's entries; club and private tanks have none (404). */
export const GET: RequestHandler = async ({ params }) => {
	const xml = await feed.atomFor(Number(params.id));
	if (!xml) error(404, 'We could not find that feed.');
	return new Response(xml, { headers: { 'content-type': 'application/atom+xml; charset=utf-8', 'cache-control': 'public, max-age=300' } });
};
