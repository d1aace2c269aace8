// What a tank's page says about it, in the member's units: the lines of its specifications, its
// lists split into what is in the tank now and what was, and the upkeep due soon. Every unit
// conversion and rounding the page shows goes through here (and so through ./calc), not through
// the page's markup.
import {
	formatFlow,
	formatGlass,
	formatLength,
	formatNumber,
	formatTemperature,
	formatVolume,
	fromMetric,
	PAR_BAND_LABELS,
	parBand,
	suggestedPhotoperiod,
	SUBSTRATE_LABELS,
	unitSymbol,
	type UnitSystem
} from './calc';
import { flowLitresPerHour, type TankFigures } from './figures';
import { CO2_METHOD_LABELS, FLOW_UNIT_LABELS, type Co2Method, type FlowUnit } from './tank-vocabulary';

const n = (value: number, decimals?: number) => formatNumber(value, decimals === undefined ? {} : { decimals });
/** "60 cm" → "60": the unit is said once, after the last of several numbers. */
const bare = (text: string) => text.replace(/ \S+$/, '');

/** "90 × 45 × 45 cm", "24 × 12 × 16 in": length × width × height. */
export function sizeText(box: { lengthCm: number; widthCm: number; heightCm: number }, units: UnitSystem): string {
	return `${bare(formatLength(box.lengthCm, units))} × ${bare(formatLength(box.widthCm, units))} × ${formatLength(box.heightCm, units)}`;
}

/** The glass: in mm for metric members (as it is sold), to the nearest sixteenth of an inch otherwise ("3/8 in"). */
export const glassText = (glassMm: number, units: UnitSystem): string => formatGlass(glassMm, units);

/** Watts per litre expressed per the member's volume unit (litre, US or imperial gallon). */
export function wattsPerVolumeUnit(wattsPerLitre: number, units: UnitSystem): number {
	// fromMetric gives the unit's size of one litre; a gallon holds 1 / that many litres.
	return units === 'metric' ? wattsPerLitre : wattsPerLitre / fromMetric('volume', 1, units);
}

/** "92 W · 0.52 W per L · 7 h a day". */
export function lightingText(lighting: { totalWatts: number; wattsPerLitre: number; photoperiodHours: number }, units: UnitSystem): string {
	return `${n(lighting.totalWatts)} W · ${n(wattsPerVolumeUnit(lighting.wattsPerLitre, units), 2)} W per ${unitSymbol('volume', units)} · ${n(lighting.photoperiodHours, 1)} h a day`;
}

/**
 * A measured PAR at the substrate with the depth it was taken at and a word for the level:
 * "95 µmol·m⁻²·s⁻¹ at 38 cm deep · high light". Null without a reading.
 */
export function parText(tank: { parAtSubstrate: number | null; parDepthCm: number | null }, units: UnitSystem): string | null {
	if (tank.parAtSubstrate === null) return null;
	const depth = tank.parDepthCm === null ? '' : ` at ${formatLength(tank.parDepthCm, units)} deep`;
	return `${n(tank.parAtSubstrate, 0)} µmol·m⁻²·s⁻¹${depth} · ${PAR_BAND_LABELS[parBand(tank.parAtSubstrate)]}`;
}

/** One light of the list: "LED bar, front: 46 W, 7 h". */
export const lightText = (light: { label: string; watts: number; hoursPerDay: number }) =>
	`${light.label || 'Light'}: ${n(light.watts)} W, ${n(light.hoursPerDay, 1)} h`;

/**
 * A shorter day than the lights run, for a running tank of known age: about 6 h in its first six
 * weeks, rising to about 8 (common practice, see calc/lighting). Null when the lights already run
 * no longer than that.
 */
export function photoperiodAdvice(figures: Pick<TankFigures, 'age' | 'lighting'>, retired: boolean): string | null {
	if (retired || !figures.age || !figures.lighting) return null;
	const suggested = suggestedPhotoperiod(figures.age.days);
	if (figures.lighting.photoperiodHours <= suggested.hours) return null;
	return `Suggested for its age: about ${n(suggested.hours, 1)} h a day. ${suggested.reason}`;
}

