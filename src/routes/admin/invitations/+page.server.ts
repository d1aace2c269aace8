import { z } from 'zod';
import { parseOrThrow } from '$lib/errors';
import { requireRole } from '$lib/server/club/guards';
import * as invitations from '$lib/server/club/invitations';
import { formAction, valuesOf } from '$lib/server/http/forms';
import { INVITATION_STATES } from '$lib/club/membership';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	state: z.enum(INVITATION_STATES).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	return { ...(await invitations.list(admin, params)), params };
}) satisfies PageServerLoad;

const pasteForm = z.object({ addresses: z.string().max(20_000, 'That is too much text: paste at most a hundred addresses.') });
const oneForm = z.object({ id: z.coerce.number().int().positive() });

export const actions = {
	invite: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { addresses } = parseOrThrow(pasteForm, valuesOf(data));
			return { outcome: await invitations.invite(admin, addresses) };
		},
		{ id: 'invite' }
	),
	resend: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { id } = parseOrThrow(oneForm, valuesOf(data), 'Choose an invitation.');
			await invitations.resend(admin, id);
			return { resent: id };
		},
		{ id: 'resend' }
	),
	revoke: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { id } = parseOrThrow(oneForm, valuesOf(data), 'Choose an invitation.');
			await invitations.revoke(admin, id);
			return { revoked: id };
		},
		{ id: 'revoke' }
	)
} satisfies Actions;
