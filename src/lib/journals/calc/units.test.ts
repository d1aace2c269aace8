import Qty from 'js-quantities';
import { describe, expect, test } from 'vitest';
import {
	celsiusToFahrenheit,
	cmToInches,
	fahrenheitToCelsius,
	distanceUnitOf,
	formatFlow,
	formatGlass,
	formatInchFraction,
	formatLength,
	formatMass,
	formatTemperature,
	formatVolume,
	imperialGallonsToLitres,
	inchesToCm,
	kgToPounds,
	litresPerHourToImperialGallonsPerHour,
	litresPerHourToUsGallonsPerHour,
	litresToImperialGallons,
	litresToUsGallons,
	METRES_PER_MILE,
	metresPerDistanceUnit,
	parseLength,
	parseQuantity,
	parseTemperature,
	parseVolume,
	poundsToKg,
	unitSymbol,
	usGallonsPerHourToLitresPerHour,
	usGallonsToLitres
} from './units';

describe('exact definitions', () => {
	test('US gallon is 231 cubic inches (NIST Handbook 44, App. C), with the inch 2.54 cm', () => {
		const litresIn231CubicInches = (231 * 2.54 ** 3) / 1000;
		expect(usGallonsToLitres(1)).toBeCloseTo(litresIn231CubicInches, 12);
		expect(usGallonsToLitres(1)).toBe(3.785411784);
	});
	test('imperial gallon is 4.54609 L (UK Weights and Measures Act 1985, Sch. 1)', () => {
		expect(imperialGallonsToLitres(1)).toBe(4.54609);
		expect(litresToImperialGallons(4.54609)).toBeCloseTo(1, 14);
	});
	test('pound is 0.45359237 kg (NIST Handbook 44, App. C)', () => {
		expect(poundsToKg(1)).toBe(0.45359237);
		expect(kgToPounds(0.45359237)).toBeCloseTo(1, 14);
	});
	test('°F = °C × 9/5 + 32: water freezes at 32 °F and boils at 212 °F (definition of the scale)', () => {
		expect(celsiusToFahrenheit(0)).toBe(32);
		expect(celsiusToFahrenheit(100)).toBe(212);
		expect(celsiusToFahrenheit(-40)).toBe(-40);
		expect(fahrenheitToCelsius(77)).toBeCloseTo(25, 12);
	});
	test('round trips', () => {
		for (const v of [0, 0.5, 60, 123.45]) {
			expect(inchesToCm(cmToInches(v))).toBeCloseTo(v, 12);
			expect(usGallonsToLitres(litresToUsGallons(v))).toBeCloseTo(v, 12);
			expect(usGallonsPerHourToLitresPerHour(litresPerHourToUsGallonsPerHour(v))).toBeCloseTo(v, 12);
		}
	});
	test('rejects NaN and temperatures below absolute zero', () => {
		expect(() => cmToInches(Number.NaN)).toThrow(/finite/);
		expect(() => celsiusToFahrenheit(-300)).toThrow(/absolute zero/);
		expect(() => fahrenheitToCelsius(-500)).toThrow(/absolute zero/);
	});
});

describe('cross-check with npm libraries', () => {
	// js-quantities 1.8.0 defines the inch (0.0254 m), pound (0.45359237 kg) and imperial gallon
	// (0.00454609 m³) exactly, but rounds the US gallon to 0.0037854118 m³ (exact: 0.003785411784),
	// so US-gallon checks agree to about one part in a hundred million.
	test('js-quantities: length, US volume, mass, flow, temperature', () => {
		const relDiff = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
		expect(inchesToCm(10)).toBeCloseTo(Qty('10 in').to('cm').scalar, 12);
		expect(relDiff(usGallonsToLitres(7), Qty('7 gal').to('l').scalar)).toBeLessThan(1e-8);
		expect(poundsToKg(50)).toBeCloseTo(Qty('50 lb').to('kg').scalar, 12);
		expect(relDiff(litresPerHourToUsGallonsPerHour(1000), Qty('1000 l/h').to('gal/h').scalar)).toBeLessThan(1e-8);
		expect(celsiusToFahrenheit(26.5)).toBeCloseTo(Qty('26.5 tempC').to('tempF').scalar, 9);
	});
	test('js-quantities: imperial gallon, pound, inch, temperature', () => {
		expect(imperialGallonsToLitres(3)).toBeCloseTo(Qty('3 galimp').to('l').scalar, 10);
		expect(litresPerHourToImperialGallonsPerHour(500)).toBeCloseTo(Qty('500 l').to('galimp').scalar, 9);
		expect(poundsToKg(12)).toBeCloseTo(Qty('12 lb').to('kg').scalar, 12);
		expect(cmToInches(60)).toBeCloseTo(Qty('60 cm').to('in').scalar, 12);
		expect(fahrenheitToCelsius(80)).toBeCloseTo(Qty('80 tempF').to('tempC').scalar, 9);
	});
});

