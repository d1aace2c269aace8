import { requireSignedIn } from '$lib/server/club/guards';
import * as membership from '$lib/server/club/membership';
import { formAction, parseForm } from '$lib/server/http/forms';
import { requestForm } from '$lib/club/membership';
import type { Actions, PageServerLoad } from './$types';

// Where a signed-in person stands with the club: the one page (besides public ones) someone
// waiting to be admitted may open.
export const load = (async (event) => {
	const account = requireSignedIn(event);
	return { status: await membership.status(account), displayName: account.displayName ?? '' };
}) satisfies PageServerLoad;

export const actions = {
	request: formAction(async (event, data) => {
		const account = requireSignedIn(event);
		await membership.sendRequest(account, parseForm(requestForm, data));
		return { sent: true };
	})
} satisfies Actions;
