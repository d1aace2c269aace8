import { json } from '@sveltejs/kit';
import { notFound } from '$lib/errors';
import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as threads from '$lib/server/swaps/threads';
import type { RequestHandler } from './$types';

const NOT_FOUND = 'We could not find that conversation.';

/**
 * New messages of a conversation for the open page's poller, GET …/messages?after=<last id>;
 * marks those to the viewer read. 404 for anyone who may not read the conversation, signed out included.
 */
export const GET: RequestHandler = endpoint(async (event) => {
	// Signed out, a conversation does not exist either (404, not 401), as for its page.
	if (!event.locals.user) throw notFound(NOT_FOUND);
	const viewer = requireUser(event);
	const after = Number(event.url.searchParams.get('after') ?? 0);
	const result = await threads.poll(viewer, Number(event.params.id), Number.isSafeInteger(after) && after > 0 ? after : 0);
	if (!result) throw notFound(NOT_FOUND);
	return json(result, { headers: { 'cache-control': 'private, no-store' } });
});
