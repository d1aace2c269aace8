import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as media from '$lib/server/media';
import type { RequestHandler } from './$types';

/** Discards one of the member's own uploads that is not yet saved with anything. */
export const DELETE: RequestHandler = async (event) => {
	const viewer = requireUser(event);
	const removed = await media.discardPending(viewer.id, Number(event.params.id));
	if (!removed) return json({ code: 'not-found', message: 'No such unsaved upload of yours.' }, { status: 404 });
	return new Response(null, { status: 204 });
};
