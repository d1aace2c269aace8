import { describe, expect, test } from 'vitest';
import { formatPercent, formatPlace, formatPoints, formatZ } from './format';

describe('contest figures as shown', () => {
	test('percentages to two decimals', () => {
		expect(formatPercent(78.666666)).toBe('78.67 %');
		expect(formatPercent(null)).toBe('—');
	});
	test('standardised scores carry a sign and never show "−0.000"', () => {
		expect(formatZ(0.41234)).toBe('+0.412');
		expect(formatZ(-1.03)).toBe('−1.030');
		expect(formatZ(-0.0001)).toBe('0.000');
	});
	test('points and places', () => {
		expect(formatPoints(7.333333)).toBe('7.33');
		expect(formatPoints(7.5)).toBe('7.5');
		expect(formatPlace(2, true)).toBe('2nd (shared)');
		expect(formatPlace(null)).toBe('Not placed');
	});
});
