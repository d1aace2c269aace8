import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { refusal } from '$lib/server/contests/api';
import { cardSaveSchema } from '$lib/contests/card';
import type { RequestHandler } from './$types';

/** The judge's card for one entry (blind: no entrant, no tank). */
export const GET: RequestHandler = async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	try {
		return json(await judging.getCard(viewer, Number(event.params.contest), Number(event.params.number)), { headers: { 'cache-control': 'no-store' } });
	} catch (error) {
		return refusal(error);
	}
};

/** Autosave: { baseVersion, saveId, fields } → the saved card, or 409 with the newer one. */
export const PUT: RequestHandler = async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const body = await event.request.json().catch(() => null);
	const parsed = cardSaveSchema.safeParse(body);
	if (!parsed.success) return json({ code: 'bad-request', message: parsed.error.issues[0]?.message ?? 'The save could not be read.' }, { status: 400 });
	try {
		return json(await judging.saveCard(viewer, Number(event.params.contest), Number(event.params.number), parsed.data));
	} catch (error) {
		return refusal(error);
	}
};
