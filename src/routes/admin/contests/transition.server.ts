// The confirmed state step, shared by the overview and the review page.
import { fail, redirect, type RequestEvent } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { ContestError } from '$lib/server/contests/errors';
import { transition } from '$lib/server/contests/review';
import { TRANSITION_NAMES } from '$lib/contests/lifecycle';

const schema = z.object({
	step: z.enum(TRANSITION_NAMES),
	confirm: z.literal('yes', { message: 'Tick the box to confirm this step.' }),
	reason: z.string().trim().max(500).optional()
});

export async function takeStep(event: RequestEvent, back: string) {
	const viewer = requireRole(event, 'admin');
	const form = Object.fromEntries(await event.request.formData());
	const parsed = schema.safeParse({ step: form.step, confirm: form.confirm ?? '', reason: form.reason || undefined });
	if (!parsed.success)
		return fail(400, { stepError: parsed.error.issues[0]?.message ?? 'Check the form.', step: String(form.step ?? ''), reason: String(form.reason ?? '') });
	try {
		await transition(viewer, Number(event.params.id), parsed.data.step, { overrideReason: parsed.data.reason ?? null });
	} catch (e) {
		if (e instanceof ContestError)
			return fail(e.status === 404 ? 404 : 409, { stepError: e.message, step: parsed.data.step, reason: parsed.data.reason ?? '' });
		throw e;
	}
	redirect(303, `${back}?step=${parsed.data.step}`);
}
