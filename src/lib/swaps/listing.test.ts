import { describe, expect, test } from 'vitest';
import { checkAvailableUntil, DEFAULT_AVAILABLE_DAYS, defaultAvailableUntil, MAX_AVAILABLE_DAYS } from './listing';

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
