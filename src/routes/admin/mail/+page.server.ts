import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { listOutbox, OUTBOX_STATES } from '$lib/server/mail/report';
import type { PageServerLoad } from './$types';

const query = z.object({
	state: z.enum(OUTBOX_STATES).optional().catch(undefined),
	topic: z.string().trim().max(120).optional().catch(undefined),
	address: z.string().trim().max(200).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(100_000).catch(1)
});

export const load = (async (event) => {
	requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	return { ...(await listOutbox({ ...params, topic: params.topic || undefined, address: params.address || undefined })), params };
}) satisfies PageServerLoad;
