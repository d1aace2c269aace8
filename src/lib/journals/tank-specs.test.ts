import { describe, expect, test } from 'vitest';
import {
	co2Text,
	fertiliserText,
	filterText,
	glassText,
	hardscapeText,
	heaterText,
	lightingText,
	parText,
	lightText,
	nowAndBefore,
	photoperiodAdvice,
	sizeText,
	substrateText,
	turnoverText,
	wattsPerVolumeUnit
} from './tank-specs';

// Units: 1 in = 2.54 cm, 1 US gal = 3.785411784 L (NIST Handbook 44, Appendix C);
// 1 imperial gallon = 4.54609 L (UK Weights and Measures Act 1985, Schedule 1).
describe('sizes in the member’s units', () => {
	test('60.96 × 30.48 × 40.64 cm is 24 × 12 × 16 in; the unit is said once', () => {
		expect(sizeText({ lengthCm: 60.96, widthCm: 30.48, heightCm: 40.64 }, 'us')).toBe('24 × 12 × 16 in');
		expect(sizeText({ lengthCm: 90, widthCm: 45, heightCm: 45 }, 'metric')).toBe('90 × 45 × 45 cm');
	});
	test('glass in mm for metric members, in the sixteenths of an inch it is sold in otherwise (6.35 mm = 1/4 in; 10 mm ≈ 0.394 in ≈ 3/8 in)', () => {
		expect(glassText(10, 'metric')).toBe('10 mm');
		expect(glassText(6.35, 'us')).toBe('1/4 in');
		expect(glassText(10, 'us')).toBe('3/8 in');
		expect(glassText(12, 'imperial')).toBe('1/2 in');
	});
	test('substrate depth and hardscape volume follow the units', () => {
		expect(substrateText({ substrateKind: 'nutrient-soil', substrateNote: 'capped with sand', substrateDepthCm: 7.62 }, 'us')).toBe(
			'Nutrient soil (fired granules), capped with sand · 3 in deep'
		);
		expect(substrateText({ substrateKind: '', substrateNote: '', substrateDepthCm: null }, 'metric')).toBe('—');
		expect(hardscapeText({ hardscape: 'Seven pale rocks', hardscapeLitres: 7.57 }, 'us')).toBe('Seven pale rocks · about 2 US gal');
		expect(hardscapeText({ hardscape: '', hardscapeLitres: null }, 'metric')).toBe('—');
	});
});

describe('light and flow', () => {
	test('0.5 W per litre is 1.89 W per US gallon and 2.27 W per imperial gallon', () => {
		expect(wattsPerVolumeUnit(0.5, 'metric')).toBe(0.5);
		expect(wattsPerVolumeUnit(0.5, 'us')).toBeCloseTo(0.5 * 3.785411784, 10);
		expect(wattsPerVolumeUnit(0.5, 'imperial')).toBeCloseTo(0.5 * 4.54609, 10);
	});
	test('the lighting line: total watts, watts per volume unit, hours a day', () => {
		expect(lightingText({ totalWatts: 92, wattsPerLitre: 92 / 160, photoperiodHours: 7 }, 'metric')).toBe('92 W · 0.58 W per L · 7 h a day');
		expect(lightingText({ totalWatts: 36, wattsPerLitre: 36 / 50, photoperiodHours: 6 }, 'us')).toBe('36 W · 2.73 W per US gal · 6 h a day');
	});
	test('a measured PAR with its depth in the member’s unit: 38 cm is 14.96 in (1 in = 2.54 cm exactly, NIST Handbook 44, Appendix C); the band word is common practice, no source', () => {
		expect(parText({ parAtSubstrate: 95, parDepthCm: 38 }, 'metric')).toBe('95 µmol·m⁻²·s⁻¹ at 38 cm deep · high light');
		// 38 / 2.54 = 14.96 in, shown at the page's precision for lengths.
		expect(parText({ parAtSubstrate: 45, parDepthCm: 38 }, 'us')).toBe('45 µmol·m⁻²·s⁻¹ at 15 in deep · medium light');
		expect(parText({ parAtSubstrate: 12, parDepthCm: null }, 'metric')).toBe('12 µmol·m⁻²·s⁻¹ · low light');
		expect(parText({ parAtSubstrate: null, parDepthCm: 30 }, 'metric')).toBeNull();
		expect(lightText({ label: '', watts: 8, hoursPerDay: 6.5 })).toBe('Light: 8 W, 6.5 h');
	});
	test('a filter rated in US gal/h also says its L/h to metric members: 100 US gal/h = 379 L/h', () => {
		const filter = { label: 'Hang-on-back', ratedFlow: 100, flowUnit: 'usgph' as const, mediaNotes: 'sponge' };
		expect(filterText(filter, 'metric')).toBe('Hang-on-back: 100 US gal/h (379 L/h) — sponge');
		expect(filterText(filter, 'us')).toBe('Hang-on-back: 100 US gal/h — sponge');
		// 600 L/h = 159 US gal/h = 132 imp gal/h.
		expect(filterText({ label: 'Canister', ratedFlow: 600, flowUnit: 'lph', mediaNotes: '' }, 'us')).toBe('Canister: 600 L/h (159 US gal/h)');
		expect(filterText({ label: 'Canister', ratedFlow: 600, flowUnit: 'lph', mediaNotes: '' }, 'imperial')).toBe('Canister: 600 L/h (132 imp gal/h)');
		expect(filterText(filter, 'imperial')).toBe('Hang-on-back: 100 US gal/h (83.3 imp gal/h) — sponge');
		expect(filterText({ label: '', ratedFlow: null, flowUnit: 'lph', mediaNotes: '' }, 'metric')).toBe('Filter');
		expect(turnoverText(1200, { perHour: 7.07, assessment: { label: 'Good' } }, 'metric')).toBe('1,200 L/h rated · 7.1 × the volume an hour (good)');
	});
});

