import { error } from '@sveltejs/kit';
import * as media from '$lib/server/media';
import { audienceFor } from '$lib/server/media/access';
import { store } from '$lib/server/media/storage';
import type { RequestHandler } from './$types';

/**
 * A photo rendition. Keys never change, so browsers may keep a copy for a year; shared caches
 * only for public photos and for an hour, so a tank made private stops being served by them soon.
 * Anyone who may not see what the photo belongs to gets 404, as if it did not exist.
 */
export const GET: RequestHandler = async (event) => {
	const id = Number(event.params.id);
	const size = event.params.size as 'thumb' | 'medium' | 'large';
	const row = await media.getRow(id);
	if (!row) error(404, 'No such photo.');
	const audience = await audienceFor(event.locals.user, row);
	if (!audience) error(404, 'No such photo.');

	const etag = `"${id}-${size}"`;
	const cacheControl = audience === 'public' ? 'public, max-age=31536000, s-maxage=3600, immutable' : 'private, max-age=31536000, immutable';
	const headers: Record<string, string> = {
		'cache-control': cacheControl,
		etag,
		vary: 'Cookie',
		'content-security-policy': "default-src 'none'; img-src 'self'",
		'cross-origin-resource-policy': 'same-origin'
	};
	if (event.request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });

	const object = await store().get(media.objectKey(row.storageKey, size));
	if (!object) error(404, 'No such photo.');
	if (object.length !== undefined) headers['content-length'] = String(object.length);
	return new Response(object.body, { headers: { ...headers, 'content-type': 'image/webp' } });
};
