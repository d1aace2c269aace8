import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	return { contests: await judging.myContests(viewer) };
}) satisfies PageServerLoad;
