import { z } from 'zod';
import { parseOrThrow } from '$lib/errors';
import { requireRole } from '$lib/server/club/guards';
import * as users from '$lib/server/club/users';
import { formAction, valuesOf } from '$lib/server/http/forms';
import { ROLES } from '$lib/club/roles';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	q: z.string().trim().max(100).catch(''),
	role: z.enum(ROLES).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	const result = await users.listMembers(admin, { search: params.q || undefined, role: params.role, page: params.page });
	return { ...result, params };
}) satisfies PageServerLoad;

const change = z.object({ userId: z.string().min(1).max(255), role: z.enum(ROLES) });

export const actions = {
	role: formAction(async (event, data) => {
		const admin = requireRole(event, 'admin');
		const input = parseOrThrow(change, valuesOf(data), 'Choose a member and a role.');
		await users.changeRole(admin, input.userId, input.role);
		return { changed: input };
	})
} satisfies Actions;
