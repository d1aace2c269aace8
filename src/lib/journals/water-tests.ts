// Water tests: the form (any subset of readings, temperature in the member's unit), where each
// reading falls against the common target bands, the CO2 and un-ionised ammonia estimates worked
// out from a test that has their inputs, and the per-parameter series the charts draw.
import {
	TARGET_BANDS,
	WATER_PARAMETERS,
	classifyReading,
	dayNumber,
	estimateCo2,
	co2FromHobbyRule,
	fromMetric,
	parseTemperature,
	roundTo,
	dangerousTotalAmmonia,
	totalAmmoniaAsNH3,
	unionisedAmmonia,
	UNIONISED_AMMONIA_LEVELS,
	unitSymbol,
	type AmmoniaBasis,
	type BandStatus,
	type Co2Estimate,
	type UnionisedAmmonia,
	type UnitSystem,
	type WaterParameter
} from './calc';

export const AMMONIA_BASIS_LABELS: Record<AmmoniaBasis, string> = {
	NH3: 'as NH₃ (most hobby kits)',
	NH4: 'as NH₄⁺',
	N: 'as nitrogen (NH₃-N, laboratory reports)'
};

/** The stored test: metric, every reading optional. */
export interface WaterTestValues {
	ph: number | null;
	kh: number | null;
	gh: number | null;
	no3: number | null;
	po4: number | null;
	k: number | null;
	fe: number | null;
	ammonia: number | null;
	ammoniaBasis: AmmoniaBasis;
	no2: number | null;
	temperatureC: number | null;
	tds: number | null;
}

export interface WaterTestInput extends WaterTestValues {
	testedOn: string;
	note: string;
}

type Column = Exclude<keyof WaterTestValues, 'ammoniaBasis'>;

/** Each parameter's column, form field, allowed range (metric) and shown decimals. */
/** `scale` is the decimals the column stores; `decimals` those shown. */
export const WATER_FIELDS: Record<WaterParameter, { column: Column; max: number; decimals: number; scale: number; short: string }> = {
	pH: { column: 'ph', max: 14, decimals: 2, scale: 2, short: 'pH' },
	KH: { column: 'kh', max: 60, decimals: 1, scale: 2, short: 'KH' },
	GH: { column: 'gh', max: 60, decimals: 1, scale: 2, short: 'GH' },
	NO3: { column: 'no3', max: 500, decimals: 1, scale: 2, short: 'NO₃' },
	PO4: { column: 'po4', max: 100, decimals: 2, scale: 2, short: 'PO₄' },
	K: { column: 'k', max: 500, decimals: 1, scale: 2, short: 'K' },
	Fe: { column: 'fe', max: 20, decimals: 2, scale: 3, short: 'Fe' },
	ammonia: { column: 'ammonia', max: 50, decimals: 2, scale: 3, short: 'Ammonia' },
	NO2: { column: 'no2', max: 50, decimals: 2, scale: 3, short: 'NO₂' },
	temperature: { column: 'temperatureC', max: 45, decimals: 1, scale: 1, short: 'Temp.' },
	TDS: { column: 'tds', max: 5000, decimals: 0, scale: 0, short: 'TDS' }
};

export type WaterTestDraft = Record<Column, string> & { testedOn: string; ammoniaBasis: string; note: string };

export const emptyWaterTestDraft = (today: string): WaterTestDraft => ({
	testedOn: today,
	ph: '',
	kh: '',
	gh: '',
	no3: '',
	po4: '',
	k: '',
	fe: '',
	ammonia: '',
	ammoniaBasis: 'NH3',
	no2: '',
	temperatureC: '',
	tds: '',
	note: ''
});

export function waterTestDraftFrom(form: FormData): WaterTestDraft {
	const text = (key: string) => String(form.get(key) ?? '').trim();
	const draft = emptyWaterTestDraft(text('testedOn'));
	for (const key of Object.keys(draft) as (keyof WaterTestDraft)[]) draft[key] = text(key);
	draft.ammoniaBasis ||= 'NH3';
	return draft;
}

/** A stored test as its edit form starts: every reading as typed, temperature in the member's unit. */
export function waterTestDraftOf(test: WaterTestInput, units: UnitSystem): WaterTestDraft {
	const draft = emptyWaterTestDraft(test.testedOn);
	for (const parameter of WATER_PARAMETERS) {
		const { column } = WATER_FIELDS[parameter];
		const value = test[column];
		if (value === null) continue;
		// One decimal of °F is finer than the tenth of a °C kept, so saving the form unchanged keeps the value.
		draft[column] = String(parameter === 'temperature' ? roundTo(fromMetric('temperature', value, units), 1) : value);
	}
	return { ...draft, ammoniaBasis: test.ammoniaBasis, note: test.note };
}

