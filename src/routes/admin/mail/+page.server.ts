import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { listOutbox, OUTBOX_STATES } from '$lib/server/mail/report';
import { describeTopic, topicFilter } from '$lib/mail/topics';
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
	const topic = topicFilter(params.topic);
	const found = await listOutbox({ ...params, topic, address: params.address || undefined });
	// Topic keys are internal: the page gets the kind in words.
	const rows = found.rows.map(({ topic: key, ...row }) => ({ ...row, kind: describeTopic(key) }));
	return { ...found, rows, params: { ...params, topic } };
}) satisfies PageServerLoad;
