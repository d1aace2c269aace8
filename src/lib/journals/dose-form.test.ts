import { describe, expect, test } from 'vitest';
import { DOSE_MODE_LABELS, SALT_CHOICES, stockDoseGrams, workOutDose } from './dose-form';

const ask = (query: Record<string, string>, units: 'metric' | 'us' = 'metric', tankLitres: number | null = null) =>
	workOutDose(new URLSearchParams(query), units, tankLitres);

// Check values worked by hand with the CIAAW 2021 abridged atomic weights (see calc/dosing.test.ts).
describe('workOutDose', () => {
	test('nothing is worked out before the form is sent; a tank fills in its volume', () => {
		expect(ask({}, 'metric', 160)).toMatchObject({ result: null, errors: {}, values: { salt: 'KNO3', mode: 'grams', nutrient: 'K', volume: '160' } });
		// 160 L = 42.3 US gal (1 US gal = 3.785411784 L, NIST Handbook 44).
		expect(ask({}, 'us', 160).values.volume).toBe('42.3');
	});
	test('1 g KNO3 in 100 L adds 6.13 mg/L NO3⁻ and 3.87 mg/L K⁺', () => {
		const { result, errors } = ask({ salt: 'KNO3', mode: 'grams', grams: '1', volume: '100' });
		expect(errors).toEqual({});
		expect(result!.grams).toBe(1);
		expect(result!.adds.find((a) => a.nutrient === 'NO3')!.mgPerL).toBeCloseTo(6.13, 2);
		expect(result!.adds.find((a) => a.nutrient === 'K')!.mgPerL).toBeCloseTo(3.87, 2);
	});
	test('1 g KHCO3 in 100 L adds 6.095 mg/L HCO3⁻, which raises KH by 0.28 °dKH (1 °dKH = 21.76 mg/L HCO3⁻)', () => {
		const hco3 = ask({ salt: 'KHCO3', grams: '1', volume: '100' }).result!.adds.find((a) => a.nutrient === 'HCO3')!;
		expect(hco3.mgPerL).toBeCloseTo(6.095, 3);
		expect(hco3.khRiseDkh).toBeCloseTo(0.2801, 3);
	});
	test('a target in 26.417 US gal (100 L): 6.13 mg/L NO3⁻ needs 1 g KNO3; decimal commas are read', () => {
		const { result } = ask({ salt: 'KNO3', mode: 'target', nutrient: 'NO3', target: '6,1328', volume: '26.417' }, 'us');
		expect(result!.grams).toBeCloseTo(1, 3);
	});
	test('each wrong field gets its message; a salt that does not supply the nutrient is refused at it', () => {
		expect(ask({ salt: 'KNO3', grams: '0', volume: 'lots' }).errors).toEqual({ grams: 'Enter a number greater than zero.', volume: expect.any(String) });
		const wrong = ask({ salt: 'KNO3', mode: 'target', nutrient: 'PO4', target: '1', volume: '100' });
		expect(wrong.result).toBeNull();
		expect(wrong.errors.nutrient).toMatch(/does not supply/);
	});
	test('the salts to choose from say what they supply and its share: KHCO3 is 39.05 % K and 60.95 % HCO3 (39.098 and 61.016 of 100.114 g/mol)', () => {
		const khco3 = SALT_CHOICES.find((s) => s.id === 'KHCO3')!;
		expect(khco3.supplies).toEqual(['K', 'HCO3']);
		expect(khco3.fractions.map((f) => f.nutrient)).toEqual(['K', 'HCO3']);
		expect(khco3.fractions[0]!.percent).toBeCloseTo(39.053, 2);
		expect(khco3.fractions[1]!.percent).toBeCloseTo(60.947, 2);
	});
});

describe('stock solution', () => {
	// The dose rule of REFERENCES (mg/L = g × 1000 × share ÷ L) applied to the salt in one dose; NO3⁻ is
	// 62.004 of 101.10 g/mol of KNO3 (CIAAW 2021 abridged), 61.33 %.
	test('50 g KNO3 made up to 500 mL, 10 mL a dose in 100 L: 1 g a dose, 6.13 mg/L NO3⁻; 100 g/L, 50 doses a batch', () => {
		expect(stockDoseGrams(50, 500, 10)).toBe(1);
		const { result, errors } = ask({ salt: 'KNO3', mode: 'stock', stockGrams: '50', stockMl: '500', doseMl: '10', volume: '100' });
		expect(errors).toEqual({});
		expect(result!.grams).toBe(1);
		expect(result!.stock).toEqual({ gPerL: 100, doses: 50 });
		expect(result!.adds.find((a) => a.nutrient === 'NO3')!.mgPerL).toBeCloseTo(6.13, 2);
	});
	test('the same dose as the dry salt gives the same figures', () => {
		const dry = ask({ salt: 'KH2PO4', grams: '0.3', volume: '60' }).result!;
		const wet = ask({ salt: 'KH2PO4', mode: 'stock', stockGrams: '30', stockMl: '1000', doseMl: '10', volume: '60' }).result!;
		expect(wet.adds).toEqual(dry.adds.map((a) => ({ ...a, mgPerL: expect.closeTo(a.mgPerL, 12) })));
	});
	test('each field is checked; a dose larger than the batch is refused', () => {
		expect(ask({ salt: 'KNO3', mode: 'stock', stockGrams: '', stockMl: '500', doseMl: '10', volume: '100' }).errors).toEqual({
			stockGrams: 'Enter a number greater than zero.'
		});
		expect(ask({ salt: 'KNO3', mode: 'stock', stockGrams: '5', stockMl: '50', doseMl: '60', volume: '100' }).errors.doseMl).toMatch(/more than the whole/);
	});
	test('the modes have names of our own that say what each answers', () => {
		expect(Object.values(DOSE_MODE_LABELS)).toEqual(['What does this dose add?', 'How much salt for a rise?', 'Dosing from a stock solution']);
	});
});
