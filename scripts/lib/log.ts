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

/** A step or a spawn cut short because everything is being stopped (Ctrl-C, SIGTERM). */
export class Interrupted extends Error {
	constructor() {
		super('Interrupted.');
	}
}

export function reportFailure(error: unknown): void {
	// The shutdown itself says what happens; an interrupted step is not a failure to report.
	if (error instanceof Interrupted) return;
	if (error instanceof SetupError) {
		console.error(paint('31', '\n✗ ' + error.message));
		console.error('  ' + error.fix.split('\n').join('\n  '));
	} else {
		console.error(paint('31', '\n✗ Unexpected failure:'), error);
	}
}
