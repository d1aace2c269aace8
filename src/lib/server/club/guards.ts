// Who may reach what, checked twice: `guardSections` (a hook) refuses whole parts of the site to
// the wrong roles before any route code runs, and every load, action and endpoint still calls
// requireUser or requireRole itself. Domain commands check roles a third time (assertRole in
// $lib/club/roles), so a command is safe whoever calls it.
import { error, json, redirect, type Handle, type RequestEvent } from '@sveltejs/kit';
import type { Account } from '../../club/membership';
import { hasRole, onlyFor, type Role } from '../../club/roles';
import type { Viewer } from '../../club/viewer';

type Guarded = Pick<RequestEvent, 'locals' | 'url'>;

const isApi = (event: Guarded) => event.url.pathname.startsWith('/api/');

const SIGN_IN_FIRST = 'Sign in to use this.';

const signInPath = (url: URL) => `/signin?redirectTo=${encodeURIComponent(url.pathname + url.search)}`;

const MEMBERS_ONLY = 'This part of Riparia is for members of the club.';

/** Where a signed-in person who is not (yet) a member is told where they stand. */
export const MEMBERSHIP_PATH = '/membership';

/**
 * The signed-in member (active), or: a redirect to sign-in for pages, 401 for API routes. Someone
 * signed in who is not a member (waiting to be admitted, turned down) is sent to their membership
 * page (403 for API routes). Call it in every protected load, action and endpoint; a layout check
 * alone does not protect actions.
 */
export function requireUser(event: Guarded): Viewer {
	const user = event.locals.user;
	if (!user) {
		const applicant = event.locals.account;
		if (isApi(event)) error(applicant ? 403 : 401, applicant ? MEMBERS_ONLY : SIGN_IN_FIRST);
		redirect(303, applicant ? MEMBERSHIP_PATH : signInPath(event.url));
	}
	return user;
}

/** Whoever is signed in, member or not (a suspended member is signed out): for their own membership pages. */
export function requireSignedIn(event: Guarded): Account {
	const account = event.locals.account;
	if (!account) {
		if (isApi(event)) error(401, SIGN_IN_FIRST);
		redirect(303, signInPath(event.url));
	}
	return account;
}

/**
 * "Not found" for something the viewer may not see. A signed-out visitor is offered sign-in, in
 * the same words whether the thing is missing or only for members, so the answer says nothing
 * about whether it exists.
 */
export function notFoundOrSignIn(event: Guarded, message: string): never {
	if (!event.locals.user && !isApi(event)) {
		error(404, {
			message:
				'There is nothing to show here without signing in. Much of the club’s site is for members only: sign in, and if it is there for you, you will see it.',
			signIn: signInPath(event.url)
		});
	}
	error(404, message);
}

/** The signed-in person when they hold one of `roles`; 403 otherwise. */
export function requireRole(event: Guarded, ...roles: Role[]): Viewer {
	const user = requireUser(event);
	if (!hasRole(user, ...roles)) error(403, onlyFor(roles));
	return user;
}

/** Parts of the site only some roles may enter, by path prefix. */
export const SECTIONS: readonly { prefix: string; roles: readonly Role[] }[] = [
	{ prefix: '/admin', roles: ['admin'] },
	{ prefix: '/judging', roles: ['judge', 'admin'] },
	{ prefix: '/api/judging', roles: ['judge', 'admin'] }
];

/**
 * The section a path lies in. Decided on the path as the router sees it: percent-decoded (so
 * `/%61dmin` is `/admin`), dot segments already resolved by the URL parser.
 */
export function sectionOf(pathname: string) {
	let path: string;
	try {
		path = decodeURI(pathname);
	} catch {
		return undefined; // The router refuses a path it cannot decode (400) before any route runs.
	}
	return SECTIONS.find((s) => path === s.prefix || path.startsWith(s.prefix + '/'));
}

const wantsJson = (event: RequestEvent) => isApi(event) || (event.request.headers.get('accept') ?? '').includes('application/json');
/** A form action posted by use:enhance: it reads an ActionResult back. */
const isEnhancedAction = (event: RequestEvent) => event.request.method === 'POST' && event.request.headers.get('x-sveltekit-action') === 'true';

/**
 * Refuses a section to anyone without its role before any route code runs: a signed-out visitor
 * goes to sign-in (401 JSON for API-style requests), an applicant to their membership page (403
 * JSON), a member without the role gets 403 (JSON, an
 * ActionResult for use:enhance, or plain text). Only a signed-in visitor's page view reaches the
 * route, because only a route can render the site's error page: its own guard (or the
 * section's layout) refuses it there, and anything other than that refusal is replaced by a
 * plain 403. Page views change nothing, so running their loads is harmless; actions and other
 * methods never run.
 */
export const guardSections: Handle = async ({ event, resolve }) => {
	const section = sectionOf(event.url.pathname);
	if (!section || hasRole(event.locals.user, ...section.roles)) return resolve(event);
	const user = event.locals.user;
	// Signed in but not a member (waiting to be admitted): told where they stand, as requireUser does.
	if (!user && event.locals.account) {
		if (isEnhancedAction(event)) return json({ type: 'redirect', status: 303, location: MEMBERSHIP_PATH });
		if (wantsJson(event) || event.isDataRequest) return json({ code: 'forbidden', message: MEMBERS_ONLY, fields: {} }, { status: 403 });
		return new Response(null, { status: 303, headers: { location: MEMBERSHIP_PATH } });
	}
	const status = user ? 403 : 401;
	const message = user ? onlyFor(section.roles) : SIGN_IN_FIRST;

	if (isEnhancedAction(event)) {
		return user ? json({ type: 'error', error: { message } }, { status }) : json({ type: 'redirect', status: 303, location: signInPath(event.url) });
	}
	if (!user && !wantsJson(event)) {
		// SvelteKit turns this into its JSON redirect for client-side navigations (data requests).
		return new Response(null, { status: 303, headers: { location: signInPath(event.url) } });
	}
	if (!user || wantsJson(event) || event.isDataRequest) return json({ code: user ? 'forbidden' : 'sign-in', message, fields: {} }, { status });

	if (event.request.method === 'GET' || event.request.method === 'HEAD') {
		const response = await resolve(event);
		if (response.status === 403) return response;
		await response.body?.cancel();
	}
	// Returned rather than thrown, so the outer hooks still add their headers.
	return new Response(message, { status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
};
