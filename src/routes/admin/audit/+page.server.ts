import { requireRole } from '$lib/server/club/guards';
import * as auditLog from '$lib/server/club/audit-log';
import { auditQuery } from '$lib/club/audit-filter';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const query = auditQuery.parse(Object.fromEntries(event.url.searchParams));
	return { ...(await auditLog.page(admin, query)), query };
}) satisfies PageServerLoad;
