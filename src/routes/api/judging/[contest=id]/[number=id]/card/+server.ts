import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { endpoint, readJson } from '$lib/server/http/api';
import * as judging from '$lib/server/contests/judging';
import { cardSaveSchema } from '$lib/contests/card';
import type { RequestHandler } from './$types';

/** The judge's card for one entry (blind: no entrant, no tank). */
export const GET: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	return json(await judging.getCard(viewer, Number(event.params.contest), Number(event.params.number)), { headers: { 'cache-control': 'no-store' } });
});

/** Autosave: { baseVersion, saveId, fields } → the saved card, or 409 'version-conflict' with the newer one as `current`. */
export const PUT: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const save = await readJson(event, cardSaveSchema);
	return json(await judging.saveCard(viewer, Number(event.params.contest), Number(event.params.number), save));
});
