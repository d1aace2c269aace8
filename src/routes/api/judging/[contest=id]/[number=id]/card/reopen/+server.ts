import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { refusal } from '$lib/server/contests/api';
import type { RequestHandler } from './$types';

/** Reopens a submitted card while the judging window lasts. */
export const POST: RequestHandler = async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	try {
		return json(await judging.reopenCard(viewer, Number(event.params.contest), Number(event.params.number)));
	} catch (error) {
		return refusal(error);
	}
};
