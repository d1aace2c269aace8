// Unit conversion at the edges, for every feature (journals, the swap board's distances, judges'
// bands). Everything is stored metric (cm, mm of glass, L, kg, L/h, °C, metres); a member's unit
// system only decides how a value is typed in and shown, so stored data never changes meaning
// when someone switches their preference.

import type { UnitSystem } from '$lib/club/roles';
import { formatNumber } from './round';
import { CalcInputError, requireFinite } from './validate';

export type { UnitSystem };

/** International inch (1959 agreement), exact. */
export const CM_PER_INCH = 2.54;
/** US liquid gallon = 231 in³ = 3.785411784 L exactly (NIST Handbook 44, Appendix C). */
export const LITRES_PER_US_GALLON = 3.785411784;
/** Imperial gallon = 4.54609 L exactly (UK Weights and Measures Act 1985, Schedule 1). */
export const LITRES_PER_IMPERIAL_GALLON = 4.54609;
/** International avoirdupois pound = 0.45359237 kg exactly (NIST Handbook 44, Appendix C). */
export const KG_PER_POUND = 0.45359237;
/** International mile = 5,280 ft × 0.3048 m = 1,609.344 m exactly (NIST Handbook 44, Appendix C). */
export const METRES_PER_MILE = 1609.344;

/** The unit distances between members are shown in: miles for US and imperial members, kilometres otherwise. */
export type DistanceUnit = 'km' | 'mi';
export const distanceUnitOf = (system: UnitSystem): DistanceUnit => (system === 'metric' ? 'km' : 'mi');
/** Metres in one kilometre or one mile. */
export const metresPerDistanceUnit = (unit: DistanceUnit) => (unit === 'km' ? 1000 : METRES_PER_MILE);

export const cmToInches = (cm: number) => requireFinite('length', cm) / CM_PER_INCH;
export const inchesToCm = (inches: number) => requireFinite('length', inches) * CM_PER_INCH;
export const litresToUsGallons = (litres: number) => requireFinite('volume', litres) / LITRES_PER_US_GALLON;
export const usGallonsToLitres = (gallons: number) => requireFinite('volume', gallons) * LITRES_PER_US_GALLON;
export const litresToImperialGallons = (litres: number) => requireFinite('volume', litres) / LITRES_PER_IMPERIAL_GALLON;
export const imperialGallonsToLitres = (gallons: number) => requireFinite('volume', gallons) * LITRES_PER_IMPERIAL_GALLON;
export const kgToPounds = (kg: number) => requireFinite('mass', kg) / KG_PER_POUND;
export const poundsToKg = (pounds: number) => requireFinite('mass', pounds) * KG_PER_POUND;
export const litresPerHourToUsGallonsPerHour = (lph: number) => requireFinite('flow', lph) / LITRES_PER_US_GALLON;
export const usGallonsPerHourToLitresPerHour = (gph: number) => requireFinite('flow', gph) * LITRES_PER_US_GALLON;
export const litresPerHourToImperialGallonsPerHour = (lph: number) => requireFinite('flow', lph) / LITRES_PER_IMPERIAL_GALLON;
export const imperialGallonsPerHourToLitresPerHour = (gph: number) => requireFinite('flow', gph) * LITRES_PER_IMPERIAL_GALLON;

/** Absolute zero; a temperature below it is a typing error, not a cold tank. */
export const ABSOLUTE_ZERO_C = -273.15;

export function celsiusToFahrenheit(celsius: number): number {
	requireFinite('temperature', celsius);
	if (celsius < ABSOLUTE_ZERO_C) throw new CalcInputError('temperature', `temperature below absolute zero (got ${celsius} °C)`);
	return (celsius * 9) / 5 + 32;
}

export function fahrenheitToCelsius(fahrenheit: number): number {
	requireFinite('temperature', fahrenheit);
	const celsius = ((fahrenheit - 32) * 5) / 9;
	if (celsius < ABSOLUTE_ZERO_C - 1e-9) throw new CalcInputError('temperature', `temperature below absolute zero (got ${fahrenheit} °F)`);
	return celsius;
}

export type Quantity = 'length' | 'volume' | 'mass' | 'flow' | 'temperature';

interface DisplayUnit {
	symbol: string;
	fromMetric: (value: number) => number;
	toMetric: (value: number) => number;
	/** Fixed decimals for quantities whose useful resolution does not scale with size. */
	decimals?: number;
}

const identity = (value: number) => value;
const cm: DisplayUnit = { symbol: 'cm', fromMetric: identity, toMetric: identity };
const inch: DisplayUnit = { symbol: 'in', fromMetric: cmToInches, toMetric: inchesToCm };
const kg: DisplayUnit = { symbol: 'kg', fromMetric: identity, toMetric: identity };
const lb: DisplayUnit = { symbol: 'lb', fromMetric: kgToPounds, toMetric: poundsToKg };
const celsius: DisplayUnit = { symbol: '°C', fromMetric: identity, toMetric: identity, decimals: 1 };
const fahrenheit: DisplayUnit = { symbol: '°F', fromMetric: celsiusToFahrenheit, toMetric: fahrenheitToCelsius, decimals: 1 };

