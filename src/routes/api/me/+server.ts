import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import type { RequestHandler } from './$types';

/** Who the client is signed in as; the client uses it to decide what to show. */
export const GET: RequestHandler = endpoint((event) => {
	const user = requireUser(event);
	return json({ id: user.id, displayName: user.displayName, role: user.role, units: user.units });
});
