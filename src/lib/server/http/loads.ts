// A load that asks a domain function which may refuse (a thing that is not the viewer's to see)
// wraps the call in pageLoad(): the refusal becomes SvelteKit's error page with its own status and
// sentence (404 "We could not find that care plan."), not a 500. Actions have formAction(), APIs
// endpoint(); this is the same for loads.
import { error, type ServerLoadEvent } from '@sveltejs/kit';
import { isDomainError } from '$lib/errors';

export function pageLoad<E extends ServerLoadEvent, R>(run: (event: E) => Promise<R>): (event: E) => Promise<R> {
	return async (event) => {
		try {
			return await run(event);
		} catch (e) {
			if (isDomainError(e)) error(e.status, e.message);
			throw e;
		}
	};
}