/**
 * What each system shows. US and imperial share inches and pounds and differ in the gallon.
 * Imperial members see flow in imperial gallons per hour so that flow ÷ volume (turnover) works in
 * their own gallon, and temperature in °C, which is what the countries using that gallon use today.
 */
export const DISPLAY_UNITS: Record<Quantity, Record<UnitSystem, DisplayUnit>> = {
	length: { metric: cm, us: inch, imperial: inch },
	mass: { metric: kg, us: lb, imperial: lb },
	volume: {
		metric: { symbol: 'L', fromMetric: identity, toMetric: identity },
		us: { symbol: 'US gal', fromMetric: litresToUsGallons, toMetric: usGallonsToLitres },
		imperial: { symbol: 'imp gal', fromMetric: litresToImperialGallons, toMetric: imperialGallonsToLitres }
	},
	flow: {
		metric: { symbol: 'L/h', fromMetric: identity, toMetric: identity },
		us: { symbol: 'US gal/h', fromMetric: litresPerHourToUsGallonsPerHour, toMetric: usGallonsPerHourToLitresPerHour },
		imperial: {
			symbol: 'imp gal/h',
			fromMetric: litresPerHourToImperialGallonsPerHour,
			toMetric: imperialGallonsPerHourToLitresPerHour
		}
	},
	temperature: { metric: celsius, us: fahrenheit, imperial: celsius }
};

/** The unit symbol a form field should show for this quantity in the member's system. */
export function unitSymbol(quantity: Quantity, system: UnitSystem): string {
	return DISPLAY_UNITS[quantity][system].symbol;
}

/** The stored metric value expressed in the member's unit, unrounded. */
export function fromMetric(quantity: Quantity, metricValue: number, system: UnitSystem): number {
	return DISPLAY_UNITS[quantity][system].fromMetric(metricValue);
}

export interface FormatOptions {
	/** Significant figures (default 3). */
	figures?: number;
}

/** A stored metric value, converted and rounded for the member's system, with its unit. */
export function formatQuantity(quantity: Quantity, metricValue: number, system: UnitSystem, options: FormatOptions = {}): string {
	const unit = DISPLAY_UNITS[quantity][system];
	const shown = unit.fromMetric(metricValue);
	const text = unit.decimals !== undefined ? formatNumber(shown, { decimals: unit.decimals }) : formatNumber(shown, { figures: options.figures });
	return `${text} ${unit.symbol}`;
}

export const formatLength = (cmValue: number, system: UnitSystem, options?: FormatOptions) => formatQuantity('length', cmValue, system, options);
export const formatVolume = (litres: number, system: UnitSystem, options?: FormatOptions) => formatQuantity('volume', litres, system, options);
export const formatMass = (kgValue: number, system: UnitSystem, options?: FormatOptions) => formatQuantity('mass', kgValue, system, options);
export const formatFlow = (lph: number, system: UnitSystem, options?: FormatOptions) => formatQuantity('flow', lph, system, options);
export const formatTemperature = (celsiusValue: number, system: UnitSystem) => formatQuantity('temperature', celsiusValue, system);

/** Glass is sold by nominal thickness: in whole millimetres, or in sixteenths of an inch. */
export const GLASS_INCH_DENOMINATOR = 16;

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

/**
 * Inches as a trade fraction to the nearest `denominator`th (a power of two): "3/8 in",
 * "1 1/4 in", "1 in". A value that rounds to nothing is shown as the smallest step ("1/16 in"), so
 * a thin pane never reads as "0 in".
 */
export function formatInchFraction(inches: number, denominator = GLASS_INCH_DENOMINATOR): string {
	requireFinite('length', inches);
	if (inches < 0) throw new CalcInputError('length', `a thickness is not negative (got ${inches})`);
	const steps = Math.max(1, Math.round(inches * denominator));
	const whole = Math.floor(steps / denominator);
	const rest = steps % denominator;
	const divisor = gcd(rest, denominator);
	const fraction = rest === 0 ? '' : `${rest / divisor}/${denominator / divisor}`;
	return `${[whole ? String(whole) : '', fraction].filter(Boolean).join(' ')} in`;
}

/** The glass: millimetres for metric members (as it is sold), the nearest sixteenth of an inch otherwise ("3/8 in"). */
export function formatGlass(mm: number, system: UnitSystem): string {
	requireFinite('length', mm);
	return system === 'metric' ? `${formatNumber(mm, { decimals: 1 })} mm` : formatInchFraction(cmToInches(mm / 10));
}

export type ParseResult = { ok: true; value: number } | { ok: false; error: string };

