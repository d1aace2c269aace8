import { redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import * as upkeep from '$lib/server/journals/upkeep';
import { invalid } from '$lib/errors';
import { defaultSchedule, parseScheduleRows, taskRowOf, taskRowsFrom } from '$lib/journals/schedule';
import { FILTER_PARTS, TASK_KINDS } from '$lib/journals/journal-vocabulary';
import { ownTankRow } from '../own-tank.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const { tank } = await ownTankRow(event);
	const tasks = await upkeep.listForTank(tank.id);
	return {
		tank: { id: tank.id, name: tank.name },
		rows: (tasks.length ? tasks : defaultSchedule(tank)).map(taskRowOf),
		suggested: tasks.length === 0
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTankRow(event);
			const parsed = parseScheduleRows(taskRowsFrom(data), TASK_KINDS, FILTER_PARTS);
			if (!parsed.ok) throw invalid(parsed.errors);
			await upkeep.saveSchedule(viewer, tank.id, parsed.tasks);
			redirect(303, `/journals/${tank.id}?saved=1`);
		},
		{ values: (data) => ({ rows: taskRowsFrom(data) }) }
	)
} satisfies Actions;
