import { error, fail } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/journal-entries';
import * as showcase from '$lib/server/journals/showcase';
import * as upkeep from '$lib/server/journals/upkeep';
import { isDomainError } from '$lib/errors';
import type { Actions, PageServerLoad } from './$types';

/** Upkeep due within this many days shows on the dashboard. */
const SOON_DAYS = 3;

// The home page: a dashboard for a signed-in member, the showcase's newest tanks for everyone else.
export const load = (async ({ locals }) => {
	const viewer = locals.user;
	if (!viewer) {
		const { cards } = await showcase.list({ sort: 'updated', page: 1 });
		return { dashboard: null, showcase: cards.slice(0, 3) };
	}
	const now = new Date();
	const [scheduled, mine, followed] = await Promise.all([
		upkeep.scheduleOf(viewer, { now }),
		tanks.listOwn(viewer, { retired: false }),
		entries.recentFollowed(viewer)
	]);
	const withSchedule = new Set(scheduled.map((s) => s.task.tankIdNumber));
	return {
		dashboard: {
			due: upkeep.dueWithin(scheduled, SOON_DAYS),
			laterCount: scheduled.length - upkeep.dueWithin(scheduled, SOON_DAYS).length,
			tanks: mine.map((t) => ({ id: t.id, name: t.name, cover: t.cover, scheduled: withSchedule.has(t.id) })),
			followed
		},
		showcase: []
	};
}) satisfies PageServerLoad;

export const actions = {
	/** "Done today" from the dashboard. */
	done: async (event) => {
		const viewer = requireUser(event);
		const taskId = String((await event.request.formData()).get('taskId') ?? '');
		if (!/^[1-9]\d{0,14}$/.test(taskId)) return fail(400, { doneError: 'Choose a task.' });
		try {
			await upkeep.markDone(viewer, Number(taskId));
		} catch (e) {
			if (isDomainError(e) && e.status === 404) error(404, 'We could not find that task.');
			throw e;
		}
		return { done: Number(taskId) };
	}
} satisfies Actions;
