import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { mean, median, populationStandardDeviation, sampleStandardDeviation } from './stats';

function randomSamples(count: number, seed: number): number[][] {
	let s = seed;
	const next = () => (s = (s * 48271) % 2147483647) / 2147483647;
	return Array.from({ length: count }, () => Array.from({ length: 1 + Math.floor(next() * 12) }, () => Math.round(next() * 200) / 2));
}

describe('descriptive statistics', () => {
	test('textbook example 2, 4, 4, 4, 5, 5, 7, 9: mean 5, population SD 2, sample SD √(32/7) (standard-deviation article of a general encyclopaedia, from memory)', () => {
		const data = [2, 4, 4, 4, 5, 5, 7, 9];
		expect(mean(data)).toBe(5);
		expect(populationStandardDeviation(data)).toBe(2);
		expect(sampleStandardDeviation(data)).toBeCloseTo(Math.sqrt(32 / 7), 12);
		expect(median(data)).toBe(4.5);
	});
	test('agree with simple-statistics (mean, median, standardDeviation, sampleStandardDeviation) on random data', () => {
		for (const values of randomSamples(300, 11)) {
			expect(mean(values)).toBeCloseTo(ss.mean(values), 9);
			expect(median(values)).toBeCloseTo(ss.median(values), 9);
			expect(populationStandardDeviation(values)).toBeCloseTo(ss.standardDeviation(values), 9);
			if (values.length >= 2) expect(sampleStandardDeviation(values)).toBeCloseTo(ss.sampleStandardDeviation(values), 9);
		}
	});
	test('refuse empty input, and a sample SD of one value', () => {
		expect(() => mean([])).toThrow(RangeError);
		expect(() => median([])).toThrow(RangeError);
		expect(() => sampleStandardDeviation([3])).toThrow(RangeError);
	});
});
