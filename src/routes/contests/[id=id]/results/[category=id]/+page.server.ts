import { error } from '@sveltejs/kit';
import { z } from 'zod';
import * as contests from '$lib/server/contests/contests';
import { publishedResultsOf } from '$lib/server/contests/review';
import { formatVolume } from '$lib/journals/calc/units';
import type { PageServerLoad } from './$types';

/** Entries shown a page at a time: a large category's every photo, score and comment on one page is slow to send and to read. */
const RESULTS_PAGE_SIZE = 20;
const pageParam = z.coerce.number().int().min(1).max(10_000).catch(1);

// Public after publication; before it there are no results to show (404).
export const load = (async (event) => {
	const contest = await contests.get(event.locals.user, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const results = await publishedResultsOf(contest);
	const category = results?.categories.find((c) => c.id === Number(event.params.category));
	if (!results || !category) error(404, 'These results are not published.');
	const viewerId = event.locals.user?.id;
	const pages = Math.max(1, Math.ceil(category.entries.length / RESULTS_PAGE_SIZE));
	const page = Math.min(pageParam.parse(event.url.searchParams.get('page') ?? undefined), pages);
	const first = (page - 1) * RESULTS_PAGE_SIZE;
	const mineAt = viewerId ? category.entries.findIndex((e) => e.entrantId === viewerId) : -1;
	return {
		paging: {
			page,
			pages,
			total: category.entries.length,
			first: first + 1,
			last: Math.min(first + RESULTS_PAGE_SIZE, category.entries.length),
			/** The page the viewer's own entry is on, when it is another one. */
			minePage: mineAt >= 0 && Math.floor(mineAt / RESULTS_PAGE_SIZE) + 1 !== page ? Math.floor(mineAt / RESULTS_PAGE_SIZE) + 1 : null
		},
		contest: { id: contest.id, title: contest.title, aggregation: contest.aggregation, rankBy: contest.rankBy },
		tieBreak: [...contest.criteria].sort((a, b) => a.tieBreakRank - b.tieBreakRank).map((k) => k.label),
		category: {
			id: category.id,
			name: category.name,
			description: category.description,
			unevenPanel: category.unevenPanel,
			entries: category.entries.slice(first, first + RESULTS_PAGE_SIZE).map((e) => ({
				entryId: e.entryId,
				number: e.number,
				place: e.place,
				placeRaw: e.placeRaw,
				placeStandardised: e.placeStandardised,
				shared: e.sharedWith > 0,
				tieBrokenBy: e.tieBrokenBy,
				entrantName: e.entrantName,
				score: e.score,
				cardCount: e.cardCount,
				methodNote: e.methodNote,
				criteria: e.criteria,
				comments: e.comments,
				photos: e.photos.map((p) => ({
					id: p.id,
					alt: p.alt,
					caption: p.caption,
					urls: p.urls,
					width: p.renditions.medium.width,
					height: p.renditions.medium.height,
					largeWidth: p.renditions.large.width,
					largeHeight: p.renditions.large.height
				})),
				volume: e.litres === null ? null : formatVolume(e.litres, event.locals.user?.units ?? 'metric'),
				ageWeeks: e.ageWeeks,
				publicTankId: e.publicTankId,
				mine: e.entrantId === viewerId
			}))
		},
		others: results.categories.filter((c) => c.id !== category.id).map((c) => ({ id: c.id, name: c.name }))
	};
}) satisfies PageServerLoad;
