import distance from '@turf/distance';
import { describe, expect, test } from 'vitest';
import type { LatLng } from '$lib/club/location';
import { boundingBox, centralAngle, haversineDistance, MEAN_EARTH_RADIUS_M, type BoundingBox } from './distance';

/** Park–Miller generator: the same "random" points on every run. */
function random(seed: number) {
	let s = seed;
	return () => (s = (s * 48271) % 2147483647) / 2147483647;
}
const uniformOnSphere = (next: () => number): LatLng => ({
	lat: (Math.asin(2 * next() - 1) * 180) / Math.PI,
	lng: next() * 360 - 180
});
const turfMetres = (a: LatLng, b: LatLng) => distance([a.lng, a.lat], [b.lng, b.lat], { units: 'meters' });

/** Destination from `start` after `metres` on initial bearing θ (spherical direct formula, written here for the tests). */
function destination(start: LatLng, bearingRad: number, metres: number): LatLng {
	const d = metres / MEAN_EARTH_RADIUS_M;
	const phi1 = (start.lat * Math.PI) / 180;
	const lambda1 = (start.lng * Math.PI) / 180;
	const phi2 = Math.asin(Math.sin(phi1) * Math.cos(d) + Math.cos(phi1) * Math.sin(d) * Math.cos(bearingRad));
	const lambda2 = lambda1 + Math.atan2(Math.sin(bearingRad) * Math.sin(d) * Math.cos(phi1), Math.cos(d) - Math.sin(phi1) * Math.sin(phi2));
	const lng = (((((lambda2 * 180) / Math.PI + 540) % 360) + 360) % 360) - 180;
	return { lat: (phi2 * 180) / Math.PI, lng };
}

describe('haversineDistance', () => {
	test('IUGG mean radius R₁ = 6,371,008.8 m (Moritz, Geodetic Reference System 1980)', () => {
		expect(MEAN_EARTH_RADIUS_M).toBe(6_371_008.8);
	});

	test('Aviation Formulary (Ed Williams) worked example LAX–JFK: 0.623585 rad = 2144 nm (values from memory)', () => {
		// LAX 33°57′N 118°24′W, JFK 40°38′N 73°47′W. The Formulary works on a sphere on which one
		// nautical mile is one minute of arc, i.e. radius 180·60/π nm, so its 2144 nm is the central
		// angle × 10800/π. On our sphere the same angle is 0.623585 × 6,371,008.8 m ≈ 3,972.9 km.
		const lax = { lat: 33 + 57 / 60, lng: -(118 + 24 / 60) };
		const jfk = { lat: 40 + 38 / 60, lng: -(73 + 47 / 60) };
		const angle = centralAngle(lax, jfk);
		expect(angle).toBeCloseTo(0.623585, 6);
		expect(Math.round((angle * 10800) / Math.PI)).toBe(2144);
		expect(haversineDistance(lax, jfk, (10800 / Math.PI) * 1852) / 1852).toBeCloseTo(2143.7, 1);
		expect(haversineDistance(lax, jfk)).toBeCloseTo(0.623585 * 6_371_008.8, -1);
	});

	test('agrees with @turf/distance (haversine, same radius) on random pairs', () => {
		const next = random(17);
		for (let i = 0; i < 2000; i++) {
			const a = uniformOnSphere(next);
			const b = uniformOnSphere(next);
			expect(Math.abs(haversineDistance(a, b) - turfMetres(a, b))).toBeLessThan(1e-6);
		}
	});

	test('agrees with @turf/distance near the antipode and across the antimeridian', () => {
		const next = random(29);
		for (let i = 0; i < 500; i++) {
			const a = uniformOnSphere(next);
			// Nearly antipodal: the antipode moved by up to 0.01°. Both formulas lose digits here
			// (the argument of asin/atan2 is near 1), so allow 1 m on 20,000 km.
			const far = { lat: -a.lat + (next() - 0.5) * 0.02, lng: ((a.lng + 360) % 360) - 180 + (next() - 0.5) * 0.02 };
			expect(Math.abs(haversineDistance(a, far) - turfMetres(a, far))).toBeLessThan(1);
			// Either side of ±180°.
			const west = { lat: (next() - 0.5) * 170, lng: 179.5 + next() * 0.5 };
			const east = { lat: west.lat + (next() - 0.5), lng: -180 + next() * 0.5 };
			expect(Math.abs(haversineDistance(west, east) - turfMetres(west, east))).toBeLessThan(1e-6);
			expect(haversineDistance(west, east)).toBeLessThan(200_000);
		}
	});

	test('exact cases: same point 0, antipodes πR, a quarter of the equator πR/2', () => {
		expect(haversineDistance({ lat: 55.1, lng: 3.2 }, { lat: 55.1, lng: 3.2 })).toBe(0);
		// At the antipode asin(√h) has h ≈ 1, where a rounding of h by ε moves the angle by √ε:
		// about R·√(2.2e-16) ≈ 0.1 m. Known for the haversine formula; harmless for a swap board.
		expect(Math.abs(haversineDistance({ lat: 10, lng: 20 }, { lat: -10, lng: -160 }) - Math.PI * MEAN_EARTH_RADIUS_M)).toBeLessThan(0.5);
		expect(haversineDistance({ lat: 0, lng: 0 }, { lat: 0, lng: 90 })).toBeCloseTo((Math.PI / 2) * MEAN_EARTH_RADIUS_M, 6);
		expect(haversineDistance({ lat: 0, lng: 179.9 }, { lat: 0, lng: -179.9 })).toBeCloseTo((0.2 * Math.PI * MEAN_EARTH_RADIUS_M) / 180, 6);
	});
});

