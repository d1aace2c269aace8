// Every process the orchestrators (start, test, cluster, bench) start is tracked here, from the
// moment it is spawned: the long-running ones (MariaDB, the fakes, the app) and the steps that run
// to their end (the build, migrations, seeding). A Ctrl-C or SIGTERM at any step, a failure or a
// plain exit then stops all of them, newest first, so MariaDB goes last and shuts down cleanly and
// nothing is left holding a port for the next start.
import { spawn } from 'node:child_process';
import { Interrupted, SetupError, note, ok, step } from './log';

interface Tracked {
	name: string;
	/** Stops it and resolves once it is gone. */
	stop(): Promise<void>;
	/** Synchronous last resort when this process exits anyway: ask it to stop (SIGTERM). */
	signal(): void;
}

const tracked: Tracked[] = [];
let closing: Promise<void> | null = null;

/** Whether a shutdown has begun (a signal arrived or `stopEverything` was called). */
export const shuttingDown = () => closing !== null;

/** Tracks `child` until it is stopped; refuses (and stops it at once) while shutting down. */
export function track(child: Tracked): () => void {
	if (closing) {
		child.signal();
		throw new Interrupted();
	}
	tracked.push(child);
	return () => {
		const at = tracked.indexOf(child);
		if (at >= 0) tracked.splice(at, 1);
	};
}

/** Stops every tracked process, newest first; safe to call more than once (one shutdown). */
export function stopEverything(): Promise<void> {
	closing ??= (async () => {
		while (tracked.length) {
			const child = tracked.at(-1)!;
			note(`Stopping ${child.name}…`);
			await child.stop();
			const at = tracked.indexOf(child);
			if (at >= 0) tracked.splice(at, 1);
		}
	})();
	return closing;
}

// If this process ends without an orderly shutdown (an uncaught error, process.exit), no child is
// left behind: each gets SIGTERM, on which MariaDB and the fakes shut down by themselves.
process.on('exit', () => {
	for (const child of [...tracked].reverse()) child.signal();
});

/**
 * Stops everything once — on Ctrl-C, SIGTERM or SIGHUP, or when `shutdown` is called — and exits
 * with the code given (`signalCode` for a signal). Every process the orchestrator started is
 * tracked, so this works at any step, before a stack object even exists.
 */
export function orderlyShutdown(signalCode = 0) {
	let stopping = false;
	const shutdown = async (code: number) => {
		if (stopping) return;
		stopping = true;
		console.log('');
		step('Shutting down…');
		await stopEverything();
		ok('Stopped cleanly.');
		process.exit(code);
	};
	for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, () => void shutdown(signalCode));
	return { shutdown, stopping: () => stopping };
}

interface ChildOptions {
	cwd?: string;
	env?: NodeJS.ProcessEnv;
	/** How long it may take to stop after SIGTERM before SIGKILL (15 s). */
	graceMs?: number;
	/** Keep its output (shown by `runStep` only if it fails) rather than passing it to ours. */
	quiet?: boolean;
}

/**
 * Runs a command to its end, tracked while it runs, and says how it ended. It stays in our process
 * group, so a Ctrl-C in the terminal reaches it directly; on a shutdown it gets SIGTERM and
 * `graceMs` to finish (a migration finishes what it began) before SIGKILL.
 */
export async function runChild(what: string, command: string, args: string[], options: ChildOptions = {}) {
	if (closing) throw new Interrupted();
	const child = spawn(command, args, {
		cwd: options.cwd,
		env: options.env ?? process.env,
		stdio: ['ignore', options.quiet ? 'pipe' : 'inherit', options.quiet ? 'pipe' : 'inherit']
	});
	let output = '';
	child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
	child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
	const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null; error?: Error }>((resolve) => {
		child.once('close', (code, signal) => resolve({ code, signal }));
		child.once('error', (error) => resolve({ code: null, signal: null, error }));
	});
	const alive = () => child.exitCode === null && child.signalCode === null;
	const untrack = track({
		name: what.charAt(0).toLowerCase() + what.slice(1),
		signal: () => void (alive() && child.kill('SIGTERM')),
		async stop() {
			if (alive()) child.kill('SIGTERM');
			const timer = setTimeout(() => alive() && child.kill('SIGKILL'), options.graceMs ?? 15_000);
			await exited;
			clearTimeout(timer);
		}
	});
	const result = await exited;
	untrack();
	return { ...result, output };
}

/** Runs a step of the set-up to its end (see `runChild`); a failure is a `SetupError`, a shutdown `Interrupted`. */
export async function runStep(what: string, command: string, args: string[], options: ChildOptions & { fix?: string } = {}): Promise<void> {
	const result = await runChild(what, command, args, options);
	if (closing) throw new Interrupted();
	if (result.code !== 0) {
		const why = result.error ? `: ${result.error.message}` : result.signal ? ` (stopped by ${result.signal})` : '';
		const tail = options.quiet ? `:\n${result.output.trim().split('\n').slice(-15).join('\n')}` : ' (see above)';
		throw new SetupError(`${what} failed${why}${tail}`, options.fix ?? 'Fix the error shown above and run the command again.');
	}
}
