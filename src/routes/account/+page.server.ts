import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as areas from '$lib/server/club/areas';
import * as sessions from '$lib/server/club/sessions';
import * as users from '$lib/server/club/users';
import { formAction, parseForm } from '$lib/server/http/forms';
import { profileSchema } from '$lib/club/profile';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const [row, areaList, active] = await Promise.all([users.getById(viewer.id), areas.list(), sessions.listActive(viewer.id, event.locals.sessionToken)]);
	if (!row) redirect(303, '/signin');
	return {
		profile: {
			email: row.email ?? '',
			displayName: row.displayName ?? '',
			role: row.role,
			units: row.units,
			timeZone: row.timeZone ?? 'UTC',
			homeAreaId: row.homeAreaId,
			homeLat: row.homeLat,
			homeLng: row.homeLng,
			memberSince: row.createdAt
		},
		areas: areaList.map((a) => ({ id: a.id, name: a.name })),
		// Every IANA zone this runtime knows, with UTC first (it is not in the list of regions).
		// The member's own zone is in the list even where this runtime files it under another name
		// (a browser's "Asia/Kolkata" is "Asia/Calcutta" here).
		zones: ['UTC', ...[...new Set([...Intl.supportedValuesOf('timeZone'), row.timeZone ?? 'UTC'])].filter((z) => z !== 'UTC').sort()],
		sessions: active
	};
}) satisfies PageServerLoad;

const revokeForm = z.object({ handle: z.string({ message: 'Choose a session.' }).max(64) });

export const actions = {
	profile: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await users.saveProfile(viewer, parseForm(profileSchema, data));
			return { profileSaved: true };
		},
		{ id: 'profile' }
	),
	revoke: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { handle } = parseForm(revokeForm, data);
			await sessions.revoke(viewer.id, handle);
			if (event.locals.sessionToken && handle === sessions.sessionHandle(event.locals.sessionToken)) redirect(303, '/signin');
			return { sessionRevoked: true };
		},
		{ id: 'sessions' }
	),
	revokeAll: formAction(async (event) => {
		const viewer = requireUser(event);
		await sessions.revokeAll(viewer.id);
		redirect(303, '/signin?signedOutEverywhere=1');
	})
} satisfies Actions;
