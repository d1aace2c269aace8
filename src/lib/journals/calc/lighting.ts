// Light on a tank. Keepers compare lights by electrical watts, which only means something per
// litre of water lit, and young tanks are usually kept on a short day while plants root and
// algae have less to feed on.

import { requireFinite, requireInRange, requireNonNegative, requirePositive } from './validate';

export interface LightFixture {
	label: string;
	/** Electrical input power, W. */
	watts: number;
	/** On-time per day, hours. */
	hoursPerDay: number;
}

export interface FixtureSummary extends LightFixture {
	wattsPerLitre: number;
	whPerDay: number;
}

export interface LightingSummary {
	totalWatts: number;
	wattsPerLitre: number;
	/** Daily electrical energy of all fixtures, Wh. */
	whPerDay: number;
	fixtures: FixtureSummary[];
	/** The longest on-time, hours: the tank is lit at least partly for this long. */
	photoperiodHours: number;
	/** True when fixtures run for different lengths of time. */
	photoperiodsDiffer: boolean;
	/** A sentence for the page when photoperiods differ, else null. */
	photoperiodNote: string | null;
}

function checkFixture(fixture: LightFixture): LightFixture {
	requirePositive(`power of "${fixture.label}" (W)`, fixture.watts);
	requireInRange(`hours per day of "${fixture.label}"`, fixture.hoursPerDay, 0, 24);
	return fixture;
}

/**
 * Totals for the fixtures over a tank. Watts are what the member can read off a label; they are
 * electrical input, not light delivered, so two fixtures of different make and efficiency compare
 * only roughly.
 */
export function summariseLighting(fixtures: readonly LightFixture[], litres: number): LightingSummary {
	requirePositive('water volume (L)', litres);
	const summaries = fixtures.map((f) => {
		checkFixture(f);
		return { ...f, wattsPerLitre: f.watts / litres, whPerDay: f.watts * f.hoursPerDay };
	});
	const totalWatts = summaries.reduce((sum, f) => sum + f.watts, 0);
	const hours = summaries.map((f) => f.hoursPerDay);
	const photoperiodHours = hours.length ? Math.max(...hours) : 0;
	const photoperiodsDiffer = hours.length > 1 && Math.min(...hours) !== photoperiodHours;
	const shorter = summaries.filter((f) => f.hoursPerDay < photoperiodHours).map((f) => f.label);
	return {
		totalWatts,
		wattsPerLitre: totalWatts / litres,
		whPerDay: summaries.reduce((sum, f) => sum + f.whPerDay, 0),
		fixtures: summaries,
		photoperiodHours,
		photoperiodsDiffer,
		photoperiodNote: photoperiodsDiffer
			? `The lights run for different lengths of time: the tank is lit for ${photoperiodHours} h, at full strength for less (${shorter.join(', ')} ${shorter.length === 1 ? 'runs' : 'run'} shorter).`
			: null
	};
}

/** Below this age a tank counts as young for lighting (common practice, no source). */
export const YOUNG_TANK_LIGHT_DAYS = 42;
/** Short day for a young tank and the usual full day (common practice, no source). */
export const YOUNG_TANK_PHOTOPERIOD_HOURS = 6;
export const USUAL_PHOTOPERIOD_HOURS = 8;
/** After the young weeks, add this much each week up to the usual day (common practice, no source). */
export const PHOTOPERIOD_STEP_HOURS_PER_WEEK = 0.5;

export interface PhotoperiodSuggestion {
	hours: number;
	reason: string;
}

/**
 * A suggested day length by tank age (common practice, no source): about 6 h in the first six
 * weeks, then half an hour more each week until about 8 h.
 */
