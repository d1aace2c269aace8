// Hardness and alkalinity units. Test kits read in German degrees, labs and many charts in
// ppm as CaCO3 or mmol/L; the factors are derived from atomic weights here so they stay in step
// with the table the dose calculator uses.

import { MOLAR_MASS } from './elements';
import { requireNonNegative } from './validate';

/** One German degree is defined as 10 mg of CaO per litre. */
export const MG_CAO_PER_DEGREE = 10;

/** mmol/L of Ca²⁺ + Mg²⁺ (or of CaCO3 equivalent) in one °dH: 10 / M(CaO) ≈ 0.17833. */
export const MMOL_PER_DEGREE = MG_CAO_PER_DEGREE / MOLAR_MASS.CaO;

/** mg/L as CaCO3 (≈ ppm in fresh water) in one °dH: 0.17833 × M(CaCO3) ≈ 17.848. */
export const MG_CACO3_PER_DEGREE = MMOL_PER_DEGREE * MOLAR_MASS.CaCO3;

/**
 * mmol/L of HCO3⁻ in one °dKH. Carbonate hardness counts bicarbonate as the CaO that would
 * balance it, and each Ca²⁺ balances two HCO3⁻, so it is twice MMOL_PER_DEGREE ≈ 0.35665.
 */
export const MMOL_HCO3_PER_DKH = 2 * MMOL_PER_DEGREE;

/** GH or KH in °dH/°dKH → mg/L (ppm) as CaCO3. */
export const degreesToPpmCaCO3 = (degrees: number) => requireNonNegative('hardness (°d)', degrees) * MG_CACO3_PER_DEGREE;
/** mg/L (ppm) as CaCO3 → °dH/°dKH. */
export const ppmCaCO3ToDegrees = (ppm: number) => requireNonNegative('hardness (ppm as CaCO3)', ppm) / MG_CACO3_PER_DEGREE;
/** GH in °dH → mmol/L of Ca²⁺ + Mg²⁺. */
export const dhToMmolPerL = (dh: number) => requireNonNegative('general hardness (°dH)', dh) * MMOL_PER_DEGREE;
/** mmol/L of Ca²⁺ + Mg²⁺ → °dH. */
export const mmolPerLToDh = (mmol: number) => requireNonNegative('hardness (mmol/L)', mmol) / MMOL_PER_DEGREE;
/** KH in °dKH → mmol/L HCO3⁻ (numerically meq/L of alkalinity). */
export const dkhToMmolHco3 = (dkh: number) => requireNonNegative('carbonate hardness (°dKH)', dkh) * MMOL_HCO3_PER_DKH;
/** mmol/L HCO3⁻ → °dKH. */
export const mmolHco3ToDkh = (mmol: number) => requireNonNegative('bicarbonate (mmol/L)', mmol) / MMOL_HCO3_PER_DKH;
/** KH in °dKH → mg/L of HCO3⁻ itself (as some lab reports give it). */
export const dkhToMgHco3 = (dkh: number) => dkhToMmolHco3(dkh) * MOLAR_MASS.HCO3;
/** mg/L of HCO3⁻ → °dKH, e.g. for what a dose of potassium bicarbonate adds. */
export const mgHco3ToDkh = (mg: number) => mmolHco3ToDkh(requireNonNegative('bicarbonate (mg/L)', mg) / MOLAR_MASS.HCO3);
