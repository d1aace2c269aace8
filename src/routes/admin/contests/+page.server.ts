import { requireRole } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	return { contests: await contests.listAll(viewer) };
}) satisfies PageServerLoad;
