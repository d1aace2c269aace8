// The tank profile form: what the member typed (a draft of strings, in their own units) and the
// validated, metric TankInput the domain takes. Conversions go through ./calc so every form and
// page agrees on units and rounding.
import { composed, nameProblem } from '../text';
import {
	compareLighting,
	dayNumber,
	formatGlass,
	formatTemperature,
	fromMetric,
	PAR_RANGE,
	parseLength,
	parseTemperature,
	parseVolume,
	roundTo,
	SUBSTRATE_KINDS,
	unitSymbol,
	type UnitSystem
} from './calc';
import { PLACEMENTS, type Placement } from '../species/kinds';
import { CO2_METHODS, FLOW_UNITS, TANK_VISIBILITIES, type Co2Method, type FlowUnit, type TankVisibility } from './tank-vocabulary';
import type { StoredTankProfile, TankInput } from './tank-input';

export const SUBSTRATE_CHOICES = [...SUBSTRATE_KINDS, 'other'] as const;

export interface LightDraft {
	id: string;
	label: string;
	watts: string;
	hours: string;
}
export interface FilterDraft {
	id: string;
	label: string;
	flow: string;
	unit: string;
	media: string;
}
export interface FertiliserDraft {
	id: string;
	item: string;
	amount: string;
	frequency: string;
}
export interface PlantDraft {
	id: string;
	speciesId: string;
	name: string;
	placement: string;
	added: string;
	removed: string;
}
export interface LivestockDraft {
	id: string;
	speciesId: string;
	name: string;
	count: string;
	added: string;
	removed: string;
}

export interface TankDraft {
	name: string;
	style: string;
	setUpOn: string;
	length: string;
	width: string;
	height: string;
	glass: string;
	substrateKind: string;
	substrateNote: string;
	substrateDepth: string;
	hardscape: string;
	hardscapeVolume: string;
	heaterWatts: string;
	heaterSet: string;
	par: string;
	parDepth: string;
	heaterNote: string;
	co2Method: string;
	co2Bps: string;
	waterVolume: string;
	description: string;
	visibility: string;
	lights: LightDraft[];
	filters: FilterDraft[];
	fertilisers: FertiliserDraft[];
	plants: PlantDraft[];
	livestock: LivestockDraft[];
}

export const LIST_FIELDS = {
	lights: ['id', 'label', 'watts', 'hours'],
	filters: ['id', 'label', 'flow', 'unit', 'media'],
	fertilisers: ['id', 'item', 'amount', 'frequency'],
	plants: ['id', 'speciesId', 'name', 'placement', 'added', 'removed'],
	livestock: ['id', 'speciesId', 'name', 'count', 'added', 'removed']
} as const;
export type ListName = keyof typeof LIST_FIELDS;

/** Most rows of each list a profile keeps. */
export const LIST_MAX: Record<ListName, number> = { lights: 8, filters: 6, fertilisers: 20, plants: 80, livestock: 40 };

export const listFieldName = (list: ListName, index: number, field: string) => `${list}[${index}][${field}]`;

export function emptyRow<L extends ListName>(list: L, units: UnitSystem): TankDraft[L][number] {
	const row = Object.fromEntries(LIST_FIELDS[list].map((f) => [f, ''])) as Record<string, string>;
	if (list === 'filters') row.unit = units === 'us' ? 'usgph' : 'lph';
	if (list === 'livestock') row.count = '1';
	return row as unknown as TankDraft[L][number];
}

export function emptyDraft(units: UnitSystem): TankDraft {
	return {
		name: '',
		style: '',
		setUpOn: '',
		length: '',
		width: '',
		height: '',
		glass: '',
		substrateKind: '',
		substrateNote: '',
		substrateDepth: '',
		hardscape: '',
		hardscapeVolume: '',
		heaterWatts: '',
		heaterSet: '',
		par: '',
		parDepth: '',
		heaterNote: '',
		co2Method: 'none',
		co2Bps: '',
		waterVolume: '',
		description: '',
		visibility: 'club',
		lights: [emptyRow('lights', units)],
		filters: [emptyRow('filters', units)],
		fertilisers: [],
		plants: [],
		livestock: []
	};
}

