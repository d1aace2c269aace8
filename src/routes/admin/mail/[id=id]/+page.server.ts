import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import { readMail } from '$lib/server/mail/report';
import { describeTopic } from '$lib/mail/topics';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireRole(event, 'admin');
	const mail = await readMail(viewer, Number(event.params.id));
	if (!mail) error(404, 'We could not find that mail.');
	const { topic, ...rest } = mail;
	return { mail: { ...rest, kind: describeTopic(topic) } };
}) satisfies PageServerLoad;
