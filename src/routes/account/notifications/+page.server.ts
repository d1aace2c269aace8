import { requireUser } from '$lib/server/club/guards';
import * as preferences from '$lib/server/mail/preferences';
import { formAction, parseForm } from '$lib/server/http/forms';
import { categoriesFor, preferencesForm } from '$lib/mail/categories';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	return { settings: await preferences.of(viewer.id), categories: categoriesFor(viewer.role) };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event, data) => {
		const viewer = requireUser(event);
		const input = parseForm(preferencesForm, data);
		// A category the member's role does not show (judging, for a member) is never changed from here.
		const shown = new Set(categoriesFor(viewer.role));
		const allowed = Object.fromEntries(Object.entries(input).filter(([c]) => shown.has(c as never)));
		return { saved: await preferences.save(viewer.id, allowed) };
	})
} satisfies Actions;
