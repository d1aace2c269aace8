import { redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

export const load = (() => redirect(303, '/')) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const request = new Request(event.request.url, {
			method: 'POST',
			headers: { ...Object.fromEntries(event.request.headers), 'content-type': 'application/x-www-form-urlencoded' },
			body: new URLSearchParams({ redirectTo: '/?signedOut=1' })
		});
		await signOut({ ...event, request });
	}
} satisfies Actions;
