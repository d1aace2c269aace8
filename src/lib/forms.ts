import type { SubmitFunction } from '@sveltejs/kit';

/**
 * The `use:enhance` callback our forms share: the form is busy while the action runs, and what
 * was typed stays in the fields when the action answers with errors (SvelteKit resets by default).
 */
export function keepInput(busy: (value: boolean) => void = () => {}): SubmitFunction {
	return () => {
		busy(true);
		return async ({ update }) => {
			await update({ reset: false });
			busy(false);
		};
	};
}
