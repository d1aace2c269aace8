// A tank's timeline: entries, events logged on their own ("done today") and water tests, newest
// first, in pages. Each source is read from the database already sorted and cut to what the
// requested page could need; this merges them and takes the page.

export type TimelineKind = 'entry' | 'event' | 'test';

export interface TimelineKey {
	kind: TimelineKind;
	id: number;
	/** The calendar day it is dated ('YYYY-MM-DD'). */
	on: string;
	/** When it was written, to order things of the same day. */
	at: Date;
}

/** On the same day and moment: an entry first, then a test, then an event. */
const KIND_RANK: Record<TimelineKind, number> = { entry: 0, test: 1, event: 2 };

/** Newest first: by day, then by when written, then entry/test/event, then the larger id. */
export function compareTimeline(a: TimelineKey, b: TimelineKey): number {
	if (a.on !== b.on) return a.on < b.on ? 1 : -1;
	const at = b.at.getTime() - a.at.getTime();
	if (at !== 0) return at;
	if (a.kind !== b.kind) return KIND_RANK[a.kind] - KIND_RANK[b.kind];
	return b.id - a.id;
}

export interface TimelinePage<K extends TimelineKey> {
	items: K[];
	page: number;
	pages: number;
	total: number;
}

/** How many rows of each source page `page` can need: everything up to its end. */
export const rowsNeeded = (page: number, pageSize: number) => Math.max(1, page) * pageSize;

/**
 * Merges sources (each sorted newest first and holding at least its first `rowsNeeded` rows, or
 * all it has) into one page. `totals` are the full row counts of the sources, for the page count;
 * a page past the end is answered with the last page.
 */
export function mergeTimeline<K extends TimelineKey>(
	sources: readonly (readonly K[])[],
	totals: readonly number[],
	page: number,
	pageSize: number
): TimelinePage<K> {
	if (!Number.isInteger(pageSize) || pageSize < 1) throw new RangeError('pageSize must be a whole number of at least 1');
	const total = totals.reduce((sum, n) => sum + n, 0);
	const pages = Math.max(1, Math.ceil(total / pageSize));
	const current = Math.min(Math.max(1, Math.floor(page) || 1), pages);
	const heads = sources.map(() => 0);
	const merged: K[] = [];
	const end = current * pageSize;
	while (merged.length < end) {
		let best = -1;
		for (let s = 0; s < sources.length; s++) {
			const candidate = sources[s]![heads[s]!];
			if (candidate && (best === -1 || compareTimeline(candidate, sources[best]![heads[best]!]!) < 0)) best = s;
		}
		if (best === -1) break;
		merged.push(sources[best]![heads[best]!]!);
		heads[best]!++;
	}
	return { items: merged.slice((current - 1) * pageSize, end), page: current, pages, total };
}
