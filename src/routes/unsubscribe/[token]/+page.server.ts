import { error, fail } from '@sveltejs/kit';
import * as unsubscribe from '$lib/server/mail/unsubscribe';
import type { Actions, PageServerLoad } from './$types';

// Reached from a link in mail, without signing in: the unguessable token is the credential.
export const load = (async ({ params, url }) => {
	const row = await unsubscribe.findByToken(params.token);
	if (!row) error(404, 'That unsubscribe link is not valid any more. You can change your mail settings on your account page.');
	const kind = url.searchParams.get('kind') === 'digest' ? 'digest' : 'announcements';
	return { email: unsubscribe.maskEmail(row.email ?? ''), announcements: row.announcements, weeklyDigest: row.weeklyDigest, kind };
}) satisfies PageServerLoad;

export const actions = {
	default: async ({ params, request }) => {
		const form = await request.formData();
		const settings = { announcements: form.get('announcements') === 'on', weeklyDigest: form.get('weeklyDigest') === 'on' };
		if (!(await unsubscribe.setSubscriptions(params.token, settings))) return fail(404, { error: 'That link is not valid any more.' });
		return { saved: settings };
	}
} satisfies Actions;
