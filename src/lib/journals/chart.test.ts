import { describe, expect, test } from 'vitest';
import { chartGeometry, valueDomain, type ChartBox, type ChartPoint } from './chart';

const box: ChartBox = { width: 500, height: 240, margin: { top: 20, right: 0, bottom: 20, left: 100 } };
// Plot area: x 100…500 (400 px), y 20…220 (200 px), worked out by hand from the box.
const point = (id: number, on: string, value: number): ChartPoint => ({ id, on, value, status: 'in-band' });

describe('valueDomain', () => {
	test('covers every reading and the band, padded and rounded outwards to round numbers', () => {
		const [min, max] = valueDomain({ points: [point(1, '2026-03-01', 12), point(2, '2026-03-08', 31)], band: { low: 5, high: 25 }, danger: {} }, true);
		expect(min).toBeLessThanOrEqual(5);
		expect(max).toBeGreaterThanOrEqual(31);
		// 5…31 padded by 8 % of 26 (2.08) is 2.92…33.08; d3's nice() rounds to steps of 5: 0…35.
		expect([min, max]).toEqual([0, 35]);
	});
	test('a danger level far above the readings is left out; a near one is included', () => {
		const points = [point(1, '2026-03-01', 0), point(2, '2026-03-08', 0.02)];
		const far = valueDomain({ points, band: { low: 0, high: 0.05 }, danger: { high: 5 } }, true);
		expect(far[1]).toBeLessThan(1);
		const near = valueDomain({ points, band: { low: 0, high: 0.05 }, danger: { high: 0.06 } }, true);
		expect(near[1]).toBeGreaterThanOrEqual(0.06);
	});
	test('pH is not floored at zero; no readings give 0…1', () => {
		const [min] = valueDomain({ points: [point(1, '2026-03-01', 6.8), point(2, '2026-03-02', 7.1)], band: null, danger: {} }, false);
		expect(min).toBeGreaterThan(6);
		expect(valueDomain({ points: [], band: null, danger: {} }, true)).toEqual([0, 1]);
	});
});

describe('chartGeometry', () => {
	const points = [point(1, '2026-03-01', 10), point(2, '2026-03-11', 20), point(3, '2026-03-06', 0)];
	const g = chartGeometry({ points, band: { low: 5, high: 15 }, danger: {} }, { box });

	test('x runs from the first to the last day across the plot; points are sorted by day', () => {
		expect(g.points.map((p) => p.id)).toEqual([1, 3, 2]);
		expect(g.points[0]!.x).toBeCloseTo(100);
		expect(g.points[1]!.x).toBeCloseTo(300); // 5 of 10 days → half of 400 px
		expect(g.points[2]!.x).toBeCloseTo(500);
	});
	test('y maps the domain onto the plot upside down (SVG y grows downwards)', () => {
		const [lo, hi] = g.domain;
		const yOf = (v: number) => 220 - ((v - lo) / (hi - lo)) * 200;
		for (const p of g.points) expect(p.y).toBeCloseTo(yOf(p.value));
		expect(g.band!.y).toBeCloseTo(yOf(15));
		expect(g.band!.height).toBeCloseTo(yOf(5) - yOf(15));
	});
	test('the line goes through the points in day order', () => {
		const [first, second, third] = g.points;
		expect(g.path).toBe(`M${first!.x},${first!.y}L${second!.x},${second!.y}L${third!.x},${third!.y}`);
	});
	test('y ticks are round values inside the domain, x ticks are days inside the range', () => {
		expect(g.yTicks.length).toBeGreaterThanOrEqual(3);
		for (const t of g.yTicks) {
			expect(t.value).toBeGreaterThanOrEqual(g.domain[0]);
			expect(t.value).toBeLessThanOrEqual(g.domain[1]);
			expect(Number.isInteger(t.value / 5)).toBe(true);
		}
		for (const t of g.xTicks) {
			expect(t.on >= '2026-03-01' && t.on <= '2026-03-11').toBe(true);
			expect(t.x).toBeGreaterThanOrEqual(100);
			expect(t.x).toBeLessThanOrEqual(500);
		}
	});
	test('one reading sits in the middle of a week of axis', () => {
		const one = chartGeometry({ points: [point(1, '2026-03-01', 7)], band: null, danger: {} }, { box, floorAtZero: false });
		expect(one.points[0]!.x).toBeCloseTo(100 + (3 / 7) * 400);
		expect(one.path).toMatch(/^M/);
	});
	test('a danger line is drawn only inside the domain', () => {
		const d = chartGeometry(
			{ points: [point(1, '2026-03-01', 0.1), point(2, '2026-03-05', 0.3)], band: { low: 0, high: 0.05 }, danger: { high: 0.25 } },
			{ box }
		);
		expect(d.dangerLines.map((l) => l.value)).toEqual([0.25]);
		const none = chartGeometry({ points: [point(1, '2026-03-01', 0.01)], band: { low: 0, high: 0.05 }, danger: { high: 5 } }, { box });
		expect(none.dangerLines).toEqual([]);
	});
});

describe('a danger level per reading (ammonia: it follows each test’s pH and temperature)', () => {
	const box2: ChartBox = { width: 500, height: 240, margin: { top: 20, right: 0, bottom: 20, left: 100 } };
	const points: ChartPoint[] = [
		{ ...point(1, '2026-03-01', 0.5), dangerAt: 0.7 },
		{ ...point(2, '2026-03-11', 0.5), dangerAt: 0.6 },
		{ ...point(3, '2026-03-21', 0.4), dangerAt: null }
	];
	const g = chartGeometry({ points, band: { low: 0, high: 0.05 }, danger: {} }, { box: box2 });
	test('a stepped line through the readings that carry one, the newest of them labelled', () => {
		expect(g.domain[1]).toBeGreaterThanOrEqual(0.7);
		// Two levels, x 100 and 300: steps at the midpoint, x 200.
		expect(g.dangerPath.startsWith('M100,')).toBe(true);
		expect(g.dangerPath).toMatch(/^M100,([\d.]+)L200,\1L200,([\d.]+)L300,\2$/);
		expect(g.dangerLabel?.value).toBe(0.6);
		expect(g.dangerLines).toEqual([]);
	});
	test('no levels, no line', () => {
		expect(chartGeometry({ points: [point(1, '2026-03-01', 1)], band: null, danger: {} }, { box: box2 }).dangerPath).toBe('');
	});
});
