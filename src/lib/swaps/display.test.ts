import { describe, expect, test } from 'vitest';
import { roundToKilometre } from '$lib/club/location';
import { haversineDistance } from './distance';
import Qty from 'js-quantities';
import { RADIUS_CHOICES } from './board-filter';
import { bandsInMetres, DISTANCE_BANDS, labelOf, radiusReachMetres, shownFigure, type DistanceUnit } from './display';

// The rounding steps are our choice (no source); these tests pin them and check that what is shown
// never claims more precision than the stored, rounded points carry.

/** The label for an exact distance: its shown figure, in words. */
const formatDistance = (metres: number, unit: DistanceUnit = 'km') => labelOf(shownFigure(metres, unit), unit);
/** Below this, the rounding of the stored points is as large as the distance itself. */
const NEARBY_LIMIT_M = DISTANCE_BANDS[0]!.below * 1000;
/** A mile in metres, from js-quantities (1,609.344 m, NIST Handbook 44, Appendix C). */
const MILE = Qty('1 mi').to('m').scalar;

/** The step a shown figure was rounded to at most (its own band's step), in metres. */
const stepOf = (metres: number, unit: DistanceUnit = 'km') => bandsInMetres(unit).find((b) => metres < b.belowMetres)!.stepMetres;

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
		expect(formatDistance(0)).toEqual({ text: 'under 2 km', figure: null, unit: 'km' });
		expect(formatDistance(NEARBY_LIMIT_M - 1).text).toBe('under 2 km');
		expect(formatDistance(NEARBY_LIMIT_M).text).toBe('about 2 km');
	});
	test('whole kilometres up to 10 km', () => {
		expect(formatDistance(3_600)).toEqual({ text: 'about 4 km', figure: 4, unit: 'km' });
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
			const shown = shownFigure(m, 'km');
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
		expect(samples.filter((metres) => formatDistance(metres).figure !== earlier(metres))).toEqual([]);
	});
	test('the words for a figure', () => {
		expect(labelOf(0, 'km')).toEqual({ text: 'under 2 km', figure: null, unit: 'km' });
		expect(labelOf(7, 'km')).toEqual({ text: 'about 7 km', figure: 7, unit: 'km' });
		expect(labelOf(1200, 'mi')).toEqual({ text: 'about 1,200 mi', figure: 1200, unit: 'mi' });
		expect(() => labelOf(-1, 'km')).toThrow(RangeError);
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
			if (shown.figure === null) {
				expect(exact).toBeLessThan(NEARBY_LIMIT_M + 1_600);
			} else {
				// Rounding of the points (≤ 1.6 km) plus half a display step (0.5 km here).
				expect(Math.abs(shown.figure * 1000 - exact)).toBeLessThanOrEqual(1_600 + stepOf(shown.figure * 1000) / 2 + 1);
			}
		}
	});
});

describe('in miles, for US and imperial members', () => {
	test('the same bands in miles: under 2 mi below 1.5 mi, whole miles to 9, then steps of 5, 10, 50 and 100 miles', () => {
		expect(formatDistance(0, 'mi')).toEqual({ text: 'under 2 mi', figure: null, unit: 'mi' });
		expect(formatDistance(1.5 * MILE - 1, 'mi').text).toBe('under 2 mi');
		expect(formatDistance(1.5 * MILE, 'mi').text).toBe('about 2 mi');
		// 10 km = 6.21 mi; 40 km = 24.9 mi; 160 km = 99.4 mi (js-quantities).
		expect(formatDistance(Qty('10 km').to('m').scalar, 'mi').text).toBe('about 6 mi');
		expect(Qty('40 km').to('mi').scalar).toBeCloseTo(24.85, 2);
		expect(formatDistance(40_000, 'mi').text).toBe('about 25 mi');
		expect(formatDistance(160_000, 'mi').text).toBe('about 100 mi');
		expect(formatDistance(2_000_000, 'mi').text).toBe('about 1,200 mi'); // 1,242.7 mi
	});
	test('figures never go down as distances grow, and never claim more than the stored points allow', () => {
		let previous = 0;
		const drops: number[] = [];
		for (let m = 0; m < 2_000_000; m += 41) {
			const shown = shownFigure(m, 'mi');
			if (shown < previous) drops.push(m);
			previous = shown;
		}
		expect(drops).toEqual([]);
		// The nearest figure ("under 2 mi", up to 2.4 km) is coarser than the 1.6 km the stored points may be off by.
		expect(bandsInMetres('mi')[0]!.belowMetres).toBeGreaterThan(1_600);
		for (const m of [2_500, 5_000, 15_000, 44_000, 300_000]) {
			const shown = formatDistance(m, 'mi').figure!;
			expect(Math.abs(shown * MILE - m)).toBeLessThanOrEqual(stepOf(m, 'mi') / 2 + 1e-6);
		}
	});
});

describe('radiusReachMetres: how far the pre-filter looks for a radius', () => {
	test("the upper edge of the radius's own figure", () => {
		expect(RADIUS_CHOICES.map((r) => radiusReachMetres(r, 'km'))).toEqual([2_500, 5_500, 12_500, 27_500, 55_000]);
		// 2.5, 5.5, 12.5, 27.5 and 55 miles.
		const miles = RADIUS_CHOICES.map((r) => radiusReachMetres(r, 'mi'));
		[2.5, 5.5, 12.5, 27.5, 55].forEach((m, i) => expect(miles[i]).toBeCloseTo(m * MILE, 6));
		expect(() => radiusReachMetres(1, 'km')).toThrow(RangeError);
		expect(() => radiusReachMetres(12, 'km')).toThrow(RangeError);
		expect(() => radiusReachMetres(12, 'mi')).toThrow(RangeError);
	});
	test.each<DistanceUnit>(['km', 'mi'])(
		'every distance below it is shown within the radius, every distance from it on beyond: at the edges too (%s)',
		(unit) => {
			const next = random(11);
			const size = unit === 'km' ? 1000 : MILE;
			for (const radius of RADIUS_CHOICES) {
				const reach = radiusReachMetres(radius, unit);
				const samples = [...around(reach), ...around(radius * size), ...Array.from({ length: 5_000 }, () => next() * 2 * reach)];
				expect(samples.filter((metres) => shownFigure(metres, unit) <= radius !== metres < reach)).toEqual([]);
			}
		}
	);
});
