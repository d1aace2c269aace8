// How merging a page of a tank's timeline grows with the page asked for, against sorting every
// item of the journal, for a long journal (2,000 entries, events and tests each). Prints figures
// from one run on this machine; compare the ratios, not the absolute times.
//   npx tsx bench/timeline.ts
import { dayOf } from '../src/lib/dates';
import { compareTimeline, mergeTimeline, rowsNeeded, type TimelineKey } from '../src/lib/journals/timeline-merge';

const PER_SOURCE = 2000;
const SIZE = 10;
const start = Date.UTC(2020, 0, 1);
const source = (kind: TimelineKey['kind'], offset: number): TimelineKey[] =>
	Array.from({ length: PER_SOURCE }, (_, i) => {
		const at = new Date(start + (i * 3 + offset) * 3_600_000 * 11);
		return { kind, id: i + 1, on: dayOf(at), at };
	}).sort(compareTimeline);
const sources = [source('entry', 0), source('event', 1), source('test', 2)];
const totals = sources.map((s) => s.length);

function time(label: string, run: () => unknown, rounds = 200): number {
	run();
	const t0 = performance.now();
	for (let i = 0; i < rounds; i++) run();
	const ms = (performance.now() - t0) / rounds;
	console.log(`${label.padEnd(44)} ${ms.toFixed(4)} ms`);
	return ms;
}

const all = time('sort every item, then slice page 1', () => sources.flat().sort(compareTimeline).slice(0, SIZE));
const results: [number, number][] = [];
for (const page of [1, 10, 100, 600]) {
	const cut = sources.map((s) => s.slice(0, rowsNeeded(page, SIZE)));
	results.push([page, time(`merge page ${page} (reads ${rowsNeeded(page, SIZE)} rows a source)`, () => mergeTimeline(cut, totals, page, SIZE))]);
}
console.log('\nratio of merging to sorting everything:');
for (const [page, ms] of results) console.log(`  page ${String(page).padStart(3)}: ${(ms / all).toFixed(3)}`);
