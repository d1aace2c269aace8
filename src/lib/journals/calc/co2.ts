// Dissolved CO2 from pH and KH. Keepers of injected tanks aim the gas by this number, so both the
// published equilibrium and the rule of thumb are given, with why either can be off.

import { MOLAR_MASS } from './elements';
import { dkhToMmolHco3 } from './hardness';
import { CalcInputError, requireFinite, requireInRange, requireNonNegative } from './validate';

/** Kelvin offset of the Celsius scale. */
const KELVIN = 273.15;

/**
 * First dissociation constant of carbonic acid, CO2(aq) + H2O ⇌ H⁺ + HCO3⁻, from Plummer &
 * Busenberg (1982), Geochim. Cosmochim. Acta 46:1011–1040:
 * log K1 = −356.3094 − 0.06091964 T + 21834.37 / T + 126.8339 log10 T − 1 684 915 / T², T in K.
 */
export const PLUMMER_BUSENBERG_1982_K1 = { a: -356.3094, b: -0.06091964, c: 21834.37, d: 126.8339, e: -1684915 } as const;

/**
 * pK1 at a water temperature. The fit spans 0–250 °C, so every temperature at which water is
 * liquid at normal pressure is inside it; temperatures outside 0–100 °C are refused as typing errors.
 */
export function carbonicAcidPK1(tempC: number): number {
	requireFinite('water temperature (°C)', tempC);
	if (tempC < 0 || tempC > 100) throw new CalcInputError('water temperature (°C)', `water is not liquid at ${tempC} °C at normal pressure`);
	const T = tempC + KELVIN;
	const { a, b, c, d, e } = PLUMMER_BUSENBERG_1982_K1;
	const logK1 = a + b * T + c / T + d * Math.log10(T) + e / T ** 2;
	return -logK1;
}

export interface Co2Reading {
	/** Carbonate hardness, °dKH. */
	kh: number;
	pH: number;
	/** Water temperature, °C (used by the equilibrium estimate only). */
	tempC: number;
}

function checkReading(reading: Pick<Co2Reading, 'kh' | 'pH'>): void {
	requireNonNegative('carbonate hardness (°dKH)', reading.kh);
	requireInRange('pH', reading.pH, 0, 14);
}

export interface Co2Equilibrium {
	mgPerL: number;
	pK1: number;
	bicarbonateMmolPerL: number;
}

/**
 * CO2 = [HCO3⁻] · 10^(pK1 − pH), taking all of KH as bicarbonate and concentrations for
 * activities (fresh water is dilute enough that the difference is small beside kit error).
 */
export function co2FromEquilibrium(reading: Co2Reading): Co2Equilibrium {
	checkReading(reading);
	const pK1 = carbonicAcidPK1(reading.tempC);
	const bicarbonateMmolPerL = dkhToMmolHco3(reading.kh);
	const mgPerL = bicarbonateMmolPerL * MOLAR_MASS.CO2 * 10 ** (pK1 - reading.pH);
	return { mgPerL, pK1, bicarbonateMmolPerL };
}

/** The hobby rule CO2 ≈ 3 × KH × 10^(7 − pH) mg/L (common practice, no source). */
export function co2FromHobbyRule(reading: Pick<Co2Reading, 'kh' | 'pH'>): number {
	checkReading(reading);
	return 3 * reading.kh * 10 ** (7 - reading.pH);
}

/** A common aim for tanks with injected CO2, mg/L (common practice, no source). */
export const CO2_COMMON_AIM_MG_PER_L = { low: 20, high: 30 } as const;

export interface Co2Estimate {
	/**
	 * Which figure the page shows first. The equilibrium value: it follows the water temperature
	 * and a published constant, while the rule of thumb fixes both; the rule is shown beside it
	 * because it is the figure on the charts most keepers know.
	 */
	primary: 'equilibrium';
	equilibriumMgPerL: number;
	hobbyRuleMgPerL: number;
	pK1: number;
	explanation: string;
	caution: string;
}

export function estimateCo2(reading: Co2Reading): Co2Estimate {
	const equilibrium = co2FromEquilibrium(reading);
	return {
		primary: 'equilibrium',
		equilibriumMgPerL: equilibrium.mgPerL,
		hobbyRuleMgPerL: co2FromHobbyRule(reading),
		pK1: equilibrium.pK1,
		explanation: CO2_ESTIMATE_EXPLANATION,
		caution: CO2_SAFETY_CAUTION
	};
}

export const CO2_ESTIMATE_EXPLANATION =
	'Both figures are estimates worked out from pH and KH, not a measurement of CO2. ' +
	'They assume all of the KH is bicarbonate: other buffers in the water, such as phosphate or the humic acids from wood, leaves and soil, ' +
	'add to the KH reading and make the CO2 figure read too high. ' +
	'Drop test kits are rarely better than one step of their colour chart, and a pH error of 0.1 changes the result by about a quarter. ' +
	'The equilibrium figure allows for water temperature; the rule of thumb (3 × KH × 10^(7 − pH)) does not and reads lower. ' +
	'Watch the fish as well as the number.';

export const CO2_SAFETY_CAUTION =
	'Too much CO2 suffocates fish: if they gasp at the surface, stop the gas and aerate the water at once. ' +
	'Keep pressurised cylinders upright and secured so they cannot fall, use a regulator with a solenoid that turns the gas off at night, ' +
	'and check joints for leaks with soapy water. Follow the supplier’s instructions and local safety rules for gas cylinders.';