const text = (form: FormData, key: string) => String(form.get(key) ?? '');

/** The draft as posted; repeatable rows are read by their index, in order, skipping blank rows. */
export function draftFromForm(form: FormData): TankDraft {
	const rows = <L extends ListName>(list: L): TankDraft[L] => {
		const indexes = new Set<number>();
		const pattern = new RegExp(`^${list}\\[(\\d{1,3})\\]\\[`);
		for (const key of form.keys()) {
			const match = pattern.exec(key);
			if (match) indexes.add(Number(match[1]));
		}
		const result = [...indexes]
			.sort((a, b) => a - b)
			.map((i) => Object.fromEntries(LIST_FIELDS[list].map((f) => [f, text(form, listFieldName(list, i, f)).trim()])) as Record<string, string>)
			.filter((r) => LIST_FIELDS[list].some((f) => f !== 'id' && f !== 'unit' && f !== 'count' && r[f] !== ''));
		return result as unknown as TankDraft[L];
	};
	return {
		name: text(form, 'name'),
		style: text(form, 'style'),
		setUpOn: text(form, 'setUpOn'),
		length: text(form, 'length'),
		width: text(form, 'width'),
		height: text(form, 'height'),
		glass: text(form, 'glass'),
		substrateKind: text(form, 'substrateKind'),
		substrateNote: text(form, 'substrateNote'),
		substrateDepth: text(form, 'substrateDepth'),
		hardscape: text(form, 'hardscape'),
		hardscapeVolume: text(form, 'hardscapeVolume'),
		heaterWatts: text(form, 'heaterWatts'),
		heaterSet: text(form, 'heaterSet'),
		par: text(form, 'par'),
		parDepth: text(form, 'parDepth'),
		heaterNote: text(form, 'heaterNote'),
		co2Method: text(form, 'co2Method') || 'none',
		co2Bps: text(form, 'co2Bps'),
		waterVolume: text(form, 'waterVolume'),
		description: text(form, 'description'),
		visibility: text(form, 'visibility'),
		lights: rows('lights'),
		filters: rows('filters'),
		fertilisers: rows('fertilisers'),
		plants: rows('plants'),
		livestock: rows('livestock')
	};
}

/** The glass is given in mm for metric members and in inches otherwise. */
export const glassUnit = (units: UnitSystem) => (units === 'metric' ? 'mm' : 'in');

const show = (value: number, decimals = 2) => String(roundTo(value, decimals));
const showLength = (cm: number | null, units: UnitSystem) => (cm === null ? '' : show(fromMetric('length', cm, units), units === 'metric' ? 1 : 2));
const showVolume = (litres: number | null, units: UnitSystem) => (litres === null ? '' : show(fromMetric('volume', litres, units), 2));

/** The stored tank as a draft in the member's units, for the edit form. */
export function draftFromTank(tank: StoredTankProfile, units: UnitSystem): TankDraft {
	return {
		name: tank.name,
		style: tank.style,
		setUpOn: tank.setUpOn ?? '',
		length: showLength(tank.lengthCm, units),
		width: showLength(tank.widthCm, units),
		height: showLength(tank.heightCm, units),
		glass: tank.glassMm === null ? '' : units === 'metric' ? show(tank.glassMm, 1) : formatGlass(tank.glassMm, units).replace(/ in$/, ''),
		substrateKind: tank.substrateKind,
		substrateNote: tank.substrateNote,
		substrateDepth: showLength(tank.substrateDepthCm, units),
		hardscape: tank.hardscape,
		hardscapeVolume: showVolume(tank.hardscapeLitres, units),
		heaterWatts: tank.heaterWatts === null ? '' : show(tank.heaterWatts, 1),
		heaterSet: tank.heaterSetC === null ? '' : show(fromMetric('temperature', tank.heaterSetC, units), 1),
		par: tank.parAtSubstrate === null ? '' : String(tank.parAtSubstrate),
		parDepth: showLength(tank.parDepthCm, units),
		heaterNote: tank.heaterNote,
		co2Method: tank.co2Method,
		co2Bps: tank.co2BubblesPerSecond === null ? '' : show(tank.co2BubblesPerSecond, 1),
		waterVolume: showVolume(tank.waterLitres, units),
		description: tank.description ?? '',
		visibility: tank.visibility,
		lights: tank.lights.map((l) => ({ id: String(l.id), label: l.label, watts: show(l.watts, 1), hours: show(l.hoursPerDay, 2) })),
		filters: tank.filters.map((f) => ({
			id: String(f.id),
			label: f.label,
			flow: f.ratedFlow === null ? '' : show(f.ratedFlow, 1),
			unit: f.flowUnit,
			media: f.mediaNotes
		})),
		fertilisers: tank.fertilisers.map((f) => ({ id: String(f.id), item: f.item, amount: f.amount, frequency: f.frequency })),
		plants: tank.plants.map((p) => ({
			id: String(p.id),
			speciesId: p.speciesId ? String(p.speciesId) : '',
			name: p.name,
			placement: p.placement ?? '',
			added: p.addedOn ?? '',
			removed: p.removedOn ?? ''
		})),
		livestock: tank.livestock.map((a) => ({
			id: String(a.id),
			speciesId: a.speciesId ? String(a.speciesId) : '',
			name: a.name,
			count: String(a.count),
			added: a.addedOn ?? '',
			removed: a.removedOn ?? ''
		}))
	};
}

