import { describe, expect, test } from 'vitest';
import { ELECTRICAL_SAFETY_CAUTION, PAR_BAND_EDGES, compareLighting, parBand, suggestedPhotoperiod, summariseLighting } from './lighting';

describe('summariseLighting', () => {
	test('worked example: 40 W for 8 h and 15 W for 6 h over 100 L', () => {
		// 55 W total, 0.55 W/L; 40·8 + 15·6 = 410 Wh a day; longest on-time 8 h.
		const s = summariseLighting(
			[
				{ label: 'Main bar', watts: 40, hoursPerDay: 8 },
				{ label: 'Sunset strip', watts: 15, hoursPerDay: 6 }
			],
			100
		);
		expect(s.totalWatts).toBe(55);
		expect(s.wattsPerLitre).toBeCloseTo(0.55, 12);
		expect(s.whPerDay).toBe(410);
		expect(s.fixtures.map((f) => f.whPerDay)).toEqual([320, 90]);
		expect(s.fixtures[1]?.wattsPerLitre).toBeCloseTo(0.15, 12);
		expect(s.photoperiodHours).toBe(8);
		expect(s.photoperiodsDiffer).toBe(true);
		expect(s.photoperiodNote).toMatch(/Sunset strip runs shorter/);
	});
	test('equal on-times need no note; no fixtures gives zeros', () => {
		const s = summariseLighting(
			[
				{ label: 'A', watts: 30, hoursPerDay: 7 },
				{ label: 'B', watts: 30, hoursPerDay: 7 }
			],
			60
		);
		expect(s.photoperiodsDiffer).toBe(false);
		expect(s.photoperiodNote).toBeNull();
		expect(summariseLighting([], 60)).toMatchObject({ totalWatts: 0, whPerDay: 0, photoperiodHours: 0 });
	});
	test('rejects bad input', () => {
		expect(() => summariseLighting([{ label: 'A', watts: 30, hoursPerDay: 25 }], 60)).toThrow(/between 0 and 24/);
		expect(() => summariseLighting([{ label: 'A', watts: -3, hoursPerDay: 8 }], 60)).toThrow(/power of "A"/);
		expect(() => summariseLighting([], 0)).toThrow(/water volume/);
	});
});

describe('suggestedPhotoperiod (common practice, no source)', () => {
	test('six hours under six weeks, then half an hour a week up to eight', () => {
		expect(suggestedPhotoperiod(0).hours).toBe(6);
		expect(suggestedPhotoperiod(41).hours).toBe(6);
		expect(suggestedPhotoperiod(41).reason).toMatch(/under six weeks/);
		expect(suggestedPhotoperiod(42).hours).toBe(6.5);
		expect(suggestedPhotoperiod(49).hours).toBe(7);
		expect(suggestedPhotoperiod(63).hours).toBe(8);
		expect(suggestedPhotoperiod(400)).toEqual({ hours: 8, reason: expect.stringMatching(/established/) });
		expect(() => suggestedPhotoperiod(-1)).toThrow(/negative/);
	});
});

describe('compareLighting', () => {
	test('70 W against 40 W on the same tank is 1.75×, "almost twice" (worked example)', () => {
		const c = compareLighting({ watts: 70, litres: 100 }, { watts: 40, litres: 100 });
		expect(c.ratio).toBeCloseTo(1.75, 12);
		expect(c.stronger).toBe('a');
		expect(c.description).toBe('almost twice as strong per litre');
	});
	test('per litre reverses it: 70 W over 200 L against 40 W over 100 L is 0.35 vs 0.4 W/L', () => {
		const c = compareLighting({ watts: 70, litres: 200 }, { watts: 40, litres: 100 });
		expect(c.ratio).toBeCloseTo(0.875, 12);
		expect(c.stronger).toBe('b');
		expect(c.description).toBe('somewhat stronger per litre');
	});
	test('near-equal and large ratios', () => {
		expect(compareLighting({ watts: 41, litres: 100 }, { watts: 40, litres: 100 }).stronger).toBe('same');
		expect(compareLighting({ watts: 120, litres: 100 }, { watts: 40, litres: 100 }).description).toBe('about 3 times as strong per litre');
		expect(() => compareLighting({ watts: 0, litres: 100 }, { watts: 40, litres: 100 })).toThrow(/watts of A/);
	});
	test('the electrical caution names an RCD, drip loops and unplugging', () => {
		expect(ELECTRICAL_SAFETY_CAUTION).toMatch(/residual-current device/);
		expect(ELECTRICAL_SAFETY_CAUTION).toMatch(/drip loop/);
		expect(ELECTRICAL_SAFETY_CAUTION).toMatch(/unplug/);
	});
});

describe('parBand (common practice, no source: the edges are from memory of hobby write-ups)', () => {
	test('each reading gets one word, the edges belonging to the band above', () => {
		expect(parBand(1)).toBe('low');
		expect(parBand(PAR_BAND_EDGES.medium - 1)).toBe('low');
		expect(parBand(PAR_BAND_EDGES.medium)).toBe('medium');
		expect(parBand(PAR_BAND_EDGES.high - 1)).toBe('medium');
		expect(parBand(PAR_BAND_EDGES.high)).toBe('high');
		expect(parBand(1800)).toBe('high');
	});
	test('a reading outside what a meter can show under a tank light is refused', () => {
		expect(() => parBand(0)).toThrow(/PAR/);
		expect(() => parBand(2501)).toThrow(/PAR/);
		expect(() => parBand(Number.NaN)).toThrow(/PAR/);
	});
});
