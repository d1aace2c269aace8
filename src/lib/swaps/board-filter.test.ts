import { describe, expect, test } from 'vitest';
import { boardQueryString, EMPTY_FILTER, nearbyOrder, pageCount, parseBoardQuery, withinRadius } from './board';
import { shownMetres } from './display';

const parse = (query: string) => parseBoardQuery(new URLSearchParams(query));

// Our own query-string format (no source).
describe('board filters in the query string', () => {
	test('an empty query is no filter', () => {
		expect(parse('')).toEqual(EMPTY_FILTER);
		expect(boardQueryString(EMPTY_FILTER)).toBe('');
	});
	test('reads every filter', () => {
		expect(parse('q=rotala&category=plants&kind=offer&species=12&speciesName=Rotala+indica&radius=10&page=3')).toEqual({
			q: 'rotala',
			category: 'plants',
			kind: 'offer',
			speciesId: 12,
			speciesName: 'Rotala indica',
			radiusKm: 10,
			page: 3
		});
	});
	test('only the offered radii; anything else is any distance', () => {
		expect([2, 5, 10, 25, 50].map((r) => parse(`radius=${r}`).radiusKm)).toEqual([2, 5, 10, 25, 50]);
		expect(parse('radius=7').radiusKm).toBeNull();
		expect(parse('radius=any').radiusKm).toBeNull();
		expect(parse('radius=10.0').radiusKm).toBeNull();
	});
	test('malformed values fall back instead of failing', () => {
		expect(parse('category=boats&kind=sale&species=-4&page=0')).toEqual(EMPTY_FILTER);
		expect(parse('page=abc').page).toBe(1);
		expect(parse('page=501').page).toBe(1);
		expect(parse('species=1e3').speciesId).toBeNull();
		expect(parse('speciesName=Rotala').speciesName).toBe('');
		expect(parse(`q=${'a'.repeat(100)}`).q).toHaveLength(80);
		expect(parse('q=%20%20java%20%20%20moss%20').q).toBe('java moss');
	});
	test('writes what it reads', () => {
		for (const query of ['?q=java+moss', '?category=livestock&radius=25', '?kind=wanted&species=3&speciesName=Java+moss&page=2']) {
			expect(boardQueryString(parse(query.slice(1)))).toBe(query);
		}
	});
	test('page count', () => {
		expect([0, 1, 20, 21, 40, 41].map(pageCount)).toEqual([1, 1, 1, 2, 2, 3]);
	});
});

// The board's rule from a point (our own, no source): filter and order on the shown figure only.
describe('withinRadius and nearbyOrder', () => {
	test('a radius keeps what is shown at that figure or nearer', () => {
		expect(withinRadius(0, 2)).toBe(true);
		expect(withinRadius(2_000, 2)).toBe(true);
		expect(withinRadius(3_000, 2)).toBe(false);
		expect(withinRadius(25_000, 25)).toBe(true);
		expect(withinRadius(30_000, 25)).toBe(false);
		expect(withinRadius(1_000_000, null)).toBe(true);
	});
	test('by shown figure, then newest first, then the higher id', () => {
		const at = (id: number, shown: number, day: number) => ({ id, shown, createdAt: new Date(Date.UTC(2026, 10, day)) });
		const rows = [at(1, 3_000, 1), at(2, 0, 2), at(3, 3_000, 5), at(4, 2_000, 3), at(5, 3_000, 5)];
		expect([...rows].sort(nearbyOrder).map((r) => r.id)).toEqual([2, 4, 5, 3, 1]);
	});
	test('two listings shown alike stay in the same order wherever the viewer stands', () => {
		// Their exact distances swap places as a viewer walks between them; the order does not.
		const older = { id: 10, createdAt: new Date(Date.UTC(2026, 10, 1)) };
		const newer = { id: 11, createdAt: new Date(Date.UTC(2026, 10, 2)) };
		for (const [a, b] of [
			[5_600, 5_950],
			[5_950, 5_600]
		] as const) {
			const rows = [
				{ ...older, shown: shownMetres(a) },
				{ ...newer, shown: shownMetres(b) }
			];
			expect(rows.sort(nearbyOrder).map((r) => r.id)).toEqual([11, 10]);
		}
	});
});
