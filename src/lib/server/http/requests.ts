// Checks every request gets before any route sees it: where a state-changing request comes
// from, what its body claims to be, and a clear 400 when a body cannot be read.
import { error, json, type Handle, type RequestEvent } from '@sveltejs/kit';
import { config } from '../config';
import { UNSUBSCRIBE_PATH } from '../mail/unsubscribe';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Endpoints under /api/ that take a photo upload instead of JSON; they read and check the form themselves. */
const UPLOAD_ENDPOINTS = [/^\/api\/media$/];

/** Bodies other than uploads are small: a journal entry's markdown is the largest (see entry-form). */
export const MAX_FORM_BYTES = 512 * 1024;

const refuse = (event: RequestEvent, status: number, message: string) =>
	event.url.pathname.startsWith('/api/') || event.request.headers.get('accept')?.includes('application/json')
		? json({ code: status === 403 ? 'cross-site' : status === 415 ? 'content-type' : 'bad-request', message }, { status })
		: new Response(message, { status, headers: { 'content-type': 'text/plain; charset=utf-8' } });

/**
 * A state-changing request must come from one of our own pages. SvelteKit checks this for form
 * posts only; a body-less or JSON POST from another site would pass, so every non-GET request
 * is checked here: its `Origin` must be ours, or, where a browser sends none, `Sec-Fetch-Site`
 * must say same-origin. Requests with neither (not from a browser) are refused too.
 */
export function sameOrigin(request: Request, origin = new URL(config().ORIGIN).origin): boolean {
	const sent = request.headers.get('origin');
	if (sent !== null) return sent === origin;
	return request.headers.get('sec-fetch-site') === 'same-origin';
}

const mediaType = (request: Request) => (request.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();

const hasBody = (request: Request) => {
	const length = request.headers.get('content-length');
	return (length !== null && length !== '0') || request.headers.has('transfer-encoding');
};

/**
 * Readers that turn an unreadable body (a truncated upload, broken JSON) into a 400 with a clear
 * message instead of the 500 the platform's TypeError would give.
 */
function guardBodyReaders(request: Request) {
	const formData = request.formData.bind(request);
	const readJson = request.json.bind(request);
	Object.defineProperty(request, 'formData', {
		value: async () => {
			try {
				return await formData();
			} catch {
				error(400, 'We could not read what was sent: the form arrived incomplete or in a shape we do not take. Please send it again.');
			}
		}
	});
	Object.defineProperty(request, 'json', {
		value: async () => {
			try {
				return await readJson();
			} catch {
				error(400, 'We could not read what was sent: it is not valid JSON.');
			}
		}
	});
}

/**
 * The one exemption from the origin check: a mail provider's one-click unsubscribe (RFC 8058), a
 * POST from its servers with no Origin, to an unsubscribe page, whose small form body is exactly
 * `List-Unsubscribe=One-Click`. It is authenticated by the signed token in its path alone, and
 * the page's action can only unsubscribe for such a body (see routes/unsubscribe/[token]).
 */
async function isOneClickUnsubscribe(event: RequestEvent): Promise<boolean> {
	const { request } = event;
	if (request.method !== 'POST' || !UNSUBSCRIBE_PATH.test(event.url.pathname)) return false;
	const type = mediaType(request);
	if (type !== 'application/x-www-form-urlencoded' && type !== 'multipart/form-data') return false;
	if (Number(request.headers.get('content-length') ?? MAX_FORM_BYTES) > 4096) return false;
	try {
		const body = await request.clone().formData();
		return [...body.keys()].length === 1 && body.get('List-Unsubscribe') === 'One-Click';
	} catch {
		return false;
	}
}

export const checkRequests: Handle = async ({ event, resolve }) => {
	const { request } = event;
	if (SAFE_METHODS.has(request.method)) return resolve(event);

	if (!sameOrigin(request) && !(await isOneClickUnsubscribe(event))) return refuse(event, 403, 'This request did not come from a Riparia page.');

	const type = mediaType(request);
	const length = Number(request.headers.get('content-length') ?? 0);
	const upload = UPLOAD_ENDPOINTS.some((p) => p.test(event.url.pathname));
	if (event.url.pathname.startsWith('/api/') && !upload && hasBody(request) && type !== 'application/json') {
		return refuse(event, 415, 'Send this as application/json.');
	}
	if (type !== 'multipart/form-data' && length > MAX_FORM_BYTES) {
		return refuse(event, 400, 'That is more text than a form here takes. Shorten it and send it again.');
	}
	guardBodyReaders(request);
	return resolve(event);
};
