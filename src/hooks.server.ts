import { redirect, type Handle, type HandleServerError, type ServerInit } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { building } from '$app/environment';
import { authHandle } from '$lib/server/auth';
import * as sessions from '$lib/server/club/sessions';
import * as users from '$lib/server/club/users';
import { config } from '$lib/server/config';
import { startWorker } from '$lib/server/mail/outbox';
import { jobs } from '$lib/server/jobs';
import { startJobs } from '$lib/server/jobs/runner';
import { defaultTransport } from '$lib/server/mail/transport';
import { pool } from '$lib/server/db';
import { safeRedirectPath } from '$lib/club/redirect';
import { log } from '$lib/server/ops/log';
import { observeRequests, probes } from '$lib/server/ops/hooks';
import { newRequestId } from '$lib/ops/request-id';
import { startMetricsServer } from '$lib/server/ops/scrape';

const SESSION_COOKIES = ['__Secure-authjs.session-token', 'authjs.session-token'];

export const init: ServerInit = async () => {
	if (building) return;
	const stopWorker = config().OUTBOX_WORKER ? startWorker() : () => {};
	const stopJobs = startJobs(jobs);
	const metricsPort = config().METRICS_PORT;
	const metricsServer = metricsPort ? startMetricsServer(metricsPort) : null;
	// adapter-node emits this once the HTTP server has closed; open timers and pooled
	// connections would otherwise keep the process alive.
	process.once('sveltekit:shutdown', () => {
		stopWorker();
		stopJobs();
		metricsServer?.close();
		defaultTransport().close();
		void pool.end();
	});
};

/** Sign-in links are requested only through /signin, where they are validated and rate-limited. */
const onlyOurSignInForm: Handle = async ({ event, resolve }) => {
	if (event.request.method === 'POST' && event.url.pathname.startsWith('/auth/signin')) {
		return new Response('Request a sign-in link on /signin.', { status: 404 });
	}
	return resolve(event);
};

const resolveViewer: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.sessionToken = null;
	if (event.url.pathname.startsWith('/auth/')) return resolve(event);
	const token = SESSION_COOKIES.map((name) => event.cookies.get(name)).find(Boolean) ?? null;
	if (token) {
		const session = await event.locals.auth();
		const id = session?.user?.id;
		const row = id ? await users.getById(id) : undefined;
		if (row) {
			event.locals.user = users.toViewer(row);
			event.locals.sessionToken = token;
			const stored = await sessions.getByToken(token);
			await Promise.all([
				users.touchLastSeen(row.id, row.lastSeenAt),
				stored ? sessions.touch(token, stored.lastSeenAt, event.request.headers.get('user-agent')) : undefined
			]);
		}
	}
	return resolve(event);
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
		redirect(303, `/welcome?redirectTo=${encodeURIComponent(safeRedirectPath(path + event.url.search))}`);
	}
	return resolve(event);
};

const securityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
	response.headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=(self), payment=(), usb=(), interest-cohort=()');
	response.headers.set('X-Frame-Options', 'DENY');
	if (event.url.protocol === 'https:') {
		response.headers.set('Strict-Transport-Security', 'max-age=31536000; includeSubDomains');
	}
	return response;
};

export const handle: Handle = sequence(observeRequests, probes, onlyOurSignInForm, authHandle, resolveViewer, askForDisplayName, securityHeaders);

/** Last resort: log the error under the request's id, show the person only that id. */
export const handleError: HandleServerError = ({ error, event, status, message }) => {
	// Set by observeRequests, first in the sequence; the fallback only guards against a reordering.
	const errorId = event.locals.requestId ?? newRequestId();
	if (status >= 500) {
		// Query strings can carry sign-in tokens: the route id only, never the URL.
		log.error({ reqId: errorId, method: event.request.method, route: event.route.id, err: error }, 'unexpected error');
	}
	return {
		message: status === 404 ? 'We could not find that page.' : status >= 500 ? 'Something went wrong on our side.' : message,
		errorId
	};
};
