// A member's small profile as other members see it: name, roughly where (an area name, or "near"
// the nearest area for a point of their own, never the point), completed swaps.
import { eq } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';
import type { Viewer } from '../club/users';
import * as areas from '../club/areas';
import { nearestArea } from '../../swaps/places';
import * as blocks from './blocks';
import { completedSwaps } from './listings';

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
export async function areaLabelOf(
	user: { homeAreaId: number | null; homeLat: number | null; homeLng: number | null },
	database: DbOrTx = appDb
): Promise<string | null> {
	const all = await areas.list({ db: database });
	const own = user.homeAreaId !== null ? all.find((a) => a.id === user.homeAreaId) : undefined;
	if (own) return own.name;
	if (user.homeLat === null || user.homeLng === null) return null;
	const near = nearestArea({ lat: user.homeLat, lng: user.homeLng }, all);
	return near ? `near ${near.name}` : null;
}

export async function profile(viewer: Viewer, memberId: string, database: DbOrTx = appDb): Promise<MemberProfile | null> {
	const [user] = await database.select().from(users).where(eq(users.id, memberId));
	if (!user || !user.displayName) return null;
	const [area, completed, relation] = await Promise.all([
		areaLabelOf(user, database),
		completedSwaps(user.id, database),
		blocks.between(viewer.id, user.id, database)
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
