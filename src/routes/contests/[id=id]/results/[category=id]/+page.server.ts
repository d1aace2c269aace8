import { error } from '@sveltejs/kit';
import * as contests from '$lib/server/contests/contests';
import { publishedResultsOf } from '$lib/server/contests/review';
import { formatVolume } from '$lib/journals/calc/units';
import type { PageServerLoad } from './$types';

// Public after publication; before it there are no results to show (404).
export const load = (async (event) => {
	const contest = await contests.get(event.locals.user, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const results = await publishedResultsOf(contest);
	const category = results?.categories.find((c) => c.id === Number(event.params.category));
	if (!results || !category) error(404, 'These results are not published.');
	const viewerId = event.locals.user?.id;
	return {
		contest: { id: contest.id, title: contest.title, aggregation: contest.aggregation, rankBy: contest.rankBy },
		tieBreak: [...contest.criteria].sort((a, b) => a.tieBreakRank - b.tieBreakRank).map((k) => k.label),
		category: {
			id: category.id,
			name: category.name,
			description: category.description,
			unevenPanel: category.unevenPanel,
			entries: category.entries.map((e) => ({
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
