import { describe, expect, test } from 'vitest';
import { YOUNG_TANK_DAYS, dayNumber, isoDay, tankAge } from './age';

describe('dayNumber and isoDay', () => {
	test('1970-01-01 is day 0 and 2000-03-01 is day 11017 (Unix epoch, counted by hand: 30 years, 7 leap days, Jan + Feb 2000)', () => {
		expect(dayNumber('1970-01-01')).toBe(0);
		expect(dayNumber('2000-03-01')).toBe(30 * 365 + 7 + 31 + 29);
		expect(isoDay(11017)).toBe('2000-03-01');
	});
	test('a Date counts by its UTC day', () => {
		expect(dayNumber(new Date('2024-05-10T23:59:59Z'))).toBe(dayNumber('2024-05-10'));
	});
	test('rejects malformed and impossible dates', () => {
		expect(() => dayNumber('2024-02-30')).toThrow(/not a calendar date/);
		expect(() => dayNumber('10/05/2024')).toThrow(/YYYY-MM-DD/);
		expect(() => dayNumber(new Date('nonsense'))).toThrow(/not a valid date/);
	});
	test('2024 is a leap year: 1 Feb to 1 Mar is 29 days (Gregorian calendar)', () => {
		expect(dayNumber('2024-03-01') - dayNumber('2024-02-01')).toBe(29);
		expect(dayNumber('2023-03-01') - dayNumber('2023-02-01')).toBe(28);
		expect(isoDay(dayNumber('2024-02-28') + 1)).toBe('2024-02-29');
	});
});

describe('tankAge', () => {
	const now = new Date('2024-06-15T08:00:00Z');
	test('45 days is 6 weeks 3 days and no longer young (six weeks, common practice, no source)', () => {
		const age = tankAge('2024-05-01', now);
		expect(age).toEqual({ days: 45, weeks: 6, extraDays: 3, young: false, label: '6 weeks 3 days' });
		expect(YOUNG_TANK_DAYS).toBe(42);
	});
	test('young under 42 days; labels', () => {
		expect(tankAge('2024-05-05', now)).toMatchObject({ days: 41, young: true });
		expect(tankAge('2024-06-15', now).label).toBe('0 days');
		expect(tankAge('2024-06-14', now).label).toBe('1 day');
		expect(tankAge('2024-06-01', now).label).toBe('2 weeks');
		expect(tankAge('2024-06-07', now).label).toBe('1 week 1 day');
	});
	test('refuses a set-up date in the future', () => {
		expect(() => tankAge('2024-06-16', now)).toThrow(/future/);
	});
});
