/** A refusal the person can act on; routes turn it into fail(status, { error }) or a JSON answer. */
export class ContestError extends Error {
	constructor(
		readonly status: number,
		message: string,
		readonly code: string = 'refused',
		/** Messages for particular form fields, when the refusal is about them. */
		readonly fields: Record<string, string> = {}
	) {
		super(message);
	}
}

/** Something that does not exist, or that this person may not know exists. */
export class ContestNotFound extends ContestError {
	constructor(what = 'We could not find that.') {
		super(404, what, 'not-found');
	}
}
