import { describe, expect, test } from 'vitest';
import { CATEGORY_CAUTIONS, checkAvailableUntil, DEFAULT_AVAILABLE_DAYS, defaultAvailableUntil, MAX_AVAILABLE_DAYS } from './listing';

const created = new Date('2031-03-01T09:30:00Z');

describe('defaultAvailableUntil', () => {
	test('plants 7 days (common practice, no source); livestock 14, hardscape and equipment 30 (our choice)', () => {
		expect(DEFAULT_AVAILABLE_DAYS).toEqual({ plants: 7, livestock: 14, hardscape: 30, equipment: 30 });
		expect(defaultAvailableUntil('plants', created).toISOString()).toBe('2031-03-08T09:30:00.000Z');
		expect(defaultAvailableUntil('livestock', created).toISOString()).toBe('2031-03-15T09:30:00.000Z');
		expect(defaultAvailableUntil('equipment', created).toISOString()).toBe('2031-03-31T09:30:00.000Z');
	});
	test('a club can set its own days, within the limit', () => {
		expect(defaultAvailableUntil('plants', created, { plants: 3 }).toISOString()).toBe('2031-03-04T09:30:00.000Z');
		expect(defaultAvailableUntil('hardscape', created, { plants: 3 }).toISOString()).toBe('2031-03-31T09:30:00.000Z');
		expect(() => defaultAvailableUntil('plants', created, { plants: 0 })).toThrow(RangeError);
		expect(() => defaultAvailableUntil('plants', created, { plants: MAX_AVAILABLE_DAYS + 1 })).toThrow(RangeError);
	});
});

describe('checkAvailableUntil', () => {
	test('future dates up to the limit', () => {
		expect(checkAvailableUntil(new Date(created.getTime() + 1), created)).toBeNull();
		expect(checkAvailableUntil(created, created)).toBe('Choose a date in the future.');
		expect(checkAvailableUntil(new Date(created.getTime() + (MAX_AVAILABLE_DAYS * 86_400_000 + 1)), created)).toBe('Choose a date at most 90 days from now.');
	});
});

describe('category cautions', () => {
	// The usual cautions of the hobby (common practice, no source): every plant and livestock
	// listing carries the release warning and the pointer to local rules.
	const text = (c: keyof typeof CATEGORY_CAUTIONS) => CATEGORY_CAUTIONS[c].join(' ');
	test('plants: no release, dry and bin trimmings, rinse or dip, local rules first', () => {
		expect(text('plants')).toMatch(/Never release plants, trimmings or tank water into ponds, rivers or drains/);
		expect(text('plants')).toMatch(/Dry out unwanted trimmings and put them in the bin/);
		expect(text('plants')).toMatch(/Rinse new plants, or dip them/);
		expect(text('plants')).toMatch(/local rules, which take precedence/);
	});
	test('livestock: insulated bags, short journeys, slow acclimatisation, no release, local rules', () => {
		expect(text('livestock')).toMatch(/insulated bags/);
		expect(text('livestock')).toMatch(/keep the journey short/);
		expect(text('livestock')).toMatch(/Settle them in slowly/);
		expect(text('livestock')).toMatch(/Never release animals/);
		expect(text('livestock')).toMatch(/local rules, which take precedence/);
	});
	test('equipment defers to licensed practice for mains power and CO2; every category has cautions', () => {
		expect(text('equipment')).toMatch(/residual-current device/);
		expect(text('equipment')).toMatch(/licensed supplier/);
		for (const c of Object.keys(CATEGORY_CAUTIONS) as (keyof typeof CATEGORY_CAUTIONS)[]) expect(CATEGORY_CAUTIONS[c].length).toBeGreaterThan(0);
	});
});
