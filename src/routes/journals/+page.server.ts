import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	return { tanks: await tanks.listOwn(viewer) };
}) satisfies PageServerLoad;