export type WaterTestParse = { ok: true; input: WaterTestInput } | { ok: false; errors: Record<string, string> };

/** Reads the form; at least one reading is needed. Temperature is typed in °C or °F by the member's units. */
export function parseWaterTest(draft: WaterTestDraft, units: UnitSystem, options: { today: string; notBefore?: string | null }): WaterTestParse {
	const errors: Record<string, string> = {};
	const values: Partial<WaterTestValues> = {};
	for (const parameter of WATER_PARAMETERS) {
		const field = WATER_FIELDS[parameter];
		const raw = draft[field.column].replace(',', '.');
		if (!raw) {
			values[field.column] = null;
			continue;
		}
		let value: number;
		if (parameter === 'temperature') {
			const parsed = parseTemperature(raw, units);
			if (!parsed.ok) {
				errors[field.column] = parsed.error;
				continue;
			}
			value = parsed.value;
			if (value < 0 || value > field.max) {
				errors[field.column] = `Enter a water temperature between ${units === 'us' ? '32 and 113 °F' : `0 and ${field.max} °C`}.`;
				continue;
			}
		} else {
			value = Number(raw);
			if (!/^\d*\.?\d+$/.test(raw) || !Number.isFinite(value)) {
				errors[field.column] = 'Enter a number, such as 6.8 or 0.25.';
				continue;
			}
			if (value > field.max) {
				errors[field.column] = `That is more than any test kit reads (up to ${field.max}); check the number.`;
				continue;
			}
		}
		values[field.column] = roundTo(value, field.scale);
	}
	const basis = (['NH3', 'NH4', 'N'] as const).find((b) => b === draft.ammoniaBasis);
	if (!basis) errors.ammoniaBasis = 'Choose how your kit reports ammonia.';
	let testedOn = draft.testedOn;
	try {
		if (dayNumber(testedOn) > dayNumber(options.today)) errors.testedOn = 'That day has not come yet.';
		else if (options.notBefore && testedOn < options.notBefore) errors.testedOn = 'That is before the tank was set up.';
	} catch {
		errors.testedOn = 'Give the day as YYYY-MM-DD.';
		testedOn = '';
	}
	const note = draft.note.trim();
	if (note.length > 500) errors.note = 'Keep the note to 500 characters.';
	if (!Object.keys(errors).length && WATER_PARAMETERS.every((p) => values[WATER_FIELDS[p].column] === null)) {
		errors.readings = 'Enter at least one reading.';
	}
	if (Object.keys(errors).length) return { ok: false, errors };
	return { ok: true, input: { ...(values as Omit<WaterTestValues, 'ammoniaBasis'>), ammoniaBasis: basis!, testedOn, note } };
}

/** A reading as the bands judge it: total ammonia on the NH3 basis the bands are written in. */
export function bandValue(parameter: WaterParameter, test: WaterTestValues): number | null {
	const raw = test[WATER_FIELDS[parameter].column];
	if (raw === null) return null;
	return parameter === 'ammonia' ? totalAmmoniaAsNH3(raw, test.ammoniaBasis) : raw;
}

/**
 * How an ammonia reading is judged. The harm comes from un-ionised NH3, so with the test's pH and
 * temperature the reading is judged on NH3 (Emerson et al. 1975 for the split; danger at the
 * IFAS FA16 level, concern at the common-practice one), and the total's usual band can only say
 * "above the usual range". Without pH or temperature only the total is known, and the total
 * band's levels (common practice, no source) are used, saying so.
 */
export type AmmoniaJudgement =
	| { basis: 'unionised'; status: BandStatus; totalAsNH3: number; nh3MgPerL: number; ph: number; tempC: number; dangerAtTotal: number }
	| { basis: 'total'; status: BandStatus; totalAsNH3: number; missing: ('pH' | 'temperature')[]; dangerAtTotal: number | null };

export function judgeAmmonia(test: WaterTestValues): AmmoniaJudgement | null {
	if (test.ammonia === null) return null;
	const totalAsNH3 = totalAmmoniaAsNH3(test.ammonia, test.ammoniaBasis);
	const totalStatus = classifyReading('ammonia', totalAsNH3);
	if (test.ph === null || test.temperatureC === null) {
		const missing = [...(test.ph === null ? (['pH'] as const) : []), ...(test.temperatureC === null ? (['temperature'] as const) : [])];
		return { basis: 'total', status: totalStatus, totalAsNH3, missing, dangerAtTotal: TARGET_BANDS.ammonia.dangerHigh ?? null };
	}
	const u = unionisedAmmonia({ totalMgPerL: test.ammonia, basis: test.ammoniaBasis, pH: test.ph, tempC: test.temperatureC });
	const status: BandStatus = u.level === 'danger' ? 'danger' : u.level === 'concern' || totalStatus !== 'in-band' ? 'high' : 'in-band';
	return {
		basis: 'unionised',
		status,
		totalAsNH3,
		nh3MgPerL: u.nh3MgPerL,
		ph: test.ph,
		tempC: test.temperatureC,
		dangerAtTotal: dangerousTotalAmmonia(test.ph, test.temperatureC)
	};
}

