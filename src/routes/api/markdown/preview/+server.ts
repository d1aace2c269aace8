import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { MARKDOWN_MAX_CHARS, renderMarkdown } from '$lib/server/markdown';
import type { RequestHandler } from './$types';

const body = z.object({ text: z.string().max(MARKDOWN_MAX_CHARS, `Keep it under ${MARKDOWN_MAX_CHARS.toLocaleString('en-GB')} characters.`) });

/** The editor's Preview tab: the same renderer and sanitiser as the saved text. */
export const POST: RequestHandler = async (event) => {
	requireUser(event);
	let input: unknown;
	try {
		input = await event.request.json();
	} catch {
		return json({ message: 'Send JSON such as {"text": "…"}.' }, { status: 400 });
	}
	const parsed = body.safeParse(input);
	if (!parsed.success) return json({ message: parsed.error.issues[0]?.message ?? 'Send {"text": "…"}.' }, { status: 400 });
	return json({ html: renderMarkdown(parsed.data.text) });
};
