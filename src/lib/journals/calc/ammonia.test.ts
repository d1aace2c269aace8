import { describe, expect, test } from 'vitest';
import {
	NEW_TANK_AMMONIA_NOTE,
	NH3_PER_N,
	ammoniaNH4ToNH3,
	ammoniaNToNH3,
	ammoniumPKa,
	totalAmmoniaAsNH3,
	unionisedAmmonia,
	unionisedAmmoniaLevel,
	unionisedFraction
} from './ammonia';

describe('unionisedFraction (Emerson et al. 1975)', () => {
	// Percent NH3 of total ammonia from the table in Emerson et al. (1975), values from memory. They
	// fit the equation best with T = t + 273.2 while this code uses 273.15, so 1 % relative is allowed.
	const table: [number, number, number][] = [
		[10, 7.0, 0.186],
		[20, 7.0, 0.396],
		[20, 8.0, 3.82],
		[25, 7.0, 0.566],
		[25, 8.0, 5.38],
		[30, 8.0, 7.46]
	];
	test.each(table)('%s °C, pH %s → %s %%', (t, pH, percent) => {
		const { fraction } = unionisedFraction(pH, t);
		expect(Math.abs(fraction * 100 - percent) / percent).toBeLessThan(0.01);
	});
	test('pKa at 25 °C by hand: 0.09018 + 2729.92 / 298.15 = 9.2464', () => {
		expect(ammoniumPKa(25)).toBeCloseTo(9.2464, 4);
	});
	test('half is NH3 when pH equals pKa', () => {
		expect(unionisedFraction(ammoniumPKa(20), 20).fraction).toBeCloseTo(0.5, 12);
	});
	test('flags temperatures outside 0–50 °C and refuses impossible input', () => {
		expect(unionisedFraction(7, 55).inValidRange).toBe(false);
		expect(unionisedFraction(7, 25).inValidRange).toBe(true);
		expect(() => unionisedFraction(7, -2)).toThrow(/not liquid/);
		expect(() => unionisedFraction(14.5, 25)).toThrow(/pH/);
	});
});

describe('reading bases: N, NH3 and NH4', () => {
	test('1 mg/L as N = 1.2159 mg/L as NH3 (14.007 and 17.031 g/mol, CIAAW 2021 abridged)', () => {
		expect(NH3_PER_N).toBeCloseTo(17.031 / 14.007, 10);
		expect(ammoniaNToNH3(1)).toBeCloseTo(1.2159, 4);
		// 1 mg/L as NH4⁺ = 17.031 / 18.039 = 0.9441 mg/L as NH3.
		expect(ammoniaNH4ToNH3(1)).toBeCloseTo(0.9441, 4);
		expect(totalAmmoniaAsNH3(0.5, 'NH3')).toBe(0.5);
		expect(() => ammoniaNToNH3(-1)).toThrow(/negative/);
	});
});

describe('unionisedAmmonia', () => {
	test('1 mg/L total as NH3 at pH 8.0 and 25 °C is about 0.054 mg/L NH3: danger', () => {
		const r = unionisedAmmonia({ totalMgPerL: 1, basis: 'NH3', pH: 8, tempC: 25 });
		expect(Math.abs(r.nh3MgPerL - 0.0538) / 0.0538).toBeLessThan(0.01); // Emerson table: 5.38 %
		expect(r.level).toBe('danger');
		expect(r.nh3AsNMgPerL).toBeCloseTo(r.nh3MgPerL * (14.007 / 17.031), 12);
	});
	test('the same reading is harmless in soft water: pH 6.5 at 24 °C', () => {
		const r = unionisedAmmonia({ totalMgPerL: 1, basis: 'NH3', pH: 6.5, tempC: 24 });
		expect(r.nh3MgPerL).toBeLessThan(0.002);
		expect(r.level).toBe('safe');
	});
	test('a lab figure as N is converted first', () => {
		const asN = unionisedAmmonia({ totalMgPerL: 1, basis: 'N', pH: 7.5, tempC: 25 });
		const asNH3 = unionisedAmmonia({ totalMgPerL: 1.2159, basis: 'NH3', pH: 7.5, tempC: 25 });
		expect(asN.nh3MgPerL).toBeCloseTo(asNH3.nh3MgPerL, 5);
	});
	test('levels (common practice, no source): 0.02 concern, 0.05 danger', () => {
		expect(unionisedAmmoniaLevel(0.019)).toBe('safe');
		expect(unionisedAmmoniaLevel(0.02)).toBe('concern');
		expect(unionisedAmmoniaLevel(0.05)).toBe('danger');
		expect(NEW_TANK_AMMONIA_NOTE).toMatch(/mature filter/);
	});
});
