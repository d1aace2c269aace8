import { requireRole } from '$lib/server/club/guards';
import * as settings from '$lib/server/club/settings';
import { formAction, parseForm } from '$lib/server/http/forms';
import { settingsForm } from '$lib/club/settings-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return { settings: await settings.get() };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event, data) => {
		const admin = requireRole(event, 'admin');
		await settings.save(admin, parseForm(settingsForm, data));
		return { saved: true };
	})
} satisfies Actions;
