import { describe, expect, test } from 'vitest';
import { reason, serializeError } from './log';

/** Shaped like drizzle-orm's DrizzleQueryError: the SQL and its parameters in the message, the driver's error as cause. */
function failedQuery() {
	const error = new Error('Failed query: select * from `session` where `session_token` = ?\nparams: 9b2f-secret-token,mara@kettlewater.test', {
		cause: new Error('connect ECONNREFUSED 127.0.0.1:3307')
	}) as Error & { query: string; params: unknown[] };
	error.query = 'select * from `session` where `session_token` = ?';
	error.params = ['9b2f-secret-token', 'mara@kettlewater.test'];
	return error;
}

describe('what an error leaves in the log', () => {
	test('reason: the message and its cause, without query parameters', () => {
		const text = reason(failedQuery());
		expect(text).toBe('Failed query: select * from `session` where `session_token` = ?: connect ECONNREFUSED 127.0.0.1:3307');
		expect(reason('plain words')).toBe('plain words');
	});
	test('serializeError keeps type, message and stack but drops params and masks addresses', () => {
		const serialized = serializeError(failedQuery());
		expect(serialized.type).toBe('Error');
		expect(serialized.query).toBe('select * from `session` where `session_token` = ?');
		expect(serialized).not.toHaveProperty('params');
		expect(JSON.stringify(serialized)).not.toContain('9b2f-secret-token');
		expect(serializeError(new Error('550 no such user oriel@fen.test')).message).toBe('550 no such user o***@fen.test');
	});
});
