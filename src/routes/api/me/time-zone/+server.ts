import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { endpoint, readJson } from '$lib/server/http/api';
import * as users from '$lib/server/club/users';
import type { RequestHandler } from './$types';

const body = z.object({ timeZone: z.string().max(64) });

/**
 * The browser's own time zone, sent once by the layout while the member has none:
 * POST /api/me/time-zone { timeZone } → { kept }. A zone the member chose is never replaced.
 */
export const POST: RequestHandler = endpoint(async (event) => {
	const user = requireUser(event);
	const { timeZone } = await readJson(event, body);
	return json({ kept: await users.adoptTimeZone(user, timeZone) });
});
