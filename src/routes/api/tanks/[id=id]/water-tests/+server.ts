import { json } from '@sveltejs/kit';
import * as water from '$lib/server/journals/water';
import type { RequestHandler } from './$types';

/**
 * The chart data of a tank: GET /api/tanks/<id>/water-tests → { tank, units, series }. Who may
 * read it follows the tank: anyone for a public tank, members for a club tank, its keeper for a
 * private one; everyone else gets 404, signed in or not, so a tank's existence does not leak.
 * Values are in the viewer's units, so the answer is never shared between viewers.
 */
export const GET: RequestHandler = async (event) => {
	const data = await water.seriesFor(event.locals.user, Number(event.params.id));
	if (!data) return json({ message: 'We could not find that tank.' }, { status: 404 });
	return json(data, { headers: { 'cache-control': 'private, no-cache' } });
};
