// The answer to a request for a photo rendition, shared by every route that serves one: the
// headers that keep an image an image (no scripts, no embedding elsewhere), 304 for a copy the
// browser already has, 404 when the object is missing from the bucket.
import { error } from '@sveltejs/kit';
import type { RenditionHandle } from './index';

export async function renditionResponse(request: Request, rendition: RenditionHandle, cacheControl: string): Promise<Response> {
	const headers: Record<string, string> = {
		'cache-control': cacheControl,
		etag: rendition.etag,
		vary: 'Cookie',
		'content-security-policy': "default-src 'none'; img-src 'self'",
		'cross-origin-resource-policy': 'same-origin'
	};
	if (request.headers.get('if-none-match') === rendition.etag) return new Response(null, { status: 304, headers });
	const object = await rendition.open();
	if (!object) error(404, 'No such photo.');
	if (object.length !== undefined) headers['content-length'] = String(object.length);
	return new Response(object.body, { headers: { ...headers, 'content-type': 'image/webp' } });
}
