import * as posts from '$lib/server/news/posts';
import type { PageServerLoad } from './$types';

export const load = (async ({ locals, url }) => {
	const page = Math.max(1, Math.min(500, Number(url.searchParams.get('page')) || 1));
	return { ...(await posts.list(locals.user ?? null, page)), page, signedIn: locals.user !== null && locals.user !== undefined };
}) satisfies PageServerLoad;
