// The member directory, for members: who is in the club, roughly where, and what they do here.
// Members appear only once they choose to (off by default: a name with an area is personal
// data, and a member who only keeps a journal need not be findable).
import { and, asc, count, eq, isNotNull, like } from 'drizzle-orm';
import type { Viewer } from '../../club/viewer';
import { resolve, type Context } from '../context';
import * as contestEntries from '../contests/contest-entries';
import * as tanks from '../journals/tanks';
import * as swapMembers from '../swaps/members';
import * as directory from './directory';
import { users } from './schema';

export const DIRECTORY_PAGE_SIZE = 24;

export interface DirectoryCard {
	id: string;
	name: string;
	area: string | null;
	tanks: number;
	completedSwaps: number;
	contestsEntered: number;
	memberSince: Date;
}

/** Listed members by name, searched by name, a page at a time; plus whether the viewer is listed. */
export async function list(viewer: Viewer, filter: { q?: string; page: number }, context: Context = {}) {
	const { db } = resolve(context);
	const where = and(
		eq(users.state, 'active'),
		eq(users.inDirectory, true),
		isNotNull(users.displayName),
		filter.q ? like(users.displayName, `%${filter.q.replace(/[\\%_]/g, (c) => '\\' + c)}%`) : undefined
	);
	const [{ total }] = (await db.select({ total: count() }).from(users).where(where)) as [{ total: number }];
	const rows = await db
		.select({ id: users.id, displayName: users.displayName, homeAreaId: users.homeAreaId, createdAt: users.createdAt })
		.from(users)
		.where(where)
		.orderBy(asc(users.displayName), asc(users.id))
		.limit(DIRECTORY_PAGE_SIZE)
		.offset((filter.page - 1) * DIRECTORY_PAGE_SIZE);
	const ids = rows.map((r) => r.id);
	const [areaNames, tankCounts, swapCounts, contestCounts, [me]] = await Promise.all([
		directory.areaNames(
			rows.flatMap((r) => (r.homeAreaId === null ? [] : [r.homeAreaId])),
			context
		),
		tanks.sharedCounts(ids, context),
		swapMembers.completedSwapsOf(ids, context),
		contestEntries.contestsEnteredBy(ids, context),
		db.select({ inDirectory: users.inDirectory }).from(users).where(eq(users.id, viewer.id))
	]);
	const cards: DirectoryCard[] = rows.map((r) => ({
		id: r.id,
		name: r.displayName!,
		area: r.homeAreaId === null ? null : (areaNames.get(r.homeAreaId) ?? null),
		tanks: tankCounts.get(r.id) ?? 0,
		completedSwaps: swapCounts.get(r.id) ?? 0,
		contestsEntered: contestCounts.get(r.id) ?? 0,
		memberSince: r.createdAt
	}));
	return { cards, total, pages: Math.max(1, Math.ceil(total / DIRECTORY_PAGE_SIZE)), listed: me?.inDirectory ?? false };
}

/** The member's own choice to appear in the directory. */
export async function setListed(viewer: Viewer, listed: boolean, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.update(users).set({ inDirectory: listed }).where(eq(users.id, viewer.id));
}
