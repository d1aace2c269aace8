import { describe, expect, test } from 'vitest';
import { checkPickup, describePickup } from './pickup';

const now = new Date('2031-03-10T12:00:00Z');
const ok = { on: '2031-03-14', from: '10:00', to: '11:00', place: 'the library entrance' };

// The limits are our choice (no source); the calendar checks follow the Gregorian calendar
// (2031 is not a leap year, 2032 is).
describe('pickup proposals', () => {
	test('a day, a window and a place', () => {
		expect(checkPickup(ok, now)).toEqual({});
	});
	test('the day must exist, not have passed, and be at most 60 days ahead', () => {
		expect(checkPickup({ ...ok, on: '2031-02-29' }, now).on).toBe('Give the day as YYYY-MM-DD.');
		expect(checkPickup({ ...ok, on: '2032-02-29' }, new Date('2032-02-20T00:00:00Z')).on).toBeUndefined();
		expect(checkPickup({ ...ok, on: '14/03/2031' }, now).on).toBe('Give the day as YYYY-MM-DD.');
		expect(checkPickup({ ...ok, on: '2031-03-09' }, now).on).toBeUndefined();
		expect(checkPickup({ ...ok, on: '2031-03-08' }, now).on).toBe('Choose a day that has not passed.');
		expect(checkPickup({ ...ok, on: '2031-05-09' }, now).on).toBeUndefined();
		expect(checkPickup({ ...ok, on: '2031-05-10' }, now).on).toBe('Choose a day within 60 days.');
	});
	test('the window ends after it starts, in 24-hour times', () => {
		expect(checkPickup({ ...ok, from: '11:00', to: '11:00' }, now).to).toBe('The window ends after it starts.');
		expect(checkPickup({ ...ok, from: '9:00' }, now).from).toBe('Give a time such as 10:30.');
		expect(checkPickup({ ...ok, to: '24:00' }, now).to).toBe('Give a time such as 11:00.');
		expect(checkPickup({ ...ok, from: '23:00', to: '23:59' }, now)).toEqual({});
	});
	test('a meeting point of 3 to 200 characters', () => {
		expect(checkPickup({ ...ok, place: ' x ' }, now).place).toBe('Say where to meet, e.g. the library entrance.');
		expect(checkPickup({ ...ok, place: 'y'.repeat(201) }, now).place).toBe('Keep the meeting point to 200 characters.');
	});
	test('describes the arrangement with the weekday', () => {
		// 14 March 2031 is a Friday.
		expect(describePickup(ok)).toBe('Fri 14 Mar 2031, 10:00–11:00, at the library entrance');
		// The zone that day from the IANA database: New Zealand keeps daylight time (UTC+13) until April.
		expect(describePickup(ok, 'Pacific/Auckland')).toBe('Fri 14 Mar 2031, 10:00–11:00 local time (GMT+13), at the library entrance');
	});
});
