import { error, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { ContestNotFound } from '$lib/server/contests/errors';
import * as contests from '$lib/server/contests/contests';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	try {
		return { listing: await judging.blindList(viewer, Number(event.params.contest)) };
	} catch (e) {
		if (e instanceof ContestNotFound) {
			// Once the results are out, the judging list is the public results page.
			const contest = await contests.get(viewer, Number(event.params.contest));
			if (contest && (contest.state === 'published' || contest.state === 'archived')) redirect(303, `/contests/${contest.id}`);
			error(404, e.message);
		}
		throw e;
	}
}) satisfies PageServerLoad;
