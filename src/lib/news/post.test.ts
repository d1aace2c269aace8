import distance from '@turf/distance';
import { describe, expect, test } from 'vitest';
import type { LatLng } from '$lib/club/location';
import { audienceOf, describeAudience, postForm, withinRadius } from './post';

// Distances checked against @turf/distance (an npm reference library, haversine on the mean
// Earth radius); the band rounding is the swap board's own ($lib/swaps/display).
const turfKm = (a: LatLng, b: LatLng) => distance([a.lng, a.lat], [b.lng, b.lat], { units: 'kilometers' });

describe('members in an area', () => {
	const centre = { lat: -40, lng: -20 };
	test('a member well inside and one well outside the radius, by the reference distance', () => {
		const near = { lat: -40.05, lng: -20 }; // about 5.6 km south
		const far = { lat: -40.2, lng: -20 }; // about 22 km south
		expect(turfKm(centre, near)).toBeCloseTo(5.56, 1);
		expect(turfKm(centre, far)).toBeCloseTo(22.24, 1);
		expect(withinRadius(near, centre, 10, 'km')).toBe(true);
		expect(withinRadius(far, centre, 10, 'km')).toBe(false);
		expect(withinRadius(far, centre, 25, 'km')).toBe(true);
		// 22.24 km is 13.8 miles: outside 10 mi, inside 25 mi.
		expect(turfKm(centre, far) / 1.609344).toBeCloseTo(13.82, 1);
		expect(withinRadius(far, centre, 10, 'mi')).toBe(false);
		expect(withinRadius(far, centre, 25, 'mi')).toBe(true);
	});
	test('the edge follows the board: a distance shown as the radius is inside', () => {
		// Between 9.5 and 27.5 km the board shows steps of 5: 12.4 km is "about 10 km", so within 10 km; 12.6 km is "about 15 km".
		const at = (km: number) => ({ lat: centre.lat - km / 111.195, lng: centre.lng });
		expect(turfKm(centre, at(12.4))).toBeCloseTo(12.4, 2);
		expect(withinRadius(at(12.4), centre, 10, 'km')).toBe(true);
		expect(withinRadius(at(12.6), centre, 10, 'km')).toBe(false);
	});
});

describe('the post form', () => {
	const base = { title: 'Plant auction', body: 'Bring **cuttings**.', visibility: 'public', audienceKind: 'all', contestId: '', areaId: '', radius: '' };
	test('an audience needs its own fields', () => {
		expect(postForm.safeParse({ ...base, audienceKind: 'entrants' }).error?.issues.map((i) => i.path[0])).toEqual(['contestId']);
		expect(postForm.safeParse({ ...base, audienceKind: 'area', areaId: '3', radius: '7' }).error?.issues.map((i) => i.path[0])).toEqual(['radius']);
		const area = postForm.parse({ ...base, audienceKind: 'area', areaId: '3', radius: '25' });
		expect(audienceOf(area, 'mi')).toEqual({ kind: 'area', areaId: 3, radius: 25, unit: 'mi' });
		expect(audienceOf(postForm.parse(base), 'km')).toEqual({ kind: 'all' });
	});
	test('described for the admin', () => {
		expect(describeAudience({ kind: 'area', areaId: 1, radius: 10, unit: 'km' }, { area: 'Harbour Reach' })).toBe('Members within 10 km of Harbour Reach');
		expect(describeAudience({ kind: 'entrants', contestId: 2 }, { contest: 'Spring' })).toBe('Entrants of “Spring”');
	});
});
