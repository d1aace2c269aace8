import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as plans from '$lib/server/away/plans';
import * as sitters from '$lib/server/away/sitters';
import { pageLoad } from '$lib/server/http/loads';
import type { Actions, PageServerLoad } from './$types';

export const load = pageLoad(async (event) => {
	const viewer = requireUser(event);
	return { away: await plans.mine(viewer) };
}) satisfies PageServerLoad;

const answerForm = z.object({
	request: z
		.string()
		.regex(/^[1-9]\d{0,14}$/, 'Choose a request.')
		.transform(Number),
	answer: z.enum(['yes', 'no'], { message: 'Say yes or no.' })
});
const helperForm = z.object({ helper: z.enum(['on', 'off'], { message: 'Choose on or off.' }) });

export const actions = {
	answer: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { request, answer } = parseForm(answerForm, data);
			const planId = await sitters.answer(viewer, request, answer === 'yes');
			if (answer === 'yes') redirect(303, `/away/${planId}`);
			return { answered: request };
		},
		{ id: 'answer' }
	),
	helper: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { helper } = parseForm(helperForm, data);
			await plans.setHelper(viewer, helper === 'on');
			return { helperSaved: true };
		},
		{ id: 'helper' }
	)
} satisfies Actions;
