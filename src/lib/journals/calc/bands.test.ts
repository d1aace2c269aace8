import { describe, expect, test } from 'vitest';
import { TARGET_BANDS, WATER_PARAMETERS, classifyReading } from './bands';

// The bands are common practice, no source; these tests pin the classification rules on them.
describe('TARGET_BANDS', () => {
	test('every parameter has a unit and a band that is not inverted', () => {
		for (const p of WATER_PARAMETERS) {
			const b = TARGET_BANDS[p];
			expect(typeof b.unit).toBe('string');
			expect(b.low).toBeLessThanOrEqual(b.high);
			if (b.dangerLow !== undefined) expect(b.dangerLow).toBeLessThan(b.low);
			if (b.dangerHigh !== undefined) expect(b.dangerHigh).toBeGreaterThan(b.high);
		}
		expect(TARGET_BANDS.KH.unit).toBe('°dKH');
		expect(TARGET_BANDS.pH.unit).toBe('');
	});
});

describe('classifyReading', () => {
	test('low, in band, high, with edges in band', () => {
		expect(classifyReading('NO3', 2)).toBe('low');
		expect(classifyReading('NO3', 5)).toBe('in-band');
		expect(classifyReading('NO3', 25)).toBe('in-band');
		expect(classifyReading('NO3', 40)).toBe('high');
		expect(classifyReading('pH', 6.8)).toBe('in-band');
		expect(classifyReading('GH', 3)).toBe('low');
	});
	test('ammonia and nitrite above small levels are danger; zero is on target', () => {
		expect(classifyReading('ammonia', 0)).toBe('in-band');
		expect(classifyReading('ammonia', 0.1)).toBe('high');
		expect(classifyReading('ammonia', 0.25)).toBe('danger');
		expect(classifyReading('NO2', 0.5)).toBe('danger');
	});
	test('danger on both sides where it exists', () => {
		expect(classifyReading('temperature', 14)).toBe('danger');
		expect(classifyReading('temperature', 33)).toBe('danger');
		expect(classifyReading('temperature', 20)).toBe('low');
		expect(classifyReading('pH', 9.2)).toBe('danger');
		expect(classifyReading('NO3', 100)).toBe('danger');
	});
	test('rejects NaN and negative concentrations, accepts sub-zero temperature readings', () => {
		expect(() => classifyReading('KH', Number.NaN)).toThrow(/finite/);
		expect(() => classifyReading('PO4', -0.1)).toThrow(/negative/);
		expect(classifyReading('temperature', -1)).toBe('danger');
	});
});
