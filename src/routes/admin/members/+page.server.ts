import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as users from '$lib/server/club/users';
import { ROLES } from '$lib/club/roles';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	q: z.string().trim().max(100).catch(''),
	role: z.enum(ROLES).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	const result = await users.listMembers({ search: params.q || undefined, role: params.role, page: params.page });
	return { ...result, params };
}) satisfies PageServerLoad;

const change = z.object({ userId: z.string().min(1).max(255), role: z.enum(ROLES) });

export const actions = {
	role: async (event) => {
		const admin = requireRole(event, 'admin');
		const parsed = change.safeParse(Object.fromEntries(await event.request.formData()));
		if (!parsed.success) return fail(400, { error: 'Choose a member and a role.' });
		try {
			await users.changeRole(admin, parsed.data.userId, parsed.data.role);
		} catch (error) {
			if (error instanceof users.LastAdminError) return fail(409, { error: error.message, userId: parsed.data.userId });
			throw error;
		}
		return { changed: parsed.data };
	}
} satisfies Actions;
