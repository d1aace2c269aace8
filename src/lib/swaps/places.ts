// Where a listing is picked up, as the board shows it: a club area's name when the owner lives
// in that area, "near <area>" when the owner gave a point of their own (the nearest area names
// it), never an address or a point.
import type { LatLng } from '$lib/club/location';
import { haversineDistance } from './distance';

export interface NamedPlace extends LatLng {
	id: number;
	name: string;
}

/**
 * Beyond this, a point is not "near" any area (our choice, no source): a member far from the
 * club's areas gets no area name rather than a misleading one.
 */
export const NEAR_AREA_MAX_M = 30_000;

/** The area whose centre is closest to `point` (great-circle) within `maxMetres`, or null. */
export function nearestArea<T extends NamedPlace>(point: LatLng, areas: readonly T[], maxMetres = NEAR_AREA_MAX_M): T | null {
	let best: T | null = null;
	let bestDistance = Infinity;
	for (const area of areas) {
		const d = haversineDistance(point, area);
		if (d > maxMetres) continue;
		if (d < bestDistance || (d === bestDistance && best !== null && area.name < best.name)) {
			best = area;
			bestDistance = d;
		}
	}
	return best;
}

export function pickupLabel(areaName: string | null, near: boolean): string {
	if (!areaName) return 'Pickup area not given';
	return near ? `near ${areaName}` : areaName;
}