describe('display', () => {
	// 112 / 3.785411784 = 29.587…, 112 / 4.54609 = 24.636… (by hand from the exact definitions).
	test('volume in each system', () => {
		expect(formatVolume(112, 'metric')).toBe('112 L');
		expect(formatVolume(112, 'us')).toBe('29.6 US gal');
		expect(formatVolume(112, 'imperial')).toBe('24.6 imp gal');
		expect(formatVolume(1234.4, 'metric')).toBe('1,234 L');
	});
	test('length, mass, flow and temperature', () => {
		expect(formatLength(60, 'metric')).toBe('60 cm');
		expect(formatLength(60, 'us')).toBe('23.6 in'); // 60 / 2.54 = 23.62
		expect(formatMass(128, 'imperial')).toBe('282 lb'); // 128 / 0.45359237 = 282.19
		expect(formatFlow(800, 'us')).toBe('211 US gal/h'); // 800 / 3.785411784 = 211.34
		expect(formatFlow(800, 'imperial')).toBe('176 imp gal/h'); // 800 / 4.54609 = 175.98
		expect(formatTemperature(25.3, 'us')).toBe('77.5 °F'); // 25.3 × 1.8 + 32 = 77.54
		expect(formatTemperature(25, 'imperial')).toBe('25 °C');
		expect(unitSymbol('volume', 'imperial')).toBe('imp gal');
	});
});

describe('glass and distances', () => {
	// Checked against js-quantities (inch, mile) and NIST Handbook 44, Appendix C (1 mi = 1,609.344 m).
	test('the international mile', () => {
		expect(METRES_PER_MILE).toBe(Qty('1 mi').to('m').scalar);
		expect(metresPerDistanceUnit(distanceUnitOf('us'))).toBe(1609.344);
		expect(metresPerDistanceUnit(distanceUnitOf('imperial'))).toBe(1609.344);
		expect(metresPerDistanceUnit(distanceUnitOf('metric'))).toBe(1000);
	});
	test('glass to the nearest sixteenth of an inch, in lowest terms', () => {
		const inches = (mm: number) => Qty(`${mm} mm`).to('in').scalar;
		// 10 mm = 0.3937 in: 6.3 sixteenths, so 6/16 = 3/8.
		expect(inches(10) * 16).toBeCloseTo(6.299, 3);
		expect(formatGlass(10, 'us')).toBe('3/8 in');
		expect(formatGlass(6, 'imperial')).toBe('1/4 in'); // 3.78 sixteenths
		expect(formatGlass(19, 'us')).toBe('3/4 in'); // 11.97 sixteenths
		expect(formatGlass(25.4, 'us')).toBe('1 in');
		expect(formatGlass(31.75, 'us')).toBe('1 1/4 in');
		expect(formatGlass(8, 'us')).toBe('5/16 in'); // 5.04 sixteenths
		expect(formatGlass(0.5, 'us')).toBe('1/16 in');
		expect(formatGlass(8, 'metric')).toBe('8 mm');
		expect(formatGlass(6.5, 'metric')).toBe('6.5 mm');
		expect(formatInchFraction(0.5, 8)).toBe('1/2 in');
	});
	test('fractions typed as the trade writes them', () => {
		expect(parseLength('3/8', 'us')).toEqual({ ok: true, value: 0.9525 });
		expect(parseLength('1 1/2 in', 'metric')).toEqual({ ok: true, value: 3.81 });
		expect(parseLength('1/0', 'us').ok).toBe(false);
	});
});

describe('parsing form input into metric', () => {
	test('a bare number is in the member’s unit', () => {
		expect(parseLength('24', 'us')).toEqual({ ok: true, value: 60.96 });
		expect(parseVolume('10', 'imperial')).toEqual({ ok: true, value: 45.4609 });
		expect(parseLength('2,5', 'metric')).toEqual({ ok: true, value: 2.5 });
		const f = parseTemperature('77', 'us');
		expect(f.ok && f.value).toBeCloseTo(25, 12);
	});
	test('an explicit unit wins over the member’s system', () => {
		expect(parseLength('60 cm', 'us')).toEqual({ ok: true, value: 60 });
		expect(parseLength('24"', 'metric')).toEqual({ ok: true, value: 60.96 });
		expect(parseVolume('5 US gal', 'metric')).toEqual({ ok: true, value: 18.92705892 });
		expect(parseVolume('100 L', 'us')).toEqual({ ok: true, value: 100 });
		expect(parseQuantity('flow', '100 gph', 'us')).toEqual({ ok: true, value: 378.5411784 });
		const c = parseTemperature('25 °C', 'us');
		expect(c).toEqual({ ok: true, value: 25 });
	});
	test('rejects empty, non-numeric, negative, ambiguous and unknown input', () => {
		expect(parseLength('', 'metric')).toEqual({ ok: false, error: 'Enter a number.' });
		expect(parseLength('abc', 'metric').ok).toBe(false);
		expect(parseLength('1,250', 'metric').ok).toBe(false); // could be 1.25 or 1250
		expect(parseLength('-3', 'metric').ok).toBe(false);
		expect(parseLength('0', 'metric', { allowZero: false }).ok).toBe(false);
		expect(parseVolume('20 gal', 'metric').ok).toBe(false);
		expect(parseVolume('20 gal', 'imperial')).toEqual({ ok: true, value: 90.9218 });
		expect(parseQuantity('mass', '3 stone', 'imperial').ok).toBe(false);
		expect(parseTemperature('-500 °F', 'us').ok).toBe(false);
		expect(parseTemperature('-2', 'metric')).toEqual({ ok: true, value: -2 });
	});
});
