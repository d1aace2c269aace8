import { requireRole } from '$lib/server/club/guards';
import * as posts from '$lib/server/news/posts';
import type { PageServerLoad } from './$types';

export const load = (async (event) => ({ posts: await posts.adminList(requireRole(event, 'admin')) })) satisfies PageServerLoad;
