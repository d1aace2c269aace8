import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as panel from '$lib/server/contests/panel';
import * as reminders from '$lib/server/contests/reminders';
import { review } from '$lib/server/contests/review';
import { invalid } from '$lib/errors';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const found = await review(viewer, Number(event.params.id));
	if (!found) error(404, 'We could not find that contest.');
	const { data, matrix, report } = found;
	const candidates = await panel.candidates(viewer, data.contest.id);
	return {
		contest: { id: data.contest.id, title: data.contest.title, state: data.contest.state },
		panel: data.panel.map((p) => ({ id: p.id, name: p.name, isJudge: p.role === 'judge' })),
		candidates: candidates.map((j) => ({ id: j.id, name: j.name })),
		matrix,
		conflicts: data.conflicts.map((c) => ({
			number: data.entries.find((e) => e.id === c.entryId)?.number ?? null,
			judge: data.people.get(c.judgeId)?.name ?? '',
			reason: c.reason
		})),
		overall: report.readiness.overall
	};
}) satisfies PageServerLoad;

const judgeForm = z.object({ judgeId: z.string({ message: 'Choose a judge.' }).min(1, 'Choose a judge.').max(255, 'Choose a judge.') });

/** Assigns or takes off the judge the form names; taking off asks for the tick first. */
const panelAction = (id: 'assign' | 'unassign', change: typeof panel.assign, confirm?: string) =>
	formAction(
		async (event: RequestEvent, data) => {
			const viewer = requireRole(event, 'admin');
			const { judgeId } = parseForm(judgeForm, data);
			if (confirm && data.get('confirm') !== 'yes') throw invalid({ confirm });
			await change(viewer, Number(event.params.id), judgeId);
			return { done: id === 'assign' ? 'assigned' : 'unassigned' };
		},
		{ id }
	);

export const actions = {
	assign: panelAction('assign', panel.assign),
	unassign: panelAction('unassign', panel.unassign, 'Tick the box to confirm taking the judge off the panel.'),
	remind: formAction(
		async (event, data) => {
			const viewer = requireRole(event, 'admin');
			const only = data.get('judgeId');
			const sent = await reminders.remindJudges(viewer, Number(event.params.id), typeof only === 'string' && only ? [only] : null);
			return { done: 'reminded', sent };
		},
		{ id: 'remind' }
	)
} satisfies Actions;
