// While MariaDB cannot be reached, every page and API answers "we'll be right back" with 503 and
// Retry-After, instead of a stack of 500s. The pool reconnects by itself once the server is back
// (mysql2 drops a broken connection and opens a new one on the next query), so nothing has to be
// restarted. /readyz (probes, earlier in the sequence) reports the same outage to load balancers.
import { json, type Handle, type RequestEvent } from '@sveltejs/kit';
import { createHash } from 'node:crypto';
import { isDatabaseUnavailable } from '../db/unavailable';
import { component } from './log';

const log = component('outage');

export const RETRY_AFTER_SECONDS = 30;
const MESSAGE = 'Riparia is briefly unavailable while its database restarts. Nothing you saved before this is lost; please try again in a minute.';

// The page is self-contained (the layout's styles and scripts may need what is down); its one
// inline style is allowed by its hash, nothing else may load or run.
const STYLE =
	'body{margin:0;font:17px/1.55 system-ui,sans-serif;background:#f4f6f3;color:#1d2a24}main{max-width:34rem;margin:12vh auto;padding:0 1.25rem}' +
	'h1{font-family:Georgia,serif;font-size:1.9rem;margin:.2rem 0 1rem}p{margin:.6rem 0}.status{font-size:.95rem;color:#4a5a52}code{font-size:.9rem}a{color:#1f4d3d;font-weight:600}a:focus-visible{outline:3px solid #1f4d3d;outline-offset:2px}';
const CSP = `default-src 'none'; style-src 'sha256-${createHash('sha256').update(STYLE).digest('base64')}'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'`;

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(requestId: string, retryPath: string): string {
	return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><meta name="robots" content="noindex">
<title>We'll be right back · Riparia</title><style>${STYLE}</style></head>
<body><main data-testid="outage-page">
<p class="status">503 · Service briefly unavailable</p>
<h1>We'll be right back</h1>
<p>${escapeHtml(MESSAGE)}</p>
<p><a href="${escapeHtml(retryPath)}">Try this page again</a></p>
<p class="status" data-testid="error-reference">If this lasts more than a few minutes, tell an admin this reference: <code>${escapeHtml(requestId)}</code></p>
</main></body></html>`;
}

const wantsJson = (event: RequestEvent) => {
	const accept = event.request.headers.get('accept') ?? '';
	return event.url.pathname.startsWith('/api/') || (accept.includes('application/json') && !accept.includes('text/html'));
};

/** The 503 answer in the form the client asked for: a form action's result, JSON, or the page. */
export function outageResponse(event: RequestEvent): Response {
	const headers = { 'retry-after': String(RETRY_AFTER_SECONDS), 'cache-control': 'no-store' };
	const errorId = event.locals.requestId;
	if (event.request.headers.get('x-sveltekit-action') === 'true') {
		// What SvelteKit's use:enhance expects of an action: it shows the error page with this message.
		return json({ type: 'error', status: 503, error: { message: MESSAGE, errorId } }, { status: 503, headers });
	}
	if (wantsJson(event)) return json({ code: 'unavailable', message: MESSAGE, fields: {}, errorId }, { status: 503, headers });
	// Only a path of this site, never the query (it can hold a sign-in token).
	const retryPath = event.request.method === 'GET' ? event.url.pathname : '/';
	return new Response(page(errorId, retryPath), {
		status: 503,
		headers: { ...headers, 'content-type': 'text/html; charset=utf-8', 'content-security-policy': CSP }
	});
}

// Keyed by the request's locals: SvelteKit hands handleError an event object of its own, with the same locals.
const outages = new WeakSet<App.Locals>();

/** Called by handleError: this request failed because the database is away. */
export function noteOutage(event: RequestEvent, error: unknown): boolean {
	if (!isDatabaseUnavailable(error)) return false;
	outages.add(event.locals);
	log.warn({ reqId: event.locals.requestId, route: event.route.id }, 'database unavailable');
	return true;
}

/**
 * Turns a request that failed on the database's absence into the 503 answer, whether the error was
 * thrown by a later hook (the session lookup) or by a load, action or endpoint (handleError noted it).
 */
export const answerOutages: Handle = async ({ event, resolve }) => {
	let response: Response;
	try {
		response = await resolve(event);
	} catch (error) {
		if (!noteOutage(event, error)) throw error;
		return outageResponse(event);
	}
	return outages.has(event.locals) && response.status >= 500 ? outageResponse(event) : response;
};
