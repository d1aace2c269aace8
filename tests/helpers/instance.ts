// A second app instance, started from a build (this checkout's or a clean clone's) with its own
// database and port, for tests that must break or inspect one instance without touching the
// stack `npm test` started. Its output goes to a log file under .data/test/.
import { spawn } from 'node:child_process';
import { closeSync, openSync } from 'node:fs';
import { join } from 'node:path';
import { waitForPort } from '../../scripts/lib/system';
import { freePort } from './ports';

export const checkoutRoot = join(import.meta.dirname, '..', '..');

export interface AppInstance {
	url: string;
	port: number;
	logFile: string;
	stop(): Promise<void>;
}

/**
 * Starts `node build` in `root` with the test stack's settings (mail and storage fakes, secret),
 * the given database and overrides. The metrics listener stays off: the stack's app holds its port.
 */
export async function startInstance(options: {
	root?: string;
	databaseUrl: string;
	logName: string;
	env?: NodeJS.ProcessEnv;
	/** The environment to start from (default: this process's, which carries the stack's settings). */
	baseEnv?: NodeJS.ProcessEnv;
}): Promise<AppInstance> {
	const port = await freePort();
	const url = `http://localhost:${port}`;
	const logFile = join(checkoutRoot, '.data', 'test', `${options.logName}.log`);
	const log = openSync(logFile, 'w');
	const child = spawn(process.execPath, ['build'], {
		cwd: options.root ?? checkoutRoot,
		env: {
			...(options.baseEnv ?? process.env),
			// As the stack runs its app: production mode, JSON log lines the tests can read.
			NODE_ENV: 'production',
			LOG_FORMAT: 'json',
			LOG_LEVEL: 'info',
			DATABASE_URL: options.databaseUrl,
			PORT: String(port),
			HOST: '127.0.0.1',
			ORIGIN: url,
			METRICS_PORT: '',
			...options.env
		},
		stdio: ['ignore', log, log]
	});
	closeSync(log);
	const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
	if (!(await waitForPort(port, 60_000))) {
		child.kill('SIGKILL');
		throw new Error(`The app instance did not listen on ${port}; see ${logFile}.`);
	}
	return {
		url,
		port,
		logFile,
		async stop() {
			if (child.exitCode !== null || child.signalCode !== null) return;
			child.kill('SIGTERM');
			const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
			await exited;
			clearTimeout(timer);
		}
	};
}

/** Asks `probe` every 250 ms until it returns something truthy, or fails after `timeoutMs`. */
export async function poll<T>(probe: () => Promise<T | null | undefined | false>, what: string, timeoutMs = 30_000): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	let last: unknown;
	while (Date.now() < deadline) {
		try {
			const value = await probe();
			if (value) return value;
		} catch (error) {
			last = error;
		}
		await new Promise((r) => setTimeout(r, 250));
	}
	throw new Error(`Timed out waiting for ${what}${last ? ` (last error: ${String(last)})` : ''}.`);
}
