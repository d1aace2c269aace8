import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/journal-entries';
import * as showcase from '$lib/server/journals/showcase';
import * as upkeep from '$lib/server/journals/upkeep';
import * as judging from '$lib/server/contests/judging';
import * as threads from '$lib/server/swaps/threads';
import type { Actions, PageServerLoad } from './$types';

/** Upkeep due within this many days shows on the dashboard. */
const SOON_DAYS = 3;

// The home page: a dashboard for a signed-in member, the showcase's newest tanks for everyone else.
export const load = (async ({ locals }) => {
	const viewer = locals.user;
	// Someone signed in but not yet admitted lands on where their membership stands.
	if (!viewer && locals.account) redirect(303, '/membership');
	if (!viewer) {
		const { cards } = await showcase.list({ sort: 'updated', page: 1 });
		return { dashboard: null, showcase: cards.slice(0, 3) };
	}
	const now = new Date();
	const [scheduled, mine, followed, judged, swapNews] = await Promise.all([
		upkeep.scheduleOf(viewer, { now }),
		tanks.listOwn(viewer, { retired: false }),
		entries.recentFollowed(viewer),
		judging.myContests(viewer),
		threads.unreadOnOwnListings(viewer.id)
	]);
	const judgingNow = judged.filter((c) => c.state === 'judging' && c.toScore > c.submitted);
	const withSchedule = new Set(scheduled.map((s) => s.task.tankIdNumber));
	return {
		dashboard: {
			due: upkeep.dueWithin(scheduled, SOON_DAYS),
			laterCount: scheduled.length - upkeep.dueWithin(scheduled, SOON_DAYS).length,
			tanks: mine.map((t) => ({ id: t.id, name: t.name, cover: t.cover, scheduled: withSchedule.has(t.id) })),
			followed,
			// Cards a judge still owes in contests being judged, and conversations on the member's listings with news.
			cardsWaiting: judgingNow.reduce((n, c) => n + c.toScore - c.submitted, 0),
			judgingContests: judgingNow.length,
			swapNews
		},
		showcase: []
	};
}) satisfies PageServerLoad;

const doneForm = z.object({
	taskId: z
		.string({ message: 'Choose a task.' })
		.regex(/^[1-9]\d{0,14}$/, 'Choose a task.')
		.transform(Number)
});

export const actions = {
	/** "Done today" from the dashboard. */
	done: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const { taskId } = parseForm(doneForm, data);
			// Another member's task, or one that is gone, is "not found" (upkeep refuses it so).
			return { done: await upkeep.markDone(viewer, taskId) };
		},
		{ id: 'done' }
	)
} satisfies Actions;
