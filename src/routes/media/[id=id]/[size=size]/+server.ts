import { error } from '@sveltejs/kit';
import * as media from '$lib/server/media';
import { audienceFor } from '$lib/server/media/access';
import { store } from '$lib/server/media/storage';
import type { RequestHandler } from './$types';

/**
 * A photo rendition. Public photos may be kept by browsers for a year and by shared caches for
 * an hour, so a tank made private stops being served by them soon. Anything else is kept only by
 * the viewer's browser and only briefly, then asked for again (a 304 while access lasts), so
 * someone who loses access — a tank made private, a judge who stepped back — stops seeing it.
 * Anyone who may not see what the photo belongs to gets 404, as if it did not exist.
 */
const PRIVATE_CACHE = 'private, max-age=60, must-revalidate';
const PUBLIC_CACHE = 'public, max-age=31536000, s-maxage=3600, immutable';

export const GET: RequestHandler = async (event) => {
	const id = Number(event.params.id);
	const size = event.params.size as 'thumb' | 'medium' | 'large';
	const row = await media.getRow(id);
	if (!row) error(404, 'No such photo.');
	const audience = await audienceFor(event.locals.user, row);
	if (!audience) error(404, 'No such photo.');

	const etag = `"${id}-${size}"`;
	const headers: Record<string, string> = {
		'cache-control': audience === 'public' ? PUBLIC_CACHE : PRIVATE_CACHE,
		etag,
		// Who may see it depends on the cookie; the bytes of a public photo do not.
		...(audience === 'public' ? {} : { vary: 'Cookie' }),
		// Opened on its own, the browser's image viewer styles the page inline; no script may run.
		'content-security-policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'",
		'cross-origin-resource-policy': 'same-origin'
	};
	if (event.request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });

	const object = await store().get(media.objectKey(row.storageKey, size));
	if (!object) error(404, 'No such photo.');
	if (object.length !== undefined) headers['content-length'] = String(object.length);
	return new Response(object.body, { headers: { ...headers, 'content-type': 'image/webp' } });
};
