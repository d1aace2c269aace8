import { error, fail, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as upkeep from '$lib/server/journals/upkeep';
import { defaultSchedule, parseScheduleRows, taskRowOf, taskRowsFrom } from '$lib/journals/schedule';
import { FILTER_PARTS, TASK_KINDS } from '$lib/journals/journal-vocabulary';
import type { Actions, PageServerLoad } from './$types';

async function ownTank(event: { locals: App.Locals; url: URL; params: { id: string } }) {
	const viewer = requireUser(event);
	const tank = await tanks.findOwn(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	return { viewer, tank };
}

export const load = (async (event) => {
	const { tank } = await ownTank(event);
	const tasks = await upkeep.listForTank(tank.id);
	return {
		tank: { id: tank.id, name: tank.name },
		rows: (tasks.length ? tasks : defaultSchedule(tank)).map(taskRowOf),
		suggested: tasks.length === 0
	};
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const rows = taskRowsFrom(await event.request.formData());
		const parsed = parseScheduleRows(rows, TASK_KINDS, FILTER_PARTS);
		if (!parsed.ok) return fail(400, { errors: parsed.errors, rows });
		try {
			await upkeep.saveSchedule(viewer, tank.id, parsed.tasks);
		} catch (e) {
			if (e instanceof upkeep.ScheduleError) return fail(400, { errors: e.errors, rows });
			throw e;
		}
		redirect(303, `/journals/${tank.id}?saved=1`);
	}
} satisfies Actions;
