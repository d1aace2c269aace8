import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { ContestError, ContestNotFound } from '$lib/server/contests/errors';
import type { Actions, PageServerLoad } from './$types';

// The scorecard page: the blind entry and the rubric come with the page; the card itself is
// fetched and autosaved by the browser through /api/judging/….
export const load = (async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	try {
		return { card: await judging.scorecardPage(viewer, Number(event.params.contest), Number(event.params.number)), judgeId: viewer.id };
	} catch (e) {
		if (e instanceof ContestNotFound) error(404, e.message);
		throw e;
	}
}) satisfies PageServerLoad;

const conflictSchema = z.object({
	confirm: z.literal('yes', { message: 'Tick the box to confirm.' }),
	reason: z.string().trim().min(3, 'Say briefly why, for the admins.').max(judging.CONFLICT_REASON_MAX)
});

export const actions = {
	conflict: async (event) => {
		const viewer = requireRole(event, 'judge', 'admin');
		const form = Object.fromEntries(await event.request.formData());
		const parsed = conflictSchema.safeParse({ confirm: form.confirm ?? '', reason: form.reason ?? '' });
		if (!parsed.success) return fail(400, { conflictError: parsed.error.issues[0]?.message ?? 'Check the form.', reason: String(form.reason ?? '') });
		try {
			await judging.declareConflict(viewer, Number(event.params.contest), Number(event.params.number), parsed.data.reason);
		} catch (e) {
			if (e instanceof ContestNotFound) error(404, e.message);
			if (e instanceof ContestError) return fail(e.status, { conflictError: e.message, reason: parsed.data.reason });
			throw e;
		}
		redirect(303, `/judging/${event.params.contest}?conflict=1`);
	}
} satisfies Actions;
