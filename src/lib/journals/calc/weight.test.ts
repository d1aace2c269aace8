import { describe, expect, test } from 'vitest';
import Qty from 'js-quantities';
import {
	FILLED_TANK_LOAD_CAUTION,
	SODA_LIME_GLASS_DENSITY_G_PER_CM3,
	filledTankWeight,
	glassMass,
	loadCaution,
	substrateMassKg,
	waterDensity,
	waterMassKg
} from './weight';

describe('waterDensity (Tanaka et al. 2001, Metrologia 38:301–309)', () => {
	// Values of the paper's recommended table (kg/m³, air-free water, 101.325 kPa); the digits are
	// recalled from memory of that table, and the test allows 0.0002 kg/m³ for that reason.
	const table: [number, number][] = [
		[0, 999.8428],
		[4, 999.975],
		[10, 999.7026],
		[20, 998.2067],
		[25, 997.047],
		[30, 995.6488],
		[40, 992.2152]
	];
	test.each(table)('%s °C → %s kg/m³', (t, rho) => {
		const d = waterDensity(t);
		expect(Math.abs(d.kgPerM3 - rho)).toBeLessThan(2e-4);
		expect(d.inValidRange).toBe(true);
	});
	test('densest near 3.98 °C (temperature of maximum density, from memory)', () => {
		expect(waterDensity(3.98).kgPerM3).toBeGreaterThan(waterDensity(3).kgPerM3);
		expect(waterDensity(3.98).kgPerM3).toBeGreaterThan(waterDensity(5).kgPerM3);
	});
	test('flags temperatures outside 0–40 °C and refuses non-liquid ones', () => {
		expect(waterDensity(45).inValidRange).toBe(false);
		expect(() => waterDensity(-5)).toThrow(/not liquid/);
		expect(() => waterDensity(120)).toThrow(/not liquid/);
		expect(() => waterDensity(Number.NaN)).toThrow(/finite/);
	});
	test('mass of 100 L at 25 °C is 99.7047 kg (table value × 0.1 m³)', () => {
		expect(waterMassKg(100, 25).kg).toBeCloseTo(99.7047, 3);
		expect(() => waterMassKg(-1, 25)).toThrow(/negative/);
	});
});

describe('glassMass', () => {
	const outer = { lengthCm: 60, widthCm: 30, heightCm: 36, glassThicknessCm: 0.5 };
	test('pane areas and volume for 60 × 30 × 36 cm outer, 5 mm glass (worked by hand)', () => {
		// bottom 60 × 30; front and back 2 × 60 × 35.5; ends 2 × 29 × 35.5.
		const g = glassMass(outer);
		expect(g.bottomCm2).toBe(1800);
		expect(g.frontAndBackCm2).toBe(4260);
		expect(g.endsCm2).toBe(2059);
		expect(g.volumeCm3).toBeCloseTo(4059.5, 9);
		// The sum equals outer box minus inner cavity: 60·30·36 − 59·29·35.5.
		expect(g.volumeCm3).toBeCloseTo(60 * 30 * 36 - 59 * 29 * 35.5, 9);
		expect(SODA_LIME_GLASS_DENSITY_G_PER_CM3).toBe(2.5);
		expect(g.kg).toBeCloseTo(10.14875, 9);
	});
	test('a thicker bottom pane', () => {
		// 60·30·1.0 + (2·60·35 + 2·29·35)·0.5 = 1800 + 3115 = 4915 cm³.
		expect(glassMass({ ...outer, bottomThicknessCm: 1 }).volumeCm3).toBeCloseTo(4915, 9);
	});
});

describe('substrate and total', () => {
	test('substrate mass from bulk density (values from memory)', () => {
		expect(substrateMassKg(9, 'sand')).toBeCloseTo(18, 12);
		expect(substrateMassKg(9, 'nutrient-soil')).toBeCloseTo(12.6, 12);
		expect(substrateMassKg(10, { kgPerLitre: 1.1 })).toBeCloseTo(11, 12);
		expect(() => substrateMassKg(10, { kgPerLitre: 0 })).toThrow(/substrate density/);
	});
	test('worked example: 47.2 L at 25 °C, 5 mm glass, 9 L of sand, 4 kg of rock', () => {
		// Water 47.2 × 0.9970470 = 47.0606 kg; glass 10.14875 kg; sand 18 kg; rock 4 kg → 79.209 kg.
		const w = filledTankWeight({
			outer: { lengthCm: 60, widthCm: 30, heightCm: 36, glassThicknessCm: 0.5 },
			waterLitres: 47.2,
			waterTempC: 25,
			substrate: { litres: 9, kind: 'sand' },
			hardscapeKg: 4
		});
		expect(w.waterKg).toBeCloseTo(47.0606, 3);
		expect(w.glassKg).toBeCloseTo(10.14875, 6);
		expect(w.totalKg).toBeCloseTo(79.2094, 3);
		// Over the 0.18 m² footprint: 79.209 / 0.18 = 440 kg/m².
		expect(w.kgPerM2OfFootprint).toBeCloseTo(440.05, 1);
		expect(w.densityInValidRange).toBe(true);
		expect(w.caution).toBe(FILLED_TANK_LOAD_CAUTION);
		expect(FILLED_TANK_LOAD_CAUTION).toMatch(/1 kg for every litre/);
		// Water near 1 kg/L: a US gallon (3.785 L) is 8.35 lb, an imperial gallon (4.546 L) 10.02 lb (js-quantities).
		expect(Qty('3.785411784 kg').to('lb').scalar).toBeCloseTo(8.345, 3);
		expect(Qty('4.54609 kg').to('lb').scalar).toBeCloseTo(10.022, 3);
		expect(loadCaution('us')).toMatch(/about 8\.3 lb for every US gallon of water, plus/);
		expect(loadCaution('imperial')).toMatch(/about 10 lb for every imperial gallon of water/);
		expect(loadCaution('metric')).toBe(FILLED_TANK_LOAD_CAUTION);
		expect(FILLED_TANK_LOAD_CAUTION).toMatch(/structural engineer/);
	});
});
