// A member's small profile as other members see it: name, roughly where (an area name, or "near"
// the nearest area for a point of their own, never the point), completed swaps.
import { and, count, eq, inArray, or } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as users from '../club/users';
import * as areas from '../club/areas';
import { nearestArea } from '../../swaps/places';
import { listings } from './schema';
import * as blocks from './blocks';

export interface MemberProfile {
	id: string;
	displayName: string;
	area: string | null;
	memberSince: Date;
	completedSwaps: number;
	/** Whether the viewer has blocked this member. */
	blocked: boolean;
	isViewer: boolean;
}

/** The label for where a member is: their area, "near" the area nearest their point, or null. */
async function areaLabelOf(user: { homeAreaId: number | null; homeLat: number | null; homeLng: number | null }, context: Context): Promise<string | null> {
	const all = await areas.list({ db: context.db });
	const own = user.homeAreaId !== null ? all.find((a) => a.id === user.homeAreaId) : undefined;
	if (own) return own.name;
	if (user.homeLat === null || user.homeLng === null) return null;
	const near = nearestArea({ lat: user.homeLat, lng: user.homeLng }, all);
	return near ? `near ${near.name}` : null;
}

/** Swaps a member has completed, as giver or receiver. */
export async function completedSwaps(userId: string, context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ n: count() })
		.from(listings)
		.where(and(eq(listings.state, 'handed-over'), or(eq(listings.ownerId, userId), eq(listings.reservedRequesterId, userId))));
	return row?.n ?? 0;
}

/** Swaps each of these members has completed, as giver or receiver, by member id. */
export async function completedSwapsOf(userIds: readonly string[], context: Context = {}): Promise<Map<string, number>> {
	if (userIds.length === 0) return new Map();
	const { db } = resolve(context);
	const ids = [...userIds];
	const [given, received] = await Promise.all([
		db
			.select({ id: listings.ownerId, n: count() })
			.from(listings)
			.where(and(eq(listings.state, 'handed-over'), inArray(listings.ownerId, ids)))
			.groupBy(listings.ownerId),
		db
			.select({ id: listings.reservedRequesterId, n: count() })
			.from(listings)
			.where(and(eq(listings.state, 'handed-over'), inArray(listings.reservedRequesterId, ids)))
			.groupBy(listings.reservedRequesterId)
	]);
	const counts = new Map<string, number>();
	for (const row of [...given, ...received]) if (row.id) counts.set(row.id, (counts.get(row.id) ?? 0) + row.n);
	return counts;
}

/** A member as other members see them; null for no such member, or one who has not named themselves yet. */
export async function profile(viewer: Viewer, memberId: string, context: Context = {}): Promise<MemberProfile | null> {
	const user = await users.getById(memberId, { db: context.db });
	if (!user || !user.displayName) return null;
	const [area, completed, relation] = await Promise.all([
		areaLabelOf(user, context),
		completedSwaps(user.id, context),
		blocks.between(viewer.id, user.id, context)
	]);
	return {
		id: user.id,
		displayName: user.displayName,
		area,
		memberSince: user.createdAt,
		completedSwaps: completed,
		blocked: relation.aBlockedB,
		isViewer: viewer.id === user.id
	};
}
