import { MF } from 'mf-parser';
import { describe, expect, test } from 'vitest';
import { mgHco3ToDkh } from './hardness';
import { FERTILISER_SAFETY_CAUTION, SALTS, SALT_IDS, doseContribution, gramsForTarget, massFraction, saltMolarMass } from './dosing';

// Check values worked by hand with the CIAAW 2021 abridged atomic weights
// (H 1.008, C 12.011, N 14.007, O 15.999, Mg 24.305, P 30.974, S 32.06, Cl 35.45, K 39.098, Ca 40.078).
const BY_HAND: Record<(typeof SALT_IDS)[number], number> = {
	KNO3: 101.102,
	KH2PO4: 136.084,
	K2SO4: 174.252,
	'MgSO4·7H2O': 246.466,
	'CaSO4·2H2O': 172.164,
	KCl: 74.548,
	'Ca(NO3)2·4H2O': 236.146,
	KHCO3: 100.114
};

// The same formulas as mf-parser writes them (hydrate water as a group).
const MF_FORMULA: Record<(typeof SALT_IDS)[number], string> = {
	KNO3: 'KNO3',
	KH2PO4: 'KH2PO4',
	K2SO4: 'K2SO4',
	'MgSO4·7H2O': 'MgSO4(H2O)7',
	'CaSO4·2H2O': 'CaSO4(H2O)2',
	KCl: 'KCl',
	'Ca(NO3)2·4H2O': 'Ca(NO3)2(H2O)4',
	KHCO3: 'KHCO3'
};

describe('molar masses of the salts', () => {
	test.each(SALT_IDS)('%s by hand from CIAAW 2021 abridged weights', (id) => {
		expect(saltMolarMass(id)).toBeCloseTo(BY_HAND[id], 3);
	});
	// mf-parser (npm, cheminfo) computes masses from its own isotope table, so it differs from the
	// abridged standard weights in the fifth figure at most.
	test.each(SALT_IDS)('%s agrees with mf-parser to 1 part in 10⁴', (id) => {
		const reference = new MF(MF_FORMULA[id]).getInfo().mass;
		expect(Math.abs(saltMolarMass(id) - reference) / reference).toBeLessThan(1e-4);
	});
	test('every salt’s composition matches its printed formula (mf-parser atom counts)', () => {
		for (const id of SALT_IDS) {
			expect(new MF(MF_FORMULA[id]).getInfo().atoms).toEqual(SALTS[id].composition);
		}
	});
});

describe('doseContribution', () => {
	test('worked example: 1 g KNO3 in 100 L → 6.13 mg/L NO3⁻ and 3.87 mg/L K⁺ (1.39 mg/L as N)', () => {
		const d = doseContribution('KNO3', 1, 100);
		expect(d.NO3).toBeCloseTo(6.13, 2);
		expect(d.K).toBeCloseTo(3.87, 2);
		expect(d.N).toBeCloseTo(1.3854, 4);
		expect(d.PO4).toBeUndefined();
	});
	test('1 g KH2PO4 in 100 L → 6.979 mg/L PO4, 2.873 K, 2.276 P (worked by hand)', () => {
		const d = doseContribution('KH2PO4', 1, 100);
		expect(d.PO4).toBeCloseTo(6.9788, 3);
		expect(d.K).toBeCloseTo(2.8731, 3);
		expect(d.P).toBeCloseTo(2.2761, 3);
	});
	test('1 g MgSO4·7H2O in 100 L → 0.986 mg/L Mg and 3.897 mg/L SO4 (worked by hand)', () => {
		const d = doseContribution('MgSO4·7H2O', 1, 100);
		expect(d.Mg).toBeCloseTo(0.9861, 3);
		expect(d.SO4).toBeCloseTo(3.8973, 3);
	});
	test('mass is conserved: the ions of K2SO4 add up to the salt', () => {
		const d = doseContribution('K2SO4', 2, 50);
		expect((d.K ?? 0) + (d.SO4 ?? 0)).toBeCloseTo((2 * 1000) / 50, 9);
	});
	test('1 g KHCO3 in 100 L raises KH by 0.28 °dKH (6.095 mg/L HCO3⁻ ÷ 21.76 mg/L per °dKH)', () => {
		const d = doseContribution('KHCO3', 1, 100);
		expect(mgHco3ToDkh(d.HCO3 ?? 0)).toBeCloseTo(0.2801, 3);
	});
	test('rejects bad amounts', () => {
		expect(() => doseContribution('KNO3', -1, 100)).toThrow(/negative/);
		expect(() => doseContribution('KNO3', 1, 0)).toThrow(/water volume/);
	});
});

describe('gramsForTarget', () => {
	test('+10 mg/L NO3⁻ in 100 L takes 1.631 g KNO3; +10 mg/L K⁺ in 60 L takes 1.337 g K2SO4 (worked by hand)', () => {
		expect(gramsForTarget('KNO3', 'NO3', 10, 100)).toBeCloseTo(1.6306, 3);
		expect(gramsForTarget('K2SO4', 'K', 10, 60)).toBeCloseTo(1.337, 3);
	});
	test('round trip with doseContribution', () => {
		const g = gramsForTarget('CaSO4·2H2O', 'Ca', 5, 80);
		expect(doseContribution('CaSO4·2H2O', g, 80).Ca).toBeCloseTo(5, 10);
	});
	test('refuses a nutrient the salt does not supply', () => {
		expect(() => gramsForTarget('KNO3', 'Mg', 5, 100)).toThrow(/does not supply/);
		expect(massFraction('KNO3', 'Mg')).toBe(0);
	});
	test('the caution covers children, pets, labels and overdosing', () => {
		expect(FERTILISER_SAFETY_CAUTION).toMatch(/children and pets/);
		expect(FERTILISER_SAFETY_CAUTION).toMatch(/labelled/);
		expect(FERTILISER_SAFETY_CAUTION).toMatch(/do not overdose/);
	});
});
