import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { ContestNotFound } from '$lib/server/contests/errors';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	try {
		return { listing: await judging.blindList(viewer, Number(event.params.contest)) };
	} catch (e) {
		if (e instanceof ContestNotFound) error(404, e.message);
		throw e;
	}
}) satisfies PageServerLoad;
