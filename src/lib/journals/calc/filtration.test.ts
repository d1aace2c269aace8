import { describe, expect, test } from 'vitest';
import { assessTurnover, turnoverPerHour } from './filtration';

describe('turnoverPerHour', () => {
	test('two filters of 600 and 300 L/h on 120 L turn it over 7.5 times an hour (worked by hand)', () => {
		expect(turnoverPerHour([600, 300], 120)).toBeCloseTo(7.5, 12);
		expect(turnoverPerHour([], 120)).toBe(0);
	});
	test('rejects zero volume and negative flow', () => {
		expect(() => turnoverPerHour([600], 0)).toThrow(/water volume/);
		expect(() => turnoverPerHour([600, -1], 100)).toThrow(/filter 2/);
	});
});

describe('assessTurnover (bands: common practice, no source)', () => {
	test('band edges', () => {
		expect(assessTurnover(2.9).band).toBe('low');
		expect(assessTurnover(3).band).toBe('modest');
		expect(assessTurnover(5).band).toBe('usual');
		expect(assessTurnover(10).band).toBe('usual');
		expect(assessTurnover(10.1).band).toBe('strong');
		expect(assessTurnover(7.5).note).toMatch(/Rated flow/);
		expect(() => assessTurnover(Number.NaN)).toThrow(/finite/);
	});
});
