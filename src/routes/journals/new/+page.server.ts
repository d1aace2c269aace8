import { redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import { emptyDraft } from '$lib/journals/tank-form';
import { readTankForm, tankFormAgain } from '../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	return { draft: emptyDraft(viewer.units), units: viewer.units };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { input, cover } = readTankForm(data, viewer);
			const id = await tanks.create(viewer, input, cover);
			redirect(303, `/journals/${id}`);
		},
		{ values: (data, event) => tankFormAgain(data, event, null) }
	)
} satisfies Actions;
