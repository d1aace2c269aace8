import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as media from '$lib/server/media';
import { notFound } from '$lib/errors';
import type { RequestHandler } from './$types';

/** Discards one of the member's own uploads that is not yet saved with anything. */
export const DELETE: RequestHandler = endpoint(async (event) => {
	const viewer = requireUser(event);
	if (!(await media.discardPending(viewer.id, Number(event.params.id)))) throw notFound('No such unsaved upload of yours.');
	return new Response(null, { status: 204 });
});
