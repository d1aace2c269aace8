import { describe, expect, test } from 'vitest';
import { volumeBandLabel } from './showcase-filters';

describe('volume bands', () => {
	test('labels in the member’s units: 40 L = 10.6 US gal = 8.80 imp gal (NIST Handbook 44; UK Weights and Measures Act 1985)', () => {
		expect(volumeBandLabel('nano', 'metric')).toBe('Under 40 L');
		expect(volumeBandLabel('small', 'metric')).toBe('40–100 L');
		expect(volumeBandLabel('large', 'metric')).toBe('250 L and more');
		expect(volumeBandLabel('nano', 'us')).toBe('Under 10.6 US gal');
		expect(volumeBandLabel('small', 'imperial')).toBe('8.8–22 imp gal');
	});
});
