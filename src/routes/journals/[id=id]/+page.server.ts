import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as tanks from '$lib/server/journals/tanks';
import * as entries from '$lib/server/journals/entries';
import * as social from '$lib/server/journals/social';
import * as timeline from '$lib/server/journals/timeline';
import * as upkeep from '$lib/server/journals/upkeep';
import * as water from '$lib/server/journals/water';
import { renderMarkdown } from '$lib/server/markdown';
import { dayNumber } from '$lib/journals/calc';
import { buildSeries, derivedFigures, latestWarnings } from '$lib/journals/water-tests';
import type { Actions, PageServerLoad } from './$types';

/** Tests shown in the table under the charts (the charts fetch their own data). */
const TABLE_TESTS = 8;

export const load = (async (event) => {
	const viewer = event.locals.user;
	const tank = await tanks.get(viewer, Number(event.params.id));
	if (!tank) error(404, 'We could not find that tank.');
	const isOwner = tanks.isOwner(viewer, tank);
	const now = new Date();
	const [page, standing, tests, schedule] = await Promise.all([
		timeline.pageOf(tank.id, Number(event.url.searchParams.get('page') ?? 1)),
		social.standingOf(viewer, tank.id),
		water.latestOf(tank.id),
		isOwner ? upkeep.scheduleOfTank(tank.id, now) : Promise.resolve([])
	]);
	const units = viewer?.units ?? 'metric';
	const latest = tests[0] ?? null;
	return {
		tank,
		figures: tanks.tankFigures(tank),
		descriptionHtml: tank.description ? renderMarkdown(tank.description) : '',
		isOwner,
		today: now.toISOString().slice(0, 10),
		timeline: page,
		standing,
		schedule,
		recentTests: tests.slice(0, TABLE_TESTS),
		testCount: tests.length,
		latestTest: latest ? { test: latest, derived: derivedFigures(latest) } : null,
		warnings: latestWarnings(buildSeries(tests, units)),
		hasFeed: tank.visibility === 'public'
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

const idField = (form: FormData, name: string) => {
	const value = String(form.get(name) ?? '');
	return /^[1-9]\d{0,14}$/.test(value) ? Number(value) : null;
};

/** An admire or follow by someone who may see the tank; 404 otherwise, 400 for one's own tank. */
async function toggle(event: Parameters<Actions[string]>[0], what: 'admire' | 'follow') {
	const viewer = requireUser(event);
	const form = await event.request.formData();
	const want = form.get('want') === 'on' ? true : form.get('want') === 'off' ? false : undefined;
	try {
		if (what === 'admire') return { admired: await social.toggleAdmire(viewer, Number(event.params.id), want) };
		return { following: await social.toggleFollow(viewer, Number(event.params.id), want) };
	} catch (e) {
		if (e instanceof tanks.TankNotFound) error(404, 'We could not find that tank.');
		if (e instanceof social.OwnTankError)
			return fail(400, { socialError: what === 'admire' ? 'You cannot admire your own tank.' : 'You keep this tank; there is nothing to follow.' });
		throw e;
	}
}

export const actions = {
	admire: (event) => toggle(event, 'admire'),
	follow: (event) => toggle(event, 'follow'),
	done: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const taskId = idField(await event.request.formData(), 'taskId');
		if (!taskId) return fail(400, { doneError: 'Choose a task.' });
		try {
			await upkeep.markDone(viewer, taskId);
		} catch (e) {
			if (e instanceof tanks.TankNotFound) error(404, 'We could not find that task.');
			throw e;
		}
		return { doneTask: taskId, tankId: tank.id };
	},
	undoEvent: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const eventId = idField(await event.request.formData(), 'eventId');
		if (!eventId) error(404, 'We could not find that event.');
		try {
			await upkeep.removeLoggedEvent(viewer, tank.id, eventId);
		} catch (e) {
			if (e instanceof tanks.TankNotFound) error(404, 'We could not find that event.');
			throw e;
		}
		return { undone: eventId };
	},
	deleteTest: async (event) => {
		const { viewer, tank } = await ownTank(event);
		const testId = idField(await event.request.formData(), 'testId');
		if (!testId) error(404, 'We could not find that test.');
		try {
			await water.remove(viewer, tank.id, testId);
		} catch (e) {
			if (e instanceof tanks.TankNotFound) error(404, 'We could not find that test.');
			throw e;
		}
		return { testDeleted: testId };
	},
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
		await entries.removeTank(viewer, tank.id);
		redirect(303, '/journals?deleted=1');
	}
} satisfies Actions;
