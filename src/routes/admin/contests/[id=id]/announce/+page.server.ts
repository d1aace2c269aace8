import { error, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as contests from '$lib/server/contests/contests';
import * as announce from '$lib/server/contests/announce';
import { invalid } from '$lib/errors';
import type { Actions, PageServerLoad } from './$types';

const query = z.object({ page: z.coerce.number().int().min(1).max(10_000).catch(1), address: z.string().trim().max(200).catch('') });

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const contest = await contests.get(viewer, Number(event.params.id));
	if (!contest) error(404, 'We could not find that contest.');
	const { page, address } = query.parse({ page: event.url.searchParams.get('page') ?? undefined, address: event.url.searchParams.get('address') ?? '' });
	const published = contest.state === 'published' || contest.state === 'archived';
	return {
		contest: { id: contest.id, title: contest.title, state: contest.state },
		preview: published ? await announce.preview(viewer, contest.id) : null,
		delivery: await announce.delivery(viewer, contest.id, page, address),
		page,
		address
	};
}) satisfies PageServerLoad;

export const actions = {
	send: formAction(async (event, data) => {
		const viewer = requireRole(event, 'admin');
		if (data.get('confirm') !== 'yes') throw invalid({ confirm: 'Tick the box to confirm that you have read the preview.' });
		const { queued } = await announce.send(viewer, Number(event.params.id));
		redirect(303, `/admin/contests/${event.params.id}/announce?sent=${queued}`);
	})
} satisfies Actions;
