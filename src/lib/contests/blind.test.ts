import { describe, expect, test } from 'vitest';
import Qty from 'js-quantities';
import { ageBand, aspectOf, blindFigures, renditionWidths, volumeBand, VOLUME_BAND_EDGES } from './blind';
import { DISPLAY_UNITS, formatVolume, type UnitSystem } from '../journals/calc/units';

// Litres in another unit from js-quantities 1.8.0, a general-purpose reference library (its US
// gallon is 231 in³ and its imperial gallon 4.54609 L, as in NIST Handbook 44 and the UK Weights and
// Measures Act 1985), so the gallon bands are checked against values the app did not compute.
const litresOf = (value: number, unit: 'gal' | 'galimp') => Qty(value, unit).to('l').scalar;

describe('volume bands', () => {
	test('litres: the lower edge is inside the band, the upper one in the next', () => {
		expect(volumeBand(12, 'metric')).toBe('Under 20 L');
		expect(volumeBand(19.94, 'metric')).toBe('Under 20 L');
		expect(volumeBand(20, 'metric')).toBe('20–40 L');
		expect(volumeBand(39.9, 'metric')).toBe('20–40 L');
		expect(volumeBand(40, 'metric')).toBe('40–60 L');
		expect(volumeBand(63.4, 'metric')).toBe('60–100 L');
		expect(volumeBand(156.4, 'metric')).toBe('100–200 L');
		expect(volumeBand(399, 'metric')).toBe('200–400 L');
		expect(volumeBand(400, 'metric')).toBe('400 L or more');
		expect(volumeBand(1250, 'metric')).toBe('400 L or more');
	});

	test('the band is picked on the volume as tank pages show it (three figures), so its upper edge is never the shown value', () => {
		// 19.96 L shows as "20 L": it belongs to 20–40 L, not to "Under 20 L".
		expect(formatVolume(19.96, 'metric')).toBe('20 L');
		expect(volumeBand(19.96, 'metric')).toBe('20–40 L');
		// 15 US gal = 56.78 L; 56.6 L is 14.95 US gal and shows as "15 US gal"; 56.5 L shows as "14.9 US gal".
		expect(litresOf(15, 'gal')).toBeCloseTo(56.781, 3);
		expect(volumeBand(litresOf(15, 'gal'), 'us')).toBe('15–25 US gal');
		expect(formatVolume(56.6, 'us')).toBe('15 US gal');
		expect(volumeBand(56.6, 'us')).toBe('15–25 US gal');
		expect(volumeBand(56.5, 'us')).toBe('10–15 US gal');
	});

	test('gallon bands in the viewer’s own gallon', () => {
		expect(volumeBand(litresOf(4.9, 'gal'), 'us')).toBe('Under 5 US gal');
		expect(volumeBand(litresOf(12, 'gal'), 'us')).toBe('10–15 US gal');
		expect(volumeBand(litresOf(120, 'gal'), 'us')).toBe('100 US gal or more');
		// 60 L is 15.85 US gal but 13.2 imperial gallons.
		expect(volumeBand(60, 'us')).toBe('15–25 US gal');
		expect(volumeBand(60, 'imperial')).toBe('10–15 imp gal');
		expect(volumeBand(litresOf(25, 'galimp'), 'imperial')).toBe('25–50 imp gal');
		expect(volumeBand(litresOf(24.9, 'galimp'), 'imperial')).toBe('15–25 imp gal');
	});

	test('no band equals a volume as tank pages show it, in any unit system, from 0.5 L to 2,000 L and closely around every edge', () => {
		const systems: UnitSystem[] = ['metric', 'us', 'imperial'];
		const volumes = Array.from({ length: 4000 }, (_, i) => (i + 1) / 2);
		// Within 0.3 L of each edge, in steps of 2 mL, where rounding for display decides the band.
		for (const units of systems) {
			for (const edge of VOLUME_BAND_EDGES[units]) {
				const centre = DISPLAY_UNITS.volume[units].toMetric(edge);
				for (let ml = -300; ml <= 300; ml += 2) volumes.push(centre + ml / 1000);
			}
		}
		for (const litres of volumes) {
			for (const units of systems) {
				const band = volumeBand(litres, units);
				const shown = formatVolume(litres, units);
				expect(band).not.toBe(shown);
				// The figure written with its unit ("Under 20 L", "40–60 L") is an upper edge, never the shown
				// value; only "400 L or more" names its lower edge, which the shown value may reach.
				const written = band.replace(/^Under /, '').replace(/^[\d.,]+–/, '');
				if (!band.endsWith(' or more')) expect(written, `${litres} L, ${units}: ${band}`).not.toBe(shown);
			}
		}
	});

	test('every unit system has its bands in rising order', () => {
		for (const edges of Object.values(VOLUME_BAND_EDGES)) expect([...edges].sort((a, b) => a - b)).toEqual(edges);
	});
});

describe('age bands', () => {
	test('13 weeks make three months and 52 a year (whole weeks since set-up)', () => {
		expect(ageBand(0)).toBe('Under 3 months');
		expect(ageBand(12)).toBe('Under 3 months');
		expect(ageBand(13)).toBe('3–12 months');
		expect(ageBand(51)).toBe('3–12 months');
		expect(ageBand(52)).toBe('A year or more');
		expect(ageBand(400)).toBe('A year or more');
	});
	test('a negative or fractional age is refused', () => {
		expect(() => ageBand(-1)).toThrow(RangeError);
		expect(() => ageBand(2.5)).toThrow(RangeError);
	});
});

describe('the scorecard’s figures', () => {
	test('the rule in the contest’s words, the bands in the viewer’s units', () => {
		const rule = { minLitres: null, maxLitres: 40, minAgeWeeks: 4 };
		expect(blindFigures({ litres: 27.7, ageWeeks: 41 }, rule, 'metric')).toEqual({
			rule: 'Up to 40 L of water, running at least 4 weeks',
			volume: '20–40 L',
			age: '3–12 months'
		});
		expect(blindFigures({ litres: 27.7, ageWeeks: 41 }, rule, 'us').volume).toBe('5–10 US gal');
	});
	test('figures that could not be worked out stay unknown', () => {
		expect(blindFigures({ litres: null, ageWeeks: null }, { minLitres: null, maxLitres: null, minAgeWeeks: null }, 'metric')).toEqual({
			rule: 'Any running tank',
			volume: null,
			age: null
		});
	});
});

describe('photo shapes', () => {
	test('an aspect ratio to two decimals instead of the pixel size', () => {
		expect(aspectOf(1200, 750)).toBe(1.6);
		expect(aspectOf(1873, 1102)).toBe(1.7);
		expect(aspectOf(3024, 4032)).toBe(0.75);
	});
	test('rendition widths follow the longest edge of each size', () => {
		expect(renditionWidths(1.6)).toEqual({ thumb: 320, medium: 960, large: 1920 });
		expect(renditionWidths(0.75)).toEqual({ thumb: 240, medium: 720, large: 1440 });
	});
});
