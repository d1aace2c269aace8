import { describe, expect, test } from 'vitest';
import { MF } from 'mf-parser';
import { MMOL_HCO3_PER_DKH, MMOL_PER_DEGREE, dkhToMmolHco3, mgHco3ToDkh, mmolHco3ToDkh } from './hardness';

// Published figures: 1 °dH = 10 mg/L CaO = 0.17833 mmol/L; 1 °dKH = 0.35665 mmol/L HCO3⁻.
describe('factors derived from atomic weights match the published figures', () => {
	test('1 °dH = 0.17833 mmol/L', () => {
		expect(MMOL_PER_DEGREE).toBeCloseTo(0.17833, 5);
	});
	test('1 °dKH = 0.35665 mmol/L HCO3⁻', () => {
		expect(MMOL_HCO3_PER_DKH).toBeCloseTo(0.35665, 5);
		expect(dkhToMmolHco3(1)).toBeCloseTo(0.35665, 5);
	});
	test('the same factor from mf-parser molar masses (npm library) agrees to 1 in 10⁴', () => {
		const cao = new MF('CaO').getInfo().mass;
		expect(Math.abs(MMOL_PER_DEGREE - 10 / cao) / MMOL_PER_DEGREE).toBeLessThan(1e-4);
	});
});

describe('conversions', () => {
	test('worked examples: 4 °dKH = 1.4266 mmol/L; 87.05 mg/L HCO3⁻ = 4 °dKH', () => {
		expect(dkhToMmolHco3(4)).toBeCloseTo(1.4266, 4);
		expect(mmolHco3ToDkh(0.35665)).toBeCloseTo(1, 4);
		// 1.4266 mmol/L × 61.016 g/mol (H + C + 3 O, CIAAW abridged) = 87.05 mg/L.
		expect(mgHco3ToDkh(87.05)).toBeCloseTo(4, 2);
	});
	test('rejects negative and NaN readings', () => {
		expect(() => mgHco3ToDkh(-1)).toThrow(/negative/);
		expect(() => dkhToMmolHco3(Number.NaN)).toThrow(/finite/);
	});
});
