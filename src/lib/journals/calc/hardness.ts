// Hardness and alkalinity units. Test kits read in German degrees; the CO2 estimate needs
// bicarbonate in mmol/L and the dose calculator turns what potassium bicarbonate adds back into
// degrees. The factors are derived from atomic weights so they stay in step with its table.

import { MOLAR_MASS } from './elements';
import { requireNonNegative } from './validate';

/** One German degree is defined as 10 mg of CaO per litre. */
export const MG_CAO_PER_DEGREE = 10;

/** mmol/L of Ca²⁺ + Mg²⁺ (or of CaCO3 equivalent) in one °dH: 10 / M(CaO) ≈ 0.17833. */
export const MMOL_PER_DEGREE = MG_CAO_PER_DEGREE / MOLAR_MASS.CaO;

/**
 * mmol/L of HCO3⁻ in one °dKH. Carbonate hardness counts bicarbonate as the CaO that would
 * balance it, and each Ca²⁺ balances two HCO3⁻, so it is twice MMOL_PER_DEGREE ≈ 0.35665.
 */
export const MMOL_HCO3_PER_DKH = 2 * MMOL_PER_DEGREE;

/** KH in °dKH → mmol/L HCO3⁻ (numerically meq/L of alkalinity). */
export const dkhToMmolHco3 = (dkh: number) => requireNonNegative('carbonate hardness (°dKH)', dkh) * MMOL_HCO3_PER_DKH;
/** mmol/L HCO3⁻ → °dKH. */
export const mmolHco3ToDkh = (mmol: number) => requireNonNegative('bicarbonate (mmol/L)', mmol) / MMOL_HCO3_PER_DKH;
/** mg/L of HCO3⁻ → °dKH, e.g. for what a dose of potassium bicarbonate adds. */
export const mgHco3ToDkh = (mg: number) => mmolHco3ToDkh(requireNonNegative('bicarbonate (mg/L)', mg) / MOLAR_MASS.HCO3);
