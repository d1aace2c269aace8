// Filter turnover: how many times an hour the filters move the tank's volume. It is a coarse
// guide, because rated flow is measured without media or hose and real flow is lower.

import { requireNonNegative, requirePositive } from './validate';

/** Turnovers per hour: total rated flow (L/h) ÷ water volume (L). */
export function turnoverPerHour(flowsLitresPerHour: readonly number[], litres: number): number {
	requirePositive('water volume (L)', litres);
	const total = flowsLitresPerHour.reduce((sum, flow, i) => sum + requireNonNegative(`flow of filter ${i + 1} (L/h)`, flow), 0);
	return total / litres;
}

export type TurnoverBand = 'low' | 'modest' | 'usual' | 'strong';

export interface TurnoverAssessment {
	band: TurnoverBand;
	label: string;
	note: string;
}

/**
 * Bands for a planted tank (common practice, no source): under 3×/h low, 3–5×/h modest,
 * 5–10×/h usual, above 10×/h strong. Lower edges belong to the higher band.
 */
export const TURNOVER_BANDS = { low: 3, usual: 5, strong: 10 } as const;

const RATED_FLOW_NOTE = 'Rated flow is measured with no media or hose; the real flow is often well below it.';

export function assessTurnover(perHour: number): TurnoverAssessment {
	requireNonNegative('turnover (per hour)', perHour);
	if (perHour < TURNOVER_BANDS.low) {
		return { band: 'low', label: 'Low', note: `Water may stand still behind plants and rock. ${RATED_FLOW_NOTE}` };
	}
	if (perHour < TURNOVER_BANDS.usual) return { band: 'modest', label: 'Modest', note: `Enough for a lightly planted tank. ${RATED_FLOW_NOTE}` };
	if (perHour <= TURNOVER_BANDS.strong) return { band: 'usual', label: 'Usual for a planted tank', note: RATED_FLOW_NOTE };
	return { band: 'strong', label: 'Strong', note: `Fine for many tanks; weak swimmers and fine-leaved plants may struggle. ${RATED_FLOW_NOTE}` };
}
