import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as deletion from '$lib/server/club/account-deletion';
import { formAction, parseForm } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

export const load = ((event) => {
	const viewer = requireUser(event);
	return { confirmation: deletion.confirmationOf(viewer) };
}) satisfies PageServerLoad;

const deleteForm = z.object({ confirm: z.string().max(255).default('') });

export const actions = {
	delete: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { confirm } = parseForm(deleteForm, data);
			await deletion.deleteOwn(viewer, confirm);
			redirect(303, '/?accountDeleted=1');
		},
		{ id: 'delete' }
	)
} satisfies Actions;
