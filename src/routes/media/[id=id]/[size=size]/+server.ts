import { error } from '@sveltejs/kit';
import * as media from '$lib/server/media';
import { audienceFor } from '$lib/server/media/access';
import { renditionResponse } from '$lib/server/media/respond';
import type { RequestHandler } from './$types';

/**
 * A photo rendition. Keys never change, so browsers may keep a copy for a year; shared caches
 * only for public photos and for an hour, so a tank made private stops being served by them soon.
 * Anyone who may not see what the photo belongs to gets 404, as if it did not exist.
 */
export const GET: RequestHandler = async (event) => {
	const row = await media.getRow(Number(event.params.id));
	if (!row) error(404, 'No such photo.');
	const audience = await audienceFor(event.locals.user, row);
	if (!audience) error(404, 'No such photo.');
	const cacheControl = audience === 'public' ? 'public, max-age=31536000, s-maxage=3600, immutable' : 'private, max-age=31536000, immutable';
	return renditionResponse(event.request, media.renditionOfRow(row, event.params.size as 'thumb' | 'medium' | 'large'), cacheControl);
};
