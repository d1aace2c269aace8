// How much water a tank loses a day, from the top-ups its keeper logged. Each top-up replaces what
// evaporated since the one before, so the water of every top-up after the first, over the days
// from the first to the last, is the rate. The first top-up replaced water lost before anything
// was logged and does not count.
import { dayNumber } from '../journals/calc';

export interface LoggedTopUp {
	on: string;
	litres: number;
}

/** Only top-ups this recent count: a tank loses more in a warm season than in a cold one. */
export const EVAPORATION_WINDOW_DAYS = 60;

/**
 * Litres a day, or null when there is not enough to go on (fewer than two top-ups on different
 * days within the window before `today`).
 */
export function evaporationPerDay(topUps: readonly LoggedTopUp[], today: string): number | null {
	const end = dayNumber(today);
	const recent = topUps
		.filter((t) => Number.isFinite(t.litres) && t.litres > 0)
		.map((t) => ({ day: dayNumber(t.on), litres: t.litres }))
		.filter((t) => t.day <= end && t.day > end - EVAPORATION_WINDOW_DAYS)
		.sort((a, b) => a.day - b.day);
	const first = recent[0];
	const last = recent[recent.length - 1];
	if (!first || !last || recent.length < 2) return null;
	const span = last.day - first.day;
	if (span <= 0) return null;
	const added = recent.slice(1).reduce((sum, t) => sum + t.litres, 0);
	return added / span;
}
