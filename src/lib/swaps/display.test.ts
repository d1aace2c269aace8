import { describe, expect, test } from 'vitest';
import { roundToKilometre } from '$lib/club/location';
import { haversineDistance } from './distance';
import { formatDistance, NEARBY_LIMIT_M, roundingStepKm } from './display';

// The rounding steps are our choice (no source); these tests pin them and check that what is shown
// never claims more precision than the stored, rounded points carry.

describe('formatDistance', () => {
	test('close by', () => {
		expect(formatDistance(0)).toEqual({ text: 'under 2 km', km: null });
		expect(formatDistance(NEARBY_LIMIT_M - 1).text).toBe('under 2 km');
		expect(formatDistance(NEARBY_LIMIT_M).text).toBe('about 2 km');
	});
	test('whole kilometres up to 10 km', () => {
		expect(formatDistance(3_600)).toEqual({ text: 'about 4 km', km: 4 });
		expect(formatDistance(4_499).text).toBe('about 4 km');
		expect(formatDistance(9_499).text).toBe('about 9 km');
		expect(formatDistance(9_500).text).toBe('about 10 km');
	});
	test('5 km steps to 30 km, 10 km to 100 km, 50 km to 1,000 km, then 100 km', () => {
		expect(formatDistance(23_800).text).toBe('about 25 km');
		expect(formatDistance(12_400).text).toBe('about 10 km');
		expect(formatDistance(47_000).text).toBe('about 50 km');
		expect(formatDistance(99_000).text).toBe('about 100 km');
		expect(formatDistance(420_000).text).toBe('about 400 km');
		expect(formatDistance(1_234_000).text).toBe('about 1,200 km');
		expect([9.9, 10, 29.9, 30, 99, 100, 999, 1000].map(roundingStepKm)).toEqual([1, 5, 5, 10, 10, 50, 50, 100]);
	});
	test('refuses negative and non-numbers', () => {
		expect(() => formatDistance(-1)).toThrow(RangeError);
		expect(() => formatDistance(Number.NaN)).toThrow(RangeError);
	});
	test('the stored points are rounded to 0.01°: two places in the same cell show as "under 2 km", and the label is never off by more than the rounding allows', () => {
		let s = 99;
		const next = () => (s = (s * 48271) % 2147483647) / 2147483647;
		for (let i = 0; i < 2000; i++) {
			const a = { lat: -60 + next() * 120, lng: -180 + next() * 360 };
			const b = { lat: a.lat + (next() - 0.5) * 0.5, lng: a.lng + (next() - 0.5) * 0.5 };
			const exact = haversineDistance(a, b);
			const shown = formatDistance(haversineDistance(roundToKilometre(a), roundToKilometre(b)));
			if (shown.km === null) {
				expect(exact).toBeLessThan(NEARBY_LIMIT_M + 1_600);
			} else {
				// Rounding of the points (≤ 1.6 km) plus half a display step (0.5 km here).
				expect(Math.abs(shown.km * 1000 - exact)).toBeLessThanOrEqual(1_600 + (roundingStepKm(shown.km) * 1000) / 2 + 1);
			}
		}
	});
});
