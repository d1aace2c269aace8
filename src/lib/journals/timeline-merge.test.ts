import { describe, expect, test } from 'vitest';
import { compareTimeline, mergeTimeline, rowsNeeded, type TimelineKey } from './timeline-merge';

const key = (kind: TimelineKey['kind'], id: number, on: string, at = `${on}T12:00:00Z`): TimelineKey => ({ kind, id, on, at: new Date(at) });
const sorted = (keys: TimelineKey[]) => [...keys].sort(compareTimeline);
const label = (k: TimelineKey) => `${k.kind}${k.id}`;

describe('compareTimeline', () => {
	test('newest day first, then the later-written, then entry before test before event, then larger id', () => {
		const items = [
			key('event', 1, '2026-03-01'),
			key('entry', 2, '2026-03-02', '2026-03-02T08:00:00Z'),
			key('event', 3, '2026-03-02', '2026-03-02T09:00:00Z'),
			key('test', 4, '2026-03-02', '2026-03-02T08:00:00Z'),
			key('entry', 5, '2026-03-02', '2026-03-02T08:00:00Z')
		];
		expect(sorted(items).map(label)).toEqual(['event3', 'entry5', 'entry2', 'test4', 'event1']);
	});
	test('a back-dated entry written today sorts by its own day', () => {
		const items = [key('entry', 1, '2026-03-10', '2026-03-10T10:00:00Z'), key('entry', 2, '2026-03-01', '2026-03-12T10:00:00Z')];
		expect(sorted(items).map(label)).toEqual(['entry1', 'entry2']);
	});
});

describe('mergeTimeline', () => {
	const entries = sorted([key('entry', 1, '2026-03-01'), key('entry', 2, '2026-03-08'), key('entry', 3, '2026-03-15')]);
	const events = sorted([key('event', 10, '2026-03-03'), key('event', 11, '2026-03-10')]);
	const tests = sorted([key('test', 20, '2026-03-08'), key('test', 21, '2026-03-16')]);

	test('merges three sorted sources into one newest-first list', () => {
		const page = mergeTimeline([entries, events, tests], [3, 2, 2], 1, 10);
		expect(page.items.map(label)).toEqual(['test21', 'entry3', 'event11', 'entry2', 'test20', 'event10', 'entry1']);
		expect(page).toMatchObject({ page: 1, pages: 1, total: 7 });
	});

	test('pages of three: each page continues where the last stopped, with nothing lost or repeated', () => {
		const all = [entries, events, tests];
		const pages = [1, 2, 3].map((p) => mergeTimeline(all, [3, 2, 2], p, 3));
		expect(pages.map((p) => p.items.map(label))).toEqual([['test21', 'entry3', 'event11'], ['entry2', 'test20', 'event10'], ['entry1']]);
		expect(pages[0]!.pages).toBe(3);
	});

	test('sources cut to what the page needs give the same page as whole sources', () => {
		const many = sorted(
			Array.from({ length: 40 }, (_, i) =>
				key(i % 3 === 0 ? 'entry' : i % 3 === 1 ? 'event' : 'test', i + 1, `2026-0${1 + (i % 5)}-${String(1 + ((i * 7) % 28)).padStart(2, '0')}`)
			)
		);
		const byKind = (kind: string) => many.filter((k) => k.kind === kind);
		const full = [byKind('entry'), byKind('event'), byKind('test')];
		const totals = full.map((s) => s.length);
		for (const p of [1, 2, 3, 4, 5]) {
			const cut = full.map((s) => s.slice(0, rowsNeeded(p, 8)));
			expect(mergeTimeline(cut, totals, p, 8).items).toEqual(mergeTimeline(full, totals, p, 8).items);
			expect(mergeTimeline(full, totals, p, 8).items).toEqual(many.slice((p - 1) * 8, p * 8));
		}
	});

	test('a page past the end shows the last page; an empty timeline has one empty page', () => {
		expect(mergeTimeline([entries, events, tests], [3, 2, 2], 9, 3)).toMatchObject({ page: 3, pages: 3 });
		expect(mergeTimeline([[], [], []], [0, 0, 0], 1, 10)).toEqual({ items: [], page: 1, pages: 1, total: 0 });
		expect(mergeTimeline([entries], [3], 0, 2).page).toBe(1);
		expect(() => mergeTimeline([entries], [3], 1, 0)).toThrow(RangeError);
	});
});
