import { describe, expect, test } from 'vitest';
import { nearestArea, pickupLabel } from './places';

// Areas over open sea (invented, like the demo club's); distances by the haversine function tested
// against @turf/distance in distance.test.ts.
const areas = [
	{ id: 1, name: 'Centre', lat: 55.2, lng: 3.2 },
	{ id: 2, name: 'East', lat: 55.2, lng: 3.4 },
	{ id: 3, name: 'North', lat: 55.4, lng: 3.2 }
];

describe('pickup places', () => {
	test('the nearest area names a point', () => {
		expect(nearestArea({ lat: 55.21, lng: 3.22 }, areas)?.name).toBe('Centre');
		expect(nearestArea({ lat: 55.2, lng: 3.31 }, areas)?.name).toBe('East');
		expect(nearestArea({ lat: 55.35, lng: 3.19 }, areas)?.name).toBe('North');
		expect(nearestArea({ lat: 0, lng: 0 }, [])).toBeNull();
	});
	test('nothing is "near" beyond 30 km', () => {
		// A degree along a meridian is πR/180 ≈ 111.19 km on the IUGG mean sphere: 0.26° ≈ 28.9 km, 0.28° ≈ 31.1 km.
		expect(nearestArea({ lat: 55.46, lng: 3.2 }, areas.slice(0, 1))?.name).toBe('Centre');
		expect(nearestArea({ lat: 55.48, lng: 3.2 }, areas.slice(0, 1))).toBeNull();
		expect(nearestArea({ lat: -40, lng: -20 }, areas)).toBeNull();
	});
	test('a degree of longitude is shorter than one of latitude away from the equator', () => {
		// At 55° N, 0.15° of longitude is about 9.6 km and 0.09° of latitude about 10.0 km: the
		// area further away in degrees is the nearer one.
		const pair = [
			{ id: 1, name: 'West', lat: 55, lng: 3.15 },
			{ id: 2, name: 'North', lat: 55.09, lng: 3 }
		];
		expect(nearestArea({ lat: 55, lng: 3 }, pair)?.name).toBe('West');
	});
	test('labels', () => {
		expect(pickupLabel('Mossbank', false)).toBe('Mossbank');
		expect(pickupLabel('Mossbank', true)).toBe('near Mossbank');
		expect(pickupLabel(null, true)).toBe('Pickup area not given');
	});
});
