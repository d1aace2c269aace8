// The judging pages read through judging's access check, which refuses whatever the judge may not
// reach as "not found": such a refusal shows the not-found page.
import { error } from '@sveltejs/kit';
import { isDomainError } from '$lib/errors';

export async function orNotFound<T>(read: Promise<T>, onNotFound?: () => Promise<void>): Promise<T> {
	try {
		return await read;
	} catch (e) {
		if (!isDomainError(e) || e.status !== 404) throw e;
		await onNotFound?.();
		error(404, e.message);
	}
}
