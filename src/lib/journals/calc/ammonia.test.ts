import { describe, expect, test } from 'vitest';
import {
	NEW_TANK_AMMONIA_NOTE,
	NH3_PER_N,
	ammoniaNH4ToNH3,
	ammoniaNToNH3,
	ammoniumPKa,
	dangerousTotalAmmonia,
	UNIONISED_AMMONIA_LEVELS,
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

describe('against the published table of University of Florida IFAS Extension circular FA16 (Francis-Floyd et al., "Ammonia in Aquatic Systems", Table 1)', () => {
	// Fraction of total ammonia that is un-ionised, as the circular prints it (four decimals), for
	// pH 7.0 from 6 to 32 °C and the circular's worked example (pH 8.0, 24 °C: 0.0502). The circular
	// computed its table from Emerson et al. (1975); the equation agrees to the printed last digit or
	// within 2.5 % (the circular's warmest column reads slightly lower than the equation gives).
	const pH7: [number, number][] = [
		[6, 0.0013],
		[8, 0.0016],
		[10, 0.0018],
		[12, 0.0022],
		[14, 0.0025],
		[16, 0.0029],
		[18, 0.0034],
		[20, 0.0039],
		[22, 0.0046],
		[24, 0.0052],
		[26, 0.006],
		[28, 0.0069],
		[30, 0.008],
		[32, 0.0093]
	];
	test.each(pH7)('pH 7.0 at %s °C → %s', (t, printed) => {
		expect(Math.abs(unionisedFraction(7, t).fraction - printed)).toBeLessThanOrEqual(Math.max(0.0001, printed * 0.025));
	});
	test('worked example: 1.0 mg/L total at pH 8.0 and 24 °C is 0.0502 mg/L un-ionised, at the level the circular says may harm fish', () => {
		const r = unionisedAmmonia({ totalMgPerL: 1, basis: 'NH3', pH: 8, tempC: 24 });
		expect(Math.abs(r.nh3MgPerL - 0.0502)).toBeLessThanOrEqual(0.0001);
		// FA16: "un-ionized ammonia of 0.05 mg/L may harm fish" — the danger level used here.
		expect(UNIONISED_AMMONIA_LEVELS.danger).toBe(0.05);
		expect(r.level).toBe('danger');
	});
	test('the total that reaches danger moves with pH: about 1 mg/L at pH 8.0, 24 °C; about 9.6 mg/L at pH 7.0 (0.05 ÷ 0.0052)', () => {
		expect(dangerousTotalAmmonia(8, 24)).toBeCloseTo(0.05 / 0.0502, 2);
		expect(Math.abs(dangerousTotalAmmonia(7, 24) - 0.05 / 0.0052) / (0.05 / 0.0052)).toBeLessThan(0.02);
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
	test('levels: 0.02 concern (common practice, no source), 0.05 danger (IFAS FA16)', () => {
		expect(unionisedAmmoniaLevel(0.019)).toBe('safe');
		expect(unionisedAmmoniaLevel(0.02)).toBe('concern');
		expect(unionisedAmmoniaLevel(0.05)).toBe('danger');
		expect(NEW_TANK_AMMONIA_NOTE).toMatch(/mature filter/);
	});
});
