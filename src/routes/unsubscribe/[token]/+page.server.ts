import { error } from '@sveltejs/kit';
import * as subscriptions from '$lib/server/club/subscriptions';
import { formAction } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

// Reached from a link in mail, without signing in: the signed token is the credential, for one
// member and one topic. A mail program's one-click POST (RFC 8058: `List-Unsubscribe=One-Click`,
// sent without an Origin header, let through by http/requests.ts) always unsubscribes.
export const load = (async ({ params }) => {
	const subscription = await subscriptions.byToken(params.token);
	if (!subscription) error(404, subscriptions.INVALID_LINK);
	return { subscription };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async ({ params }, data) => {
		const oneClick = data.get('List-Unsubscribe') === 'One-Click';
		const subscribed = !oneClick && data.get('subscribed') === 'on';
		return { saved: await subscriptions.set(params.token, subscribed) };
	})
} satisfies Actions;
