import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { authEvent, signIn } from '$lib/server/auth';
import * as signInLimit from '$lib/server/club/sign-in-limit';
import { formAction, parseForm } from '$lib/server/http/forms';
import { safeRedirectPath } from '$lib/club/redirect';
import type { Actions, PageServerLoad } from './$types';

export const load = (({ locals, url }) => {
	const redirectTo = safeRedirectPath(url.searchParams.get('redirectTo'));
	if (locals.user) redirect(303, redirectTo);
	if (locals.account) redirect(303, '/membership');
	return { redirectTo };
}) satisfies PageServerLoad;

const signInForm = z.object({
	email: z
		.string({ message: 'Enter an e-mail address like name@example.org.' })
		.trim()
		.toLowerCase()
		.max(254, 'That address is too long.')
		.email('Enter an e-mail address like name@example.org.'),
	redirectTo: z.string().optional()
});

export const actions = {
	default: formAction(async (event, data) => {
		const input = parseForm(signInForm, data);
		await signInLimit.admit(input.email, event.getClientAddress());
		// Auth.js reads the form itself: hand it a clean request on ORIGIN with a safe destination.
		// signIn throws the redirect to the "check your mail" page.
		await signIn(authEvent(event, { providerId: 'nodemailer', email: input.email, redirectTo: safeRedirectPath(input.redirectTo) }));
	})
} satisfies Actions;
