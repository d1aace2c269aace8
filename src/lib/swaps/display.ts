// Distances as members read them, and the one figure the board works with. Exact figures would help
// nobody and could help someone narrow down where a member lives, so a distance is shown coarsely,
// never finer than the stored points allow: each point is rounded to 0.01° (see $lib/club/location),
// up to about 0.8 km from the real place, so a distance between two stored points can be off by up
// to about 1.6 km.
//
// A distance is shown in the viewer's own unit: kilometres for metric members, miles for US and
// imperial members ($lib/journals/calc/units). The shown figure is also all the board decides on:
// the radius filter keeps a listing when its shown figure is within the radius, and the order is by
// shown figure, then newest first, in kilometres and in miles alike. So a member who moves their own
// point and searches again learns nothing but shown figures (see README.md, "Privacy of members'
// locations").
import { metresPerDistanceUnit, type DistanceUnit } from '../journals/calc/units';

export type { DistanceUnit };

export interface DistanceLabel {
	/** e.g. "under 2 km", "about 4 km", "about 25 mi", "about 1,200 km". */
	text: string;
	/** The rounded figure shown, in `unit`, or null for "under 2". */
	figure: number | null;
	unit: DistanceUnit;
}

/**
 * The bands of the shown figure, in the unit shown (kilometres or miles alike): a distance below
 * `below` units (and not below the band before) is rounded to the nearest multiple of `step` units,
 * halves up; step 0 shows "under 2". Whole units up to 9.5, steps of 5 up to 27.5, 10 up to 95, 50 up
 * to 975, then 100: coarser with distance, as people think of it (our choice, no source). Each band
 * starts where the rounding of the band before would first give a figure of its own step, so the
 * figures never go down as distances grow. A mile is longer than a kilometre, so the bands in miles
 * are coarser still and never finer than the stored points allow.
 */
export const DISTANCE_BANDS: readonly { below: number; step: number }[] = [
	{ below: 1.5, step: 0 },
	{ below: 9.5, step: 1 },
	{ below: 27.5, step: 5 },
	{ below: 95, step: 10 },
	{ below: 975, step: 50 },
	{ below: Number.POSITIVE_INFINITY, step: 100 }
];

/**
 * A figure in metres as the board's SQL reads it: a decimal literal of nine places
 * (server/swaps/nearby.ts). Both sides use this value, so a mile's odd metres compare alike in
 * JavaScript and in the database.
 */
export const asLiteral = (metres: number) => (Number.isFinite(metres) ? Number(metres.toFixed(9)) : metres);

export interface BandInMetres {
	/** Upper edge of the band, metres (as a literal). */
	belowMetres: number;
	/** Step in the shown unit; 0 for "under 2". */
	step: number;
	/** The step and its half in metres (as literals). */
	stepMetres: number;
	halfStepMetres: number;
}

/** The bands of a unit, in metres, as both this module and the board's SQL use them. */
export function bandsInMetres(unit: DistanceUnit): readonly BandInMetres[] {
	const size = metresPerDistanceUnit(unit);
	return DISTANCE_BANDS.map(({ below, step }) => ({
		belowMetres: asLiteral(below * size),
		step,
		stepMetres: asLiteral(step * size),
		halfStepMetres: asLiteral((step * size) / 2)
	}));
}

const BANDS: Record<DistanceUnit, readonly BandInMetres[]> = { km: bandsInMetres('km'), mi: bandsInMetres('mi') };
const bandOf = (metres: number, unit: DistanceUnit) => BANDS[unit].find((b) => metres < b.belowMetres)!;

/**
 * The figure shown for a distance in metres, in `unit`: 0 for "under 2", else the rounded distance.
 * Written as the board's SQL computes it (server/swaps/nearby.ts, `shownSql`):
 * floor((d + half step) / step) × step, with the step and its half in metres.
 */
export function shownFigure(metres: number, unit: DistanceUnit): number {
	if (!(metres >= 0)) throw new RangeError('A distance is zero or more metres.');
	const band = bandOf(metres, unit);
	return band.step === 0 ? 0 : Math.floor((metres + band.halfStepMetres) / band.stepMetres) * band.step;
}

const grouping = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** The words for a shown figure (as `shownFigure` gives it). */
export function labelOf(shown: number, unit: DistanceUnit): DistanceLabel {
	if (!(shown >= 0)) throw new RangeError('A shown distance is zero or more.');
	if (shown === 0) return { text: `under 2 ${unit}`, figure: null, unit };
	return { text: `about ${grouping.format(shown)} ${unit}`, figure: shown, unit };
}

/**
 * How far the board looks for a radius in `unit`: every distance below this many metres is shown as
 * `radius` or less, every distance from it on as more (the upper edge of the radius's own figure).
 * For the SQL pre-filter; the filter itself compares shown figures.
 */
export function radiusReachMetres(radius: number, unit: DistanceUnit): number {
	const size = metresPerDistanceUnit(unit);
	const band = bandOf(asLiteral(radius * size), unit);
	if (band.step === 0 || !Number.isInteger(radius) || radius % band.step !== 0) throw new RangeError(`${radius} ${unit} is not a figure the board shows.`);
	return asLiteral((radius / band.step) * band.stepMetres + band.halfStepMetres);
}
