import { describe, expect, test } from 'vitest';
import { checkTerms, describeTerms } from './terms';

// Our own vocabulary (no source): these pin what a member must say for each choice.
describe('listing terms', () => {
	test('a swap says what is wanted, a token price gives the price; free needs nothing', () => {
		expect(checkTerms('free', '')).toBeNull();
		expect(checkTerms('swap', '  ')).toBe('Say what you would like in return.');
		expect(checkTerms('swap', 'any moss')).toBeNull();
		expect(checkTerms('token', '')).toBe('Give the price you ask, to be paid in person.');
		expect(checkTerms('token', '2 for the lot')).toBeNull();
	});
	test('refuses unknown terms and long notes', () => {
		expect(checkTerms('auction', '')).toBe('Choose what you ask in return.');
		expect(checkTerms('free', 'x'.repeat(161))).toBe('Keep this to 160 characters.');
	});
	test('describes the terms for the listing', () => {
		expect(describeTerms('free', '')).toBe('Free');
		expect(describeTerms('free', 'bring a bag')).toBe('Free (bring a bag)');
		expect(describeTerms('swap', 'any moss')).toBe('Swap for: any moss');
		expect(describeTerms('token', '2 for the lot')).toBe('Small price, paid in person: 2 for the lot');
	});
});
