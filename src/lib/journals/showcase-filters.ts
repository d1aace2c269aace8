// The showcase's filters: size bands of water volume and the ways to sort.
import { formatVolume, type UnitSystem } from './calc';

/** Size bands by the volume the figures use (our own cut-offs, no source). */
export const VOLUME_BANDS = {
	nano: { min: 0, max: 40 },
	small: { min: 40, max: 100 },
	medium: { min: 100, max: 250 },
	large: { min: 250, max: null }
} as const satisfies Record<string, { min: number; max: number | null }>;
export type VolumeBand = keyof typeof VOLUME_BANDS;
export const VOLUME_BAND_KEYS = Object.keys(VOLUME_BANDS) as VolumeBand[];
export const isVolumeBand = (v: string): v is VolumeBand => Object.hasOwn(VOLUME_BANDS, v);

/** "Under 10.6 US gal", "40–100 L", "250 L and more": in the member's units. */
export function volumeBandLabel(band: VolumeBand, units: UnitSystem): string {
	const { min, max } = VOLUME_BANDS[band];
	const v = (litres: number) => formatVolume(litres, units, { figures: 3 });
	if (min === 0 && max !== null) return `Under ${v(max)}`;
	if (max === null) return `${v(min)} and more`;
	return `${v(min).replace(/ \S+( \S+)?$/, '')}–${v(max)}`;
}

export const SHOWCASE_SORTS = { newest: 'Newest', updated: 'Recently updated', admired: 'Most admired' } as const;
export type ShowcaseSort = keyof typeof SHOWCASE_SORTS;
export const isShowcaseSort = (v: string): v is ShowcaseSort => Object.hasOwn(SHOWCASE_SORTS, v);
