import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import * as people from '$lib/server/contests/people';
import { ContestError } from '$lib/server/contests/errors';
import { review } from '$lib/server/contests/review';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const found = await review(viewer, Number(event.params.id));
	if (!found) error(404, 'We could not find that contest.');
	const { data, matrix, report } = found;
	const onPanel = new Set(data.panel.map((p) => p.id));
	const judges = await people.withRole('judge');
	return {
		contest: { id: data.contest.id, title: data.contest.title, state: data.contest.state },
		panel: data.panel.map((p) => ({ id: p.id, name: p.displayName, isJudge: p.role === 'judge' })),
		candidates: judges.filter((j) => !onPanel.has(j.id)).map((j) => ({ id: j.id, name: j.displayName })),
		matrix,
		conflicts: data.conflicts.map((c) => ({
			number: data.entries.find((e) => e.id === c.entryId)?.number ?? null,
			judge: data.people.get(c.judgeId)?.displayName ?? '',
			reason: c.reason
		})),
		overall: report.readiness.overall
	};
}) satisfies PageServerLoad;

const judgeId = z.object({ judgeId: z.string().min(1).max(255) });

async function guarded(work: () => Promise<unknown>) {
	try {
		await work();
	} catch (e) {
		if (e instanceof ContestError) return fail(e.status === 404 ? 404 : 400, { error: e.message });
		throw e;
	}
	return null;
}

export const actions = {
	assign: async (event) => {
		const viewer = requireRole(event, 'admin');
		const parsed = judgeId.safeParse(Object.fromEntries(await event.request.formData()));
		if (!parsed.success) return fail(400, { error: 'Choose a judge.' });
		return (await guarded(() => judging.assign(viewer, Number(event.params.id), parsed.data.judgeId))) ?? { done: 'assigned' };
	},
	unassign: async (event) => {
		const viewer = requireRole(event, 'admin');
		const form = Object.fromEntries(await event.request.formData());
		const parsed = judgeId.safeParse(form);
		if (!parsed.success) return fail(400, { error: 'Choose a judge.' });
		if (form.confirm !== 'yes') return fail(400, { error: 'Tick the box to confirm taking the judge off the panel.', confirmFor: parsed.data.judgeId });
		return (await guarded(() => judging.unassign(viewer, Number(event.params.id), parsed.data.judgeId))) ?? { done: 'unassigned' };
	},
	remind: async (event) => {
		const viewer = requireRole(event, 'admin');
		const form = await event.request.formData();
		const only = form.get('judgeId');
		let sent = 0;
		const failed = await guarded(async () => {
			sent = await judging.remindJudges(viewer, Number(event.params.id), typeof only === 'string' && only ? [only] : null);
		});
		return failed ?? { done: 'reminded', sent };
	}
} satisfies Actions;
