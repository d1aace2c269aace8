import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { endpoint, readJson } from '$lib/server/http/api';
import * as judging from '$lib/server/contests/judging';
import type { RequestHandler } from './$types';

const SAY_WHICH = 'Say which version of the card you submit.';
const body = z.object({ version: z.number({ message: SAY_WHICH }).int(SAY_WHICH).min(1, SAY_WHICH) }, { message: SAY_WHICH });

/** Submits the card as last saved: { version } must be the version the judge is looking at. */
export const POST: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const { version } = await readJson(event, body);
	return json(await judging.submitCard(viewer, Number(event.params.contest), Number(event.params.number), version));
});
