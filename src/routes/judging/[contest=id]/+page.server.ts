import { redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import * as contests from '$lib/server/contests/contests';
import { orNotFound } from '../not-found.server';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const contestId = Number(event.params.contest);
	const listing = await orNotFound(judging.blindList(viewer, contestId), async () => {
		// Once the results are out, the judging list is the public results page.
		const contest = await contests.get(viewer, contestId);
		if (contest && (contest.state === 'published' || contest.state === 'archived')) redirect(303, `/contests/${contest.id}`);
	});
	return { listing };
}) satisfies PageServerLoad;
