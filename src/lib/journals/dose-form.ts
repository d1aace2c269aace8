// The dose calculator's question and answer. The page is a GET form (it works without
// JavaScript): the query says which salt, how much or which target, and the water volume in the
// member's units; this reads it, checks each field and works the dose out through ./calc.
import {
	NUTRIENTS,
	SALT_IDS,
	SALTS,
	CalcInputError,
	doseContribution,
	fromMetric,
	gramsForTarget,
	massFraction,
	mgHco3ToDkh,
	parseVolume,
	roundTo,
	type Nutrient,
	type SaltId,
	type UnitSystem
} from './calc';

export const DOSE_MODES = ['grams', 'target', 'stock'] as const;
export type DoseMode = (typeof DOSE_MODES)[number];

/** What each mode answers, in the club's words. */
export const DOSE_MODE_LABELS: Record<DoseMode, string> = {
	grams: 'What does this dose add?',
	target: 'How much salt for a rise?',
	stock: 'Dosing from a stock solution'
};

export interface DoseValues {
	salt: SaltId;
	mode: DoseMode;
	nutrient: Nutrient;
	volume: string;
	grams: string;
	target: string;
	/** Stock solution: grams of salt, the volume it is made up to (mL), and millilitres per dose. */
	stockGrams: string;
	stockMl: string;
	doseMl: string;
}

export interface StockSolution {
	/** Grams of salt per litre of stock. */
	gPerL: number;
	/** Whole doses in one batch. */
	doses: number;
}

export interface DoseResult {
	/** Grams of salt that reach the tank (in stock mode, the salt in one dose of the solution). */
	grams: number;
	stock?: StockSolution;
	/** What the dose adds, mg/L of each nutrient; bicarbonate also as the rise in KH (°dKH). */
	adds: { nutrient: Nutrient; mgPerL: number; khRiseDkh?: number }[];
}

export interface DoseAnswer {
	values: DoseValues;
	errors: Record<string, string>;
	/** Null until the form is sent, or while a field is wrong. */
	result: DoseResult | null;
}

const isSalt = (v: string): v is SaltId => (SALT_IDS as readonly string[]).includes(v);
const isNutrient = (v: string): v is Nutrient => (NUTRIENTS as readonly string[]).includes(v);
const suppliedBy = (salt: SaltId) => Object.keys(SALTS[salt].yields) as Nutrient[];

/**
 * Reads the calculator's query. `tankLitres` is the volume of a tank named in it, filling the
 * volume field when the member typed none.
 */
export function workOutDose(query: URLSearchParams, units: UnitSystem, tankLitres: number | null): DoseAnswer {
	const q = (key: string) => (query.get(key) ?? '').trim();
	const saltParam = q('salt');
	const nutrientParam = q('nutrient');
	const salt: SaltId = isSalt(saltParam) ? saltParam : 'KNO3';
	const modeParam = q('mode');
	const mode: DoseMode = (DOSE_MODES as readonly string[]).includes(modeParam) ? (modeParam as DoseMode) : 'grams';
	const nutrient: Nutrient = isNutrient(nutrientParam) ? nutrientParam : suppliedBy(salt)[0]!;
	const volumeText = q('volume') || (tankLitres ? String(roundTo(fromMetric('volume', tankLitres, units), 1)) : '');
	const values: DoseValues = {
		salt,
		mode,
		nutrient,
		volume: volumeText,
		grams: q('grams'),
		target: q('target'),
		stockGrams: q('stockGrams'),
		stockMl: q('stockMl'),
		doseMl: q('doseMl')
	};
	const errors: Record<string, string> = {};
	if (!query.has('salt')) return { values, errors, result: null };

	const volume = parseVolume(volumeText, units, { allowZero: false });
	if (!volume.ok) errors.volume = volume.error;
	const positive = (key: 'grams' | 'target' | 'stockGrams' | 'stockMl' | 'doseMl') => {
		const n = Number(values[key].replace(',', '.'));
		if (values[key] && Number.isFinite(n) && n > 0) return n;
		errors[key] = 'Enter a number greater than zero.';
		return null;
	};
	let stock: StockSolution | undefined;
	let amount: number | null;
	if (mode === 'stock') {
		const [stockGrams, stockMl, doseMl] = [positive('stockGrams'), positive('stockMl'), positive('doseMl')];
		if (stockMl !== null && doseMl !== null && doseMl > stockMl) errors.doseMl = 'A dose cannot be more than the whole solution.';
		amount = stockGrams !== null && stockMl !== null && doseMl !== null && !errors.doseMl ? stockDoseGrams(stockGrams, stockMl, doseMl) : null;
		if (amount !== null) stock = { gPerL: (stockGrams! * 1000) / stockMl!, doses: Math.floor(stockMl! / doseMl! + 1e-9) };
	} else amount = positive(mode);
	if (!volume.ok || amount === null) return { values, errors, result: null };
	try {
		const grams = mode === 'target' ? gramsForTarget(salt, nutrient, amount, volume.value) : amount;
		const adds = (Object.entries(doseContribution(salt, grams, volume.value)) as [Nutrient, number][]).map(([n, mgPerL]) =>
			n === 'HCO3' ? { nutrient: n, mgPerL, khRiseDkh: mgHco3ToDkh(mgPerL) } : { nutrient: n, mgPerL }
		);
		return { values, errors, result: { grams, adds, ...(stock ? { stock } : {}) } };
	} catch (e) {
		// The salt does not supply the nutrient asked for.
		if (!(e instanceof CalcInputError)) throw e;
		errors.nutrient = e.message;
		return { values, errors, result: null };
	}
}

/**
 * Grams of salt in one dose of a stock solution: `stockGrams` dissolved and made up to `stockMl`,
 * of which `doseMl` is dosed. Made up to the volume (not added to it), so the share is exact.
 */
export function stockDoseGrams(stockGrams: number, stockMl: number, doseMl: number): number {
	return (stockGrams * doseMl) / stockMl;
}

/** The salts to choose from, with what each supplies and its shares by mass. */
export const SALT_CHOICES = SALT_IDS.map((id) => ({
	id,
	name: SALTS[id].name,
	formula: SALTS[id].formula,
	supplies: suppliedBy(id),
	fractions: suppliedBy(id).map((n) => ({ nutrient: n, percent: massFraction(id, n) * 100 }))
}));
