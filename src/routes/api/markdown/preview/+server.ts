import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { endpoint, readJson } from '$lib/server/http/api';
import { MARKDOWN_MAX_CHARS, renderMarkdown } from '$lib/server/markdown';
import type { RequestHandler } from './$types';

const body = z.object({ text: z.string().max(MARKDOWN_MAX_CHARS, `Keep it under ${MARKDOWN_MAX_CHARS.toLocaleString('en-GB')} characters.`) });

/** The editor's Preview tab: the same renderer and sanitiser as the saved text. */
export const POST: RequestHandler = endpoint(async (event) => {
	requireUser(event);
	const { text } = await readJson(event, body);
	return json({ html: renderMarkdown(text) });
});
