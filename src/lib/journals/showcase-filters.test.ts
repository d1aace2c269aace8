import { describe, expect, test } from 'vitest';
import { bandOf, volumeBandLabel } from './showcase-filters';

describe('volume bands', () => {
	test('edges: the lower one is inside the band, the upper one in the next', () => {
		expect(bandOf(12)).toBe('nano');
		expect(bandOf(40)).toBe('small');
		expect(bandOf(99.9)).toBe('small');
		expect(bandOf(100)).toBe('medium');
		expect(bandOf(250)).toBe('large');
	});
	test('labels in the member’s units: 40 L = 10.6 US gal = 8.80 imp gal (NIST Handbook 44; UK Weights and Measures Act 1985)', () => {
		expect(volumeBandLabel('nano', 'metric')).toBe('Under 40 L');
		expect(volumeBandLabel('small', 'metric')).toBe('40–100 L');
		expect(volumeBandLabel('large', 'metric')).toBe('250 L and more');
		expect(volumeBandLabel('nano', 'us')).toBe('Under 10.6 US gal');
		expect(volumeBandLabel('small', 'imperial')).toBe('8.8–22 imp gal');
	});
});
