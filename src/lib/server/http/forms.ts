// One shape for every form's refusal, and one place that makes it. A form action throws (or lets
// through) a DomainError; formAction() turns it into
//
//   fail(status, { form, errors, values })
//
// where `errors` holds a message per field name plus `_form` for the form as a whole, `values` is
// what was sent (so nothing typed is lost), and `form` names the form when a page holds several.
// A 404 becomes the not-found page. Anything else (a redirect, a bug) passes through untouched.
import { error, fail, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { FORM_ERROR, isDomainError, parseOrThrow, type FieldErrors } from '$lib/errors';

export { FORM_ERROR };

export interface FormRefusal<V = Record<string, string>> {
	form?: string;
	errors: FieldErrors;
	values: V;
}

/** What was sent, as strings by field name (files left out; a repeated name keeps its first value). */
export function valuesOf(data: FormData): Record<string, string> {
	const values: Record<string, string> = {};
	for (const [name, value] of data) if (typeof value === 'string' && !(name in values)) values[name] = value;
	return values;
}

/** fail() for a refusal; rethrows anything that is not one. */
export function refused<V>(e: unknown, values: V, form?: string) {
	if (!isDomainError(e)) throw e;
	if (e.status === 404) error(404, e.message);
	const errors: FieldErrors = { ...e.fields };
	if (!Object.values(errors).includes(e.message)) errors[FORM_ERROR] ??= e.message;
	const payload: FormRefusal<V> = { errors, values, ...(form ? { form } : {}) };
	return fail(e.status, payload);
}

export interface FormActionOptions<V, E extends RequestEvent = RequestEvent> {
	/** Names the form in the payload, for pages with several. */
	id?: string;
	/**
	 * The values to send back; defaults to valuesOf(data). May be async, e.g. to show the
	 * photos a form named again (media.photosAgain); only called for a refusal.
	 */
	values?: (data: FormData, event: E) => V | Promise<V>;
}

/**
 * Wraps a form action: reads the form once, runs `run`, and answers a DomainError with the
 * common payload. `run` returns what the action would (data, or throws a redirect).
 */
export function formAction<E extends RequestEvent, R, V = Record<string, string>>(
	run: (event: E, data: FormData) => Promise<R> | R,
	options: FormActionOptions<V, E> = {}
) {
	return async (event: E) => {
		const data = await event.request.formData();
		try {
			return await run(event, data);
		} catch (e) {
			if (!options.values || !isDomainError(e) || e.status === 404) return refused(e, valuesOf(data) as V, options.id);
			return refused(e, await options.values(data, event), options.id);
		}
	};
}

/** Parses a form with a zod schema (fields by name), or throws the refusal that puts each message at its field. */
export const parseForm = <S extends z.ZodType>(schema: S, data: FormData): z.output<S> => parseOrThrow(schema, valuesOf(data));
