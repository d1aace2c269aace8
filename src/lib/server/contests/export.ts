// Results and every card as CSV for the admins (see $lib/contests/csv for the format).
import type { Context } from '../context';
import type { Viewer } from '../club/users';
import { notFound } from '../../errors';
import { computeResults } from '../../contests/results';
import { toCsv, type Cell } from '../../contests/csv';
import { STATE_LABELS } from '../../contests/lifecycle';
import { assertAdmin } from './contests';
import { inputOf, loadData, type ContestData } from './review';

const round = (n: number | null | undefined, decimals: number) => (n === null || n === undefined ? null : Number(n.toFixed(decimals)));

/** The contest's data for an admin's export; refused as not found when there is no such contest. */
async function exported(viewer: Viewer, contestId: number, context: Context): Promise<ContestData> {
	assertAdmin(viewer);
	const data = await loadData(contestId, context);
	if (!data) throw notFound('No such contest.');
	return data;
}

export async function resultsCsv(viewer: Viewer, contestId: number, context: Context = {}): Promise<{ title: string; csv: string }> {
	const data = await exported(viewer, contestId, context);
	const report = computeResults(inputOf(data));
	const criteria = data.contest.criteria;
	const header = [
		'Category',
		'Place',
		'Place by raw score',
		'Place by standardised score',
		'Entry number',
		'Entrant',
		`Score % (${data.contest.aggregation})`,
		'Standardised score',
		'Cards counted',
		...criteria.map((c) => `${c.label} (of ${c.maxPoints})`),
		'Tie broken by',
		'Status'
	];
	const rows: Cell[][] = [];
	data.contest.categories.forEach((category, i) => {
		for (const e of report.categories[i]!.entries) {
			const entry = data.entries.find((x) => String(x.id) === e.entryId)!;
			const tie = e.separatedFromAbove ? criteria.find((c) => String(c.id) === e.separatedFromAbove!.criterionId)?.label : null;
			rows.push([
				category.name,
				e.place,
				e.placeRaw,
				e.placeStandardised,
				entry.number,
				data.people.get(entry.entrantId)?.name ?? '',
				round(e.score, 2),
				round(e.standardised, 3),
				e.cards.length,
				...criteria.map((c) => round(e.aggregate?.criteria[String(c.id)]?.value, 2)),
				tie ?? null,
				STATE_LABELS[data.contest.state]
			]);
		}
	});
	return { title: data.contest.title, csv: toCsv(header, rows) };
}

export async function cardsCsv(viewer: Viewer, contestId: number, context: Context = {}): Promise<{ title: string; csv: string }> {
	const data = await exported(viewer, contestId, context);
	const report = computeResults(inputOf(data));
	const counted = new Map(report.categories.flatMap((c) => c.entries.flatMap((e) => e.cards.map((k) => [k.cardId, k] as const))));
	const criteria = data.contest.criteria;
	const header = [
		'Category',
		'Entry number',
		'Entrant',
		'Judge',
		'Card status',
		'Counted',
		'Card total %',
		'z-score',
		'Dropped by trimming',
		'SDs from the other judges',
		...criteria.flatMap((c) => [`${c.label} (of ${c.maxPoints})`, `${c.label}: comment`]),
		'Comment for the entrant',
		'Note for the panel',
		'Submitted at (UTC)'
	];
	const category = new Map(data.contest.categories.map((c) => [c.id, c.name]));
	const rows: Cell[][] = data.cards.map((card) => {
		const entry = data.entries.find((e) => e.id === card.entryId)!;
		const result = counted.get(String(card.id));
		return [
			category.get(entry.categoryId) ?? '',
			entry.number,
			data.people.get(entry.entrantId)?.name ?? '',
			data.people.get(card.judgeId)?.name ?? '',
			card.status,
			!!result,
			round(result?.total, 2),
			round(result?.z, 3),
			result?.dropped ?? null,
			round(result?.outlier?.deviationSds, 2),
			...criteria.flatMap((c) => [card.fields.scores[String(c.id)] ?? null, card.fields.comments[String(c.id)] ?? '']),
			card.fields.entrantComment,
			card.fields.panelNote,
			card.submittedAt ? card.submittedAt.toISOString().replace('T', ' ').slice(0, 19) : null
		];
	});
	return { title: data.contest.title, csv: toCsv(header, rows) };
}
