import { describe, expect, test } from 'vitest';
import { counted, describeUserAgent, formatDate, formatDateTime, maskEmail, zoneName } from './format';

// Offsets checked against the IANA time zone database as the runtime's ICU carries it: New Zealand
// keeps daylight time (UTC+13) in December, New York standard time (UTC−5); India is UTC+5:30 all year.
describe('times in the viewer’s zone', () => {
	const at = new Date('2026-12-03T13:05:00Z');
	test('a moment in the viewer’s zone, the zone named', () => {
		expect(formatDateTime(at)).toBe('3 Dec 2026, 13:05 UTC');
		expect(formatDateTime(at, 'Pacific/Auckland')).toBe('4 Dec 2026, 02:05 GMT+13');
		expect(formatDateTime(at, 'America/New_York')).toBe('3 Dec 2026, 08:05 GMT-5');
		expect(formatDateTime(new Date('2026-07-03T13:05:00Z'), 'Europe/London')).toBe('3 Jul 2026, 14:05 BST');
		expect(zoneName(at, 'Asia/Kolkata')).toBe('GMT+5:30');
		expect(formatDateTime(null, 'Pacific/Auckland')).toBe('—');
	});
	test('a moment’s day is the viewer’s day; a day stays that day in every zone', () => {
		expect(formatDate(at, 'Pacific/Auckland')).toBe('4 Dec 2026');
		expect(formatDate(at, 'UTC')).toBe('3 Dec 2026');
		expect(formatDate('2026-12-03', 'Pacific/Honolulu')).toBe('3 Dec 2026');
		expect(formatDate('2026-12-03', 'Pacific/Kiritimati')).toBe('3 Dec 2026');
	});
});

describe('counted', () => {
	test('one of a thing, and many', () => {
		expect(counted(1, 'unread message')).toBe('1 unread message');
		expect(counted(0, 'unread message')).toBe('0 unread messages');
		expect(counted(1200, 'stem')).toBe('1,200 stems');
		expect(counted(2, 'person', 'people')).toBe('2 people');
	});
});

describe('maskEmail', () => {
	test('keeps the first and last letter of the local part and the whole domain', () => {
		expect(maskEmail('mara.quillfeather@kettlewater.test')).toBe('m…r@kettlewater.test');
	});
	test('short local parts keep only their first letter', () => {
		expect(maskEmail('jo@reedholme.test')).toBe('j…@reedholme.test');
		expect(maskEmail('@reedholme.test')).toBe('…@reedholme.test');
	});
});

// User-agent strings in the shapes MDN's "User-Agent" header reference describes for Chrome on
// Android, Firefox on Windows and Safari on iOS.
describe('describeUserAgent', () => {
	test.each([
		['Mozilla/5.0 (Linux; Android 10; K) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/120.0.0.0 Mobile Safari/537.36', 'Chrome or Chromium on Android'],
		['Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:121.0) Gecko/20100101 Firefox/121.0', 'Firefox on Windows'],
		[
			'Mozilla/5.0 (iPhone; CPU iPhone OS 17_2 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.2 Mobile/15E148 Safari/604.1',
			'Safari on iOS'
		],
		[null, 'Unknown device']
	])('%s → %s', (ua, expected) => {
		expect(describeUserAgent(ua)).toBe(expected);
	});
});
