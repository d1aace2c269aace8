import { requireUser } from '$lib/server/club/guards';
import * as summary from '$lib/server/away/summary';
import { pageLoad } from '$lib/server/http/loads';
import type { PageServerLoad } from './$types';

export const load = pageLoad(async (event) => {
	const viewer = requireUser(event);
	return { summary: await summary.get(viewer, Number(event.params.plan)), units: viewer.units };
}) satisfies PageServerLoad;
