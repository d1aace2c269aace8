import * as tanks from '$lib/server/journals/tanks';
import { SALT_CHOICES, workOutDose } from '$lib/journals/dose-form';
import type { PageServerLoad } from './$types';

// Public, like any calculator; a tank named in ?tank= fills in its volume only for those who may see it.
export const load = (async ({ url, locals }) => {
	const units = locals.user?.units ?? 'metric';
	const tankParam = url.searchParams.get('tank') ?? '';
	const tank = /^[1-9]\d{0,14}$/.test(tankParam) ? await tanks.findVisible(locals.user, Number(tankParam)) : null;
	return {
		...workOutDose(url.searchParams, units, tank?.volumeLitres ?? null),
		units,
		tank: tank ? { id: tank.id, name: tank.name } : null,
		salts: SALT_CHOICES
	};
}) satisfies PageServerLoad;
