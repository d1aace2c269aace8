import { z } from 'zod';
import * as contests from '$lib/server/contests/contests';
import type { PageServerLoad } from './$types';

const query = z.object({ page: z.coerce.number().int().min(1).max(10_000).catch(1) });

// Public: the club's contests and their results are for anyone to read.
export const load = (async (event) => {
	const { page } = query.parse(Object.fromEntries(event.url.searchParams));
	return { ...(await contests.list(event.locals.user, { page })), page };
}) satisfies PageServerLoad;
