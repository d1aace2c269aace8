import { fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as areas from '$lib/server/club/areas';
import * as sessions from '$lib/server/club/sessions';
import * as users from '$lib/server/club/users';
import { fieldErrors, profileSchema } from '$lib/club/profile';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const [row, areaList, active] = await Promise.all([
		users.getById(viewer.id),
		areas.list(),
		sessions.listActive(viewer.id, event.locals.sessionToken ?? undefined)
	]);
	if (!row) redirect(303, '/signin');
	return {
		profile: {
			email: row.email ?? '',
			displayName: row.displayName ?? '',
			role: row.role,
			units: row.units,
			homeAreaId: row.homeAreaId,
			homeLat: row.homeLat,
			homeLng: row.homeLng,
			notifyMessages: row.notifyMessages,
			weeklyDigest: row.weeklyDigest,
			announcements: row.announcements,
			memberSince: row.createdAt
		},
		areas: areaList.map((a) => ({ id: a.id, name: a.name })),
		sessions: active
	};
}) satisfies PageServerLoad;

export const actions = {
	profile: async (event) => {
		const viewer = requireUser(event);
		const values = Object.fromEntries(await event.request.formData()) as Record<string, string>;
		const parsed = profileSchema.safeParse(values);
		if (!parsed.success) return fail(400, { profileErrors: fieldErrors(parsed.error.issues), values });
		const p = parsed.data;
		let home: { lat: number; lng: number } | null = null;
		let homeAreaId: number | null = null;
		if (p.locationMode === 'area' && p.homeAreaId) {
			const area = await areas.get(p.homeAreaId);
			if (!area) return fail(400, { profileErrors: { homeAreaId: 'That area no longer exists; choose another.' }, values });
			homeAreaId = area.id;
			home = { lat: area.lat, lng: area.lng };
		} else if (p.locationMode === 'point' && p.homeLat !== null && p.homeLng !== null) {
			home = { lat: p.homeLat, lng: p.homeLng };
		}
		await users.updateProfile(viewer.id, {
			displayName: p.displayName,
			units: p.units,
			homeAreaId,
			home,
			notifyMessages: p.notifyMessages,
			weeklyDigest: p.weeklyDigest,
			announcements: p.announcements
		});
		return { profileSaved: true };
	},
	revoke: async (event) => {
		const viewer = requireUser(event);
		const handle = String((await event.request.formData()).get('handle') ?? '');
		const current = event.locals.sessionToken ? sessions.sessionHandle(event.locals.sessionToken) : null;
		if (!(await sessions.revoke(viewer.id, handle))) return fail(404, { sessionError: 'That session has already ended.' });
		if (handle === current) redirect(303, '/signin');
		return { sessionRevoked: true };
	},
	revokeAll: async (event) => {
		const viewer = requireUser(event);
		await sessions.revokeAll(viewer.id);
		redirect(303, '/signin?signedOutEverywhere=1');
	}
} satisfies Actions;
