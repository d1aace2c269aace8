import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as judging from '$lib/server/contests/judging';
import { orNotFound } from '../../not-found.server';
import type { Actions, PageServerLoad } from './$types';

// The scorecard page: the blind entry and the rubric come with the page; the card itself is
// fetched and autosaved by the browser through /api/judging/….
export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	return { card: await orNotFound(judging.scorecardPage(viewer, Number(event.params.contest), Number(event.params.number))), judgeId: viewer.id };
}) satisfies PageServerLoad;

const conflictForm = z.object({
	confirm: z.literal('yes', { message: 'Tick the box to confirm.' }),
	reason: z.string({ message: 'Say briefly why, for the admins.' }).trim().min(3, 'Say briefly why, for the admins.').max(judging.CONFLICT_REASON_MAX)
});

export const actions = {
	conflict: formAction(async (event, data) => {
		const viewer = requireRole(event, 'judge', 'admin');
		const { reason } = parseForm(conflictForm, data);
		await judging.declareConflict(viewer, Number(event.params.contest), Number(event.params.number), reason);
		redirect(303, `/judging/${event.params.contest}?conflict=1`);
	})
} satisfies Actions;
