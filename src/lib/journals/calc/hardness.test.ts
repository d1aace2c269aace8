import { describe, expect, test } from 'vitest';
import { MF } from 'mf-parser';
import {
	MG_CACO3_PER_DEGREE,
	MMOL_HCO3_PER_DKH,
	MMOL_PER_DEGREE,
	degreesToPpmCaCO3,
	dhToMmolPerL,
	dkhToMgHco3,
	dkhToMmolHco3,
	mmolHco3ToDkh,
	mmolPerLToDh,
	ppmCaCO3ToDegrees
} from './hardness';

// Published figures: 1 °dH = 10 mg/L CaO = 17.848 mg/L CaCO3 = 0.17833 mmol/L; 1 °dKH = 0.35665 mmol/L HCO3⁻.
describe('factors derived from atomic weights match the published figures', () => {
	test('1 °dH = 0.17833 mmol/L', () => {
		expect(MMOL_PER_DEGREE).toBeCloseTo(0.17833, 5);
		expect(dhToMmolPerL(1)).toBeCloseTo(0.17833, 5);
	});
	test('1 °dH = 17.848 mg/L as CaCO3', () => {
		expect(MG_CACO3_PER_DEGREE).toBeCloseTo(17.848, 3);
	});
	test('1 °dKH = 0.35665 mmol/L HCO3⁻', () => {
		expect(MMOL_HCO3_PER_DKH).toBeCloseTo(0.35665, 5);
		expect(dkhToMmolHco3(1)).toBeCloseTo(0.35665, 5);
	});
	test('the same factors from mf-parser molar masses (npm library) agree to 1 in 10⁴', () => {
		const cao = new MF('CaO').getInfo().mass;
		const caco3 = new MF('CaCO3').getInfo().mass;
		expect(Math.abs(MMOL_PER_DEGREE - 10 / cao) / MMOL_PER_DEGREE).toBeLessThan(1e-4);
		expect(Math.abs(MG_CACO3_PER_DEGREE - (10 / cao) * caco3) / MG_CACO3_PER_DEGREE).toBeLessThan(1e-4);
	});
});

describe('conversions', () => {
	test('worked examples: 6 °dH = 107.1 ppm as CaCO3; 4 °dKH = 1.4266 mmol/L = 87.0 mg/L HCO3⁻', () => {
		expect(degreesToPpmCaCO3(6)).toBeCloseTo(6 * 17.848, 2);
		expect(ppmCaCO3ToDegrees(178.48)).toBeCloseTo(10, 3);
		expect(dkhToMmolHco3(4)).toBeCloseTo(1.4266, 4);
		// 1.4266 mmol/L × 61.016 g/mol (H + C + 3 O, CIAAW abridged) = 87.05 mg/L.
		expect(dkhToMgHco3(4)).toBeCloseTo(87.05, 1);
		expect(mmolHco3ToDkh(0.35665)).toBeCloseTo(1, 4);
		expect(mmolPerLToDh(1)).toBeCloseTo(5.6077, 4); // 56.077 mg/L CaO per mmol ÷ 10
	});
	test('rejects negative and NaN readings', () => {
		expect(() => degreesToPpmCaCO3(-1)).toThrow(/negative/);
		expect(() => dkhToMmolHco3(Number.NaN)).toThrow(/finite/);
	});
});
