import type { ParamMatcher } from '@sveltejs/kit';

/** A row id: a positive whole number that fits a BIGINT (and a JavaScript number). */
export const match = ((param: string) => /^[1-9]\d{0,14}$/.test(param)) satisfies ParamMatcher;
