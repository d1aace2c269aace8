import { requireRole } from '$lib/server/club/guards';
import * as auditLog from '$lib/server/club/audit-log';
import { endpoint } from '$lib/server/http/api';
import { auditQuery } from '$lib/club/audit-filter';
import { CSV_MIME } from '$lib/contests/csv';
import type { RequestHandler } from './$types';

/** The audit log as CSV, with the page's filters. */
export const GET: RequestHandler = endpoint(async (event) => {
	const admin = requireRole(event, 'admin');
	const query = auditQuery.parse(Object.fromEntries(event.url.searchParams));
	const csv = await auditLog.csv(admin, { ...query, before: undefined });
	return new Response(csv, {
		headers: { 'content-type': CSV_MIME, 'content-disposition': 'attachment; filename="audit-log.csv"', 'cache-control': 'private, no-store' }
	});
});
