// Rounding for display. Journal pages show measured and estimated quantities; printing every
// binary digit ("29.587270425 US gal") claims a precision no tape measure or test kit has.

import { requireFinite } from './validate';

/**
 * Rounds half away from zero at `decimals` places. The product is first trimmed to 15 significant
 * digits so that binary representation error (1.005 × 100 = 100.49999…) does not round down.
 */
export function roundTo(value: number, decimals: number): number {
	requireFinite('value', value);
	if (!Number.isInteger(decimals)) throw new RangeError(`decimals must be an integer (got ${decimals})`);
	if (value === 0) return 0;
	const sign = value < 0 ? -1 : 1;
	const magnitude = Math.abs(value);
	const rounded =
		decimals >= 0
			? Math.round(Number((magnitude * 10 ** decimals).toPrecision(15))) / 10 ** decimals
			: Math.round(Number((magnitude / 10 ** -decimals).toPrecision(15))) * 10 ** -decimals;
	return rounded === 0 ? 0 : sign * rounded;
}

/**
 * Decimals that give about `figures` significant figures without ever cutting the integer part:
 * 112.4 → 0 ("112"), 29.58 → 1 ("29.6"), 0.0372 → 4 ("0.0372"); 1234 stays "1234", not "1230",
 * because a whole number of litres or kilograms reads as exact enough and rounding it hides data.
 */
export function decimalsForMagnitude(value: number, figures = 3): number {
	requireFinite('value', value);
	if (value === 0) return 0;
	const decimals = figures - 1 - Math.floor(Math.log10(Math.abs(value)));
	return Math.max(0, decimals);
}

export interface NumberFormatOptions {
	/** Significant figures aimed at (default 3); ignored when `decimals` is given. */
	figures?: number;
	/** Fixed maximum of decimals, for quantities whose resolution does not scale (pH, °C). */
	decimals?: number;
}

const formatters = new Map<number, Intl.NumberFormat>();
function formatterFor(decimals: number): Intl.NumberFormat {
	let formatter = formatters.get(decimals);
	if (!formatter) {
		formatter = new Intl.NumberFormat('en-GB', { maximumFractionDigits: decimals, minimumFractionDigits: 0 });
		formatters.set(decimals, formatter);
	}
	return formatter;
}

/** A number as the club reads it: rounded by magnitude, grouped thousands, no trailing zeros. */
export function formatNumber(value: number, options: NumberFormatOptions = {}): string {
	requireFinite('value', value);
	const decimals = options.decimals ?? decimalsForMagnitude(value, options.figures ?? 3);
	const rounded = roundTo(value, decimals);
	return formatterFor(decimals).format(rounded === 0 ? 0 : rounded);
}
