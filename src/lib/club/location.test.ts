import { describe, expect, test } from 'vitest';
import { roundToKilometre } from './location';

describe('roundToKilometre', () => {
	test('keeps two decimals of a degree', () => {
		expect(roundToKilometre({ lat: 55.23456, lng: 3.24987 })).toEqual({ lat: 55.23, lng: 3.25 });
	});
	test('two decimals of latitude are about 1.1 km: 0.01° × 111.2 km/° (mean meridian degree, from memory)', () => {
		const kmPerHundredth = 0.01 * ((Math.PI * 6371.0088) / 180);
		expect(kmPerHundredth).toBeGreaterThan(1.0);
		expect(kmPerHundredth).toBeLessThan(1.2);
	});
	test('wraps longitudes and clamps latitudes', () => {
		expect(roundToKilometre({ lat: 91, lng: 190 })).toEqual({ lat: 90, lng: -170 });
		expect(roundToKilometre({ lat: 0, lng: -180 })).toEqual({ lat: 0, lng: 180 });
	});
});
