import { requireRole } from '$lib/server/club/guards';
import type { PageServerLoad } from './$types';

export const load = ((event) => {
	requireRole(event, 'admin');
	return {};
}) satisfies PageServerLoad;
