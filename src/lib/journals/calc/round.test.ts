import { describe, expect, test } from 'vitest';
import { decimalsForMagnitude, formatNumber, roundTo } from './round';

describe('roundTo', () => {
	test('rounds half away from zero despite binary representation (1.005 is stored as 1.00499…)', () => {
		expect(roundTo(1.005, 2)).toBe(1.01);
		expect(roundTo(-1.005, 2)).toBe(-1.01);
		expect(roundTo(2.5, 0)).toBe(3);
		expect(roundTo(1234.5, -2)).toBe(1200);
	});
	test('never returns negative zero', () => {
		expect(Object.is(roundTo(-0.0004, 2), 0)).toBe(true);
	});
	test('rejects NaN and infinities', () => {
		expect(() => roundTo(Number.NaN, 1)).toThrow(/finite/);
		expect(() => roundTo(Infinity, 1)).toThrow(/finite/);
		expect(() => roundTo(1, 0.5)).toThrow(/integer/);
	});
});

describe('decimalsForMagnitude and formatNumber', () => {
	test('three significant figures but whole numbers are never cut', () => {
		expect(decimalsForMagnitude(112.4)).toBe(0);
		expect(decimalsForMagnitude(29.58)).toBe(1);
		expect(decimalsForMagnitude(0.0372)).toBe(4);
		expect(formatNumber(1234.4)).toBe('1,234');
		expect(formatNumber(112.4)).toBe('112');
		expect(formatNumber(5.3)).toBe('5.3');
		expect(formatNumber(0.03719)).toBe('0.0372');
		expect(formatNumber(-0.0001, { decimals: 1 })).toBe('0');
		expect(formatNumber(25.04, { decimals: 1 })).toBe('25');
	});
});