/** The test the board's SQL pre-filter makes (server/swaps/nearby.ts, `boxSql`), for longitudes in [−180, 180]. */
const isInBoundingBox = (point: LatLng, box: BoundingBox) =>
	point.lat >= box.minLat && point.lat <= box.maxLat && box.lngRanges.some((r) => point.lng >= r.min && point.lng <= r.max);

describe('boundingBox', () => {
	test('every point within the radius lies in the box (random centres, radii and points)', () => {
		const next = random(41);
		let checked = 0;
		for (let trial = 0; trial < 400; trial++) {
			// A quarter of the centres near a pole, a quarter near the antimeridian.
			const kind = trial % 4;
			const base = uniformOnSphere(next);
			const center =
				kind === 0
					? { lat: (next() < 0.5 ? 1 : -1) * (85 + next() * 5), lng: base.lng }
					: kind === 1
						? { lat: base.lat * 0.9, lng: next() < 0.5 ? 179 + next() : -180 + next() }
						: base;
			const radius = trial % 10 === 0 ? 500_000 + next() * 4_000_000 : 100 + next() * 200_000;
			const box = boundingBox(center, radius);
			for (let k = 0; k < 60; k++) {
				// Points on and inside the circle, in every direction, and the rim itself.
				const d = k < 12 ? radius : radius * Math.sqrt(next());
				const p = destination(center, next() * 2 * Math.PI, d);
				if (haversineDistance(center, p) > radius) continue;
				expect(isInBoundingBox(p, box), JSON.stringify({ center, radius, p, box })).toBe(true);
				checked++;
			}
			// And uniform points anywhere on the globe that happen to fall within a large radius.
			for (let k = 0; k < 40; k++) {
				const p = uniformOnSphere(next);
				if (haversineDistance(center, p) <= radius) expect(isInBoundingBox(p, box)).toBe(true);
			}
		}
		expect(checked).toBeGreaterThan(20_000);
	});

	test('is tight at mid latitudes: height exactly 2r, width along the centre parallel within 0.1 % of 2r', () => {
		for (const lat of [-60, -45, -20, 0, 30, 45, 55, 60]) {
			const radius = 25_000;
			const box = boundingBox({ lat, lng: 3 }, radius);
			expect(box.lngRanges).toHaveLength(1);
			const range = box.lngRanges[0]!;
			const height = ((box.maxLat - box.minLat) * Math.PI * MEAN_EARTH_RADIUS_M) / 180;
			const width = ((range.max - range.min) * Math.PI * MEAN_EARTH_RADIUS_M * Math.cos((lat * Math.PI) / 180)) / 180;
			expect(height).toBeCloseTo(2 * radius, 0);
			// ≥ 2r: asin(sin r / cos φ)·cos φ ≥ asin(sin r) = r, as asin(x)/x grows with x (equality
			// on the equator, where the edge margin keeps it from rounding below).
			expect(width).toBeGreaterThanOrEqual(2 * radius);
			expect(width).toBeLessThan(2 * radius * 1.001);
			// The box's area is the circle's times 4/π, within a percent.
			expect((height * width) / (Math.PI * radius * radius)).toBeLessThan((4 / Math.PI) * 1.01);
		}
	});

	test('the circle touches the box: due north reaches maxLat, the tangent meridians reach the lng limits', () => {
		const center = { lat: 52, lng: 4 };
		const radius = 50_000;
		const box = boundingBox(center, radius);
		expect(destination(center, 0, radius).lat).toBeCloseTo(box.maxLat, 7);
		// The farthest longitude on the circle, found by sweeping the bearing.
		let maxLng = -Infinity;
		for (let b = 0; b < 2 * Math.PI; b += 0.0005) maxLng = Math.max(maxLng, destination(center, b, radius).lng);
		expect(maxLng).toBeCloseTo(box.lngRanges[0]!.max, 5);
	});

	test('near a pole: clamped latitude, every longitude', () => {
		const box = boundingBox({ lat: 89.5, lng: 10 }, 100_000);
		expect(box).toMatchObject({ maxLat: 90, coversPole: true, crossesAntimeridian: false, lngRanges: [{ min: -180, max: 180 }] });
		expect(box.minLat).toBeCloseTo(89.5 - (100_000 / MEAN_EARTH_RADIUS_M) * (180 / Math.PI), 6);
		expect(boundingBox({ lat: -89.9, lng: 0 }, 20_000)).toMatchObject({ minLat: -90, coversPole: true });
		expect(boundingBox({ lat: 0, lng: 0 }, 25_000_000)).toMatchObject({ minLat: -90, maxLat: 90, coversPole: true });
	});

	test('across the antimeridian: two longitude ranges', () => {
		const box = boundingBox({ lat: -40, lng: 179.9 }, 50_000);
		expect(box.crossesAntimeridian).toBe(true);
		expect(box.lngRanges).toHaveLength(2);
		const [east, west] = box.lngRanges;
		expect(east!.max).toBe(180);
		expect(west!.min).toBe(-180);
		expect(east!.min).toBeGreaterThan(179);
		expect(west!.max).toBeLessThan(-179);
		expect(isInBoundingBox({ lat: -40, lng: -179.8 }, box)).toBe(true);
		expect(isInBoundingBox({ lat: -40, lng: 0 }, box)).toBe(false);
		expect(boundingBox({ lat: 10, lng: -179.95 }, 30_000)).toMatchObject({ crossesAntimeridian: true });
	});

	test('refuses a negative radius; zero radius is the point itself', () => {
		expect(() => boundingBox({ lat: 0, lng: 0 }, -1)).toThrow(RangeError);
		const box = boundingBox({ lat: 10, lng: 20 }, 0);
		expect(isInBoundingBox({ lat: 10, lng: 20 }, box)).toBe(true);
		expect(isInBoundingBox({ lat: 10.0001, lng: 20 }, box)).toBe(false);
	});
});
