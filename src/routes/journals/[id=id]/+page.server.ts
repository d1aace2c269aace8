import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import { renderMarkdown } from '$lib/server/markdown';
import { dayNumber } from '$lib/journals/calc';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = event.locals.user;
	const tank = await tanks.get(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return {
		tank,
		figures: tanks.tankFigures(tank),
		descriptionHtml: tank.description ? renderMarkdown(tank.description) : '',
		isOwner: tanks.isOwner(viewer, tank),
		today: new Date().toISOString().slice(0, 10)
	};
}) satisfies PageServerLoad;

const retireSchema = z.object({
	retiredOn: z
		.string()
		.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the day as YYYY-MM-DD.')
		.refine((d) => {
			try {
				return dayNumber(d) <= dayNumber(new Date());
			} catch {
				return false;
			}
		}, 'Give a day that is not in the future.'),
	retiredNote: z.string().trim().max(300, 'Keep the note to 300 characters.')
});

async function ownTank(event: Parameters<Actions[string]>[0]) {
	const viewer = requireUser(event);
	const id = Number(event.params.id);
	const tank = await tanks.getOwn(viewer, id);
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}

export const actions = {
	retire: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const form = Object.fromEntries(await event.request.formData()) as Record<string, string>;
		const parsed = retireSchema.safeParse({ retiredOn: form.retiredOn ?? '', retiredNote: form.retiredNote ?? '' });
		if (!parsed.success) return fail(400, { retireError: parsed.error.issues[0]?.message ?? 'Check the day.', values: form });
		if (tank.setUpOn && parsed.data.retiredOn < tank.setUpOn) return fail(400, { retireError: 'That is before the tank was set up.', values: form });
		await tanks.retire(viewer, tank.id, parsed.data.retiredOn, parsed.data.retiredNote);
		redirect(303, `/journals/${tank.id}`);
	},
	reopen: async (event) => {
		const { viewer, tank } = await ownTank(event);
		await tanks.reopen(viewer, tank.id);
		redirect(303, `/journals/${tank.id}`);
	},
	delete: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const form = await event.request.formData();
		if (String(form.get('confirmName') ?? '').trim() !== tank.name) {
			return fail(400, { deleteError: 'Type the tank’s name exactly to delete it.' });
		}
		await tanks.remove(viewer, tank.id);
		redirect(303, '/journals?deleted=1');
	}
} satisfies Actions;
