import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as contests from '$lib/server/contests/contests';
import { review } from '$lib/server/contests/review';
import { describeRule } from '$lib/contests/eligibility';
import { nextTransition, transitionProblems } from '$lib/contests/lifecycle';
import { takeStep } from '../transition.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const id = Number(event.params.id);
	const found = await review(viewer, id);
	if (!found) error(404, 'We could not find that contest.');
	const { data, report } = found;
	const c = data.contest;
	const next = nextTransition(c.state);
	const problems = next
		? transitionProblems(next.name, {
				state: c.state,
				title: c.title,
				windows: contests.windowsOf(c),
				rubric: contests.rubricOf(c.criteria),
				categories: c.categories.length,
				entries: data.entries.length,
				judges: data.panel.length,
				judgingComplete: report.readiness.ready
			})
		: [];
	const trail = await contests.log(viewer, id, 30);
	return {
		contest: {
			id: c.id,
			title: c.title,
			state: c.state,
			entryOpensOn: c.entryOpensOn,
			entryClosesOn: c.entryClosesOn,
			judgingOpensOn: c.judgingOpensOn,
			judgingClosesOn: c.judgingClosesOn,
			entriesPerMember: c.entriesPerMember,
			aggregation: c.aggregation
		},
		next,
		problems,
		needsReason: next?.name === 'publish' && !report.readiness.ready,
		categories: c.categories.map((k) => ({
			id: k.id,
			name: k.name,
			rule: describeRule(contests.ruleOf(k)),
			entries: data.entries.filter((e) => e.categoryId === k.id).length
		})),
		criteria: c.criteria.map((k) => ({ id: k.id, label: k.label, maxPoints: k.maxPoints, weight: k.weight })),
		panel: data.panel.map((p) => p.name),
		progress: report.readiness.overall,
		trail: trail.map((t) => ({ id: t.id, action: t.action, actorName: t.actorName, createdAt: t.createdAt, detail: t.detail }))
	};
}) satisfies PageServerLoad;

export const actions = {
	step: takeStep((id) => `/admin/contests/${id}`)
} satisfies Actions;
