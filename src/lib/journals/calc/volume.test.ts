import Qty from 'js-quantities';
import { describe, expect, test } from 'vitest';
import { inchesToCm, litresToUsGallons } from './units';
import { DEFAULT_WATER_LINE_BELOW_RIM_CM, averageSubstrateDepthCm, chooseWaterVolume, estimateWaterVolume, grossVolumeLitres, innerFromOuter } from './volume';

const tank = { lengthCm: 60, widthCm: 30, heightCm: 36 };

describe('grossVolumeLitres', () => {
	test('60 × 30 × 36 cm = 64 800 cm³ = 64.8 L (js-quantities cm³ → L)', () => {
		expect(grossVolumeLitres(tank)).toBeCloseTo(Qty(`${60 * 30 * 36} cm^3`).to('l').scalar, 10);
		expect(grossVolumeLitres(tank)).toBeCloseTo(64.8, 10);
	});
	test('a box of 30 × 12 × 12 in holds 4320 in³ = 18.70 US gal (231 in³ per gallon, NIST HB 44)', () => {
		const litres = grossVolumeLitres({ lengthCm: inchesToCm(30), widthCm: inchesToCm(12), heightCm: inchesToCm(12) });
		expect(litresToUsGallons(litres)).toBeCloseTo(4320 / 231, 9);
	});
	test('rejects zero, negative and NaN dimensions', () => {
		expect(() => grossVolumeLitres({ ...tank, widthCm: 0 })).toThrow(/inner width.*greater than zero/);
		expect(() => grossVolumeLitres({ ...tank, lengthCm: -5 })).toThrow(/inner length/);
		expect(() => grossVolumeLitres({ ...tank, heightCm: Number.NaN })).toThrow(/finite/);
	});
});

describe('innerFromOuter', () => {
	test('length and width lose two panes, height only the bottom pane (worked by hand)', () => {
		expect(innerFromOuter({ ...tank, glassThicknessCm: 0.5 })).toEqual({ lengthCm: 59, widthCm: 29, heightCm: 35.5 });
		expect(innerFromOuter({ ...tank, glassThicknessCm: 0.5, bottomThicknessCm: 0.8 }).heightCm).toBeCloseTo(35.2, 12);
	});
	test('refuses glass thicker than the tank', () => {
		expect(() => innerFromOuter({ lengthCm: 10, widthCm: 0.8, heightCm: 10, glassThicknessCm: 0.5 })).toThrow(/thicker/);
		expect(() => innerFromOuter({ ...tank, glassThicknessCm: 0 })).toThrow(/glass thickness/);
	});
});

describe('estimateWaterVolume', () => {
	test('worked example: 5 cm substrate, default 2 cm gap, 5 L of rock', () => {
		// Water column 36 − 2 − 5 = 29 cm; 60 × 30 × 29 = 52 200 cm³ = 52.2 L; minus 5 L = 47.2 L.
		const e = estimateWaterVolume({ inner: tank, substrateDepth: 5, hardscape: { litres: 5 } });
		expect(DEFAULT_WATER_LINE_BELOW_RIM_CM).toBe(2);
		expect(e.waterDepthCm).toBe(29);
		expect(e.substrateLitres).toBeCloseTo(9, 12);
		expect(e.waterSpaceLitres).toBeCloseTo(52.2, 12);
		expect(e.waterLitres).toBeCloseTo(47.2, 12);
		expect(e.grossLitres).toBeCloseTo(64.8, 12);
	});
	test('hardscape as a share of the water space, sloped substrate averaged', () => {
		// Slope 3 → 7 cm averages 5 cm; 52.2 L × (1 − 0.1) = 46.98 L.
		const e = estimateWaterVolume({ inner: tank, substrateDepth: { frontCm: 3, backCm: 7 }, hardscape: { share: 0.1 } });
		expect(e.substrateDepthCm).toBe(5);
		expect(e.hardscapeLitres).toBeCloseTo(5.22, 12);
		expect(e.waterLitres).toBeCloseTo(46.98, 12);
	});
	test('no substrate, no gap gives the gross volume', () => {
		expect(estimateWaterVolume({ inner: tank, waterLineBelowRimCm: 0 }).waterLitres).toBeCloseTo(64.8, 12);
	});
	test('refuses impossible layouts', () => {
		expect(() => estimateWaterVolume({ inner: tank, substrateDepth: 34 })).toThrow(/no room for water/);
		expect(() => estimateWaterVolume({ inner: tank, hardscape: { litres: 70 } })).toThrow(/all the water space/);
		expect(() => estimateWaterVolume({ inner: tank, hardscape: { share: 1.2 } })).toThrow(/between 0 and 0.95/);
		expect(() => estimateWaterVolume({ inner: tank, substrateDepth: -1 })).toThrow(/negative/);
		expect(() => averageSubstrateDepthCm({ frontCm: Number.NaN, backCm: 3 })).toThrow(/finite/);
	});
});

describe('chooseWaterVolume', () => {
	test('a measured volume wins and says so', () => {
		expect(chooseWaterVolume(47.2, 51)).toEqual({ litres: 51, source: 'measured' });
		expect(chooseWaterVolume(47.2, null)).toEqual({ litres: 47.2, source: 'estimated' });
		expect(chooseWaterVolume(null, 30)).toEqual({ litres: 30, source: 'measured' });
	});
	test('refuses when neither is usable', () => {
		expect(() => chooseWaterVolume(null, undefined)).toThrow(/no measured or estimated volume/);
		expect(() => chooseWaterVolume(47.2, 0)).toThrow(/measured volume/);
	});
});
