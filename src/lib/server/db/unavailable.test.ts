import { describe, expect, test } from 'vitest';
import mysql from 'mysql2/promise';
import net from 'node:net';
import { isDatabaseUnavailable } from './unavailable';

/** A port on loopback that nothing listens on (the OS hands one out, and it is closed again). */
const closedPort = () =>
	new Promise<number>((resolve) => {
		const server = net.createServer().listen(0, '127.0.0.1', () => {
			const { port } = server.address() as net.AddressInfo;
			server.close(() => resolve(port));
		});
	});

describe('isDatabaseUnavailable', () => {
	test("mysql2's own error for a server that is not there", async () => {
		const port = await closedPort();
		const error = await mysql.createConnection({ host: '127.0.0.1', port, user: 'nobody', connectTimeout: 2000 }).catch((e: unknown) => e);
		expect(isDatabaseUnavailable(error)).toBe(true);
		// Drizzle wraps it as the cause of its own query error.
		expect(isDatabaseUnavailable(new Error('Failed query: select 1', { cause: error }))).toBe(true);
	});

	test('a lost connection, a server shutting down and too many connections', () => {
		// mysql2's error for a query (or the ROLLBACK after a failed one) on a connection that died: fatal, no code.
		const closed = Object.assign(new Error("Can't add new command when connection is in closed state"), { fatal: true });
		expect(isDatabaseUnavailable(new Error('Failed query: rollback', { cause: closed }))).toBe(true);
		for (const code of ['PROTOCOL_CONNECTION_LOST', 'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR', 'ECONNRESET']) {
			expect(isDatabaseUnavailable(Object.assign(new Error(code), { code })), code).toBe(true);
		}
	});

	test('faults of a query or of the data are not an outage', () => {
		for (const error of [
			Object.assign(new Error('dup'), { code: 'ER_DUP_ENTRY', errno: 1062 }),
			Object.assign(new Error('syntax'), { code: 'ER_PARSE_ERROR' }),
			Object.assign(new Error('denied'), { code: 'ER_ACCESS_DENIED_ERROR', fatal: true }),
			new Error('Failed query', { cause: Object.assign(new Error('deadlock'), { code: 'ER_LOCK_DEADLOCK' }) }),
			new TypeError('x is undefined'),
			null,
			'ECONNREFUSED'
		]) {
			expect(isDatabaseUnavailable(error)).toBe(false);
		}
	});
});