/** Where a reading falls; ammonia as `judgeAmmonia` says. */
function statusOf(parameter: WaterParameter, test: WaterTestValues): BandStatus | null {
	if (parameter === 'ammonia') return judgeAmmonia(test)?.status ?? null;
	const value = bandValue(parameter, test);
	return value === null ? null : classifyReading(parameter, value);
}

export interface Reading {
	parameter: WaterParameter;
	/** As stored (ammonia on the kit's basis). */
	value: number;
	status: BandStatus;
}

export function readingsOf(test: WaterTestValues): Reading[] {
	return WATER_PARAMETERS.flatMap((parameter) => {
		const value = test[WATER_FIELDS[parameter].column];
		if (value === null) return [];
		return [{ parameter, value, status: statusOf(parameter, test)! }];
	});
}

export interface DerivedFigures {
	/** Needs total ammonia, pH and temperature. */
	ammonia: UnionisedAmmonia | null;
	/** Needs pH and KH; the equilibrium figure also needs temperature. */
	co2: { estimate: Co2Estimate | null; hobbyRuleMgPerL: number } | null;
}

export function derivedFigures(test: WaterTestValues): DerivedFigures {
	const ammonia =
		test.ammonia !== null && test.ph !== null && test.temperatureC !== null
			? unionisedAmmonia({ totalMgPerL: test.ammonia, basis: test.ammoniaBasis, pH: test.ph, tempC: test.temperatureC })
			: null;
	const co2 =
		test.ph !== null && test.kh !== null
			? {
					estimate: test.temperatureC !== null ? estimateCo2({ kh: test.kh, pH: test.ph, tempC: test.temperatureC }) : null,
					hobbyRuleMgPerL: co2FromHobbyRule({ kh: test.kh, pH: test.ph })
				}
			: null;
	return { ammonia, co2 };
}

/** The unit a parameter is shown in for the member (temperature in °F for US members). */
export const displayUnit = (parameter: WaterParameter, units: UnitSystem) =>
	parameter === 'temperature' ? unitSymbol('temperature', units) : TARGET_BANDS[parameter].unit;

const shown = (parameter: WaterParameter, metric: number, units: UnitSystem) =>
	parameter === 'temperature' ? roundTo(fromMetric('temperature', metric, units), 1) : metric;

export interface SeriesPoint {
	id: number;
	on: string;
	/** In the member's unit; ammonia on the NH3 basis. */
	value: number;
	status: BandStatus;
	/** Ammonia only: the total (as NH3) at which this test's water reaches the danger level, and how it was judged. */
	ammonia?: AmmoniaJudgement;
	dangerAt?: number | null;
}

export interface Series {
	parameter: WaterParameter;
	label: string;
	unit: string;
	decimals: number;
	/** The common target band (common practice, no source), in the member's unit. */
	band: { low: number; high: number } | null;
	danger: { low?: number; high?: number };
	note: string | null;
	points: SeriesPoint[];
	/** Readings outside the band and at danger levels. */
	outOfBand: number;
	dangerous: number;
}

/** One series per parameter with at least one reading, oldest reading first. */
export function buildSeries(tests: readonly (WaterTestValues & { id: number; testedOn: string })[], units: UnitSystem): Series[] {
	const ordered = [...tests].sort((a, b) => (a.testedOn < b.testedOn ? -1 : a.testedOn > b.testedOn ? 1 : a.id - b.id));
	return WATER_PARAMETERS.flatMap((parameter) => {
		const band = TARGET_BANDS[parameter];
		const points: SeriesPoint[] = ordered.flatMap((t) => {
			const value = bandValue(parameter, t);
			if (value === null) return [];
			const point: SeriesPoint = { id: t.id, on: t.testedOn, value: shown(parameter, value, units), status: statusOf(parameter, t)! };
			if (parameter === 'ammonia') {
				point.ammonia = judgeAmmonia(t)!;
				point.dangerAt = point.ammonia.dangerAtTotal;
			}
			return [point];
		});
		if (!points.length) return [];
		const convert = (v: number | undefined) => (v === undefined ? undefined : shown(parameter, v, units));
		return [
			{
				parameter,
				label: band.label,
				unit: displayUnit(parameter, units),
				decimals: WATER_FIELDS[parameter].decimals,
				band: { low: convert(band.low)!, high: convert(band.high)! },
				// Ammonia's danger line follows each test's pH and temperature (the points carry it).
				danger: parameter === 'ammonia' ? {} : { low: convert(band.dangerLow), high: convert(band.dangerHigh) },
				note: band.note ?? null,
				points,
				outOfBand: points.filter((p) => p.status !== 'in-band').length,
				dangerous: points.filter((p) => p.status === 'danger').length
			}
		];
	});
}

