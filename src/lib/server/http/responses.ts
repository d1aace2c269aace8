// Headers every response leaves with, whichever part of the app (or Auth.js) answered it.
import type { Handle } from '@sveltejs/kit';

/** For responses SvelteKit did not render (JSON, Auth.js, files): nothing may run or be framed. */
const FALLBACK_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'self'";

export const isPublic = (response: Response) => /(^|,)\s*public\b/i.test(response.headers.get('cache-control') ?? '');

/**
 * Adds the security headers, makes anything dynamic uncacheable unless its route said otherwise,
 * and never lets a cookie ride on a response a shared cache may keep.
 */
export const responseHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	const headers = response.headers;
	try {
		headers.set('X-Content-Type-Options', 'nosniff');
	} catch {
		// Immutable headers (a response passed through from fetch): copy it into one we may change.
		return withHeaders(new Response(response.body, response), event.url.protocol);
	}
	return withHeaders(response, event.url.protocol);
};

function withHeaders(response: Response, protocol: string): Response {
	const headers = response.headers;
	headers.set('X-Content-Type-Options', 'nosniff');
	headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
	headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=(self), payment=(), usb=(), interest-cohort=()');
	headers.set('X-Frame-Options', 'DENY');
	if (!headers.has('content-security-policy')) headers.set('Content-Security-Policy', FALLBACK_CSP);
	if (protocol === 'https:') headers.set('Strict-Transport-Security', 'max-age=31536000; includeSubDomains');
	// Pages and data are personal or change often: no cache keeps them unless the route chose to.
	if (!headers.has('cache-control')) headers.set('Cache-Control', 'private, no-store');
	if (isPublic(response)) headers.delete('set-cookie');
	return response;
}
