// Distances as members read them, and the one figure the board works with. Exact figures would help
// nobody and could help someone narrow down where a member lives, so a distance is shown coarsely,
// never finer than the stored points allow: each point is rounded to 0.01° (see $lib/club/location),
// up to about 0.8 km from the real place, so a distance between two stored points can be off by up
// to about 1.6 km.
//
// The shown figure is also all the board decides on: the radius filter keeps a listing when its
// shown figure is within the radius, and the order is by shown figure, then newest first. So a
// member who moves their own point and searches again learns nothing but shown figures (see
// README.md, "Privacy of members' locations").

export interface DistanceLabel {
	/** e.g. "under 2 km", "about 4 km", "about 25 km", "about 1,200 km". */
	text: string;
	/** The rounded kilometres shown, or null for "under 2 km". */
	km: number | null;
}

/**
 * The bands of the shown figure: a distance below `below` metres (and not below the band before)
 * is rounded to the nearest multiple of `step` metres, halves up; step 0 shows "under 2 km".
 * Whole kilometres up to 9.5 km, 5 km steps up to 27.5, 10 km up to 95, 50 km up to 975, then
 * 100 km: coarser with distance, as people think of it (our choice, no source). Each band starts
 * where the rounding of the band before would first give a figure of its own step, so the figures
 * never go down as distances grow.
 */
export const DISTANCE_BANDS: readonly { below: number; step: number }[] = [
	{ below: 1_500, step: 0 },
	{ below: 9_500, step: 1_000 },
	{ below: 27_500, step: 5_000 },
	{ below: 95_000, step: 10_000 },
	{ below: 975_000, step: 50_000 },
	{ below: Number.POSITIVE_INFINITY, step: 100_000 }
];

const bandOf = (metres: number) => DISTANCE_BANDS.find((b) => metres < b.below)!;

/**
 * The figure shown for a distance, in metres: 0 for "under 2 km", else the rounded distance.
 * Written as the board's SQL computes it (server/swaps/nearby.ts, `shownSql`): floor((d + s/2) / s) · s.
 */
export function shownMetres(metres: number): number {
	if (!(metres >= 0)) throw new RangeError('A distance is zero or more metres.');
	const { step } = bandOf(metres);
	return step === 0 ? 0 : Math.floor((metres + step / 2) / step) * step;
}

const grouping = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** The words for a shown figure (as `shownMetres` gives it). */
export function labelOf(shown: number): DistanceLabel {
	if (!(shown >= 0)) throw new RangeError('A shown distance is zero or more metres.');
	if (shown === 0) return { text: 'under 2 km', km: null };
	const km = shown / 1000;
	return { text: `about ${grouping.format(km)} km`, km };
}

/**
 * How far the board looks for a radius: every distance below this is shown as `radiusKm` or less,
 * every distance from it on as more (the upper edge of the radius's own figure). For the SQL
 * pre-filter; the filter itself compares shown figures.
 */
export function radiusReachMetres(radiusKm: number): number {
	const figure = radiusKm * 1000;
	const { step } = bandOf(figure);
	if (step === 0 || shownMetres(figure) !== figure) throw new RangeError(`${radiusKm} km is not a figure the board shows.`);
	return figure + step / 2;
}
