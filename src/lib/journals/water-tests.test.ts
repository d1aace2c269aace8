import { describe, expect, test } from 'vitest';
import { NH3_PER_N } from './calc';
import {
	buildSeries,
	derivedFigures,
	emptyWaterTestDraft,
	judgeAmmonia,
	latestWarnings,
	parseWaterTest,
	readingsOf,
	waterTestDraftOf,
	type WaterTestValues
} from './water-tests';

const blank: WaterTestValues = {
	ph: null,
	kh: null,
	gh: null,
	no3: null,
	po4: null,
	k: null,
	fe: null,
	ammonia: null,
	ammoniaBasis: 'NH3',
	no2: null,
	temperatureC: null,
	tds: null
};
const today = '2026-03-20';

describe('waterTestDraftOf (the edit form)', () => {
	const stored = { ...blank, ph: 6.85, kh: 4, ammonia: 0.25, ammoniaBasis: 'NH4' as const, temperatureC: 25.3, testedOn: '2026-03-18', note: 'after the trim' };
	test('starts from the stored readings, temperature in °F for a US member: 25.3 °C = 77.54 °F, shown to a tenth (NIST SP 811, B.8)', () => {
		const draft = waterTestDraftOf(stored, 'us');
		expect(draft).toMatchObject({
			testedOn: '2026-03-18',
			ph: '6.85',
			kh: '4',
			ammonia: '0.25',
			ammoniaBasis: 'NH4',
			temperatureC: '77.5',
			no3: '',
			note: 'after the trim'
		});
		expect(waterTestDraftOf(stored, 'metric').temperatureC).toBe('25.3');
	});
	test('saving the form unchanged keeps every value, in either unit system', () => {
		for (const units of ['metric', 'us', 'imperial'] as const) {
			for (const temperatureC of [0, 4.4, 18.1, 25.3, 26.7, 31.9, 45]) {
				const test = { ...stored, temperatureC };
				expect(parseWaterTest(waterTestDraftOf(test, units), units, { today })).toEqual({ ok: true, input: test });
			}
		}
	});
});

describe('parseWaterTest', () => {
	test('any subset of readings; blanks stay empty', () => {
		const parsed = parseWaterTest({ ...emptyWaterTestDraft('2026-03-19'), ph: '6,8', no3: '15' }, 'metric', { today });
		expect(parsed).toEqual({ ok: true, input: { ...blank, ph: 6.8, no3: 15, testedOn: '2026-03-19', note: '' } });
	});
	test('a US member types °F: 77 °F is 25 °C exactly, (77 − 32) × 5/9 (NIST SP 811, B.8)', () => {
		const parsed = parseWaterTest({ ...emptyWaterTestDraft(today), temperatureC: '77' }, 'us', { today });
		expect(parsed.ok && parsed.input.temperatureC).toBe(25);
		const metric = parseWaterTest({ ...emptyWaterTestDraft(today), temperatureC: '77' }, 'metric', { today });
		expect(metric.ok).toBe(false);
	});
	test('refuses no readings, words, impossible values, a future day, a day before set-up', () => {
		expect(parseWaterTest(emptyWaterTestDraft(today), 'metric', { today })).toEqual({ ok: false, errors: { readings: 'Enter at least one reading.' } });
		const bad = parseWaterTest({ ...emptyWaterTestDraft('2026-03-21'), ph: 'seven', no2: '-1', gh: '900', ammoniaBasis: 'x' }, 'metric', { today });
		expect(bad.ok).toBe(false);
		if (!bad.ok) expect(Object.keys(bad.errors).sort()).toEqual(['ammoniaBasis', 'gh', 'no2', 'ph', 'testedOn']);
		const early = parseWaterTest({ ...emptyWaterTestDraft('2026-01-01'), ph: '7' }, 'metric', { today, notBefore: '2026-02-01' });
		expect(early.ok ? null : early.errors.testedOn).toBe('That is before the tank was set up.');
	});
});

