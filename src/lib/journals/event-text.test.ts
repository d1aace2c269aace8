import { describe, expect, test } from 'vitest';
import { describeEvent, doseAdds, type EventFacts } from './event-text';

const base: EventFacts = {
	kind: 'note',
	percent: null,
	filterPart: null,
	what: '',
	amount: null,
	amountUnit: null,
	saltId: null,
	speciesName: '',
	count: null,
	algaeKind: null,
	note: ''
};

describe('describeEvent', () => {
	test('a line per kind, with the note last', () => {
		expect(describeEvent({ ...base, kind: 'water-change', percent: 40, note: 'cold tap water' })).toEqual({
			label: 'Water change',
			detail: '40 % of the water · cold tap water'
		});
		expect(describeEvent({ ...base, kind: 'filter-clean', filterPart: 'prefilter' }).detail).toBe('Pre-filter sponge');
		expect(describeEvent({ ...base, kind: 'livestock-added', count: 6, speciesName: 'Otocinclus vittatus' }).detail).toBe('6 × Otocinclus vittatus');
		expect(describeEvent({ ...base, kind: 'algae', algaeKind: 'threads' })).toEqual({ label: 'Algae seen', detail: 'Long green threads' });
		expect(describeEvent({ ...base, kind: 'upkeep', what: 'Wipe the glass' }).detail).toBe('Wipe the glass');
		expect(describeEvent({ ...base, kind: 'dose', what: 'Trace solution', amount: 5, amountUnit: 'mL' }).detail).toBe('5 mL of Trace solution');
	});

	test('a dose of potassium nitrate says what it adds: 1 g in 100 L', () => {
		// By hand with CIAAW 2021 abridged atomic weights (K 39.098, N 14.007, O 15.999):
		// KNO3 = 101.102 g/mol, NO3 = 62.004 g/mol; 1000 mg × 62.004/101.102 ÷ 100 L = 6.13 mg/L NO3,
		// 1000 mg × 39.098/101.102 ÷ 100 L = 3.87 mg/L K.
		const dose = { ...base, kind: 'dose' as const, saltId: 'KNO3', amount: 1, amountUnit: 'g' };
		const adds = doseAdds(dose, 100);
		expect(adds.map((a) => a.nutrient)).toEqual(['K', 'NO3']);
		expect(adds.find((a) => a.nutrient === 'NO3')!.mgPerL).toBeCloseTo(6.133, 2);
		expect(adds.find((a) => a.nutrient === 'K')!.mgPerL).toBeCloseTo(3.867, 2);
		expect(describeEvent(dose, { litres: 100 }).detail).toBe('1 g of Potassium nitrate (KNO₃) · adds about 3.9 mg/L K, 6.1 mg/L NO3');
	});

	test('no contribution without a known salt, a mass, or a volume', () => {
		expect(doseAdds({ saltId: 'KNO3', amount: 5, amountUnit: 'mL' }, 100)).toEqual([]);
		expect(doseAdds({ saltId: 'unknown', amount: 1, amountUnit: 'g' }, 100)).toEqual([]);
		expect(doseAdds({ saltId: 'KNO3', amount: 1, amountUnit: 'g' }, null)).toEqual([]);
		expect(doseAdds({ saltId: 'KNO3', amount: 500, amountUnit: 'mg' }, 100)[1]!.mgPerL).toBeCloseTo(3.066, 2);
	});
});
