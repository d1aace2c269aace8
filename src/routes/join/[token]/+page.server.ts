import { error, redirect } from '@sveltejs/kit';
import * as invitations from '$lib/server/club/invitations';
import { sessionCookieName } from '$lib/server/club/sessions';
import { config } from '$lib/server/config';
import { formAction } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

// An invitation link. Opening it changes nothing (mail scanners open links); the button accepts.
export const load = (async ({ params }) => {
	const invitation = await invitations.preview(params.token);
	if (!invitation) error(404, invitations.UNUSABLE);
	return { invitation };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event) => {
		const { session, needsName } = await invitations.accept(event.params.token);
		const origin = config().ORIGIN;
		event.cookies.set(sessionCookieName(origin), session.token, {
			path: '/',
			httpOnly: true,
			sameSite: 'lax',
			secure: origin.startsWith('https:'),
			expires: session.expires
		});
		redirect(303, needsName ? '/welcome' : '/');
	})
} satisfies Actions;
