// How contest figures read on pages, in mails and in exports: to the precision places are decided
// on (see RAW_DECIMALS and Z_DECIMALS in ./results), so equal-looking scores are equal.
import { RAW_DECIMALS, Z_DECIMALS, ordinal } from './results';
import type { AggregationMethod } from './aggregate';

export const formatPercent = (value: number | null | undefined) => (value === null || value === undefined ? '—' : `${value.toFixed(RAW_DECIMALS)} %`);

/** Standardised score with its sign: "+0.412", "−1.030" (a real minus sign). */
export function formatZ(value: number | null | undefined): string {
	if (value === null || value === undefined) return '—';
	const fixed = Math.abs(value).toFixed(Z_DECIMALS);
	if (Number(fixed) === 0) return (0).toFixed(Z_DECIMALS);
	return `${value < 0 ? '−' : '+'}${fixed}`;
}

/** Points of a criterion, to two decimals at most: "7.5", "7.33". */
export const formatPoints = (value: number | null | undefined) => (value === null || value === undefined ? '—' : String(Math.round(value * 100) / 100));

export const formatPlace = (place: number | null, shared = false) => (place === null ? 'Not placed' : `${ordinal(place)}${shared ? ' (shared)' : ''}`);

export const METHOD_SHORT: Record<AggregationMethod, string> = { mean: 'mean', median: 'median', 'trimmed-mean': 'trimmed mean' };
