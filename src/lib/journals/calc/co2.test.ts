import { describe, expect, test } from 'vitest';
import { CO2_ESTIMATE_EXPLANATION, CO2_SAFETY_CAUTION, carbonicAcidPK1, co2FromEquilibrium, co2FromHobbyRule, estimateCo2 } from './co2';

describe('carbonicAcidPK1 (Plummer & Busenberg 1982)', () => {
	test('about 6.35 at 25 °C: 6.352, the value measured by Harned & Davis (1943), from memory', () => {
		expect(Math.abs(carbonicAcidPK1(25) - 6.352)).toBeLessThan(0.002);
	});
	test('6.579 at 0 °C and 6.298 at 40 °C (Harned & Davis 1943, from memory)', () => {
		expect(Math.abs(carbonicAcidPK1(0) - 6.579)).toBeLessThan(0.003);
		expect(Math.abs(carbonicAcidPK1(40) - 6.298)).toBeLessThan(0.003);
	});
	test('refuses temperatures at which water is not liquid', () => {
		expect(() => carbonicAcidPK1(-3)).toThrow(/not liquid/);
		expect(() => carbonicAcidPK1(Number.NaN)).toThrow(/finite/);
	});
});

describe('CO2 from pH and KH', () => {
	test('equilibrium, worked by hand: KH 4, pH 7.0, 25 °C → 4 × 0.35665 mmol/L × 44.009 g/mol × 10^(6.352 − 7) ≈ 14.1 mg/L', () => {
		// 0.35665 mmol/L per °dKH (published); 44.009 = 12.011 + 2 × 15.999 (CIAAW 2021 abridged); pK1 6.352.
		const byHand = 4 * 0.35665 * 44.009 * 10 ** (6.352 - 7);
		const r = co2FromEquilibrium({ kh: 4, pH: 7, tempC: 25 });
		expect(Math.abs(r.mgPerL - byHand) / byHand).toBeLessThan(0.005);
		expect(r.bicarbonateMmolPerL).toBeCloseTo(1.4266, 4);
	});
	test('colder water holds the same pH and KH with more CO2 (pK1 rises as it cools)', () => {
		expect(co2FromEquilibrium({ kh: 4, pH: 7, tempC: 20 }).mgPerL).toBeGreaterThan(co2FromEquilibrium({ kh: 4, pH: 7, tempC: 28 }).mgPerL);
	});
	test('hobby rule 3 × KH × 10^(7 − pH) (common practice, no source): KH 4, pH 6.8 → 19.02 mg/L', () => {
		expect(co2FromHobbyRule({ kh: 4, pH: 6.8 })).toBeCloseTo(12 * 10 ** 0.2, 9);
		expect(co2FromHobbyRule({ kh: 4, pH: 6.8 })).toBeCloseTo(19.0187, 3);
		expect(co2FromHobbyRule({ kh: 0, pH: 6.8 })).toBe(0);
	});
	test('the hobby rule reads lower than the equilibrium at tank temperatures', () => {
		for (const tempC of [20, 24, 28]) {
			const e = estimateCo2({ kh: 3, pH: 6.6, tempC });
			expect(e.hobbyRuleMgPerL).toBeLessThan(e.equilibriumMgPerL);
		}
	});
	test('the estimate leads with the equilibrium and carries the explanation and caution', () => {
		const e = estimateCo2({ kh: 4, pH: 6.8, tempC: 25 });
		expect(e.primary).toBe('equilibrium');
		expect(e.explanation).toBe(CO2_ESTIMATE_EXPLANATION);
		expect(CO2_ESTIMATE_EXPLANATION).toMatch(/phosphate/);
		expect(CO2_ESTIMATE_EXPLANATION).toMatch(/humic/);
		expect(e.caution).toBe(CO2_SAFETY_CAUTION);
		expect(CO2_SAFETY_CAUTION).toMatch(/upright/);
		expect(CO2_SAFETY_CAUTION).toMatch(/solenoid/);
		expect(CO2_SAFETY_CAUTION).toMatch(/leaks/);
	});
	test('rejects impossible readings', () => {
		expect(() => co2FromHobbyRule({ kh: -1, pH: 7 })).toThrow(/negative/);
		expect(() => co2FromEquilibrium({ kh: 4, pH: 15, tempC: 25 })).toThrow(/between 0 and 14/);
	});
});