export interface Warning {
	parameter: WaterParameter;
	status: Exclude<BandStatus, 'in-band'>;
	value: number;
	on: string;
	text: string;
}

const mgL = (v: number) => `${roundTo(v, v < 0.01 ? 4 : 3)} mg/L`;

/** What an ammonia reading means, in whole sentences: on the un-ionised figure, or on the total alone and saying why. */
export function ammoniaVerdict(value: string, j: AmmoniaJudgement): string {
	const { concern, danger } = UNIONISED_AMMONIA_LEVELS;
	if (j.basis === 'total') {
		const missing = j.missing.length === 2 ? 'pH or temperature' : j.missing[0] === 'pH' ? 'pH' : 'temperature';
		const alone = `No ${missing} was recorded with this test, so the harmful un-ionised share cannot be worked out and the total alone is used.`;
		if (j.status === 'danger') return `Total ammonia read ${value}. ${alone} At this total, fish are at risk in most tank water. ${DANGER_ADVICE.ammonia}`;
		if (j.status === 'high') return `Total ammonia read ${value}, above the usual range. ${alone} Test pH and temperature with it next time.`;
		return `Total ammonia read ${value}. ${alone}`;
	}
	const where = `At pH ${roundTo(j.ph, 2)} and ${roundTo(j.tempC, 1)} °C, ${mgL(j.nh3MgPerL)} of it is un-ionised ammonia (NH₃), the form that harms fish`;
	if (j.status === 'danger')
		return `Total ammonia read ${value}. ${where}: at or above ${danger} mg/L, which may harm fish (University of Florida circular FA16). ${DANGER_ADVICE.ammonia}`;
	if (j.nh3MgPerL >= concern)
		return `Total ammonia read ${value}. ${where}: above the ${concern} mg/L keepers take as the start of long-term stress. Find the source and change some water.`;
	if (j.status === 'high')
		return `Total ammonia read ${value}, above the usual range. ${where}: below the ${concern} mg/L keepers take as the start of long-term stress, so not dangerous now; find the source before it rises.`;
	return `Total ammonia read ${value}. ${where}: below the ${concern} mg/L keepers take as the start of long-term stress.`;
}

/** What the latest test of each parameter says, when it is off target (danger first). */
export function latestWarnings(series: readonly Series[]): Warning[] {
	const warnings = series.flatMap((s) => {
		const last = s.points.at(-1);
		if (!last || last.status === 'in-band') return [];
		const value = `${roundTo(last.value, s.decimals)}${s.unit ? ` ${s.unit}` : ''}`;
		const text = last.ammonia
			? ammoniaVerdict(value, last.ammonia)
			: last.status === 'danger'
				? `${s.label} read ${value}: a level that harms fish. ${DANGER_ADVICE[s.parameter] ?? 'Act on it today.'}`
				: `${s.label} read ${value}, ${last.status === 'low' ? 'below' : 'above'} the usual ${roundTo(s.band!.low, s.decimals)}–${roundTo(s.band!.high, s.decimals)}${s.unit ? ` ${s.unit}` : ''}.`;
		return [{ parameter: s.parameter, status: last.status, value: last.value, on: last.on, text }];
	});
	return warnings.sort((a, b) => Number(b.status === 'danger') - Number(a.status === 'danger'));
}

/** Usual first steps (common practice, no source); local advice and a vet for fish come first. */
const DANGER_ADVICE: Partial<Record<WaterParameter, string>> = {
	ammonia:
		'Keepers usually change a large share of the water at once with dechlorinated water of the same temperature, feed little or nothing, and test again the next day.',
	NO2: 'Keepers usually change a large share of the water at once, feed little, and test daily until nitrite reads zero.',
	NO3: 'Change water in steps over a few days rather than all at once, and look for the source (overfeeding, a dead animal, too much dosing).',
	pH: 'Check the test and the CO2 first; change the pH slowly, over days, never in one go.',
	temperature: 'Check the heater and the room; bring the temperature back slowly, a degree or two an hour at most.'
};
