import { error } from '@sveltejs/kit';
import * as media from '$lib/server/media';
import { audienceFor } from '$lib/server/media/access';
import { renditionResponse } from '$lib/server/media/respond';
import type { RequestHandler } from './$types';

/** A photo rendition. Anyone who may not see what the photo belongs to gets 404, as if it did not exist. */
export const GET: RequestHandler = async (event) => {
	const row = await media.getRow(Number(event.params.id));
	if (!row) error(404, 'No such photo.');
	const audience = await audienceFor(event.locals.user, row);
	if (!audience) error(404, 'No such photo.');
	return renditionResponse(
		event.request,
		media.renditionOfRow(row, event.params.size as 'thumb' | 'medium' | 'large'),
		audience === 'public' ? 'public' : 'private'
	);
};
