import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { refusal } from '$lib/server/contests/api';
import type { RequestHandler } from './$types';

const body = z.object({ version: z.number().int().min(1) });

/** Submits the card as last saved: { version } must be the version the judge is looking at. */
export const POST: RequestHandler = async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const parsed = body.safeParse(await event.request.json().catch(() => null));
	if (!parsed.success) return json({ code: 'bad-request', message: 'Say which version of the card you submit.' }, { status: 400 });
	try {
		return json(await judging.submitCard(viewer, Number(event.params.contest), Number(event.params.number), parsed.data.version));
	} catch (error) {
		return refusal(error);
	}
};