export type TankFormResult = { ok: true; input: TankInput } | { ok: false; errors: Record<string, string> };

/** Reads a draft in the member's units into a validated, metric TankInput, or field errors. */
export function parseTankDraft(draft: TankDraft, units: UnitSystem, today: Date = new Date()): TankFormResult {
	const errors: Record<string, string> = {};
	const fail = (key: string, message: string) => {
		errors[key] ??= message;
		return null;
	};
	const words = (key: string, value: string, max: number, required = false): string => {
		const v = composed(value);
		if (required && !v) fail(key, 'This is needed.');
		if (v.length > max) fail(key, `Keep it to ${max} characters.`);
		const problem = nameProblem(v);
		if (problem) fail(key, problem);
		return v;
	};
	const number = (key: string, value: string, min: number, max: number, required = false): number | null => {
		const v = value.trim().replace(',', '.');
		if (!v) return required ? fail(key, 'This is needed.') : null;
		const n = Number(v);
		if (!Number.isFinite(n)) return fail(key, 'Enter a number.');
		if (n < min || n > max) return fail(key, `Enter a number from ${min} to ${max}.`);
		return n;
	};
	const measure = (key: string, value: string, parse: typeof parseLength, maxMetric: number, required = false, decimals = 2): number | null => {
		if (!value.trim()) return required ? fail(key, 'This is needed.') : null;
		const parsed = parse(value, units, { allowZero: !required });
		if (!parsed.ok) return fail(key, parsed.error);
		if (parsed.value > maxMetric) return fail(key, 'That is larger than any tank we expect; check the number and its unit.');
		return roundTo(parsed.value, decimals);
	};
	const day = (key: string, value: string): string | null => {
		const v = value.trim();
		if (!v) return null;
		try {
			const n = dayNumber(v);
			if (n > dayNumber(today)) return fail(key, 'That day has not come yet.');
			return v;
		} catch {
			return fail(key, 'Give a date as YYYY-MM-DD.');
		}
	};
	const rowId = (value: string) => (/^[1-9]\d{0,14}$/.test(value) ? Number(value) : undefined);
	const oneOf = <T extends string>(key: string, value: string, allowed: readonly T[], message: string): T | null =>
		(allowed as readonly string[]).includes(value) ? (value as T) : fail(key, message);

	const lengthOf = (key: string, value: string, required = true) => measure(key, value, parseLength, 1000, required);
	const lengthCm = lengthOf('length', draft.length);
	const widthCm = lengthOf('width', draft.width);
	const heightCm = lengthOf('height', draft.height);

	let glassMm: number | null = null;
	if (draft.glass.trim()) {
		const typed = /^\s*[\d.,/ ]+\s*$/.test(draft.glass) ? `${draft.glass.trim()} ${glassUnit(units)}` : draft.glass;
		const cm = measure('glass', typed, parseLength, 5, false, 4);
		if (cm !== null) glassMm = roundTo(cm * 10, 2);
		if (glassMm !== null && glassMm <= 0) fail('glass', 'Enter a thickness greater than zero, or leave it empty.');
	}

	/** A heater is set between 10 and 40 °C (a wider range is a typing error or a unit mix-up). */
	const heaterSetC = (): number | null => {
		if (!draft.heaterSet.trim()) return null;
		const parsed = parseTemperature(draft.heaterSet, units);
		if (!parsed.ok) return fail('heaterSet', parsed.error);
		if (parsed.value < 10 || parsed.value > 40)
			return fail('heaterSet', `Enter a setting from ${formatTemperature(10, units)} to ${formatTemperature(40, units)}; check the number and its unit.`);
		return roundTo(parsed.value, 1);
	};

	/** A meter's whole-number reading and the depth it was taken at, within the tank's height; both or neither. */
	const parReading = (): { parAtSubstrate: number | null; parDepthCm: number | null } => {
		const par = draft.par.trim();
		let parAtSubstrate: number | null = null;
		if (par) {
			if (!/^\d+$/.test(par) || Number(par) < PAR_RANGE.min || Number(par) > PAR_RANGE.max)
				fail('par', `Enter the meter's reading as a whole number from ${PAR_RANGE.min} to ${PAR_RANGE.max.toLocaleString('en-GB')}.`);
			else parAtSubstrate = Number(par);
		}
		const parDepthCm = measure('parDepth', draft.parDepth, parseLength, 1000, false, 1);
		if (parDepthCm !== null && parDepthCm <= 0) fail('parDepth', 'Enter a depth greater than zero.');
		else if (parDepthCm !== null && heightCm !== null && parDepthCm > heightCm)
			fail('parDepth', 'That is deeper than the tank is tall; check the number and its unit.');
		if (par && parDepthCm === null && !draft.parDepth.trim()) fail('parDepth', 'Give the depth under the water surface the reading was taken at.');
		if (!par && draft.parDepth.trim()) fail('par', 'Enter the reading, or leave the depth empty too.');
		return { parAtSubstrate, parDepthCm };
	};

	const substrateKind = draft.substrateKind ? oneOf('substrateKind', draft.substrateKind, SUBSTRATE_CHOICES, 'Choose a kind of substrate.') : '';
	const co2Method = oneOf<Co2Method>('co2Method', draft.co2Method, CO2_METHODS, 'Choose how CO2 is added.');
	const visibility = oneOf<TankVisibility>('visibility', draft.visibility, TANK_VISIBILITIES, 'Choose who may see this tank.');

	const input: TankInput = {
		name: words('name', draft.name, 80, true),
		style: words('style', draft.style, 40),
		setUpOn: day('setUpOn', draft.setUpOn),
		lengthCm: lengthCm ?? 0,
		widthCm: widthCm ?? 0,
		heightCm: heightCm ?? 0,
		glassMm,
		substrateKind: substrateKind ?? '',
		substrateNote: words('substrateNote', draft.substrateNote, 120),
		substrateDepthCm: lengthOf('substrateDepth', draft.substrateDepth, false),
		hardscape: words('hardscape', draft.hardscape, 500),
		hardscapeLitres: measure('hardscapeVolume', draft.hardscapeVolume, parseVolume, 5000),
		heaterWatts: number('heaterWatts', draft.heaterWatts, 1, 5000),
		heaterSetC: heaterSetC(),
		heaterNote: words('heaterNote', draft.heaterNote, 160),
		co2Method: co2Method ?? 'none',
		co2BubblesPerSecond: co2Method === 'pressurised' ? number('co2Bps', draft.co2Bps, 0.1, 99) : null,
		waterLitres: measure('waterVolume', draft.waterVolume, parseVolume, 20000),
		...parReading(),
		description: words('description', draft.description, 5000),
		visibility: visibility ?? 'club',
		lights: [],
		filters: [],
		fertilisers: [],
		plants: [],
		livestock: []
	};
	if (input.waterLitres === 0) fail('waterVolume', 'Enter a volume greater than zero, or leave it empty to use the estimate.');

	for (const list of Object.keys(LIST_MAX) as ListName[]) {
		if (draft[list].length > LIST_MAX[list]) fail(list, `Keep it to ${LIST_MAX[list]} rows.`);
	}
	input.lights = draft.lights.map((l, i) => ({
		id: rowId(l.id),
		label: words(`lights.${i}.label`, l.label, 120),
		watts: number(`lights.${i}.watts`, l.watts, 0.1, 2000, true) ?? 0,
		hoursPerDay: number(`lights.${i}.hours`, l.hours, 0, 24, true) ?? 0
	}));
	input.filters = draft.filters.map((f, i) => {
		const unit = oneOf<FlowUnit>(`filters.${i}.unit`, f.unit || 'lph', FLOW_UNITS, 'Choose L/h or US gal/h.') ?? 'lph';
		// The rated flow is kept in the unit printed on the filter, converted only for the figures.
		const flow = number(`filters.${i}.flow`, f.flow, 1, 100000);
		return {
			id: rowId(f.id),
			label: words(`filters.${i}.label`, f.label, 120),
			ratedFlow: flow,
			flowUnit: unit,
			mediaNotes: words(`filters.${i}.media`, f.media, 300)
		};
	});
	input.fertilisers = draft.fertilisers.map((f, i) => ({
		id: rowId(f.id),
		item: words(`fertilisers.${i}.item`, f.item, 120, true),
		amount: words(`fertilisers.${i}.amount`, f.amount, 60),
		frequency: words(`fertilisers.${i}.frequency`, f.frequency, 60)
	}));
	const datedRow = (list: 'plants' | 'livestock', i: number, added: string, removed: string) => {
		const addedOn = day(`${list}.${i}.added`, added);
		const removedOn = day(`${list}.${i}.removed`, removed);
		if (addedOn && removedOn && removedOn < addedOn) fail(`${list}.${i}.removed`, 'This is before the day it was added.');
		return { addedOn, removedOn };
	};
	input.plants = draft.plants.map((p, i) => ({
		id: rowId(p.id),
		speciesId: rowId(p.speciesId) ?? null,
		name: words(`plants.${i}.name`, p.name, 160, true),
		placement: p.placement ? oneOf<Placement>(`plants.${i}.placement`, p.placement, PLACEMENTS, 'Choose where it grows.') : null,
		...datedRow('plants', i, p.added, p.removed)
	}));
	input.livestock = draft.livestock.map((a, i) => ({
		id: rowId(a.id),
		speciesId: rowId(a.speciesId) ?? null,
		name: words(`livestock.${i}.name`, a.name, 160, true),
		count: number(`livestock.${i}.count`, a.count || '1', 1, 10000, true) ?? 1,
		...datedRow('livestock', i, a.added, a.removed)
	}));

	if (Object.keys(errors).length) return { ok: false, errors };
	return { ok: true, input };
}

