/**
 * A refusal of the swap board with a sentence for the member: `status` is what a route answers
 * (400 bad input, 403 not allowed, 404 not visible, 409 the listing's state does not allow it),
 * `field` names the form field the message belongs next to, when there is one.
 */
export class SwapError extends Error {
	constructor(
		readonly status: 400 | 403 | 404 | 409,
		readonly code: string,
		message: string,
		readonly field?: string
	) {
		super(message);
	}
}

export const notFound = (what = 'listing') => new SwapError(404, 'not-found', `We could not find that ${what}.`);
