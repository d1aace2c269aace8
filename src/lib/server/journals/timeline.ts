// A tank's timeline, newest first and paged: entries, events logged on their own and water tests.
// Each source is read already sorted and cut to what the page can need, then merged by
// $lib/journals/timeline-merge.
import { and, count, desc, eq, inArray, isNull } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { mergeTimeline, rowsNeeded, type TimelineKey } from '../../journals/timeline-merge';
import { journalEntries, journalEvents, maintenanceTasks, waterTests, type EventRow, type WaterTestRow } from './schema';
import * as entries from './journal-entries';
import * as water from './water';

export const TIMELINE_PAGE_SIZE = 10;

export type TimelineItem =
	| { kind: 'entry'; key: string; on: string; entry: entries.ShownEntry }
	| { kind: 'event'; key: string; on: string; event: EventRow & { taskLabel: string | null } }
	| { kind: 'test'; key: string; on: string; test: WaterTestRow };

export interface Timeline {
	items: TimelineItem[];
	page: number;
	pages: number;
	total: number;
}

/** One page of the timeline of a tank (the caller has checked that the viewer may see it). */
export async function pageOf(tankId: number, requested: number, context: Context = {}): Promise<Timeline> {
	const { db: tx } = resolve(context);
	const pageSize = TIMELINE_PAGE_SIZE;
	const standalone = and(eq(journalEvents.tankId, tankId), isNull(journalEvents.entryId));
	const [[e], [v], [t]] = await Promise.all([
		tx.select({ n: count() }).from(journalEntries).where(eq(journalEntries.tankId, tankId)),
		tx.select({ n: count() }).from(journalEvents).where(standalone),
		tx.select({ n: count() }).from(waterTests).where(eq(waterTests.tankId, tankId))
	]);
	const totals = [e?.n ?? 0, v?.n ?? 0, t?.n ?? 0];
	const pages = Math.max(1, Math.ceil(totals.reduce((a, b) => a + b, 0) / pageSize));
	const page = Math.min(Math.max(1, Math.floor(requested) || 1), pages);
	const limit = rowsNeeded(page, pageSize);
	const [entryKeys, eventKeys, testKeys] = await Promise.all([
		tx
			.select({ id: journalEntries.id, on: journalEntries.entryOn, at: journalEntries.createdAt })
			.from(journalEntries)
			.where(eq(journalEntries.tankId, tankId))
			.orderBy(desc(journalEntries.entryOn), desc(journalEntries.createdAt), desc(journalEntries.id))
			.limit(limit),
		tx
			.select({ id: journalEvents.id, on: journalEvents.occurredOn, at: journalEvents.createdAt })
			.from(journalEvents)
			.where(standalone)
			.orderBy(desc(journalEvents.occurredOn), desc(journalEvents.createdAt), desc(journalEvents.id))
			.limit(limit),
		tx
			.select({ id: waterTests.id, on: waterTests.testedOn, at: waterTests.createdAt })
			.from(waterTests)
			.where(eq(waterTests.tankId, tankId))
			.orderBy(desc(waterTests.testedOn), desc(waterTests.createdAt), desc(waterTests.id))
			.limit(limit)
	]);
	const merged = mergeTimeline<TimelineKey>(
		[
			entryKeys.map((k) => ({ ...k, kind: 'entry' as const })),
			eventKeys.map((k) => ({ ...k, kind: 'event' as const })),
			testKeys.map((k) => ({ ...k, kind: 'test' as const }))
		],
		totals,
		page,
		pageSize
	);
	const ids = (kind: TimelineKey['kind']) => merged.items.filter((i) => i.kind === kind).map((i) => i.id);
	const [entryRows, eventRows, testRows] = await Promise.all([
		entries.many(ids('entry'), context),
		ids('event').length
			? tx
					.select({ event: journalEvents, taskLabel: maintenanceTasks.label })
					.from(journalEvents)
					.leftJoin(maintenanceTasks, eq(maintenanceTasks.id, journalEvents.taskId))
					.where(and(eq(journalEvents.tankId, tankId), inArray(journalEvents.id, ids('event'))))
			: [],
		water.many(tankId, ids('test'), context)
	]);
	const byId = {
		entry: new Map(entryRows.map((r) => [r.id, r])),
		event: new Map(eventRows.map((r) => [r.event.id, { ...r.event, taskLabel: r.taskLabel }])),
		test: new Map(testRows.map((r) => [r.id, r]))
	};
	const items = merged.items.flatMap((k): TimelineItem[] => {
		const key = `${k.kind}-${k.id}`;
		if (k.kind === 'entry') {
			const entry = byId.entry.get(k.id);
			return entry ? [{ kind: 'entry', key, on: k.on, entry: entries.shown(entry) }] : [];
		}
		if (k.kind === 'event') {
			const event = byId.event.get(k.id);
			return event ? [{ kind: 'event', key, on: k.on, event }] : [];
		}
		const test = byId.test.get(k.id);
		return test ? [{ kind: 'test', key, on: k.on, test }] : [];
	});
	return { items, page: merged.page, pages: merged.pages, total: merged.total };
}
