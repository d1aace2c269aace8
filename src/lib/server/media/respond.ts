// The answer to a request for a photo rendition, shared by every route that serves one: the
// headers that keep an image an image (no scripts, no embedding elsewhere), 304 for a copy the
// browser already has, 404 when the object is missing from the bucket.
//
// Public photos may be kept by browsers for a year and by shared caches for an hour, so a tank
// made private stops being served by them soon. Anything else is kept only by the viewer's
// browser and only briefly, then asked for again (a 304 while access lasts), so someone who loses
// access — a tank made private, a judge who stepped back — stops seeing it.
import { error } from '@sveltejs/kit';
import type { RenditionHandle } from './index';

export type PhotoAudience = 'public' | 'private';

const CACHE: Record<PhotoAudience, string> = {
	public: 'public, max-age=31536000, s-maxage=3600, immutable',
	private: 'private, max-age=60, must-revalidate'
};

export async function renditionResponse(request: Request, rendition: RenditionHandle, audience: PhotoAudience): Promise<Response> {
	const headers: Record<string, string> = {
		'cache-control': CACHE[audience],
		etag: rendition.etag,
		// Who may see a private photo depends on the cookie; the bytes of a public one do not.
		...(audience === 'public' ? {} : { vary: 'Cookie' }),
		// Opened on its own, the browser's image viewer styles the page inline; no script may run.
		'content-security-policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'",
		'cross-origin-resource-policy': 'same-origin'
	};
	if (request.headers.get('if-none-match') === rendition.etag) return new Response(null, { status: 304, headers });
	const object = await rendition.open();
	if (!object) error(404, 'No such photo.');
	if (object.length !== undefined) headers['content-length'] = String(object.length);
	return new Response(object.body, { headers: { ...headers, 'content-type': 'image/webp' } });
}
