// Distances between members for the swap board. Members' points are stored rounded to about a
// kilometre (see $lib/club/location), so a sphere is plenty: the haversine formula on a sphere of
// the mean Earth radius differs from the ellipsoidal distance by at most about 0.5 % (from memory).

import type { LatLng } from '$lib/club/location';

/** IUGG mean Earth radius R₁ = (2a + b)/3 of GRS 80, in metres (Moritz, Bulletin Géodésique 54). */
export const MEAN_EARTH_RADIUS_M = 6_371_008.8;

const toRadians = (deg: number) => (deg * Math.PI) / 180;
const toDegrees = (rad: number) => (rad * 180) / Math.PI;

/**
 * Central angle between two points in radians, by the haversine formula:
 * 2·asin(√(sin²(Δφ/2) + cos φ₁·cos φ₂·sin²(Δλ/2))). It stays accurate for short distances, where
 * the spherical law of cosines loses digits. Near the antipode it is the other way round (h ≈ 1,
 * so rounding h by ε moves the result by about R·√ε ≈ 0.1 m), which no swap cares about; the
 * argument is clamped to 1 so rounding cannot push it out of asin's domain.
 */
export function centralAngle(a: LatLng, b: LatLng): number {
	const phi1 = toRadians(a.lat);
	const phi2 = toRadians(b.lat);
	const dPhi = phi2 - phi1;
	const dLambda = toRadians(b.lng - a.lng);
	const h = Math.sin(dPhi / 2) ** 2 + Math.cos(phi1) * Math.cos(phi2) * Math.sin(dLambda / 2) ** 2;
	return 2 * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** Great-circle distance in metres on a sphere of `radius` metres (default: the IUGG mean radius). */
export function haversineDistance(a: LatLng, b: LatLng, radius: number = MEAN_EARTH_RADIUS_M): number {
	return centralAngle(a, b) * radius;
}

export interface LngRange {
	min: number;
	max: number;
}

/**
 * Latitude and longitude limits that contain every point within a radius, for a cheap indexed
 * pre-filter in SQL before the exact distance:
 *   lat BETWEEN minLat AND maxLat AND (lng BETWEEN r₀.min AND r₀.max [OR lng BETWEEN r₁.min AND r₁.max])
 */
export interface BoundingBox {
	minLat: number;
	maxLat: number;
	/** One range, or two when the circle crosses the antimeridian (±180°). */
	lngRanges: LngRange[];
	crossesAntimeridian: boolean;
	/** The circle reaches a pole: every longitude is in range and the latitude is clamped. */
	coversPole: boolean;
}

/** Widened outward by this many degrees (≈ 0.1 mm) so rounding never drops a point on the edge. */
const EDGE_MARGIN_DEG = 1e-9;

/**
 * Bounding coordinates of a spherical cap (the method of J. P. Matuschek's article "Finding Points
 * Within a Distance of a Latitude/Longitude Using Bounding Coordinates", cited from memory): latitude ± r, and longitude
 * ± asin(sin r / cos φ), the meridians tangent to the circle, where r is the angular radius. When
 * the cap reaches a pole, every longitude is inside; across ±180° the range is split in two.
 */
export function boundingBox(center: LatLng, radiusMetres: number, radius: number = MEAN_EARTH_RADIUS_M): BoundingBox {
	if (!(radiusMetres >= 0)) throw new RangeError('The search radius must be zero or more metres.');
	const r = radiusMetres / radius;
	const phi = toRadians(center.lat);
	const minPhi = phi - r;
	const maxPhi = phi + r;
	const whole: LngRange[] = [{ min: -180, max: 180 }];
	if (r >= Math.PI || maxPhi >= Math.PI / 2 || minPhi <= -Math.PI / 2) {
		return {
			minLat: Math.max(-90, toDegrees(minPhi) - EDGE_MARGIN_DEG),
			maxLat: Math.min(90, toDegrees(maxPhi) + EDGE_MARGIN_DEG),
			lngRanges: whole,
			crossesAntimeridian: false,
			coversPole: true
		};
	}
	const ratio = Math.sin(r) / Math.cos(phi);
	const box = { minLat: toDegrees(minPhi) - EDGE_MARGIN_DEG, maxLat: toDegrees(maxPhi) + EDGE_MARGIN_DEG, coversPole: false };
	if (ratio >= 1) return { ...box, lngRanges: whole, crossesAntimeridian: false };
	const dLng = toDegrees(Math.asin(ratio)) + EDGE_MARGIN_DEG;
	if (dLng >= 180) return { ...box, lngRanges: whole, crossesAntimeridian: false };
	const minLng = center.lng - dLng;
	const maxLng = center.lng + dLng;
	if (minLng < -180) {
		return {
			...box,
			lngRanges: [
				{ min: minLng + 360, max: 180 },
				{ min: -180, max: maxLng }
			],
			crossesAntimeridian: true
		};
	}
	if (maxLng > 180) {
		return {
			...box,
			lngRanges: [
				{ min: minLng, max: 180 },
				{ min: -180, max: maxLng - 360 }
			],
			crossesAntimeridian: true
		};
	}
	return { ...box, lngRanges: [{ min: minLng, max: maxLng }], crossesAntimeridian: false };
}
