// Target bands for water tests. A journal entry of readings is easier to act on when each value
// says whether it is low, fine, high or dangerous for the fish. All bands are common practice for
// a planted tank with fish, no source: keepers of soft-water or shrimp tanks aim differently.

import { CalcInputError, requireFinite } from './validate';

export const WATER_PARAMETERS = ['pH', 'KH', 'GH', 'NO3', 'PO4', 'K', 'Fe', 'ammonia', 'NO2', 'temperature', 'TDS'] as const;
export type WaterParameter = (typeof WATER_PARAMETERS)[number];

export interface TargetBand {
	label: string;
	/** Unit of the stored value; '' for pH. */
	unit: string;
	/** The usual band, inclusive; `low` is 0 where no lower limit matters. */
	low: number;
	high: number;
	/** At or beyond these the value is dangerous for fish, not merely off target. */
	dangerLow?: number;
	dangerHigh?: number;
	note?: string;
}

/** Common practice, no source (every entry). */
export const TARGET_BANDS: Record<WaterParameter, TargetBand> = {
	pH: { label: 'pH', unit: '', low: 6.0, high: 7.5, dangerLow: 5.0, dangerHigh: 9.0 },
	KH: { label: 'Carbonate hardness (KH)', unit: '°dKH', low: 1, high: 6 },
	GH: { label: 'General hardness (GH)', unit: '°dH', low: 4, high: 12 },
	NO3: { label: 'Nitrate (NO₃)', unit: 'mg/L', low: 5, high: 25, dangerHigh: 80 },
	PO4: { label: 'Phosphate (PO₄)', unit: 'mg/L', low: 0.5, high: 2 },
	K: { label: 'Potassium (K)', unit: 'mg/L', low: 5, high: 20 },
	Fe: { label: 'Iron (Fe)', unit: 'mg/L', low: 0.05, high: 0.5 },
	ammonia: {
		label: 'Total ammonia (NH₃/NH₄⁺)',
		unit: 'mg/L',
		low: 0,
		high: 0.05,
		dangerHigh: 0.25,
		note: 'How harmful a reading is depends on pH and temperature: a test with both is judged on its un-ionised ammonia, and the danger line moves with them. A test without them is judged on the total alone.'
	},
	NO2: { label: 'Nitrite (NO₂)', unit: 'mg/L', low: 0, high: 0.05, dangerHigh: 0.25 },
	temperature: { label: 'Temperature', unit: '°C', low: 22, high: 28, dangerLow: 15, dangerHigh: 32 },
	TDS: { label: 'Total dissolved solids', unit: 'mg/L', low: 50, high: 300 }
};

export type BandStatus = 'low' | 'in-band' | 'high' | 'danger';

/** Where a reading falls. Danger wins over low/high; band edges count as in band. */
export function classifyReading(parameter: WaterParameter, value: number): BandStatus {
	requireFinite(`${parameter} reading`, value);
	const band = TARGET_BANDS[parameter];
	if (parameter !== 'temperature' && value < 0) throw new CalcInputError(`${parameter} reading`, `${parameter} reading must not be negative (got ${value})`);
	if (band.dangerLow !== undefined && value <= band.dangerLow) return 'danger';
	if (band.dangerHigh !== undefined && value >= band.dangerHigh) return 'danger';
	if (value < band.low) return 'low';
	if (value > band.high) return 'high';
	return 'in-band';
}

export const BAND_STATUS_LABELS: Record<BandStatus, string> = {
	low: 'Below target',
	'in-band': 'On target',
	high: 'Above target',
	danger: 'Danger for fish'
};
