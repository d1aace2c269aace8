import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { notFoundOrSignIn, requireUser } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import * as tankDeletion from '$lib/server/journals/tank-deletion';
import * as social from '$lib/server/journals/social';
import * as timeline from '$lib/server/journals/timeline';
import * as tankPhotos from '$lib/server/journals/tank-photos';
import * as upkeep from '$lib/server/journals/upkeep';
import * as water from '$lib/server/journals/water';
import { storedHtml } from '$lib/server/markdown';
import { invalid, notFound } from '$lib/errors';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { dayNumber } from '$lib/journals/calc';
import { buildSeries, derivedFigures, latestWarnings } from '$lib/journals/water-tests';
import { ownTankRow } from './own-tank.server';
import type { Actions, PageServerLoad } from './$types';

/** Tests shown in the table under the charts (the charts fetch their own data). */
const TABLE_TESTS = 8;

export const load = (async (event) => {
	const viewer = event.locals.user;
	const tank = await tanks.get(viewer, Number(event.params.id));
	if (!tank) notFoundOrSignIn(event, 'We could not find that tank.');
	const isOwner = tanks.isOwner(viewer, tank);
	const now = new Date();
	const [page, standing, tests, schedule, photoDays] = await Promise.all([
		timeline.pageOf(tank.id, Number(event.url.searchParams.get('page') ?? 1)),
		social.standingOf(viewer, tank.id),
		water.latestOf(tank.id),
		isOwner ? upkeep.scheduleOfTank(tank.id, zoneOf(viewer), { now }) : Promise.resolve([]),
		tankPhotos.photoDays(viewer, tank.id)
	]);
	// Then and now: two of the days with photos the viewer may see (the oldest and newest unless chosen).
	const days = photoDays ?? [];
	const chosen = (name: string, fallback: string | undefined) => {
		const value = event.url.searchParams.get(name);
		return value && days.includes(value) ? value : fallback;
	};
	const thenDay = chosen('then', days.at(-1));
	const nowDay = chosen('now', days[0]);
	const compared = days.length >= 2 && thenDay && nowDay ? await tankPhotos.compare(viewer, tank.id, { then: thenDay, now: nowDay }) : null;
	const units = viewer?.units ?? 'metric';
	const latest = tests[0] ?? null;
	return {
		tank,
		figures: tanks.tankFigures(tank, { now }),
		descriptionHtml: storedHtml(tank.descriptionHtml, tank.description),
		isOwner,
		today: today(zoneOf(viewer), now),
		timeline: page,
		standing,
		schedule,
		recentTests: tests.slice(0, TABLE_TESTS),
		testCount: tests.length,
		latestTest: latest ? { test: latest, derived: derivedFigures(latest) } : null,
		warnings: latestWarnings(buildSeries(tests, units)),
		hasFeed: tank.visibility === 'public',
		comparison: compared?.then && compared.now ? { days, thenDay: thenDay!, nowDay: nowDay!, then: compared.then, now: compared.now } : null
	};
}) satisfies PageServerLoad;

const retireSchema = z.object({
	retiredOn: z
		.string()
		.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the day as YYYY-MM-DD.')
		.refine((d) => {
			try {
				return dayNumber(d) <= dayNumber(today());
			} catch {
				return false;
			}
		}, 'Give a day that is not in the future.'),
	retiredNote: z.string().trim().max(300, 'Keep the note to 300 characters.')
});

/** An id sent in a hidden field, or null when it is not one. */
const idField = (data: FormData, name: string) => {
	const value = String(data.get(name) ?? '');
	return /^[1-9]\d{0,14}$/.test(value) ? Number(value) : null;
};

/** Whether the member wants it on ('on'), off ('off') or toggled (anything else). */
const wanted = (data: FormData) => (data.get('want') === 'on' ? true : data.get('want') === 'off' ? false : undefined);

export const actions = {
	/** Admire or follow: anyone who may see the tank; "not found" otherwise, a refusal for one's own tank. */
	admire: formAction(async (event, data) => ({ admired: await social.toggleAdmire(requireUser(event), Number(event.params.id), wanted(data)) }), {
		id: 'social'
	}),
	follow: formAction(async (event, data) => ({ following: await social.toggleFollow(requireUser(event), Number(event.params.id), wanted(data)) }), {
		id: 'social'
	}),
	done: formAction(
		async (event, data) => {
			const { viewer } = await ownTankRow(event);
			const taskId = idField(data, 'taskId');
			if (!taskId) throw invalid({ taskId: 'Choose a task.' });
			return { done: await upkeep.markDone(viewer, taskId) };
		},
		{ id: 'done' }
	),
	undoEvent: formAction(async (event, data) => {
		const { viewer, tank } = await ownTankRow(event);
		const eventId = idField(data, 'eventId');
		if (!eventId) throw notFound('We could not find that event.');
		await upkeep.removeLoggedEvent(viewer, tank.id, eventId);
		return { undone: eventId };
	}),
	deleteTest: formAction(async (event, data) => {
		const { viewer, tank } = await ownTankRow(event);
		const testId = idField(data, 'testId');
		if (!testId) throw notFound('We could not find that test.');
		await water.remove(viewer, tank.id, testId);
		return { testDeleted: testId };
	}),
	retire: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTankRow(event);
			const input = parseForm(retireSchema, data);
			if (tank.setUpOn && input.retiredOn < tank.setUpOn) throw invalid({ retiredOn: 'That is before the tank was set up.' });
			await tanks.retire(viewer, tank.id, input.retiredOn, input.retiredNote);
			redirect(303, `/journals/${tank.id}`);
		},
		{ id: 'retire' }
	),
	reopen: formAction(async (event) => {
		const { viewer, tank } = await ownTankRow(event);
		await tanks.reopen(viewer, tank.id);
		redirect(303, `/journals/${tank.id}`);
	}),
	delete: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTankRow(event);
			if (String(data.get('confirmName') ?? '').trim() !== tank.name) throw invalid({ confirmName: 'Type the tank’s name exactly to delete it.' });
			await tankDeletion.deleteTank(viewer, tank.id);
			redirect(303, '/journals?deleted=1');
		},
		{ id: 'delete' }
	)
} satisfies Actions;
