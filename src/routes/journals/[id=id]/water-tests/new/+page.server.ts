import { redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import * as water from '$lib/server/journals/water';
import { invalid } from '$lib/errors';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { emptyWaterTestDraft, parseWaterTest, waterTestDraftFrom } from '$lib/journals/water-tests';
import { ownTankRow } from '../../own-tank.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const { viewer, tank } = await ownTankRow(event);
	const day = today(zoneOf(viewer));
	return { tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn }, draft: emptyWaterTestDraft(day), today: day, units: viewer.units };
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTankRow(event);
			const parsed = parseWaterTest(waterTestDraftFrom(data), viewer.units, { today: today(zoneOf(viewer)), notBefore: tank.setUpOn });
			if (!parsed.ok) throw invalid(parsed.errors);
			await water.create(viewer, tank.id, parsed.input);
			redirect(303, `/journals/${tank.id}?tested=1#latest-heading`);
		},
		{ values: (data) => waterTestDraftFrom(data) }
	)
} satisfies Actions;
