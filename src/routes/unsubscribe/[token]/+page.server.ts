import { error } from '@sveltejs/kit';
import * as subscriptions from '$lib/server/club/subscriptions';
import { formAction } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

// Reached from a link in mail, without signing in: the unguessable token is the credential.
export const load = (async ({ params, url }) => {
	const settings = await subscriptions.byToken(params.token);
	if (!settings) error(404, subscriptions.INVALID_LINK);
	const kind = url.searchParams.get('kind') === 'digest' ? 'digest' : 'announcements';
	return { ...settings, kind };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async ({ params }, data) => {
		const settings = { announcements: data.get('announcements') === 'on', weeklyDigest: data.get('weeklyDigest') === 'on' };
		await subscriptions.update(params.token, settings);
		return { saved: settings };
	})
} satisfies Actions;
