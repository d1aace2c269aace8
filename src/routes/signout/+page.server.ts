import { redirect } from '@sveltejs/kit';
import { authEvent, signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

export const load = (() => redirect(303, '/')) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		await signOut(authEvent(event, { redirectTo: '/?signedOut=1' }));
	}
} satisfies Actions;
