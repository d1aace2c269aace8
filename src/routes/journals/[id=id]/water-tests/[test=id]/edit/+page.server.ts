import { redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import { pageLoad } from '$lib/server/http/loads';
import * as water from '$lib/server/journals/water';
import { invalid } from '$lib/errors';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { parseWaterTest, waterTestDraftFrom, waterTestDraftOf } from '$lib/journals/water-tests';
import { ownTankRow } from '../../../own-tank.server';
import type { Actions, PageServerLoad } from './$types';

export const load = pageLoad(async (event) => {
	const { viewer, tank } = await ownTankRow(event);
	const test = await water.getOwn(viewer, tank.id, Number(event.params.test));
	return {
		tank: { id: tank.id, name: tank.name },
		test: { id: test.id, createdAt: test.createdAt, editedAt: test.editedAt },
		draft: waterTestDraftOf(test, viewer.units),
		today: today(zoneOf(viewer)),
		units: viewer.units
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTankRow(event);
			const parsed = parseWaterTest(waterTestDraftFrom(data), viewer.units, { today: today(zoneOf(viewer)), notBefore: tank.setUpOn });
			if (!parsed.ok) throw invalid(parsed.errors);
			await water.update(viewer, tank.id, Number(event.params.test), parsed.input);
			redirect(303, `/journals/${tank.id}?testEdited=1#water-heading`);
		},
		{ values: (data) => waterTestDraftFrom(data) }
	)
} satisfies Actions;
