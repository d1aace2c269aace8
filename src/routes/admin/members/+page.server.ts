import { z } from 'zod';
import { parseOrThrow } from '$lib/errors';
import { requireRole } from '$lib/server/club/guards';
import * as accountDeletion from '$lib/server/club/account-deletion';
import * as membership from '$lib/server/club/membership';
import * as suspension from '$lib/server/club/suspension';
import * as users from '$lib/server/club/users';
import { formAction, valuesOf } from '$lib/server/http/forms';
import { ROLES } from '$lib/club/roles';
import { MEMBER_STATES, MESSAGE_MAX, REASON_MAX } from '$lib/club/membership';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	q: z.string().trim().max(100).catch(''),
	role: z.enum(ROLES).optional().catch(undefined),
	state: z.enum(MEMBER_STATES).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	const [result, requests] = await Promise.all([
		users.listMembers(admin, { search: params.q || undefined, role: params.role, state: params.state, page: params.page }),
		membership.pendingRequests(admin)
	]);
	return { ...result, requests, params, me: admin.id };
}) satisfies PageServerLoad;

const userId = z.string().min(1).max(255);
const change = z.object({ userId, role: z.enum(ROLES) });
const suspendForm = z.object({
	userId,
	reason: z.string().trim().min(3, 'Say why, in a few words (the member is not shown this).').max(REASON_MAX, `Keep the reason to ${REASON_MAX} characters.`)
});
const removeForm = z.object({
	userId,
	reason: z.string().trim().min(3, 'Say why, in a few words; it goes into the audit log.').max(REASON_MAX, `Keep the reason to ${REASON_MAX} characters.`),
	understood: z.literal('yes', { error: 'Tick the box to confirm: a removal cannot be undone.' })
});
const decideForm = z.object({
	requestId: z.coerce.number().int().positive(),
	decision: z.enum(['approve', 'decline']),
	message: z.string().trim().max(MESSAGE_MAX, `Keep the message to ${MESSAGE_MAX} characters.`)
});

export const actions = {
	role: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseOrThrow(change, valuesOf(data), 'Choose a member and a role.');
			await users.changeRole(admin, input.userId, input.role);
			return { changed: input };
		},
		{ id: 'role' }
	),
	suspend: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseOrThrow(suspendForm, valuesOf(data));
			await suspension.suspend(admin, input.userId, input.reason);
			return { suspended: input.userId };
		},
		{ id: 'suspend' }
	),
	reinstate: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseOrThrow(z.object({ userId }), valuesOf(data), 'Choose a member.');
			await suspension.reinstate(admin, input.userId);
			return { reinstated: input.userId };
		},
		{ id: 'reinstate' }
	),
	remove: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseOrThrow(removeForm, valuesOf(data));
			await accountDeletion.removeMember(admin, input.userId, input.reason);
			return { removed: input.userId };
		},
		{ id: 'remove' }
	),
	decide: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseOrThrow(decideForm, valuesOf(data));
			await membership.decide(admin, input.requestId, input.decision, input.message);
			return { decided: input.decision };
		},
		{ id: 'decide' }
	)
} satisfies Actions;
