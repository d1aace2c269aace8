import { redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import { draftFromTank } from '$lib/journals/tank-form';
import { readTankForm, tankFormAgain } from '../../form.server';
import { ownTank } from '../own-tank.server';
import type { Actions, PageServerLoad } from './$types';

/** The saved lights' watts over the saved water volume, for the form's comparison; null without either. */
function savedLighting(tank: tanks.Tank) {
	const figures = tanks.tankFigures(tank);
	return figures.lighting && figures.volume ? { watts: figures.lighting.totalWatts, litres: figures.volume.litres } : null;
}

export const load = (async (event) => {
	const { viewer, tank } = await ownTank(event);
	return {
		tank: { id: tank.id, name: tank.name },
		draft: draftFromTank(tank, viewer.units),
		cover: tank.cover ? [{ id: tank.cover.id, alt: tank.cover.alt, caption: tank.cover.caption, urls: tank.cover.urls }] : [],
		savedLighting: savedLighting(tank),
		units: viewer.units
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTank(event);
			const { input, cover } = readTankForm(data, viewer);
			await tanks.update(viewer, tank.id, input, cover);
			redirect(303, `/journals/${tank.id}?saved=1`);
		},
		{ values: (data, event) => tankFormAgain(data, event, Number(event.params.id)) }
	)
} satisfies Actions;
