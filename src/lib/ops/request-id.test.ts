import { describe, expect, test } from 'vitest';
import { acceptRequestId, newRequestId, statusClass } from './request-id';

describe('acceptRequestId', () => {
	test('takes a proxy’s hex id, a UUID or a base64url token', () => {
		expect(acceptRequestId('4f3c2a1b0e9d8c7b')).toBe('4f3c2a1b0e9d8c7b');
		expect(acceptRequestId('0b5e3d0c-8f1a-4c62-9a57-2f7b8e6c1d40')).toBe('0b5e3d0c-8f1a-4c62-9a57-2f7b8e6c1d40');
		expect(acceptRequestId(' Ab_9-x.yZ12 ')).toBe('Ab_9-x.yZ12');
	});
	test('refuses anything that could forge a log line or hide in one', () => {
		for (const bad of [
			null,
			undefined,
			'',
			'short',
			'a'.repeat(65),
			'abc def ghi jk',
			'abcdefgh\n{"level":"info"}',
			'<script>alert(1)</script>',
			'-leadingdash1',
			'ünïcödé-ïd-1234',
			'id;drop=table1'
		]) {
			expect(acceptRequestId(bad)).toBeNull();
		}
	});
});

describe('newRequestId', () => {
	test('16 hex digits, accepted when sent back, different each time', () => {
		const ids = new Set(Array.from({ length: 200 }, () => newRequestId()));
		expect(ids.size).toBe(200);
		for (const id of ids) {
			expect(id).toMatch(/^[0-9a-f]{16}$/);
			expect(acceptRequestId(id)).toBe(id);
		}
	});
});

test('statusClass', () => {
	expect([200, 204, 303, 404, 429, 500, 503].map(statusClass)).toEqual(['2xx', '2xx', '3xx', '4xx', '4xx', '5xx', '5xx']);
});
