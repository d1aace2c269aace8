// The confirmed state step, shared by the overview and the review page.
import { redirect, type RequestEvent } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import { transition } from '$lib/server/contests/review';
import { TRANSITION_NAMES } from '$lib/contests/lifecycle';

const stepForm = z.object({
	step: z.enum(TRANSITION_NAMES, { message: 'Choose a step.' }),
	confirm: z.literal('yes', { message: 'Tick the box to confirm this step.' }),
	reason: z.string().trim().max(500).optional()
});

/** The `step` action of a page that shows the transition panel; back on `page` after the step. */
export const takeStep = (page: (id: string) => string) =>
	formAction(
		async (event: RequestEvent<{ id: string }>, data) => {
			const viewer = requireRole(event, 'admin');
			const input = parseForm(stepForm, data);
			await transition(viewer, Number(event.params.id), input.step, { overrideReason: input.reason || null });
			redirect(303, `${page(event.params.id)}?step=${input.step}`);
		},
		{ id: 'step' }
	);
