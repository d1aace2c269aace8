import { requireUser } from '$lib/server/club/guards';
import * as plans from '$lib/server/away/plans';
import { pageLoad } from '$lib/server/http/loads';
import type { PageServerLoad } from './$types';

export const load = pageLoad(async (event) => {
	const viewer = requireUser(event);
	return plans.get(viewer, Number(event.params.plan));
}) satisfies PageServerLoad;
