import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { safeRedirectPath } from './redirect';

const ORIGIN = 'https://club.riparia.test';

/** What every answer must satisfy: "/" or one slash then something else, and it stays on our origin. */
function assertSafe(input: string, result: string) {
	const ok = result === '/' || (result.startsWith('/') && result[1] !== '/' && result[1] !== '\\');
	if (!ok) throw new Error(`${JSON.stringify(input)} → ${JSON.stringify(result)} does not start with exactly one slash`);
	expect(new URL(result, ORIGIN).origin, JSON.stringify(input)).toBe(ORIGIN);
	// And a browser that decodes the path once more still stays here.
	let decoded = result;
	try {
		decoded = decodeURIComponent(result);
	} catch {
		/* not decodable: a browser keeps it as is */
	}
	expect(new URL(decoded, ORIGIN).origin, JSON.stringify(input)).toBe(ORIGIN);
}

// The cases come from the OWASP "Unvalidated Redirects and Forwards" cheat sheet's list of
// bypass shapes (absolute, protocol-relative, backslash, encoded slashes), applied to our rule,
// plus dot segments that only become `//host` once the URL parser normalises them.
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
		['/ok\u0000', '/'],
		['/./evil.example', '/evil.example'],
		['/x/..//evil.example', '/'],
		['/../..//evil.example/', '/'],
		['/.//evil.example', '/'],
		['/%2e%2e//evil.example', '/'],
		['/x/%2e%2e/%2fevil.example', '/'],
		['/\t/evil.example', '/'],
		['/journals/3/../4', '/journals/4']
	])('%s → %s', (input, expected) => {
		expect(safeRedirectPath(input)).toBe(expected);
		assertSafe(String(input), safeRedirectPath(input));
	});

	// A property over generated inputs: pieces that have broken redirect checks before, in any order.
	const piece = fc.constantFrom(
		'/',
		'//',
		'\\',
		'.',
		'..',
		'./',
		'../',
		'%2e',
		'%2E%2E',
		'%2f',
		'%2F',
		'%5c',
		'%5C',
		'%252f',
		'%09',
		'%00',
		'\t',
		'\n',
		'\r',
		'\u0000',
		'\u007f',
		' ',
		'@',
		':',
		'?',
		'#',
		'evil.example',
		'journals',
		'http:',
		'https:',
		'javascript:',
		'\u3002',
		'\uff0f',
		'\u2215',
		'%',
		'%zz'
	);
	const input = fc.oneof(
		fc.array(piece, { maxLength: 8 }).map((parts) => parts.join('')),
		fc.array(piece, { maxLength: 8 }).map((parts) => '/' + parts.join('')),
		fc.string({ maxLength: 24 }),
		fc.string({ maxLength: 24, unit: 'binary' }).map((s) => '/' + s)
	);

	test('for thousands of generated inputs the answer stays on our origin', () => {
		fc.assert(
			fc.property(input, (value) => {
				assertSafe(value, safeRedirectPath(value));
			}),
			{ numRuns: 5000, seed: 20261203 }
		);
	});
});