/** Unit words a member may type after a number; each maps to a converter into metric. */
const SUFFIXES: Record<Quantity, Record<string, ((value: number) => number) | 'gallon'>> = {
	length: { cm: identity, mm: (v) => v / 10, m: (v) => v * 100, in: inchesToCm, inch: inchesToCm, inches: inchesToCm, '"': inchesToCm },
	volume: {
		l: identity,
		litre: identity,
		litres: identity,
		liter: identity,
		liters: identity,
		'us gal': usGallonsToLitres,
		'imp gal': imperialGallonsToLitres,
		gal: 'gallon',
		gallon: 'gallon',
		gallons: 'gallon'
	},
	mass: { kg: identity, g: (v) => v / 1000, lb: poundsToKg, lbs: poundsToKg, pound: poundsToKg, pounds: poundsToKg },
	flow: {
		'l/h': identity,
		lph: identity,
		'us gal/h': usGallonsPerHourToLitresPerHour,
		'imp gal/h': imperialGallonsPerHourToLitresPerHour,
		'gal/h': 'gallon',
		gph: 'gallon'
	},
	temperature: { c: identity, '°c': identity, f: fahrenheitToCelsius, '°f': fahrenheitToCelsius }
};

const NUMBER_WITH_UNIT = /^([+-]?(?:\d+(?:[.,]\d+)?|[.,]\d+))\s*(.*)$/;
/** "3/8", "1 1/4" (a whole number, a space, a fraction): how inches are written in the trade. */
const FRACTION_WITH_UNIT = /^(?:(\d+) )?(\d+)\/(\d+)\s*(.*)$/;

/** A typed fraction as a plain decimal number followed by what came after it, or the text unchanged. */
function fractionToDecimal(text: string): string | { error: string } {
	const match = FRACTION_WITH_UNIT.exec(text);
	if (!match) return text;
	const denominator = Number(match[3]);
	if (denominator === 0) return { error: 'A fraction cannot have 0 below the line.' };
	const value = Number(match[1] ?? 0) + Number(match[2]) / denominator;
	return `${value} ${match[4] ?? ''}`.trim();
}

export interface ParseOptions {
	/** Accept zero (default true); a tank dimension would pass false. */
	allowZero?: boolean;
}

/**
 * Reads a form value typed in the member's system and returns it in metric. A number alone is in
 * the system's unit; a number followed by a unit ("60 cm", "24 in", "30 gal") is taken in that
 * unit; a fraction ("3/8", "1 1/4 in") is read as its value. A plain "gal" means the member's own gallon and is refused for metric members, where it
 * would be ambiguous. Comma or point is accepted as the decimal mark; thousands separators are not,
 * and a comma followed by exactly three digits ("1,250") is refused because it reads either way.
 */
export function parseQuantity(quantity: Quantity, input: string, system: UnitSystem, options: ParseOptions = {}): ParseResult {
	const typed = input.trim().replace(/\s+/g, ' ');
	if (typed === '') return { ok: false, error: 'Enter a number.' };
	const text = fractionToDecimal(typed);
	if (typeof text !== 'string') return { ok: false, error: text.error };
	const match = NUMBER_WITH_UNIT.exec(text);
	if (!match) return { ok: false, error: 'Enter a number, such as 12 or 12.5.' };
	const digits = match[1] ?? '';
	if (/^[+-]?\d+,\d{3}$/.test(digits)) return { ok: false, error: `Write ${digits} without the comma, or with a point as the decimal mark.` };
	const number = Number(digits.replace(',', '.'));
	const suffix = (match[2] ?? '').toLowerCase();
	let convert: (value: number) => number;
	if (suffix === '') {
		convert = DISPLAY_UNITS[quantity][system].toMetric;
	} else {
		const converter = SUFFIXES[quantity][suffix];
		if (converter === undefined)
			return { ok: false, error: `"${match[2]}" is not a unit of ${quantity} we know; leave it out to use ${unitSymbol(quantity, system)}.` };
		if (converter === 'gallon' && system === 'metric') return { ok: false, error: 'Say "US gal" or "imp gal": the two gallons differ by a fifth.' };
		convert = converter === 'gallon' ? DISPLAY_UNITS[quantity][system].toMetric : converter;
	}
	let metric: number;
	try {
		metric = convert(number);
	} catch (error) {
		if (error instanceof CalcInputError && quantity === 'temperature') return { ok: false, error: 'That is below absolute zero.' };
		throw error;
	}
	if (quantity === 'temperature') return { ok: true, value: metric };
	if (metric < 0) return { ok: false, error: 'Enter a value that is not negative.' };
	if (metric === 0 && options.allowZero === false) return { ok: false, error: 'Enter a value greater than zero.' };
	return { ok: true, value: metric };
}

export const parseLength = (input: string, system: UnitSystem, options?: ParseOptions) => parseQuantity('length', input, system, options);
export const parseVolume = (input: string, system: UnitSystem, options?: ParseOptions) => parseQuantity('volume', input, system, options);
export const parseTemperature = (input: string, system: UnitSystem) => parseQuantity('temperature', input, system);
