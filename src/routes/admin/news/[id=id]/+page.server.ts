import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import { pageLoad } from '$lib/server/http/loads';
import * as posts from '$lib/server/news/posts';
import { invalid } from '$lib/errors';
import { postForm } from '$lib/news/post';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({ page: z.coerce.number().int().min(1).max(10_000).catch(1), address: z.string().trim().max(200).catch('') });

export const load = pageLoad(async (event) => {
	const admin = requireRole(event, 'admin');
	const id = Number(event.params.id);
	const { page, address } = query.parse({ page: event.url.searchParams.get('page') ?? undefined, address: event.url.searchParams.get('address') ?? '' });
	const [detail, options, delivery] = await Promise.all([posts.adminGet(admin, id), posts.formOptions(admin), posts.delivery(admin, id, page, address)]);
	const a = detail.post.audience;
	return {
		post: {
			id: detail.post.id,
			title: detail.post.title,
			html: detail.post.bodyHtml ?? '',
			publishedAt: detail.post.publishedAt,
			recipients: detail.post.recipients,
			visibility: detail.post.visibility
		},
		initial: {
			title: detail.post.title,
			body: detail.post.body,
			visibility: detail.post.visibility,
			audienceKind: a.kind,
			contestId: a.kind === 'entrants' ? String(a.contestId) : '',
			areaId: a.kind === 'area' ? String(a.areaId) : '',
			radius: a.kind === 'area' ? String(a.radius) : ''
		},
		audienceText: detail.audienceText,
		reach: detail.reach,
		options,
		delivery,
		page,
		address
	};
}) satisfies PageServerLoad;

export const actions = {
	save: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			await posts.update(admin, Number(event.params.id), parseForm(postForm, data));
			return { saved: true };
		},
		{ id: 'save' }
	),
	test: formAction(
		async (event) => {
			const admin = requireRole(event, 'admin');
			await posts.sendTest(admin, Number(event.params.id));
			return { tested: admin.email };
		},
		{ id: 'test' }
	),
	publish: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			if (data.get('confirm') !== 'yes') throw invalid({ confirm: 'Tick the box to confirm that you have read the post and its audience.' });
			const { queued } = await posts.publish(admin, Number(event.params.id));
			redirect(303, `/admin/news/${event.params.id}?published=${queued}`);
		},
		{ id: 'publish' }
	),
	delete: formAction(
		async (event) => {
			const admin = requireRole(event, 'admin');
			await posts.remove(admin, Number(event.params.id));
			redirect(303, '/admin/news');
		},
		{ id: 'delete' }
	)
} satisfies Actions;
