// Distances as members read them. Exact figures would help nobody and could help someone narrow
// down where a member lives, so distances are shown coarsely, and never finer than the stored
// points allow: each point is rounded to 0.01° (see $lib/club/location), up to about 0.8 km from
// the real place, so a distance between two stored points can be off by up to about 1.6 km.

export interface DistanceLabel {
	/** e.g. "under 2 km", "about 4 km", "about 25 km", "about 1,200 km". */
	text: string;
	/** The rounded kilometres shown, or null for "under 2 km". */
	km: number | null;
}

/** Below this, the rounding of the stored points is as large as the distance itself. */
export const NEARBY_LIMIT_M = 1_500;

/**
 * Rounding step for a distance in km: 1 km up to 10 km, 5 km up to 30, 10 km up to 100, 50 km up
 * to 1,000, then 100 km. Coarser with distance, as people think of it (our choice, no source).
 */
export function roundingStepKm(km: number): number {
	if (km < 10) return 1;
	if (km < 30) return 5;
	if (km < 100) return 10;
	if (km < 1000) return 50;
	return 100;
}

const grouping = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

export function formatDistance(metres: number): DistanceLabel {
	if (!(metres >= 0)) throw new RangeError('A distance is zero or more metres.');
	if (metres < NEARBY_LIMIT_M) return { text: 'under 2 km', km: null };
	const km = metres / 1000;
	const step = roundingStepKm(km);
	const rounded = Math.round(km / step) * step;
	return { text: `about ${grouping.format(rounded)} km`, km: rounded };
}
