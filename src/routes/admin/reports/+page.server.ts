import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as reports from '$lib/server/swaps/reports';
import * as threads from '$lib/server/swaps/threads';
import { SwapError } from '$lib/server/swaps/errors';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({
	show: z.enum(['open', 'closed']).catch('open'),
	page: z.coerce.number().int().min(1).max(10_000).catch(1)
});

export const load = (async (event) => {
	const admin = requireRole(event, 'admin');
	const params = query.parse(Object.fromEntries(event.url.searchParams));
	const result = await reports.list(admin, params.show, params.page);
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
	return { ...result, params, conversations };
}) satisfies PageServerLoad;

const decision = z.discriminatedUnion('decision', [
	z.object({ decision: z.literal('resolve'), reportId: z.coerce.number().int().positive(), note: z.string().max(500).default('') }),
	z.object({ decision: z.literal('dismiss'), reportId: z.coerce.number().int().positive(), note: z.string().max(500).default('') }),
	z.object({
		decision: z.literal('withdraw'),
		reportId: z.coerce.number().int().positive(),
		reason: z.string().max(300, 'Keep the reason to 300 characters.').default('')
	})
]);

export const actions = {
	decide: async (event) => {
		const admin = requireRole(event, 'admin');
		const parsed = decision.safeParse(Object.fromEntries(await event.request.formData()));
		if (!parsed.success) return fail(400, { error: parsed.error.issues[0]?.message ?? 'Choose what to do with the report.' });
		const d = parsed.data;
		try {
			await reports.decide(admin, d.reportId, d.decision === 'withdraw' ? { kind: 'withdraw', reason: d.reason } : { kind: d.decision, note: d.note });
		} catch (e) {
			if (e instanceof SwapError) {
				if (e.status === 404) error(404, e.message);
				return fail(e.status, { error: e.message, reportId: d.reportId });
			}
			throw e;
		}
		return { decided: d.decision, reportId: d.reportId };
	}
} satisfies Actions;
