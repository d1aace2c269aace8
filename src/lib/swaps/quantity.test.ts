import { describe, expect, test } from 'vitest';
import { LISTING_CATEGORIES } from './listing';
import { GROWTH_HABITS } from '../species/kinds';
import { checkQuantity, formatQuantity, PLANT_UNITS, QUANTITY_UNITS, UNITS, unitFitting, unitsFor } from './quantity';

describe('units per category', () => {
	test('which units fit which category', () => {
		// A plant the catalogue does not know: every plant unit, whole plants first.
		expect(unitsFor('plants')).toEqual(['plants', 'stems', 'rhizome-pieces', 'bulbs', 'portions', 'cups', 'pots', 'mat-cm2', 'pieces']);
		expect(unitsFor('livestock')).toEqual(['portions', 'individuals']);
		expect(unitsFor('hardscape')).toEqual(['pieces']);
		expect(unitsFor('equipment')).toEqual(['pieces']);
	});
	test('every category has a unit and every unit a category', () => {
		for (const c of LISTING_CATEGORIES) expect(unitsFor(c).length).toBeGreaterThan(0);
		for (const u of QUANTITY_UNITS) expect(UNITS[u].categories.length).toBeGreaterThan(0);
	});
});

describe('units per way of growing', () => {
	test('each kind of plant is offered its own units, the usual one first', () => {
		expect(unitsFor('plants', 'stem')[0]).toBe('stems');
		expect(unitsFor('plants', 'rhizome')).toEqual(['rhizome-pieces', 'plants', 'pieces', 'pots']);
		expect(unitsFor('plants', 'bulb')[0]).toBe('bulbs');
		expect(unitsFor('plants', 'carpeting')).toEqual(['portions', 'mat-cm2', 'pots']);
		expect(unitsFor('plants', 'moss')[0]).toBe('portions');
		expect(unitsFor('plants', 'floating')).toEqual(['portions', 'cups']);
		expect(unitsFor('plants', 'rosette')[0]).toBe('plants');
		// Stems never fit a plant that does not grow on stems.
		for (const habit of GROWTH_HABITS.filter((h) => h !== 'stem')) expect(unitsFor('plants', habit)).not.toContain('stems');
		// The way of growing says nothing about other categories.
		expect(unitsFor('livestock', 'stem')).toEqual(unitsFor('livestock'));
	});
	test('every way of growing has plant units only, and every plant unit fits some way of growing', () => {
		for (const habit of GROWTH_HABITS) for (const u of PLANT_UNITS[habit]) expect(UNITS[u].categories).toContain('plants');
		const used = new Set(GROWTH_HABITS.flatMap((h) => PLANT_UNITS[h]));
		for (const u of unitsFor('plants')) expect(used.has(u)).toBe(true);
	});
	test('the form keeps a unit that still fits and otherwise moves to the default', () => {
		expect(unitFitting('plants', 'rhizome', 'stems')).toBe('rhizome-pieces');
		expect(unitFitting('plants', 'rhizome', 'plants')).toBe('plants');
		expect(unitFitting('plants', null, 'stems')).toBe('stems');
		expect(unitFitting('hardscape', null, 'stems')).toBe('pieces');
	});
	test('a unit that does not fit the kind of plant is refused, naming those that do', () => {
		expect(checkQuantity('plants', { amount: 3, unit: 'stems' }, 'rhizome')).toBe(
			'"stems" does not fit a rhizome plant; choose rhizome pieces, plants, pieces or pots.'
		);
		expect(checkQuantity('plants', { amount: 3, unit: 'stems' }, 'bulb')).toBe(
			'"stems" does not fit a bulb or tuber plant; choose bulbs or tubers, plants or pots.'
		);
		expect(checkQuantity('plants', { amount: 3, unit: 'cups' }, 'floating')).toBeNull();
		expect(checkQuantity('plants', { amount: 3, unit: 'bulbs' }, null)).toBeNull();
		expect(formatQuantity({ amount: 1, unit: 'bulbs' })).toBe('1 bulb or tuber');
		expect(formatQuantity({ amount: 4, unit: 'rhizome-pieces' })).toBe('4 rhizome pieces');
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