export function suggestedPhotoperiod(ageDays: number): PhotoperiodSuggestion {
	requireNonNegative('tank age (days)', ageDays);
	if (ageDays < YOUNG_TANK_LIGHT_DAYS) {
		return {
			hours: YOUNG_TANK_PHOTOPERIOD_HOURS,
			reason: 'The tank is under six weeks old: a short day lets plants root while algae have less light to use. Raise it slowly once the plants grow.'
		};
	}
	const weeksPast = Math.floor((ageDays - YOUNG_TANK_LIGHT_DAYS) / 7) + 1;
	const hours = Math.min(USUAL_PHOTOPERIOD_HOURS, YOUNG_TANK_PHOTOPERIOD_HOURS + weeksPast * PHOTOPERIOD_STEP_HOURS_PER_WEEK);
	return hours < USUAL_PHOTOPERIOD_HOURS
		? { hours, reason: 'The tank is settling in: add about half an hour a week while plants grow well and algae stay away.' }
		: { hours, reason: 'An established tank: about 8 hours a day is usual. Shorten it if algae take hold.' };
}

export interface LightingLoad {
	watts: number;
	litres: number;
}

export interface LightingComparison {
	/** Watts per litre of A divided by watts per litre of B. */
	ratio: number;
	stronger: 'a' | 'b' | 'same';
	/** "almost twice as strong per litre" and the like, said of the stronger one. */
	description: string;
}

function describeFactor(factor: number): string {
	if (factor < 1.1) return 'about as strong per litre';
	if (factor < 1.4) return 'somewhat stronger per litre';
	if (factor < 1.65) return 'about one and a half times as strong per litre';
	if (factor < 1.9) return 'almost twice as strong per litre';
	if (factor < 2.15) return 'about twice as strong per litre';
	return `about ${Math.round(factor * 2) / 2} times as strong per litre`;
}

/**
 * Compares two lights (or two tanks) by watts per litre, since 70 W over 200 L lights less than
 * 40 W over 100 L although it reads "almost twice" on the label.
 */
export function compareLighting(a: LightingLoad, b: LightingLoad): LightingComparison {
	const perLitreA = requirePositive('watts of A', a.watts) / requirePositive('litres of A', a.litres);
	const perLitreB = requirePositive('watts of B', b.watts) / requirePositive('litres of B', b.litres);
	const ratio = requireFinite('ratio', perLitreA / perLitreB);
	const factor = ratio >= 1 ? ratio : 1 / ratio;
	const stronger = factor < 1.1 ? 'same' : ratio > 1 ? 'a' : 'b';
	return { ratio, stronger, description: describeFactor(factor) };
}

/**
 * A PAR meter's reading: photosynthetic photon flux density, µmol of photons (400–700 nm) per
 * square metre and second (the quantity and unit of ASABE S640, "Quantities and Units of
 * Electromagnetic Radiation for Plants"). Meters show whole numbers. Full midday sun is roughly
 * 2,000 (from memory), so a tank reading above 2,500 is a typing slip.
 */
export const PAR_RANGE = { min: 1, max: 2500 } as const;

export type ParBand = 'low' | 'medium' | 'high';

/**
 * Words keepers use for light at the substrate of a planted tank, by PAR: under 30 low, 30 to
 * under 80 medium, 80 and more high (common practice, no source; the edges are from memory of
 * hobby write-ups and differ between them). For members this is only a word beside the reading.
 */
export const PAR_BAND_EDGES = { medium: 30, high: 80 } as const;

export const PAR_BAND_LABELS: Record<ParBand, string> = { low: 'low light', medium: 'medium light', high: 'high light' };

export function parBand(par: number): ParBand {
	requireInRange('PAR (µmol·m⁻²·s⁻¹)', par, PAR_RANGE.min, PAR_RANGE.max);
	return par >= PAR_BAND_EDGES.high ? 'high' : par >= PAR_BAND_EDGES.medium ? 'medium' : 'low';
}

/** Shown wherever lights or other mains equipment are entered. */
export const ELECTRICAL_SAFETY_CAUTION =
	'Mains electricity and water: put aquarium equipment on a circuit protected by a residual-current device (RCD/GFCI), ' +
	'leave a drip loop in every cable so water runs off below the socket, and unplug everything before your hands go into the water. ' +
	'Follow local electrical rules and have fixed wiring done by a licensed electrician.';
