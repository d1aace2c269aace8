// JSON endpoints answer a DomainError the same way everywhere:
//
//   { code, message, fields, ...details }  with the error's status
//
// endpoint() wraps a +server.ts handler so it can throw one; readJson() parses a body with zod.
import { json, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { DomainError, isDomainError, parseOrThrow } from '$lib/errors';

export const refusalJson = (e: DomainError) => json({ code: e.code, message: e.message, fields: e.fields, ...e.details }, { status: e.status });

export function endpoint<E extends RequestEvent>(run: (event: E) => Promise<Response> | Response) {
	return async (event: E): Promise<Response> => {
		try {
			return await run(event);
		} catch (e) {
			if (isDomainError(e)) return refusalJson(e);
			throw e;
		}
	};
}

/** The request's JSON body parsed by `schema`; unknown keys are dropped by zod objects. */
export async function readJson<S extends z.ZodType>(event: RequestEvent, schema: S): Promise<z.output<S>> {
	let body: unknown;
	try {
		body = await event.request.json();
	} catch {
		throw new DomainError(400, 'bad-json', 'Send a JSON body.');
	}
	return parseOrThrow(schema, body);
}
