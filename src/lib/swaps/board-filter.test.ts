import { describe, expect, test } from 'vitest';
import { boardQueryString, pageCount, parseBoardQuery, type BoardFilter } from './board-filter';

const parse = (query: string) => parseBoardQuery(new URLSearchParams(query));
const NO_FILTER: BoardFilter = { q: '', category: null, kind: null, speciesId: null, speciesName: '', radius: null, page: 1 };

// Our own query-string format (no source).
describe('board filters in the query string', () => {
	test('an empty query is no filter', () => {
		expect(parse('')).toEqual(NO_FILTER);
		expect(boardQueryString(NO_FILTER)).toBe('');
	});
	test('reads every filter', () => {
		expect(parse('q=rotala&category=plants&kind=offer&species=12&speciesName=Rotala+indica&radius=10&page=3')).toEqual({
			q: 'rotala',
			category: 'plants',
			kind: 'offer',
			speciesId: 12,
			speciesName: 'Rotala indica',
			radius: 10,
			page: 3
		});
	});
	test('only the offered radii; anything else is any distance', () => {
		expect([2, 5, 10, 25, 50].map((r) => parse(`radius=${r}`).radius)).toEqual([2, 5, 10, 25, 50]);
		expect(parse('radius=7').radius).toBeNull();
		expect(parse('radius=any').radius).toBeNull();
		expect(parse('radius=10.0').radius).toBeNull();
	});
	test('malformed values fall back instead of failing', () => {
		expect(parse('category=boats&kind=sale&species=-4&page=0')).toEqual(NO_FILTER);
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
