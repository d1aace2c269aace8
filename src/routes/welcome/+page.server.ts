import { fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as users from '$lib/server/club/users';
import { displayNameSchema } from '$lib/club/profile';
import { safeRedirectPath } from '$lib/club/redirect';
import type { Actions, PageServerLoad } from './$types';

export const load = ((event) => {
	const user = requireUser(event);
	return { displayName: user.displayName ?? '', redirectTo: safeRedirectPath(event.url.searchParams.get('redirectTo')) };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const user = requireUser(event);
		const data = await event.request.formData();
		const raw = String(data.get('displayName') ?? '');
		const parsed = displayNameSchema.safeParse(raw);
		if (!parsed.success) return fail(400, { displayName: raw, error: parsed.error.issues[0]?.message });
		await users.setDisplayName(user.id, parsed.data);
		redirect(303, safeRedirectPath(String(data.get('redirectTo') ?? '/')));
	}
} satisfies Actions;
