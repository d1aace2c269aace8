// Two Handle functions for hooks.server.ts, first in its sequence:
// - observeRequests gives every request an id (locals.requestId, echoed as X-Request-Id), writes one
//   log line per request (method, route id — never the raw path, whose query can hold a sign-in
//   token —, status, duration, viewer) and counts it into the metrics;
// - probes answers /healthz, /readyz and /metrics itself, before sign-in, the display-name prompt
//   or anything else runs, so a probe needs no session and is never redirected.
import { isHttpError, isRedirect, type Handle, type RequestEvent } from '@sveltejs/kit';
import { acceptRequestId, newRequestId, statusClass } from '../../ops/request-id';
import { liveResponse, readyResponse } from './health';
import { log } from './log';
import { httpDuration, httpRequests } from './metrics';
import { metricsResponse } from './scrape';

const PROBES: Record<string, (request: Request) => Response | Promise<Response>> = {
	'/healthz': liveResponse,
	'/readyz': readyResponse,
	'/metrics': metricsResponse
};

/** The route id for logs and metric labels; probes have fixed paths and no route of their own. */
function routeOf(event: RequestEvent): string {
	if (event.route.id) return event.route.id;
	return Object.hasOwn(PROBES, event.url.pathname) ? event.url.pathname : '(no route)';
}

function record(event: RequestEvent, status: number, started: number) {
	const seconds = (performance.now() - started) / 1000;
	const route = routeOf(event);
	const status_class = statusClass(status);
	httpRequests.inc({ method: event.request.method, route, status_class });
	httpDuration.observe({ route, status_class }, seconds);
	const line = {
		reqId: event.locals.requestId,
		method: event.request.method,
		route,
		status,
		ms: Math.round(seconds * 10_000) / 10,
		...(event.locals.user ? { userId: event.locals.user.id } : {})
	};
	// Probes come every few seconds: only their failures are worth a line at the usual level.
	const probe = Object.hasOwn(PROBES, route) && status < 500;
	if (status >= 500) log.error(line, 'request');
	else if (probe) log.debug(line, 'request');
	else log.info(line, 'request');
}

export const observeRequests: Handle = async ({ event, resolve }) => {
	const started = performance.now();
	const requestId = acceptRequestId(event.request.headers.get('x-request-id')) ?? newRequestId();
	event.locals.requestId = requestId;
	let response: Response;
	try {
		response = await resolve(event);
	} catch (error) {
		// A redirect or error thrown by a later hook (the display-name prompt) is turned into a
		// response by SvelteKit itself, past every hook: it is logged here but carries no header.
		record(event, isRedirect(error) || isHttpError(error) ? error.status : 500, started);
		throw error;
	}
	record(event, response.status, started);
	return withRequestId(response, requestId);
};

function withRequestId(response: Response, requestId: string): Response {
	try {
		response.headers.set('X-Request-Id', requestId);
		return response;
	} catch {
		// Response.redirect() (Auth.js's) and fetched responses have immutable headers: answer with a copy.
		const copy = new Response(response.body, response);
		copy.headers.set('X-Request-Id', requestId);
		return copy;
	}
}

export const probes: Handle = async ({ event, resolve }) => {
	const probe =
		event.request.method === 'GET' || (event.request.method === 'HEAD' && Object.hasOwn(PROBES, event.url.pathname)) ? PROBES[event.url.pathname] : undefined;
	return probe ? probe(event.request) : resolve(event);
};
