import { describe, expect, test } from 'vitest';
import { dayOf, hourOf, isTimeZone, today } from './dates';

// Offsets from the IANA time zone database (tzdata), as shipped with Node's ICU:
// Pacific/Auckland is UTC+13 in December (daylight time), America/Los_Angeles UTC−8.
describe('calendar days', () => {
	const instant = new Date('2026-12-03T20:30:00Z');
	test('the same instant is a different day in different zones', () => {
		expect(dayOf(instant)).toBe('2026-12-03');
		expect(dayOf(instant, 'Pacific/Auckland')).toBe('2026-12-04');
		expect(dayOf(new Date('2026-12-03T05:00:00Z'), 'America/Los_Angeles')).toBe('2026-12-02');
	});
	test('today defaults to UTC', () => {
		expect(today('UTC', instant)).toBe('2026-12-03');
	});
	test('the hour of the day follows the zone', () => {
		expect(hourOf(instant)).toBe(20);
		expect(hourOf(instant, 'Pacific/Auckland')).toBe(9);
		expect(hourOf(new Date('2026-12-03T05:00:00Z'), 'America/Los_Angeles')).toBe(21);
		expect(hourOf(new Date('2026-12-03T00:15:00Z'))).toBe(0);
	});
	test('time zone names are checked', () => {
		expect(isTimeZone('Europe/Lisbon')).toBe(true);
		expect(isTimeZone('Mars/Olympus')).toBe(false);
	});
});
