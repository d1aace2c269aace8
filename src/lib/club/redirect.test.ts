import { describe, expect, test } from 'vitest';
import { safeRedirectPath } from './redirect';

// The cases come from the OWASP "Unvalidated Redirects and Forwards" cheat sheet's list of
// bypass shapes (absolute, protocol-relative, backslash, encoded slashes), applied to our rule.
describe('safeRedirectPath', () => {
	test.each([
		['/tanks/12', '/tanks/12'],
		['/swaps?radius=5#list', '/swaps?radius=5#list'],
		['', '/'],
		[null, '/'],
		['https://evil.example/', '/'],
		['//evil.example/', '/'],
		['/\\evil.example', '/'],
		['\\\\evil.example', '/'],
		['/%2F%2Fevil.example', '/'],
		['javascript:alert(1)', '/'],
		['/signin?redirectTo=/x', '/'],
		['/auth/signout', '/'],
		['/ok\u0000', '/']
	])('%s → %s', (input, expected) => {
		expect(safeRedirectPath(input)).toBe(expected);
	});
});
