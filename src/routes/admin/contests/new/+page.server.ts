import { fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import { draftFromForm, emptyContestDraft, parseContestDraft } from '$lib/contests/contest-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return { draft: emptyContestDraft(new Date().toISOString().slice(0, 10)) };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const viewer = requireRole(event, 'admin');
		const draft = draftFromForm(await event.request.formData());
		const parsed = parseContestDraft(draft);
		if (!parsed.ok) return fail(400, { errors: parsed.errors, draft });
		const id = await contests.create(viewer, parsed.input);
		redirect(303, `/admin/contests/${id}?created=1`);
	}
} satisfies Actions;
