import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { authEvent, signIn } from '$lib/server/auth';
import * as limit from '$lib/server/club/sign-in-limit';
import { safeRedirectPath } from '$lib/club/redirect';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	const redirectTo = safeRedirectPath(url.searchParams.get('redirectTo'));
	if (locals.user) redirect(303, redirectTo);
	return { redirectTo };
}) satisfies PageServerLoad;

const form = z.object({
	email: z.string().trim().toLowerCase().max(254, 'That address is too long.').email('Enter an e-mail address like name@example.org.'),
	redirectTo: z.string().optional()
});

export const actions = {
	default: async (event) => {
		const data = Object.fromEntries(await event.request.formData());
		const parsed = form.safeParse(data);
		const email = typeof data.email === 'string' ? data.email : '';
		if (!parsed.success) {
			return fail(400, { email, errors: { email: parsed.error.issues[0]?.message ?? 'Check the address.' } });
		}
		const verdict = await limit.checkAndRecord(parsed.data.email, event.getClientAddress());
		if (!verdict.allowed) {
			const why =
				verdict.reason === 'address'
					? 'We have sent several links to this address in the last hour.'
					: 'Several sign-in links were asked for from this device in the last hour.';
			return fail(429, { email, errors: { email: `${why} Use the newest one, or try again in ${verdict.retryAfterMinutes} minutes.` } });
		}
		// Auth.js reads the form itself: hand it a clean request on ORIGIN with a safe destination.
		// signIn throws the redirect to the "check your mail" page.
		await signIn(authEvent(event, { providerId: 'nodemailer', email: parsed.data.email, redirectTo: safeRedirectPath(parsed.data.redirectTo) }));
	}
} satisfies Actions;
