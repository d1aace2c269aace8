import { type Handle, type HandleServerError, type ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { building } from '$app/environment';
import { authHandle } from '$lib/server/auth';
import { guardSections } from '$lib/server/club/guards';
import * as sessions from '$lib/server/club/sessions';
import * as membership from '$lib/server/club/membership';
import { config } from '$lib/server/config';
import { startWorker } from '$lib/server/mail/outbox';
import { jobs } from '$lib/server/jobs';
import { startJobs } from '$lib/server/jobs/runner';
import { defaultTransport } from '$lib/server/mail/transport';
import { pool } from '$lib/server/db';
import { countQueries } from '$lib/server/db/query-count';
import { safeRedirectPath } from '$lib/club/redirect';
import { checkRequests } from '$lib/server/http/requests';
import { isPublic, responseHeaders } from '$lib/server/http/responses';
import { log, reason } from '$lib/server/ops/log';
import { observeRequests, probes } from '$lib/server/ops/hooks';
import { answerOutages, noteOutage } from '$lib/server/ops/outage';
import { newRequestId } from '$lib/ops/request-id';
import { startMetricsServer } from '$lib/server/ops/scrape';
import { registerMediaScopes } from '$lib/server/media-scopes';

// Who may see each kind of photo is known before the first request.
registerMediaScopes();

export const init: ServerInit = async () => {
	if (building) return;
	const stopWorker = config().OUTBOX_WORKER ? startWorker() : () => {};
	const stopJobs = startJobs(jobs);
	const metricsPort = config().METRICS_PORT;
	const metricsServer = metricsPort ? startMetricsServer(metricsPort) : null;
	// adapter-node emits this once the HTTP server has closed; open timers and pooled
	// connections would otherwise keep the process alive.
	// A round in progress finishes before the pool closes.
	process.once('sveltekit:shutdown', () => {
		metricsServer?.close();
		void Promise.all([stopWorker(), stopJobs()]).finally(() => {
			defaultTransport().close();
			void pool.end();
		});
	});
};

/** A redirect returned (not thrown), so the outer hooks still add their headers to it. */
const seeOther = (location: string) => new Response(null, { status: 303, headers: { location } });

/**
 * Sign-in links are requested only through /signin, where they are validated and rate-limited;
 * Auth.js's own pages are answered by ours, so every page a person sees is one of ours.
 */
const AUTH_PAGES: Record<string, string> = {
	'/auth/signin': '/signin',
	'/auth/signout': '/',
	'/auth/error': '/signin/problem',
	'/auth/verify-request': '/signin/check-email'
};

/**
 * Sign-in links are requested only through /signin, where they are validated and rate-limited;
 * Auth.js's own pages are answered by ours, so every page a person sees is one of ours.
 */
const onlyOurAuthPages: Handle = async ({ event, resolve }) => {
	const path = event.url.pathname.replace(/\/+$/, '');
	if (event.request.method === 'POST' && path.startsWith('/auth/signin')) {
		return new Response('Request a sign-in link on /signin.', { status: 404 });
	}
	const ours = event.request.method === 'GET' ? AUTH_PAGES[path] : undefined;
	if (ours) {
		const error = event.url.searchParams.get('error');
		return seeOther(ours === '/signin/problem' && error ? `${ours}?error=${encodeURIComponent(error)}` : ours);
	}
	return resolve(event);
};

const SESSION_COOKIES = ['__Secure-authjs.session-token', 'authjs.session-token'];

/**
 * Resolves the session cookie into `locals.user` with one query (session joined to its member);
 * the time of use is written at most every few minutes, without holding up the response.
 * Auth.js's own session call is not used: it re-sends the cookie on every response, including
 * ones a shared cache may keep. The cookie is re-sent only when its end moves (once a day of
 * use) and never on a public response.
 */
const resolveViewer: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.account = null;
	event.locals.sessionToken = null;
	if (event.url.pathname.startsWith('/auth/')) return resolve(event);
	const cookieName = SESSION_COOKIES.find((name) => event.cookies.get(name));
	const token = cookieName ? event.cookies.get(cookieName)! : null;
	const session = token ? await sessions.find(token) : undefined;
	if (!token || !cookieName || !session) return resolve(event);
	// Members are `user`; applicants only `account`; a suspended member is signed out here.
	const standing = membership.standingOf(session.user);
	if (!standing.account) return resolve(event);

	event.locals.user = standing.user;
	event.locals.account = standing.account;
	event.locals.sessionToken = token;
	const response = await resolve(event);
	const renew = sessions.renewalDue(session) && !isPublic(response);
	// The last-seen write (every few minutes) is off the read path; a renewal (once a day) is
	// awaited, so the next request already sees the new end and does not renew again.
	const { expires, written } = sessions.recordUse(token, session, event.request.headers.get('user-agent'), renew);
	const recorded = written.catch((error: unknown) => log.warn({ reqId: event.locals.requestId, reason: reason(error) }, 'session use not recorded'));
	if (expires) await recorded;
	else void recorded;
	if (expires) {
		const cookie = event.cookies.serialize(cookieName, token, {
			path: '/',
			httpOnly: true,
			sameSite: 'lax',
			secure: cookieName.startsWith('__Secure-'),
			expires
		});
		try {
			response.headers.append('set-cookie', cookie);
		} catch {
			// A response with immutable headers keeps the old end; the next page renews it.
		}
	}
	return response;
};

/** A signed-in person without a display name is asked for one before anything else. */
const askForDisplayName: Handle = async ({ event, resolve }) => {
	const user = event.locals.user;
	const path = event.url.pathname;
	if (
		user &&
		!user.displayName &&
		event.request.method === 'GET' &&
		!path.startsWith('/welcome') &&
		!path.startsWith('/api/') &&
		!path.startsWith('/auth/') &&
		!path.startsWith('/signout') &&
		!path.startsWith('/media/') &&
		!path.startsWith('/_app/')
	) {
		return seeOther(`/welcome?redirectTo=${encodeURIComponent(safeRedirectPath(path + event.url.search))}`);
	}
	return resolve(event);
};

// Outermost first: requests get their id and log line, statements are counted, and every
// response, Auth.js's included, leaves through responseHeaders. While MariaDB is away, what needs
// it answers 503 "we'll be right back" (answerOutages). The sections (/admin, /judging)
// are guarded once the viewer is known; every route checks again.
export const handle: Handle = sequence(
	observeRequests,
	countQueries,
	responseHeaders,
	probes,
	answerOutages,
	checkRequests,
	onlyOurAuthPages,
	authHandle,
	resolveViewer,
	askForDisplayName,
	guardSections
);

/** Last resort: log the error under the request's id, show the person only that id. */
export const handleError: HandleServerError = ({ error, event, status, message }) => {
	// Set by observeRequests, first in the sequence; the fallback only guards against a reordering.
	const errorId = event.locals.requestId ?? newRequestId();
	// The database is away: answerOutages turns this into the 503 page; a warning, not an error.
	if (noteOutage(event, error)) return { message: 'We will be right back.', errorId };
	if (status >= 500) {
		// Query strings can carry sign-in tokens: the route id only, never the URL.
		log.error({ reqId: errorId, method: event.request.method, route: event.route.id, err: error }, 'unexpected error');
	}
	return {
		message: status === 404 ? 'We could not find that page.' : status >= 500 ? 'Something went wrong on our side.' : message,
		errorId
	};
};
