import * as tanks from '$lib/server/journals/tanks';
import {
	NUTRIENTS,
	SALT_IDS,
	SALTS,
	doseContribution,
	fromMetric,
	gramsForTarget,
	massFraction,
	parseVolume,
	roundTo,
	CalcInputError,
	type Nutrient,
	type SaltId
} from '$lib/journals/calc';
import type { PageServerLoad } from './$types';

// Public, like any calculator; a tank named in ?tank= fills in its volume only for those who may see it.
export const load = (async ({ url, locals }) => {
	const units = locals.user?.units ?? 'metric';
	const q = (key: string) => (url.searchParams.get(key) ?? '').trim();
	const tankId = /^[1-9]\d{0,14}$/.test(q('tank')) ? Number(q('tank')) : null;
	const tank = tankId ? await tanks.findVisible(locals.user, tankId) : null;
	const salt = (SALT_IDS as readonly string[]).includes(q('salt')) ? (q('salt') as SaltId) : 'KNO3';
	const mode = q('mode') === 'target' ? 'target' : 'grams';
	const nutrient = (NUTRIENTS as readonly string[]).includes(q('nutrient')) ? (q('nutrient') as Nutrient) : (Object.keys(SALTS[salt].yields)[0] as Nutrient);
	const volumeText = q('volume') || (tank?.volumeLitres ? String(roundTo(fromMetric('volume', tank.volumeLitres, units), 1)) : '');
	const values = { salt, mode, nutrient, volume: volumeText, grams: q('grams'), target: q('target') };
	const errors: Record<string, string> = {};
	let result: { grams: number; adds: { nutrient: Nutrient; mgPerL: number }[] } | null = null;
	const asked = url.searchParams.has('salt');
	if (asked) {
		const volume = parseVolume(volumeText, units, { allowZero: false });
		if (!volume.ok) errors.volume = volume.error;
		const number = (key: 'grams' | 'target') => {
			const n = Number(values[key].replace(',', '.'));
			if (!values[key] || !Number.isFinite(n) || n <= 0) {
				errors[key] = 'Enter a number greater than zero.';
				return null;
			}
			return n;
		};
		const amount = mode === 'grams' ? number('grams') : number('target');
		if (volume.ok && amount !== null) {
			try {
				const grams = mode === 'grams' ? amount : gramsForTarget(salt, nutrient, amount, volume.value);
				const adds = doseContribution(salt, grams, volume.value);
				result = { grams, adds: (Object.entries(adds) as [Nutrient, number][]).map(([n, mgPerL]) => ({ nutrient: n, mgPerL })) };
			} catch (e) {
				if (e instanceof CalcInputError) errors.nutrient = e.message;
				else throw e;
			}
		}
	}
	return {
		values,
		errors,
		result,
		units,
		tank: tank ? { id: tank.id, name: tank.name } : null,
		salts: SALT_IDS.map((id) => ({
			id,
			name: SALTS[id].name,
			formula: SALTS[id].formula,
			supplies: Object.keys(SALTS[id].yields) as Nutrient[],
			fractions: (Object.keys(SALTS[id].yields) as Nutrient[]).map((n) => ({ nutrient: n, percent: massFraction(id, n) * 100 }))
		}))
	};
}) satisfies PageServerLoad;
