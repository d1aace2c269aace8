// The one refusal type of Riparia. A domain function throws a DomainError when it will not do
// what was asked, with a sentence for the person; routes never build their own: forms turn it
// into fail(status, { form, errors, values }) and JSON endpoints into { code, message, fields }
// (src/lib/server/http/forms.ts and api.ts). Pure modules may throw it too (it does no I/O).
import type { z } from 'zod';

/** Messages for particular form fields, keyed by the field's name; FORM_ERROR holds one about the whole form. */
export type FieldErrors = Record<string, string>;

/** The key of a message about the whole form rather than one field (pages read `form?.errors._form`). */
export const FORM_ERROR = '_form';

/** The statuses a refusal may carry: bad input, not signed in, not allowed, not visible, state does not allow it, gone, too many, busy (try again soon). */
export type RefusalStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 429 | 503;

export class DomainError extends Error {
	constructor(
		readonly status: RefusalStatus,
		/** A stable, kebab-case reason a client may act on, e.g. 'version-conflict'. */
		readonly code: string,
		message: string,
		readonly fields: FieldErrors = {},
		/** Extra data a client needs to recover (e.g. the stored card on a conflict); JSON only. */
		readonly details: Record<string, unknown> = {}
	) {
		super(message);
		this.name = 'DomainError';
	}
}

export const isDomainError = (e: unknown): e is DomainError => e instanceof DomainError;

/** Something that does not exist, or that this person may not know exists. */
export const notFound = (message = 'We could not find that.') => new DomainError(404, 'not-found', message);

/** Input that fails a rule; `fields` puts each message next to its field. */
export const invalid = (fields: FieldErrors, message = Object.values(fields)[0] ?? 'Please check what you entered.', code = 'invalid') =>
	new DomainError(400, code, message, fields);

/** Allowed in general, but not to this person. */
export const forbidden = (message = 'You may not do that.', code = 'forbidden') => new DomainError(403, code, message);

/** The thing's state does not allow this step now. */
export const conflict = (code: string, message: string, details: Record<string, unknown> = {}) => new DomainError(409, code, message, {}, details);

/** Field messages from a zod error: the first message for each top-level field. */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
	const fields: FieldErrors = {};
	for (const issue of error.issues) {
		const key = issue.path.length ? String(issue.path[0]) : FORM_ERROR;
		fields[key] ??= issue.message;
	}
	return fields;
}

/** Parses input with a zod schema, or throws the DomainError that puts each message at its field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown, message?: string): z.output<S> {
	const parsed = schema.safeParse(input);
	if (parsed.success) return parsed.data;
	const fields = fieldErrorsOf(parsed.error);
	throw invalid(fields, message ?? fields._form ?? Object.values(fields)[0] ?? 'Please check what you entered.');
}