describe('readings, estimates and series', () => {
	const test1 = { ...blank, id: 1, testedOn: '2026-03-01', ph: 6.6, kh: 4, no3: 30, ammonia: 0.5, ammoniaBasis: 'N' as const, temperatureC: 25, no2: 0.3 };

	test('each reading against the common bands (common practice, no source)', () => {
		const byParam = Object.fromEntries(readingsOf(test1).map((r) => [r.parameter, r.status]));
		// 0.5 mg/L as N is 0.61 mg/L as NH3 (× 17.031/14.007, CIAAW 2021 abridged weights): above the usual
		// total, but at pH 6.6 and 25 °C only 0.0014 mg/L is un-ionised, so it is not a danger.
		expect(byParam).toEqual({ pH: 'in-band', KH: 'in-band', NO3: 'high', ammonia: 'high', NO2: 'danger', temperature: 'in-band' });
		// Without the temperature the total alone is judged: 0.61 is past the 0.25 total level (common practice, no source).
		expect(readingsOf({ ...test1, temperatureC: null }).find((r) => r.parameter === 'ammonia')!.status).toBe('danger');
	});

	test('estimates only where their inputs are: ammonia needs pH and temperature, CO2 pH and KH', () => {
		const both = derivedFigures(test1);
		expect(both.ammonia?.totalAsNH3MgPerL).toBeCloseTo(0.5 * NH3_PER_N, 10);
		// Hobby rule by hand: 3 × 4 × 10^(7 − 6.6) = 12 × 2.5119 = 30.14 mg/L (common practice, no source).
		expect(both.co2?.hobbyRuleMgPerL).toBeCloseTo(30.14, 2);
		expect(both.co2?.estimate?.equilibriumMgPerL).toBeGreaterThan(both.co2!.hobbyRuleMgPerL);
		const noTemp = derivedFigures({ ...test1, temperatureC: null });
		expect(noTemp.ammonia).toBeNull();
		expect(noTemp.co2?.estimate).toBeNull();
		expect(noTemp.co2?.hobbyRuleMgPerL).toBeCloseTo(30.14, 2);
		expect(derivedFigures({ ...blank, ph: 7 })).toEqual({ ammonia: null, co2: null });
	});

	test('series per parameter, oldest first, in the member’s units, with the band converted too', () => {
		const tests = [test1, { ...blank, id: 2, testedOn: '2026-02-20', temperatureC: 22, ph: 7.0 }];
		const series = buildSeries(tests, 'us');
		const temp = series.find((s) => s.parameter === 'temperature')!;
		// 22 °C = 71.6 °F and 25 °C = 77 °F; the 22–28 °C band is 71.6–82.4 °F.
		expect(temp.points.map((p) => [p.on, p.value])).toEqual([
			['2026-02-20', 71.6],
			['2026-03-01', 77]
		]);
		expect(temp.unit).toBe('°F');
		expect(temp.band).toEqual({ low: 71.6, high: 82.4 });
		expect(series.map((s) => s.parameter)).toEqual(['pH', 'KH', 'NO3', 'ammonia', 'NO2', 'temperature']);
		const ammonia = series.find((s) => s.parameter === 'ammonia')!;
		expect(ammonia.points[0]!.value).toBeCloseTo(0.6079, 3);
		expect(ammonia).toMatchObject({ outOfBand: 1, dangerous: 0, danger: {} });
		// Its danger line is the test's own: 0.05 mg/L NH3 ÷ the un-ionised fraction at pH 6.6, 25 °C.
		expect(ammonia.points[0]!.dangerAt).toBeCloseTo(0.05 / (1 / (10 ** (9.2464 - 6.6) + 1)), 2);
	});

	test('warnings for the latest off-target readings, danger first', () => {
		const warnings = latestWarnings(buildSeries([test1], 'metric'));
		expect(warnings.map((w) => [w.parameter, w.status])).toEqual([
			['NO2', 'danger'],
			['NO3', 'high'],
			['ammonia', 'high']
		]);
		expect(warnings[1]!.text).toBe('Nitrate (NO₃) read 30 mg/L, above the usual 5–25 mg/L.');
		expect(warnings[0]!.text).toMatch(/harms fish/);
		expect(warnings[2]!.text).toMatch(/not dangerous now/);
	});
});

describe('ammonia is judged on the un-ionised figure when pH and temperature are known', () => {
	// Fractions from University of Florida IFAS Extension circular FA16, Table 1: 0.0052 at pH 7.0 and
	// 24 °C, 0.0502 at pH 8.0 and 24 °C (its worked example); danger at 0.05 mg/L NH3 as FA16 states.
	const at = (ammonia: number, ph: number | null, temperatureC: number | null) => ({ ...blank, ammonia, ph, temperatureC });

	test('0.5 mg/L total at pH 7.0 and 24 °C: 0.0026 mg/L NH3, no danger banner, and the words agree', () => {
		const j = judgeAmmonia(at(0.5, 7, 24))!;
		expect(j.basis).toBe('unionised');
		expect(j.basis === 'unionised' && Math.abs(j.nh3MgPerL - 0.5 * 0.0052)).toBeLessThan(0.0001);
		expect(j.status).toBe('high');
		const [w] = latestWarnings(buildSeries([{ ...at(0.5, 7, 24), id: 1, testedOn: '2026-03-01' }], 'metric'));
		expect(w!.status).toBe('high');
		expect(w!.text).not.toMatch(/may harm fish|at or above|FA16/);
		expect(w!.text).toMatch(/below the 0\.02 mg\/L/);
	});
	test('the same total at pH 8.0 and 24 °C is 0.025 mg/L NH3 (concern); 1.0 mg/L there is 0.0502 (danger, FA16)', () => {
		expect(judgeAmmonia(at(0.5, 8, 24))!.status).toBe('high');
		const danger = latestWarnings(buildSeries([{ ...at(1, 8, 24), id: 1, testedOn: '2026-03-01' }], 'metric'));
		expect(danger[0]!.status).toBe('danger');
		expect(danger[0]!.text).toMatch(/University of Florida circular FA16/);
	});
	test('without pH or temperature the total alone is used, and the warning says so', () => {
		const j = judgeAmmonia(at(0.5, null, 24))!;
		expect(j).toMatchObject({ basis: 'total', status: 'danger', missing: ['pH'], dangerAtTotal: 0.25 });
		const [w] = latestWarnings(buildSeries([{ ...at(0.1, 7, null), id: 1, testedOn: '2026-03-01' }], 'metric'));
		expect(w!.text).toMatch(/No temperature was recorded with this test, so .* the total alone is used\./);
		expect(judgeAmmonia(at(0.1, null, null))).toMatchObject({ missing: ['pH', 'temperature'] });
		expect(judgeAmmonia(blank)).toBeNull();
	});
});
