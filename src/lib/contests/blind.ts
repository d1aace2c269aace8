// What a judge learns about an entered tank besides its photos and statement. Tank pages show a
// tank's exact volume and age, so exact figures on a scorecard would let a judge look the entry up;
// judges get the category's rule the entry was checked against and bands that many tanks share.
// Photos carry an aspect ratio rather than their pixel sizes, which could be matched just as well.
import { describeRule, type EligibilityRule } from './eligibility';
import { decimalsForMagnitude, formatNumber, roundTo } from '../journals/calc/round';
import { fromMetric, unitSymbol, type UnitSystem } from '../journals/calc/units';
import { RENDITIONS, type RenditionSize } from '../media/urls';

/**
 * Upper edges of the volume bands in each unit system, in that system's unit (our own cut-offs, no
 * source): round numbers of the unit, wide enough that the tanks of a club share each band.
 */
export const VOLUME_BAND_EDGES: Record<UnitSystem, readonly number[]> = {
	metric: [20, 40, 60, 100, 200, 400],
	us: [5, 10, 15, 25, 50, 100],
	imperial: [5, 10, 15, 25, 50, 100]
};

/** The volume as tank pages show it in this unit system: three significant figures, never cutting whole units. */
const asShown = (litres: number, units: UnitSystem) => {
	const value = fromMetric('volume', litres, units);
	return roundTo(value, decimalsForMagnitude(value, 3));
};

/**
 * The band of a volume in the viewer's units: "Under 20 L", "40–60 L", "100 US gal or more". The
 * band is picked from the value as tank pages show it (lower edge included, upper edge excluded), so
 * the band's upper edge is always above the shown value and never equals it; a band is a range,
 * never one exact figure.
 */
export function volumeBand(litres: number, units: UnitSystem): string {
	const shown = asShown(litres, units);
	const edges = VOLUME_BAND_EDGES[units];
	const symbol = unitSymbol('volume', units);
	const upper = edges.findIndex((edge) => shown < edge);
	if (upper === 0) return `Under ${formatNumber(edges[0]!)} ${symbol}`;
	if (upper === -1) return `${formatNumber(edges[edges.length - 1]!)} ${symbol} or more`;
	return `${formatNumber(edges[upper - 1]!)}–${formatNumber(edges[upper]!)} ${symbol}`;
}

/** Age bands in whole weeks since set-up (our own cut-offs, no source): 13 weeks ≈ 3 months, 52 ≈ a year. */
export const AGE_BANDS = [
	{ belowWeeks: 13, label: 'Under 3 months' },
	{ belowWeeks: 52, label: '3–12 months' },
	{ belowWeeks: Infinity, label: 'A year or more' }
] as const;

/** The band of a tank's age in whole weeks. */
export function ageBand(weeks: number): string {
	if (!Number.isInteger(weeks) || weeks < 0) throw new RangeError(`weeks must be a whole number of 0 or more (got ${weeks})`);
	return AGE_BANDS.find((b) => weeks < b.belowWeeks)!.label;
}

export interface BlindFigures {
	/** The category's rule the entry met when it was entered, in the contest's own words and litres. */
	rule: string;
	/** The volume band in the viewer's units; null when the volume could not be worked out. */
	volume: string | null;
	/** The age band when entered; null without a set-up date. */
	age: string | null;
}

/** What the scorecard says about the tank, from the figures checked when it was entered. */
export function blindFigures(entry: { litres: number | null; ageWeeks: number | null }, rule: EligibilityRule, units: UnitSystem): BlindFigures {
	return {
		rule: describeRule(rule),
		volume: entry.litres === null ? null : volumeBand(entry.litres, units),
		age: entry.ageWeeks === null ? null : ageBand(entry.ageWeeks)
	};
}

/** A photo's shape as width ÷ height to two decimals: enough to lay it out, too coarse to match its pixel size. */
export const aspectOf = (width: number, height: number) => roundTo(width / height, 2);

/**
 * The width each rendition has at most for a photo of this shape (renditions are scaled to their
 * longest edge and never enlarged), for `srcset`: the browser only needs it to choose a size.
 */
export function renditionWidths(aspect: number): Record<RenditionSize, number> {
	const width = (longest: number) => (aspect >= 1 ? longest : Math.round(longest * aspect));
	return { thumb: width(RENDITIONS.thumb), medium: width(RENDITIONS.medium), large: width(RENDITIONS.large) };
}
