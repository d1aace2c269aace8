import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as reports from '$lib/server/swaps/reports';
import * as threads from '$lib/server/swaps/threads';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	show: z.enum(['open', 'closed']).catch('open'),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	const [result, openCount] = await Promise.all([reports.list(admin, params.show, params.page), reports.openCount(admin)]);
	// An open report about a message lets the admin read that conversation.
	const conversations = Object.fromEntries(
		await Promise.all(
			result.rows
				.filter((r) => r.state === 'open' && r.threadId !== null)
				.map(async (r) => {
					const t = await threads.get(admin, r.threadId!);
					return [
						r.id,
						t
							? {
									id: t.id,
									ownerName: t.ownerName,
									requesterName: t.requesterName,
									messages: t.messages.map((m) => ({
										id: m.id,
										kind: m.kind,
										senderName: m.senderName,
										body: m.body,
										pickup: m.pickup,
										createdAt: m.createdAt
									}))
								}
							: null
					] as const;
				})
		)
	);
	return { ...result, openCount, params, conversations };
}) satisfies PageServerLoad;

const reportId = z.coerce.number().int().positive();
const decision = z.discriminatedUnion(
	'decision',
	[
		z.object({ decision: z.literal('resolve'), reportId, note: z.string().max(500).default('') }),
		z.object({ decision: z.literal('dismiss'), reportId, note: z.string().max(500).default('') }),
		z.object({ decision: z.literal('withdraw'), reportId, reason: z.string().max(300, 'Keep the reason to 300 characters.').default('') })
	],
	{ error: 'Choose what to do with the report.' }
);

export const actions = {
	decide: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const d = parseForm(decision, data);
			await reports.decide(admin, d.reportId, d.decision === 'withdraw' ? { kind: 'withdraw', reason: d.reason } : { kind: d.decision, note: d.note });
			return { decided: d.decision, reportId: d.reportId };
		},
		{ id: 'decide' }
	)
} satisfies Actions;
