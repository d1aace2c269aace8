import { describe, expect, test } from 'vitest';
import { speciesTag } from './kinds';

describe('speciesTag', () => {
	test('a plant by how it grows, or just "Plant"', () => {
		expect(speciesTag({ kind: 'plant', growthHabit: 'stem', temperament: null })).toBe('Stem plant');
		expect(speciesTag({ kind: 'plant', growthHabit: 'moss', temperament: null })).toBe('Moss or liverwort');
		expect(speciesTag({ kind: 'plant', growthHabit: null, temperament: null })).toBe('Plant');
	});
	test('an animal by its kind, with its temperament unless peaceful', () => {
		expect(speciesTag({ kind: 'shrimp', growthHabit: null, temperament: 'peaceful' })).toBe('Shrimp');
		expect(speciesTag({ kind: 'fish', growthHabit: null, temperament: 'predatory' })).toBe('Fish · Eats smaller tankmates');
		expect(speciesTag({ kind: 'invertebrate', growthHabit: null, temperament: null })).toBe('Other invertebrate');
	});
});
