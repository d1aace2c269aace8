import { requireRole } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import { cardsCsv, resultsCsv } from '$lib/server/contests/export';
import { notFound } from '$lib/errors';
import { CSV_MIME, csvFileName } from '$lib/contests/csv';
import type { RequestHandler } from './$types';

/** Results or every card as CSV, for admins. */
export const GET: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'admin');
	const kind = event.params.kind;
	if (kind !== 'results' && kind !== 'cards') throw notFound('No such export.');
	const { title, csv } = kind === 'results' ? await resultsCsv(viewer, Number(event.params.id)) : await cardsCsv(viewer, Number(event.params.id));
	return new Response(csv, {
		headers: {
			'content-type': CSV_MIME,
			'content-disposition': `attachment; filename="${csvFileName(title, kind)}"`,
			'cache-control': 'private, no-store'
		}
	});
});
