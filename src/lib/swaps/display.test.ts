import { describe, expect, test } from 'vitest';
import { roundToKilometre } from '$lib/club/location';
import { haversineDistance } from './distance';
import { RADIUS_CHOICES_KM } from './board-filter';
import { DISTANCE_BANDS, labelOf, radiusReachMetres, shownMetres } from './display';

// The rounding steps are our choice (no source); these tests pin them and check that what is shown
// never claims more precision than the stored, rounded points carry.

/** The label for an exact distance: its shown figure, in words. */
const formatDistance = (metres: number) => labelOf(shownMetres(metres));
/** Below this, the rounding of the stored points is as large as the distance itself. */
const NEARBY_LIMIT_M = DISTANCE_BANDS[0]!.below;

/** The step a shown figure was rounded to at most (its own band's step). */
const stepOf = (metres: number) => DISTANCE_BANDS.find((b) => metres < b.below)!.step;

/** Park–Miller generator: the same "random" distances on every run. */
function random(seed: number) {
	let s = seed;
	return () => (s = (s * 48271) % 2147483647) / 2147483647;
}

/** The neighbouring doubles of a figure, and a few metres either side: where rounding could slip. */
const around = (metres: number) => {
	const buffer = new Float64Array([metres]);
	const bits = new BigInt64Array(buffer.buffer);
	const next = (delta: bigint) => {
		const copy = new BigInt64Array([bits[0]! + delta]);
		return new Float64Array(copy.buffer)[0]!;
	};
	return [metres - 1, metres - 1e-6, next(-1n), metres, next(1n), metres + 1e-6, metres + 1];
};

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
		expect(formatDistance(20_015_000).text).toBe('about 20,000 km');
	});
	test('where the step changes, the figure does not jump back', () => {
		expect([9_499, 9_500, 12_499, 12_500].map((m) => formatDistance(m).text)).toEqual(['about 9 km', 'about 10 km', 'about 10 km', 'about 15 km']);
		expect([27_499, 27_500, 34_999, 35_000].map((m) => formatDistance(m).text)).toEqual(['about 25 km', 'about 30 km', 'about 30 km', 'about 40 km']);
		expect([94_999, 95_000, 124_999, 125_000].map((m) => formatDistance(m).text)).toEqual(['about 90 km', 'about 100 km', 'about 100 km', 'about 150 km']);
		expect([974_999, 975_000, 1_049_999, 1_050_000].map((m) => formatDistance(m).text)).toEqual([
			'about 950 km',
			'about 1,000 km',
			'about 1,000 km',
			'about 1,100 km'
		]);
		let previous = 0;
		const drops: number[] = [];
		for (let m = 0; m < 1_200_000; m += 37) {
			const shown = shownMetres(m);
			if (shown < previous) drops.push(m);
			previous = shown;
		}
		expect(drops).toEqual([]);
	});
	test('the same figures as rounding the kilometres to 1, 5, 10, 50 or 100 km by their size (the rule members have always been shown)', () => {
		const earlier = (metres: number) => {
			if (metres < NEARBY_LIMIT_M) return null;
			const km = metres / 1000;
			const step = km < 10 ? 1 : km < 30 ? 5 : km < 100 ? 10 : km < 1000 ? 50 : 100;
			return Math.round(km / step) * step;
		};
		const next = random(7);
		const samples = Array.from({ length: 20_000 }, () => next() ** 3 * 3_000_000);
		expect(samples.filter((metres) => formatDistance(metres).km !== earlier(metres))).toEqual([]);
	});
	test('the words for a figure', () => {
		expect(labelOf(0)).toEqual({ text: 'under 2 km', km: null });
		expect(labelOf(7_000)).toEqual({ text: 'about 7 km', km: 7 });
		expect(() => labelOf(-1)).toThrow(RangeError);
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
				expect(Math.abs(shown.km * 1000 - exact)).toBeLessThanOrEqual(1_600 + stepOf(shown.km * 1000) / 2 + 1);
			}
		}
	});
});

describe('radiusReachMetres: how far the pre-filter looks for a radius', () => {
	test("the upper edge of the radius's own figure", () => {
		expect(RADIUS_CHOICES_KM.map(radiusReachMetres)).toEqual([2_500, 5_500, 12_500, 27_500, 55_000]);
		expect(() => radiusReachMetres(1)).toThrow(RangeError);
		expect(() => radiusReachMetres(12)).toThrow(RangeError);
	});
	test('every distance below it is shown within the radius, every distance from it on beyond: at the edges too', () => {
		const next = random(11);
		for (const radiusKm of RADIUS_CHOICES_KM) {
			const reach = radiusReachMetres(radiusKm);
			const samples = [...around(reach), ...around(radiusKm * 1000), ...Array.from({ length: 5_000 }, () => next() * 2 * reach)];
			expect(samples.filter((metres) => shownMetres(metres) <= radiusKm * 1000 !== metres < reach)).toEqual([]);
		}
	});
});