/** Unit labels for the form's fields, in the member's system. */
export function formUnits(units: UnitSystem) {
	return { length: unitSymbol('length', units), volume: unitSymbol('volume', units), glass: glassUnit(units), temperature: unitSymbol('temperature', units) };
}

/**
 * How the lights as typed on the edit form compare with the saved ones. Over the same water the
 * comparison per litre is the ratio of watts (70 W against 40 W is "almost twice"); a sudden rise
 * in light is what algae use first. Null while nothing comparable is typed or nothing changed.
 */
export function lightingChange(lights: readonly Pick<LightDraft, 'watts'>[], saved: { watts: number; litres: number } | null): string | null {
	if (!saved || saved.watts <= 0 || saved.litres <= 0) return null;
	const watts = lights.reduce((sum, l) => {
		const w = Number(l.watts.trim().replace(',', '.'));
		return Number.isFinite(w) && w > 0 ? sum + w : sum;
	}, 0);
	if (watts <= 0 || roundTo(watts, 1) === roundTo(saved.watts, 1)) return null;
	const c = compareLighting({ watts, litres: saved.litres }, saved);
	const compared = `Compared with the saved lights (${roundTo(saved.watts, 1)} W)`;
	if (c.stronger === 'same') return `${compared}: ${c.description}.`;
	if (c.stronger === 'b') return `${compared}: those were ${c.description}.`;
	return `${compared}: these are ${c.description}. Raise the light in steps; algae use a sudden increase first (common practice).`;
}
