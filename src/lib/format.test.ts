import { describe, expect, test } from 'vitest';
import { describeUserAgent, maskEmail } from './format';

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
