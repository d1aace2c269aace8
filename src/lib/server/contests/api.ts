// JSON answers for the judging endpoints: refusals carry a code the scorecard acts on.
import { json } from '@sveltejs/kit';
import { ContestError } from './errors';
import { VersionConflict } from './judging';

export function refusal(error: unknown): Response {
	if (error instanceof VersionConflict) return json({ code: error.code, message: error.message, current: error.current }, { status: 409 });
	if (error instanceof ContestError) return json({ code: error.code, message: error.message }, { status: error.status });
	throw error;
}
