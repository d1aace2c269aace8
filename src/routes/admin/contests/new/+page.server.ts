import { redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import { today } from '$lib/dates';
import { draftFromForm, emptyContestDraft, readContestForm } from '$lib/contests/contest-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return { draft: emptyContestDraft(today()) };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const viewer = requireRole(event, 'admin');
			const id = await contests.create(viewer, readContestForm(data));
			redirect(303, `/admin/contests/${id}?created=1`);
		},
		{ values: draftFromForm }
	)
} satisfies Actions;
