import { json } from '@sveltejs/kit';
import { endpoint } from '$lib/server/http/api';
import * as water from '$lib/server/journals/water';
import { notFound } from '$lib/errors';
import type { RequestHandler } from './$types';

/**
 * The chart data of a tank: GET /api/tanks/<id>/water-tests → { tank, units, series }. Who may
 * read it follows the tank: anyone for a public tank, members for a club tank, its keeper for a
 * private one; everyone else gets 404, signed in or not, so a tank's existence does not leak.
 * Values are in the viewer's units, so the answer is never shared between viewers.
 */
export const GET: RequestHandler = endpoint(async (event) => {
	const data = await water.seriesFor(event.locals.user, Number(event.params.id));
	if (!data) throw notFound('We could not find that tank.');
	return json(data, { headers: { 'cache-control': 'private, no-cache' } });
});
