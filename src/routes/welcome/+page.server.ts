import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as users from '$lib/server/club/users';
import { formAction, parseForm } from '$lib/server/http/forms';
import { displayNameSchema } from '$lib/club/profile';
import { safeRedirectPath } from '$lib/club/redirect';
import type { Actions, PageServerLoad } from './$types';

export const load = ((event) => {
	const user = requireUser(event);
	return { displayName: user.displayName ?? '', redirectTo: safeRedirectPath(event.url.searchParams.get('redirectTo')) };
}) satisfies PageServerLoad;

const welcomeForm = z.object({ displayName: displayNameSchema, redirectTo: z.string().optional() });

export const actions = {
	default: formAction(async (event, data) => {
		const user = requireUser(event);
		const input = parseForm(welcomeForm, data);
		await users.setDisplayName(user.id, input.displayName);
		redirect(303, safeRedirectPath(input.redirectTo));
	})
} satisfies Actions;
