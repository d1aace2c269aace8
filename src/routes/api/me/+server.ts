import { json } from '@sveltejs/kit';
import { requireSignedIn } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import type { RequestHandler } from './$types';

/** Who the client is signed in as; the client uses it to decide what to show. Someone not yet admitted has no role. */
export const GET: RequestHandler = endpoint((event) => {
	const account = requireSignedIn(event);
	const user = event.locals.user;
	return json({ id: account.id, displayName: account.displayName, state: account.state, role: user?.role ?? null, units: user?.units ?? null });
});
