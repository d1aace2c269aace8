// A tank's photos by date, for comparing the tank then and now: the photos of its journal entries,
// dated by their entry. Who may see them is the tank's visibility (entry photos follow it), decided
// here by `tanks.findVisible` for every read that names a viewer.
import { and, desc, eq, lt, lte } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as media from '../media';
import type { RenditionSize } from '../../media/urls';
import { journalEntries } from './schema';
import * as tanks from './tanks';

/** One photo as a page shows it, with the day of the entry it belongs to. */
export interface DatedPhoto {
	on: string;
	entryId: number;
	id: number;
	alt: string;
	width: number;
	height: number;
	urls: Record<RenditionSize, string>;
}

/** How many entries back a look-up reads at most to find one with a photo. */
const LOOK_BACK = 40;
/** How many photo days the chooser offers (the newest). */
export const PHOTO_DAYS_MAX = 200;

async function newestAmong(tankId: number, bound: ReturnType<typeof lte> | undefined, context: Context): Promise<DatedPhoto | null> {
	const { db } = resolve(context);
	const entries = await db
		.select({ id: journalEntries.id, on: journalEntries.entryOn })
		.from(journalEntries)
		.where(and(eq(journalEntries.tankId, tankId), bound))
		.orderBy(desc(journalEntries.entryOn), desc(journalEntries.createdAt), desc(journalEntries.id))
		.limit(LOOK_BACK);
	if (entries.length === 0) return null;
	const photos = await media.listForMany(
		'entry',
		entries.map((e) => e.id),
		context
	);
	for (const entry of entries) {
		const photo = photos.get(entry.id)?.[0];
		if (photo) return { on: entry.on, entryId: entry.id, id: photo.id, alt: photo.alt, width: photo.width, height: photo.height, urls: photo.urls };
	}
	return null;
}

/**
 * The newest photo in the tank's journal dated on or before `day` (strictly before it with
 * `before`), or null. The caller has checked that the viewer may see the tank.
 */
export function newestUpTo(tankId: number, day: string, options: { before?: boolean } = {}, context: Context = {}): Promise<DatedPhoto | null> {
	return newestAmong(tankId, options.before ? lt(journalEntries.entryOn, day) : lte(journalEntries.entryOn, day), context);
}

/** The days the viewer may compare on a tank: entry days with a photo, newest first; null when the tank is not theirs to see. */
export async function photoDays(viewer: Pick<Viewer, 'id'> | null, tankId: number, context: Context = {}): Promise<string[] | null> {
	if (!(await tanks.findVisible(viewer, tankId, context))) return null;
	const { db } = resolve(context);
	const entries = await db
		.select({ id: journalEntries.id, on: journalEntries.entryOn })
		.from(journalEntries)
		.where(eq(journalEntries.tankId, tankId))
		.orderBy(desc(journalEntries.entryOn), desc(journalEntries.id))
		.limit(PHOTO_DAYS_MAX * 3);
	const photos = await media.listForMany(
		'entry',
		entries.map((e) => e.id),
		context
	);
	return [...new Set(entries.filter((e) => photos.has(e.id)).map((e) => e.on))].slice(0, PHOTO_DAYS_MAX);
}

/** The tank as it looked on two days the viewer chose (the newest photo up to each), or null when the tank is not theirs to see. */
export async function compare(
	viewer: Pick<Viewer, 'id'> | null,
	tankId: number,
	days: { then: string; now: string },
	context: Context = {}
): Promise<{ then: DatedPhoto | null; now: DatedPhoto | null } | null> {
	if (!(await tanks.findVisible(viewer, tankId, context))) return null;
	const [then, now] = await Promise.all([newestUpTo(tankId, days.then, {}, context), newestUpTo(tankId, days.now, {}, context)]);
	return { then, now };
}
