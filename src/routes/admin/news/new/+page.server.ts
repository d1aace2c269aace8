import { redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as posts from '$lib/server/news/posts';
import { postForm } from '$lib/news/post';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => ({ options: await posts.formOptions(requireRole(event, 'admin')) })) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event, data) => {
		const admin = requireRole(event, 'admin');
		const id = await posts.create(admin, parseForm(postForm, data));
		redirect(303, `/admin/news/${id}`);
	})
} satisfies Actions;
