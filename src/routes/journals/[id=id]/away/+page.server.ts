import { redirect } from '@sveltejs/kit';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as plans from '$lib/server/away/plans';
import { today } from '$lib/dates';
import { awayPlanForm } from '$lib/away/plan-form';
import { ownTankRow } from '../own-tank.server';
import { pageLoad } from '$lib/server/http/loads';
import type { Actions, PageServerLoad } from './$types';

export const load = pageLoad(async (event) => {
	const { viewer, tank } = await ownTankRow(event);
	return {
		tank: { id: tank.id, name: tank.name },
		today: today(),
		loggedEvaporation: await plans.loggedEvaporation(viewer, tank.id)
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(async (event, data) => {
		const { viewer, tank } = await ownTankRow(event);
		const id = await plans.start(viewer, tank.id, parseForm(awayPlanForm, data));
		redirect(303, `/away/${id}`);
	})
} satisfies Actions;
