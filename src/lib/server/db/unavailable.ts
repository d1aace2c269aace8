// Whether an error means "the database cannot be reached right now" (down, restarting, refusing
// connections) rather than a fault in a query. Such a request is answered with the "back soon"
// page (503, $lib/server/ops/outage), not as an unexpected error.

/** mysql2's codes for a connection that could not be made or was lost, and MariaDB's for a server going away. */
const UNAVAILABLE_CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EPIPE',
	'EHOSTUNREACH',
	'ENETUNREACH',
	'ENOTFOUND',
	'EAI_AGAIN',
	'PROTOCOL_CONNECTION_LOST',
	'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
	'PROTOCOL_SEQUENCE_TIMEOUT',
	'ER_SERVER_SHUTDOWN',
	'ER_CONNECTION_KILLED',
	'ER_CON_COUNT_ERROR',
	'ER_TOO_MANY_USER_CONNECTIONS',
	'ER_SERVER_GONE_ERROR',
	'CR_SERVER_GONE_ERROR',
	'CR_SERVER_LOST',
	'CR_CONNECTION_ERROR',
	'CR_CONN_HOST_ERROR'
]);

/** Looks through the error and its causes (Drizzle wraps the driver's error as `cause`). */
export function isDatabaseUnavailable(error: unknown): boolean {
	let current: unknown = error;
	for (let depth = 0; depth < 5 && current && typeof current === 'object'; depth++) {
		const code = (current as { code?: unknown }).code;
		if (typeof code === 'string' && UNAVAILABLE_CODES.has(code)) return true;
		// mysql2 marks errors after which the connection is unusable as fatal; some carry no code
		// ("Can't add new command when connection is in closed state"). A refused login is not an outage.
		if ((current as { fatal?: unknown }).fatal === true && !(typeof code === 'string' && code.startsWith('ER_ACCESS'))) return true;
		current = (current as { cause?: unknown }).cause;
	}
	return false;
}
