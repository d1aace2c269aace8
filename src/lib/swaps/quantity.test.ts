import { describe, expect, test } from 'vitest';
import { LISTING_CATEGORIES } from './listing';
import { checkQuantity, formatQuantity, QUANTITY_UNITS, UNITS, unitsFor } from './quantity';

describe('units per category', () => {
	test('which units fit which category', () => {
		expect(unitsFor('plants')).toEqual(['stems', 'portions', 'pots', 'mat-cm2', 'pieces']);
		expect(unitsFor('livestock')).toEqual(['portions', 'individuals']);
		expect(unitsFor('hardscape')).toEqual(['pieces']);
		expect(unitsFor('equipment')).toEqual(['pieces']);
	});
	test('every category has a unit and every unit a category', () => {
		for (const c of LISTING_CATEGORIES) expect(unitsFor(c).length).toBeGreaterThan(0);
		for (const u of QUANTITY_UNITS) expect(UNITS[u].categories.length).toBeGreaterThan(0);
	});
});

describe('checkQuantity', () => {
	test('accepts whole amounts in a fitting unit', () => {
		expect(checkQuantity('plants', { amount: 12, unit: 'stems' })).toBeNull();
		expect(checkQuantity('plants', { amount: 400, unit: 'mat-cm2' })).toBeNull();
		expect(checkQuantity('livestock', { amount: 10, unit: 'individuals' })).toBeNull();
		expect(checkQuantity('equipment', { amount: 1, unit: 'pieces' })).toBeNull();
	});
	test('refuses a unit that does not fit, naming the ones that do', () => {
		expect(checkQuantity('livestock', { amount: 5, unit: 'stems' })).toBe('"stems" does not fit livestock; choose portions or animals.');
		expect(checkQuantity('hardscape', { amount: 1, unit: 'pots' })).toBe('"pots" does not fit hardscape; choose pieces.');
		expect(checkQuantity('plants', { amount: 1, unit: 'litres' })).toBe('Choose a unit.');
	});
	test('refuses fractions, zero, negatives and amounts above the unit’s limit', () => {
		expect(checkQuantity('plants', { amount: 2.5, unit: 'stems' })).toBe('Enter a whole number.');
		expect(checkQuantity('plants', { amount: 0, unit: 'stems' })).toBe('Enter at least 1.');
		expect(checkQuantity('plants', { amount: -3, unit: 'pots' })).toBe('Enter at least 1.');
		expect(checkQuantity('plants', { amount: Number.NaN, unit: 'pots' })).toBe('Enter a whole number.');
		expect(checkQuantity('plants', { amount: 501, unit: 'stems' })).toBe('Enter at most 500 stems in one listing.');
		expect(checkQuantity('plants', { amount: 10_001, unit: 'mat-cm2' })).toBe('Enter at most 10,000 cm² of mat in one listing.');
		expect(checkQuantity('plants', { amount: 10_000, unit: 'mat-cm2' })).toBeNull();
	});
});

describe('formatQuantity', () => {
	test('singular, plural and grouping', () => {
		expect(formatQuantity({ amount: 1, unit: 'stems' })).toBe('1 stem');
		expect(formatQuantity({ amount: 12, unit: 'stems' })).toBe('12 stems');
		expect(formatQuantity({ amount: 1, unit: 'individuals' })).toBe('1 animal');
		expect(formatQuantity({ amount: 1200, unit: 'mat-cm2' })).toBe('1,200 cm² of mat');
	});
});
