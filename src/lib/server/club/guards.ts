import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import type { Role } from '../../club/roles';
import type { Viewer } from './users';

type Guarded = Pick<RequestEvent, 'locals' | 'url'>;

const isApi = (event: Guarded) => event.url.pathname.startsWith('/api/');

/**
 * The signed-in person, or: a redirect to sign-in for pages, 401 for API routes. Call it in every
 * protected load, action and endpoint; a layout check alone does not protect actions.
 */
export function requireUser(event: Guarded): Viewer {
	const user = event.locals.user;
	if (!user) {
		if (isApi(event)) error(401, 'Sign in to use this.');
		const back = event.url.pathname + event.url.search;
		redirect(303, `/signin?redirectTo=${encodeURIComponent(back)}`);
	}
	return user;
}

/** The signed-in person when they hold one of `roles`; 403 otherwise. */
export function requireRole(event: Guarded, ...roles: Role[]): Viewer {
	const user = requireUser(event);
	if (!roles.includes(user.role)) {
		const who = roles.map((r) => (r === 'admin' ? 'admins' : r === 'judge' ? 'judges' : 'members')).join(' and ');
		error(403, `This part of Riparia is for ${who} only.`);
	}
	return user;
}

export const isAdmin = (user: Viewer | null | undefined) => user?.role === 'admin';
