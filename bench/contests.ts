// How the results computation grows with the size of a contest: one category of 20 entries and
// 4 judges (a club contest) against 200 entries and 8 judges, every judge scoring every entry
// but one conflict each. Prints figures from one run on this machine; compare the ratio.
// `npm run bench` uses syntheticContest() for its 100-entry, 6-judge, 6-criteria figure.
//   npx tsx bench/contests.ts
import { computeResults, type CardInput, type ResultsInput } from '../src/lib/contests/results';
import type { Rubric } from '../src/lib/contests/rubric';

const fullRubric: Rubric = [
	{ id: 'a', label: 'A', maxPoints: 10, weight: 3 },
	{ id: 'b', label: 'B', maxPoints: 10, weight: 3 },
	{ id: 'c', label: 'C', maxPoints: 10, weight: 2 },
	{ id: 'd', label: 'D', maxPoints: 5, weight: 1 },
	{ id: 'e', label: 'E', maxPoints: 5, weight: 1 },
	{ id: 'f', label: 'F', maxPoints: 5, weight: 1 }
];

/** One category of `entries` entries scored by `judges` judges on the first `criteria` criteria. */
export function syntheticContest(entries: number, judges: number, criteria = 5): ResultsInput {
	const rubric = fullRubric.slice(0, criteria);
	let seed = 7;
	const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
	const judgeIds = Array.from({ length: judges }, (_, j) => `j${j}`);
	const entryRows = Array.from({ length: entries }, (_, e) => ({ entryId: `e${String(e).padStart(4, '0')}`, categoryId: 'c', entrantId: `m${e}` }));
	const conflicts = judgeIds.map((judgeId, j) => ({ judgeId, entryId: entryRows[(j * 7) % entries]!.entryId }));
	const cards: CardInput[] = [];
	for (const e of entryRows) {
		for (const judgeId of judgeIds) {
			if (conflicts.some((c) => c.judgeId === judgeId && c.entryId === e.entryId)) continue;
			const scores = Object.fromEntries(rubric.map((c) => [c.id, Math.round(rnd() * c.maxPoints * 2) / 2]));
			cards.push({ cardId: `${e.entryId}-${judgeId}`, entryId: e.entryId, judgeId, status: 'submitted', scores });
		}
	}
	return {
		rubric,
		tieBreakOrder: rubric.map((c) => c.id),
		method: 'trimmed-mean',
		rankBy: 'raw',
		categoryIds: ['c'],
		entries: entryRows,
		judgeIds,
		conflicts,
		cards
	};
}

/** Milliseconds per computation, the mean of `runs` after one warm-up. */
export function timeResults(input: ResultsInput, runs = 5): number {
	computeResults(input);
	const started = performance.now();
	for (let i = 0; i < runs; i++) computeResults(input);
	return (performance.now() - started) / runs;
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const cases = [
		['20 entries × 4 judges', syntheticContest(20, 4)],
		['200 entries × 8 judges', syntheticContest(200, 8)]
	] as const;
	const times: number[] = [];
	for (const [label, input] of cases) {
		const ms = timeResults(input);
		times.push(ms);
		console.log(
			`${label.padEnd(24)} ${input.cards.length.toString().padStart(5)} cards  ${ms.toFixed(1).padStart(8)} ms per computation  (${(ms / times[0]!).toFixed(1)}× the first)`
		);
	}
}
