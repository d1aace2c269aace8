import { describe, expect, test } from 'vitest';
import { digestDay, isVisitDay, missedVisitDay, periodOver } from './notices';

// Zone offsets from the IANA time zone database as Node ships it: in December Pacific/Auckland is
// UTC+13 and America/Los_Angeles UTC−8. The evening hour (18:00) and digest hour (20:00) are our choices.
const period = { startsOn: '2026-12-01', endsOn: '2026-12-08' };
const accepted = new Date('2026-11-20T10:00:00Z');

describe('a missed visit day', () => {
	test('is a day of the period, not the day the keeper is back', () => {
		expect(isVisitDay(period, '2026-11-30')).toBe(false);
		expect(isVisitDay(period, '2026-12-01')).toBe(true);
		expect(isVisitDay(period, '2026-12-07')).toBe(true);
		expect(isVisitDay(period, '2026-12-08')).toBe(false);
	});
	test('counts from the evening in the sitter’s zone', () => {
		const none = new Set<string>();
		// 17:59 and 18:00 in London (UTC in December).
		expect(missedVisitDay(period, { now: new Date('2026-12-03T17:59:00Z'), zone: 'Europe/London', acceptedAt: accepted, loggedDays: none })).toBeNull();
		expect(missedVisitDay(period, { now: new Date('2026-12-03T18:00:00Z'), zone: 'Europe/London', acceptedAt: accepted, loggedDays: none })).toBe('2026-12-03');
		// 18:00 UTC is 07:00 the next day in Auckland: morning, nothing missed yet.
		expect(missedVisitDay(period, { now: new Date('2026-12-03T18:00:00Z'), zone: 'Pacific/Auckland', acceptedAt: accepted, loggedDays: none })).toBeNull();
		// 03:00 UTC on the 4th is 19:00 on the 3rd in Los Angeles.
		expect(missedVisitDay(period, { now: new Date('2026-12-04T03:00:00Z'), zone: 'America/Los_Angeles', acceptedAt: accepted, loggedDays: none })).toBe(
			'2026-12-03'
		);
	});
	test('is not a day with a visit, nor outside the period', () => {
		const evening = (day: string) => new Date(`${day}T19:00:00Z`);
		expect(missedVisitDay(period, { now: evening('2026-12-03'), zone: 'UTC', acceptedAt: accepted, loggedDays: new Set(['2026-12-03']) })).toBeNull();
		expect(missedVisitDay(period, { now: evening('2026-12-03'), zone: 'UTC', acceptedAt: accepted, loggedDays: new Set(['2026-12-02']) })).toBe('2026-12-03');
		expect(missedVisitDay(period, { now: evening('2026-11-30'), zone: 'UTC', acceptedAt: accepted, loggedDays: new Set() })).toBeNull();
		expect(missedVisitDay(period, { now: evening('2026-12-08'), zone: 'UTC', acceptedAt: accepted, loggedDays: new Set() })).toBeNull();
	});
	test('is not a day the sitter said yes only that evening or later', () => {
		const now = new Date('2026-12-03T21:00:00Z');
		const none = new Set<string>();
		expect(missedVisitDay(period, { now, zone: 'UTC', acceptedAt: new Date('2026-12-03T17:00:00Z'), loggedDays: none })).toBe('2026-12-03');
		expect(missedVisitDay(period, { now, zone: 'UTC', acceptedAt: new Date('2026-12-03T18:30:00Z'), loggedDays: none })).toBeNull();
	});
});

describe('the keeper’s daily digest', () => {
	test('goes from 20:00 in the keeper’s zone, once a day', () => {
		expect(digestDay({ now: new Date('2026-12-03T19:59:00Z'), zone: 'UTC', sentOn: null })).toBeNull();
		expect(digestDay({ now: new Date('2026-12-03T20:00:00Z'), zone: 'UTC', sentOn: null })).toBe('2026-12-03');
		expect(digestDay({ now: new Date('2026-12-03T23:00:00Z'), zone: 'UTC', sentOn: '2026-12-03' })).toBeNull();
		expect(digestDay({ now: new Date('2026-12-04T20:00:00Z'), zone: 'UTC', sentOn: '2026-12-03' })).toBe('2026-12-04');
		// 20:00 UTC is 09:00 next morning in Auckland.
		expect(digestDay({ now: new Date('2026-12-03T20:00:00Z'), zone: 'Pacific/Auckland', sentOn: null })).toBeNull();
	});
});

describe('the end of the period', () => {
	test('comes with the keeper’s own day back', () => {
		expect(periodOver(period, new Date('2026-12-07T23:00:00Z'), 'UTC')).toBe(false);
		expect(periodOver(period, new Date('2026-12-07T23:00:00Z'), 'Pacific/Auckland')).toBe(true);
	});
});
