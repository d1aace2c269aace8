import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as tanks from '$lib/server/journals/tanks';
import * as upkeep from '$lib/server/journals/upkeep';
import { SALT_IDS } from '$lib/journals/calc';
import { SALT_CHOICES, workOutDose } from '$lib/journals/dose-form';
import type { Actions, PageServerLoad } from './$types';

// Public, like any calculator; a tank named in ?tank= fills in its volume only for those who may see it.
export const load = (async ({ url, locals }) => {
	const units = locals.user?.units ?? 'metric';
	const tankParam = url.searchParams.get('tank') ?? '';
	const [tank, own] = await Promise.all([
		/^[1-9]\d{0,14}$/.test(tankParam) ? tanks.findVisible(locals.user, Number(tankParam)) : null,
		locals.user ? tanks.listOwn(locals.user, { retired: false }) : []
	]);
	return {
		...workOutDose(url.searchParams, units, tank?.volumeLitres ?? null),
		units,
		tank: tank ? { id: tank.id, name: tank.name, own: tank.ownerId === locals.user?.id } : null,
		ownTanks: own.map((t) => ({ id: t.id, name: t.name })),
		salts: SALT_CHOICES
	};
}) satisfies PageServerLoad;

const logForm = z.object({
	tank: z
		.string()
		.regex(/^[1-9]\d{0,14}$/, 'Choose one of your tanks.')
		.transform(Number),
	salt: z.enum(SALT_IDS, { message: 'Choose a salt.' }),
	grams: z.coerce.number({ message: 'Work out a dose first.' }).positive('Work out a dose first.')
});

export const actions = {
	/** Logs the dose worked out to the member's own tank's journal; another's tank is "not found". */
	log: formAction(async (event, data) => {
		const viewer = requireUser(event);
		const input = parseForm(logForm, data);
		return { logged: await upkeep.logDose(viewer, input.tank, { saltId: input.salt, grams: input.grams }) };
	})
} satisfies Actions;