describe('the other lines', () => {
	test('heater, CO2 and fertilisers', () => {
		expect(heaterText({ heaterWatts: 200, heaterSetC: 24, heaterNote: '' }, 'metric')).toBe('200 W · set to 24 °C');
		// 24 °C × 9/5 + 32 = 75.2 °F.
		expect(heaterText({ heaterWatts: 200, heaterSetC: 24, heaterNote: 'off in summer' }, 'us')).toBe('200 W · set to 75.2 °F · off in summer');
		expect(heaterText({ heaterWatts: null, heaterSetC: null, heaterNote: '' }, 'us')).toBe('—');
		expect(co2Text({ co2Method: 'pressurised', co2BubblesPerSecond: 1.5 })).toMatch(/ · 1\.5 bubbles a second$/);
		expect(co2Text({ co2Method: 'none', co2BubblesPerSecond: 2 })).not.toMatch(/bubbles/);
		expect(fertiliserText({ item: 'Trace solution', amount: '5 mL', frequency: '' })).toBe('Trace solution, 5 mL');
	});
	test('lists split into what is in the tank now and what was', () => {
		const rows = [
			{ id: 1, removedOn: null },
			{ id: 2, removedOn: '2026-03-01' },
			{ id: 3, removedOn: null }
		];
		expect(nowAndBefore(rows)).toEqual({ now: [rows[0], rows[2]], before: [rows[1]] });
	});
});

describe('photoperiodAdvice (common practice, no source: about 6 h for six weeks, then up to 8)', () => {
	const lit = (hours: number) => ({ photoperiodHours: hours });
	const aged = (days: number) => ({ days, weeks: Math.floor(days / 7), extraDays: days % 7, young: days < 42, label: '' });
	test('a three-week-old tank lit 8 h is told about 6 h', () => {
		expect(photoperiodAdvice({ age: aged(21), lighting: lit(8) as never }, false)).toMatch(
			/^Suggested for its age: about 6 h a day\. The tank is under six weeks old/
		);
	});
	test('nothing when the lights already run no longer, for a retired tank, or without an age', () => {
		expect(photoperiodAdvice({ age: aged(21), lighting: lit(6) as never }, false)).toBeNull();
		expect(photoperiodAdvice({ age: aged(400), lighting: lit(8) as never }, false)).toBeNull();
		expect(photoperiodAdvice({ age: aged(21), lighting: lit(8) as never }, true)).toBeNull();
		expect(photoperiodAdvice({ age: null, lighting: lit(8) as never }, false)).toBeNull();
	});
	test('an established tank lit 10 h is told about 8 h', () => {
		expect(photoperiodAdvice({ age: aged(400), lighting: lit(10) as never }, false)).toMatch(/about 8 h a day\. An established tank/);
	});
});
