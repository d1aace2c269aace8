// Un-ionised ammonia. Kits read total ammonia (NH3 + NH4⁺); the harm to fish comes from the NH3
// share, which climbs steeply with pH and temperature, so the same kit colour can be harmless in
// a soft, cool tank and dangerous in a hard, warm one.

import { MOLAR_MASS } from './elements';
import { CalcInputError, requireFinite, requireInRange, requireNonNegative } from './validate';

const KELVIN = 273.15;

/**
 * pKa of NH4⁺ ⇌ NH3 + H⁺ from Emerson, Russo, Lund & Thurston (1975), J. Fish. Res. Board Can.
 * 32:2379–2383: pKa = 0.09018 + 2729.92 / T, T in K.
 */
export const EMERSON_1975 = { a: 0.09018, b: 2729.92 } as const;

/** Temperatures the equation was fitted over (0–50 °C, from memory of the paper; not checked against it). */
export const AMMONIA_VALID_RANGE_C = { min: 0, max: 50 } as const;

export function ammoniumPKa(tempC: number): number {
	requireFinite('water temperature (°C)', tempC);
	if (tempC < 0 || tempC > 100) throw new CalcInputError('water temperature (°C)', `water is not liquid at ${tempC} °C at normal pressure`);
	return EMERSON_1975.a + EMERSON_1975.b / (tempC + KELVIN);
}

export interface UnionisedFraction {
	/** Share of total ammonia present as NH3, 0–1. */
	fraction: number;
	pKa: number;
	/** False outside 0–50 °C, where the equation is extrapolated. */
	inValidRange: boolean;
}

/** fraction NH3 = 1 / (10^(pKa − pH) + 1), in fresh water (salinity ignored). */
export function unionisedFraction(pH: number, tempC: number): UnionisedFraction {
	requireInRange('pH', pH, 0, 14);
	const pKa = ammoniumPKa(tempC);
	return {
		fraction: 1 / (10 ** (pKa - pH) + 1),
		pKa,
		inValidRange: tempC >= AMMONIA_VALID_RANGE_C.min && tempC <= AMMONIA_VALID_RANGE_C.max
	};
}

/**
 * How a total ammonia reading is expressed. Most hobby kits print mg/L of total ammonia "as NH3"
 * (some as NH4⁺); laboratories report total ammonia nitrogen, mg/L as N. The same water gives
 * three different numbers, so the reading must say which.
 */
export type AmmoniaBasis = 'NH3' | 'NH4' | 'N';

/** Mass ratios from atomic weights: 1 mg N is 17.031/14.007 = 1.2159 mg as NH3. */
export const NH3_PER_N = MOLAR_MASS.NH3 / MOLAR_MASS.N;
export const NH3_PER_NH4 = MOLAR_MASS.NH3 / MOLAR_MASS.NH4;

export const ammoniaNToNH3 = (mgN: number) => requireNonNegative('ammonia (mg/L as N)', mgN) * NH3_PER_N;
export const ammoniaNH4ToNH3 = (mgNH4: number) => requireNonNegative('ammonia (mg/L as NH4)', mgNH4) * NH3_PER_NH4;

/** A total ammonia reading on any basis, re-expressed as mg/L NH3 (the basis used internally). */
export function totalAmmoniaAsNH3(mgPerL: number, basis: AmmoniaBasis): number {
	if (basis === 'NH3') return requireNonNegative('total ammonia (mg/L as NH3)', mgPerL);
	return basis === 'N' ? ammoniaNToNH3(mgPerL) : ammoniaNH4ToNH3(mgPerL);
}

/**
 * Un-ionised ammonia levels for fish, mg/L NH3.
 * - danger 0.05: University of Florida IFAS Extension circular FA16, "Ammonia in Aquatic Systems"
 *   (Francis-Floyd et al.), which says un-ionised ammonia of 0.05 mg/L may harm fish and that fish
 *   begin to die as it nears 2.0 mg/L (checked against the circular's text; see ammonia.test.ts).
 * - concern 0.02: the long-used figure for long-term stress (common practice, no source).
 */
export const UNIONISED_AMMONIA_LEVELS = { concern: 0.02, danger: 0.05 } as const;

/** How members are told where the figures come from, in plain words (shown on pages and the sources note). */
export const AMMONIA_SOURCES = {
	split: 'the share of un-ionised ammonia is worked out from the pH and temperature by the equation of Emerson and colleagues (1975)',
	danger: 'the University of Florida’s fish-health circular FA16 says 0.05 mg/L of un-ionised ammonia may harm fish',
	concern: 'around 0.02 mg/L is the level keepers have long taken as the start of long-term stress'
} as const;

/** Total ammonia (mg/L as NH3) at which water of this pH and temperature holds the danger level of NH3. */
export function dangerousTotalAmmonia(pH: number, tempC: number): number {
	return UNIONISED_AMMONIA_LEVELS.danger / unionisedFraction(pH, tempC).fraction;
}

export type AmmoniaLevel = 'safe' | 'concern' | 'danger';

export function unionisedAmmoniaLevel(mgNH3: number): AmmoniaLevel {
	requireNonNegative('un-ionised ammonia (mg/L NH3)', mgNH3);
	if (mgNH3 >= UNIONISED_AMMONIA_LEVELS.danger) return 'danger';
	if (mgNH3 >= UNIONISED_AMMONIA_LEVELS.concern) return 'concern';
	return 'safe';
}

export interface UnionisedAmmoniaInput {
	totalMgPerL: number;
	basis: AmmoniaBasis;
	pH: number;
	tempC: number;
}

export interface UnionisedAmmonia extends UnionisedFraction {
	/** Total ammonia re-expressed as mg/L NH3. */
	totalAsNH3MgPerL: number;
	/** Un-ionised ammonia, mg/L as NH3. */
	nh3MgPerL: number;
	/** The same as nitrogen, mg/L NH3-N, for comparison with laboratory figures. */
	nh3AsNMgPerL: number;
	level: AmmoniaLevel;
}

/** NH3 from a total ammonia reading, pH and temperature. */
export function unionisedAmmonia(input: UnionisedAmmoniaInput): UnionisedAmmonia {
	const totalAsNH3MgPerL = totalAmmoniaAsNH3(input.totalMgPerL, input.basis);
	const f = unionisedFraction(input.pH, input.tempC);
	const nh3MgPerL = totalAsNH3MgPerL * f.fraction;
	return {
		...f,
		totalAsNH3MgPerL,
		nh3MgPerL,
		nh3AsNMgPerL: nh3MgPerL / NH3_PER_N,
		level: unionisedAmmoniaLevel(nh3MgPerL)
	};
}

export const NEW_TANK_AMMONIA_NOTE =
	'Fresh nutrient-rich soil can release a lot of ammonia in a new tank for several weeks. ' +
	'Keepers usually seed the filter with media from a mature filter, change a large share of the water often in the first weeks, ' +
	'and add fish only once ammonia and nitrite read zero.';
