// Console output for the start and test orchestrators: steps, notes and actionable failures.

const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const paint = (code: string, text: string) => (useColour ? `\x1b[${code}m${text}\x1b[0m` : text);

export const step = (text: string) => console.log(paint('36', '» ') + text);
export const ok = (text: string) => console.log(paint('32', '✓ ') + text);
export const note = (text: string) => console.log(paint('2', '  ' + text));
export const warn = (text: string) => console.warn(paint('33', '! ') + text);

/** A set-up failure the user can fix: what went wrong and what to do about it. */
export class SetupError extends Error {
	constructor(
		message: string,
		readonly fix: string
	) {
		super(message);
	}
}

export function reportFailure(error: unknown): void {
	if (error instanceof SetupError) {
		console.error(paint('31', '\n✗ ' + error.message));
		console.error('  ' + error.fix.split('\n').join('\n  '));
	} else {
		console.error(paint('31', '\n✗ Unexpected failure:'), error);
	}
}

/**
 * Stops everything once — on Ctrl-C, SIGTERM or SIGHUP, or when `shutdown` is called — and exits
 * with the code given (0 for a signal).
 */
export function orderlyShutdown(stop: () => Promise<void>) {
	let stopping = false;
	const shutdown = async (code: number) => {
		if (stopping) return;
		stopping = true;
		console.log('');
		step('Shutting down…');
		await stop();
		ok('Stopped cleanly.');
		process.exit(code);
	};
	for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, () => void shutdown(0));
	return { shutdown, stopping: () => stopping };
}