/** "1,200 L/h rated · 7.1 × the volume an hour (good)". */
export function turnoverText(totalFlowLph: number, turnover: { perHour: number; assessment: { label: string } }, units: UnitSystem): string {
	return `${formatFlow(totalFlowLph, units)} rated · ${n(turnover.perHour, 1)} × the volume an hour (${turnover.assessment.label.toLowerCase()})`;
}

/** One filter of the list, its rated flow as printed on it (and in L/h when that was US gal/h). */
export function filterText(filter: { label: string; ratedFlow: number | null; flowUnit: FlowUnit; mediaNotes: string }, units: UnitSystem): string {
	const flow = filter.ratedFlow ? `: ${n(filter.ratedFlow)} ${FLOW_UNIT_LABELS[filter.flowUnit]}` : '';
	// Beside a rating in a unit other than the member's, the same flow in theirs.
	const printedIn = filter.flowUnit === 'usgph' ? 'us' : 'metric';
	const inLitres = filter.ratedFlow && printedIn !== units ? ` (${formatFlow(flowLitresPerHour(filter.ratedFlow, filter.flowUnit), units)})` : '';
	return `${filter.label || 'Filter'}${flow}${inLitres}${filter.mediaNotes ? ` — ${filter.mediaNotes}` : ''}`;
}

const substrateLabel = (kind: string) => (kind in SUBSTRATE_LABELS ? SUBSTRATE_LABELS[kind as keyof typeof SUBSTRATE_LABELS] : kind === 'other' ? 'Other' : '');

/** "Nutrient soil, capped with sand · 7 cm deep", or "—". */
export function substrateText(tank: { substrateKind: string; substrateNote: string; substrateDepthCm: number | null }, units: UnitSystem): string {
	const what = [substrateLabel(tank.substrateKind), tank.substrateNote].filter(Boolean).join(', ') || '—';
	return `${what}${tank.substrateDepthCm ? ` · ${formatLength(tank.substrateDepthCm, units)} deep` : ''}`;
}

/** "Two stones · about 12 L", or "—". */
export const hardscapeText = (tank: { hardscape: string; hardscapeLitres: number | null }, units: UnitSystem) =>
	`${tank.hardscape || '—'}${tank.hardscapeLitres ? ` · about ${formatVolume(tank.hardscapeLitres, units)}` : ''}`;

/** "200 W · set to 24 °C · none in summer" (75.2 °F for US members), or "—". */
export function heaterText(tank: { heaterWatts: number | null; heaterSetC: number | null; heaterNote: string }, units: UnitSystem): string {
	const parts = [
		tank.heaterWatts ? `${n(tank.heaterWatts)} W` : '',
		tank.heaterSetC !== null ? `set to ${formatTemperature(tank.heaterSetC, units)}` : '',
		tank.heaterNote
	].filter(Boolean);
	return parts.length ? parts.join(' · ') : '—';
}

/** "Pressurised cylinder · 2 bubbles a second". */
export const co2Text = (tank: { co2Method: Co2Method; co2BubblesPerSecond: number | null }) =>
	`${CO2_METHOD_LABELS[tank.co2Method]}${tank.co2Method === 'pressurised' && tank.co2BubblesPerSecond ? ` · ${n(tank.co2BubblesPerSecond, 1)} bubbles a second` : ''}`;

/** "Trace solution, 5 mL, three times a week". */
export const fertiliserText = (f: { item: string; amount: string; frequency: string }) =>
	`${f.item}${f.amount ? `, ${f.amount}` : ''}${f.frequency ? `, ${f.frequency}` : ''}`;

/** A list of plants or animals split into what is in the tank now and what was taken out. */
export function nowAndBefore<T extends { removedOn: string | null }>(rows: readonly T[]): { now: T[]; before: T[] } {
	return { now: rows.filter((r) => !r.removedOn), before: rows.filter((r) => r.removedOn) };
}
