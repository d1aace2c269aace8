import { requireUser } from '$lib/server/club/guards';
import * as plans from '$lib/server/away/plans';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	return plans.get(viewer, Number(event.params.plan));
}) satisfies PageServerLoad;
