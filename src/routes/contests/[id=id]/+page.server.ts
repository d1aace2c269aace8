import { error } from '@sveltejs/kit';
import * as contests from '$lib/server/contests/contests';
import * as contestEntries from '$lib/server/contests/contest-entries';
import { publishedResultsOf } from '$lib/server/contests/review';
import { storedHtml } from '$lib/server/markdown';
import { describeRule } from '$lib/contests/eligibility';
import type { PageServerLoad } from './$types';

// Public once the contest has opened; a contest in preparation is the admins' (404 for others).
export const load = (async (event) => {
	const viewer = event.locals.user;
	const contest = await contests.get(viewer, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const accepting = contests.acceptingEntries(contest);
	const mine = viewer ? await contestEntries.listOwn(viewer, contest.id) : [];
	const results = contest.state === 'published' || contest.state === 'archived' ? await publishedResultsOf(contest) : null;
	return {
		contest: {
			id: contest.id,
			title: contest.title,
			state: contest.state,
			entryOpensOn: contest.entryOpensOn,
			entryClosesOn: contest.entryClosesOn,
			judgingOpensOn: contest.judgingOpensOn,
			judgingClosesOn: contest.judgingClosesOn,
			entriesPerMember: contest.entriesPerMember,
			aggregation: contest.aggregation,
			rankBy: contest.rankBy,
			publishedAt: contest.publishedAt
		},
		rulesHtml: storedHtml(contest.rulesHtml, contest.rules),
		criteria: contest.criteria.map((c) => ({
			id: c.id,
			label: c.label,
			guidance: c.guidance,
			maxPoints: c.maxPoints,
			weight: c.weight,
			tieBreakRank: c.tieBreakRank
		})),
		categories: contest.categories.map((c) => ({ id: c.id, name: c.name, description: c.description, rule: describeRule(contests.ruleOf(c), viewer?.units) })),
		accepting,
		mine: mine.map((e) => ({
			id: e.id,
			categoryName: e.categoryName,
			tankName: e.tankName,
			number: e.number,
			thumb: e.photos[0]?.urls.thumb ?? null,
			alt: e.photos[0]?.alt ?? ''
		})),
		canEnter: !!viewer && accepting && mine.length < contest.entriesPerMember,
		results: results && {
			panel: results.panel,
			corrections: results.corrections.map((c) => ({ id: c.id, action: c.action, createdAt: c.createdAt, reason: String(c.detail.reason ?? '') })),
			categories: results.categories.map((cat) => ({
				id: cat.id,
				name: cat.name,
				entries: cat.entries.map((e) => ({
					entryId: e.entryId,
					number: e.number,
					place: e.place,
					shared: e.sharedWith > 0,
					entrantName: e.entrantName,
					publicTankId: e.publicTankId,
					score: e.score,
					thumb: e.photos[0]?.urls.thumb ?? null,
					alt: e.photos[0]?.alt ?? ''
				}))
			}))
		}
	};
}) satisfies PageServerLoad;
