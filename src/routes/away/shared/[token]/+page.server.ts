import * as plans from '$lib/server/away/plans';
import { pageLoad } from '$lib/server/http/loads';
import type { PageServerLoad } from './$types';

// A private link the keeper made for someone without an account: the plan only, while it runs.
export const load = pageLoad(async ({ params, setHeaders }) => {
	setHeaders({ 'referrer-policy': 'no-referrer', 'x-robots-tag': 'noindex' });
	return plans.byShareToken(params.token);
}) satisfies PageServerLoad;
