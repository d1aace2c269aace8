// The one logger of the app, the outbox worker, the periodic jobs and the scripts: pino, writing
// JSON lines in production and readable lines in development (see logSettings in ../config).
// Fields every line may carry: reqId, route, method, status, ms, userId; component (outbox, jobs,
// media, …) on the lines of a background part. Addresses are masked with $lib/ops/mask, query
// strings and message bodies are never logged.
import pino, { type Logger } from 'pino';
import pretty from 'pino-pretty';
import { logSettings } from '../config';
import { maskAddresses } from '../../ops/mask';

/** Drizzle's "Failed query: …\nparams: a,b" loses its parameter list. */
const withoutParams = (text: string) => text.replace(/\nparams: .*$/gm, '');

/**
 * Errors as pino's standard serializer writes them, less what must not reach a log: the bound
 * parameters of a failed query (a session token, an address) and addresses in the message.
 */
export function serializeError(error: unknown): Record<string, unknown> {
	const serialized = pino.stdSerializers.err(error as Error) as unknown as Record<string, unknown>;
	delete serialized.params;
	for (const key of ['message', 'stack']) {
		if (typeof serialized[key] === 'string') serialized[key] = maskAddresses(withoutParams(serialized[key] as string));
	}
	return serialized;
}

export type { Logger } from 'pino';

function create(): Logger {
	const settings = logSettings();
	const options: pino.LoggerOptions = {
		level: settings.level,
		timestamp: pino.stdTimeFunctions.isoTime,
		serializers: { err: serializeError },
		// Secrets never belong in a line; these paths catch a careless `log.info({ headers })`.
		redact: { paths: ['headers.cookie', 'headers.authorization', '*.headers.cookie', '*.headers.authorization'], censor: '[hidden]' }
	};
	if (settings.format === 'pretty') {
		return pino(
			options,
			pretty({
				sync: true,
				colorize: Boolean(process.stdout.isTTY) && !process.env.NO_COLOR,
				translateTime: 'SYS:HH:MM:ss',
				ignore: 'pid,hostname',
				singleLine: true
			})
		);
	}
	// Level names rather than numbers, which log shippers and people both read more easily.
	return pino({ ...options, formatters: { level: (label) => ({ level: label }) } });
}

export const log: Logger = create();

/** A logger for one background part, e.g. `component('outbox')`. */
export const component = (name: string): Logger => log.child({ component: name });

/**
 * An error as a short reason for a log line (the stack goes to `err` where it helps): its message
 * and its causes' (a failed query's is the database's own), with no query parameters or addresses.
 */
export function reason(error: unknown): string {
	const parts: string[] = [];
	for (let e: unknown = error, depth = 0; e !== undefined && e !== null && depth < 4; depth++) {
		parts.push(withoutParams(e instanceof Error ? e.message : String(e)));
		e = e instanceof Error ? e.cause : undefined;
	}
	return maskAddresses(parts.join(': '));
}
