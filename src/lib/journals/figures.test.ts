import { describe, expect, test } from 'vitest';
import { tankFigures, type TankMeasures } from './figures';

// These check how the tank profile is fed to the shared calculators (which carry their own
// sourced tests): each expected value is worked out by hand from the inputs below.
const base: TankMeasures = {
	lengthCm: 60,
	widthCm: 30,
	heightCm: 36,
	glassMm: 6,
	substrateKind: 'sand',
	substrateDepthCm: 5,
	hardscapeLitres: 3,
	waterLitres: null,
	heaterWatts: 100,
	co2Method: 'none',
	setUpOn: '2026-01-01',
	lights: [{ label: 'bar', watts: 30, hoursPerDay: 7 }],
	filters: [{ label: 'canister', ratedFlow: 600, flowUnit: 'lph' }]
};
const now = new Date('2026-02-15T10:00:00Z');

describe('tankFigures', () => {
	test('a 60 × 30 × 36 cm tank of 6 mm glass, by hand', () => {
		const f = tankFigures(base, now);
		// Inner 58.8 × 28.8 × 35.4 cm (outer less two panes sideways, one pane at the bottom).
		expect(f.inner).toEqual({ lengthCm: 58.8, widthCm: 28.8, heightCm: expect.closeTo(35.4, 9) });
		expect(f.grossLitres).toBeCloseTo((58.8 * 28.8 * 35.4) / 1000, 6); // 59.948 L
		// Water: footprint 1693.44 cm² × (35.4 − 2 rim − 5 substrate) = 48.094 L, less 3 L of rock.
		expect(f.estimate!.waterLitres).toBeCloseTo((1693.44 * 28.4) / 1000 - 3, 6);
		expect(f.volume).toEqual({ litres: expect.closeTo(45.0937, 3), source: 'estimated' });
		// 30 W over 45.09 L; 600 L/h over 45.09 L.
		expect(f.lighting!.wattsPerLitre).toBeCloseTo(30 / 45.0937, 4);
		expect(f.turnover!.perHour).toBeCloseTo(600 / 45.0937, 3);
		// 1 Jan → 15 Feb is 45 days: 6 weeks 3 days.
		expect(f.age).toMatchObject({ days: 45, label: '6 weeks 3 days' });
		expect(f.mainsWatts).toBe(130);
		expect(f.cautions.electrical).toMatch(/residual-current device/);
		expect(f.cautions.weight).toMatch(/1 kg for every litre/);
		expect(f.cautions.co2).toBeNull();
		// Weight: water + glass (outer box 64 800 cm³ less inner 59 947.8 cm³ = 4 852.2 cm³ × 2.5 g/cm³)
		// + sand (1693.44 × 5 = 8.467 L × 2.0 kg/L).
		const glassKg = ((60 * 30 * 36 - 58.8 * 28.8 * 35.4) * 2.5) / 1000;
		expect(f.weight!.glassKg).toBeCloseTo(glassKg, 6);
		expect(f.weight!.substrateKg).toBeCloseTo(8.4672 * 2.0, 6);
		expect(f.weight!.totalKg).toBeCloseTo(f.weight!.waterKg + glassKg + 16.9344, 6);
		expect(f.problems).toEqual([]);
	});

	test('a measured volume wins and US gallons per hour are converted', () => {
		const f = tankFigures({ ...base, waterLitres: 50, filters: [{ label: 'hang-on', ratedFlow: 100, flowUnit: 'usgph' }] }, now);
		expect(f.volume).toEqual({ litres: 50, source: 'measured' });
		// 100 US gal/h × 3.785411784 L/gal (NIST Handbook 44, Appendix C) = 378.54 L/h.
		expect(f.totalFlowLph).toBeCloseTo(378.5411784, 6);
		expect(f.turnover!.perHour).toBeCloseTo(378.5411784 / 50, 6);
	});

	test('without glass thickness the sizes count as inside ones and the glass is not weighed', () => {
		const f = tankFigures({ ...base, glassMm: null }, now);
		expect(f.inner).toEqual({ lengthCm: 60, widthCm: 30, heightCm: 36 });
		expect(f.weight).toBeNull();
		expect(f.waterKg).toBeGreaterThan(0);
		expect(f.notes.join(' ')).toMatch(/No glass thickness/);
	});

	test('impossible inputs become problems, not crashes', () => {
		const f = tankFigures({ ...base, substrateDepthCm: 40 }, now);
		expect(f.estimate).toBeNull();
		expect(f.volume).toBeNull();
		expect(f.problems.join(' ')).toMatch(/no room for water/);
		expect(tankFigures({ ...base, setUpOn: '2026-03-01' }, now).problems.join(' ')).toMatch(/future/);
	});

	test('pressurised CO2 brings its caution; a retired tank’s age stops at retirement', () => {
		const f = tankFigures({ ...base, co2Method: 'pressurised', retiredOn: '2026-01-15' }, now);
		expect(f.cautions.co2).toMatch(/suffocates fish/);
		expect(f.age!.days).toBe(14);
	});
});
