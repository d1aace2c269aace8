import { notFoundOrSignIn } from '$lib/server/club/guards';
import * as posts from '$lib/server/news/posts';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const post = await posts.get(event.locals.user ?? null, Number(event.params.id));
	// A members-only post and a missing one answer alike, with a sign-in link for visitors.
	if (!post) notFoundOrSignIn(event, 'We could not find that news post.');
	return { post };
}) satisfies PageServerLoad;
