import { describe, expect, test } from 'vitest';
import { draftFromForm, draftFromTank, emptyDraft, lightingChange, parseTankDraft, type TankDraft } from './tank-form';

const today = new Date('2026-03-01T12:00:00Z');
const draft = (overrides: Partial<TankDraft> = {}): TankDraft => ({
	...emptyDraft('metric'),
	name: 'Reed corner',
	length: '60',
	width: '30',
	height: '36',
	lights: [],
	filters: [],
	...overrides
});

describe('parseTankDraft', () => {
	test('metric sizes are taken in cm and the glass in mm', () => {
		const result = parseTankDraft(draft({ glass: '6', substrateDepth: '5', waterVolume: '48' }), 'metric', today);
		expect(result).toMatchObject({ ok: true, input: { lengthCm: 60, widthCm: 30, heightCm: 36, glassMm: 6, substrateDepthCm: 5, waterLitres: 48 } });
	});

	test('US members type inches and US gallons (1 in = 2.54 cm exactly; 1 US gal = 3.785411784 L, NIST Handbook 44)', () => {
		const result = parseTankDraft(draft({ length: '24', width: '12', height: '16', glass: '0.25', waterVolume: '20' }), 'us', today);
		expect(result.ok).toBe(true);
		if (!result.ok) return;
		expect(result.input).toMatchObject({ lengthCm: 60.96, widthCm: 30.48, heightCm: 40.64, glassMm: 6.35 });
		expect(result.input.waterLitres).toBeCloseTo(75.71, 2);
	});

	test('glass in fractions of an inch and the heater in °F for US members (5/16 in = 7.9375 mm; 77 °F = 25 °C)', () => {
		const result = parseTankDraft(draft({ glass: '5/16', heaterSet: '77' }), 'us', today);
		expect(result).toMatchObject({ ok: true, input: { glassMm: 7.94, heaterSetC: 25 } });
		const mixed = parseTankDraft(draft({ glass: '1 1/4 in', heaterSet: '24 °C' }), 'us', today);
		expect(mixed).toMatchObject({ ok: true, input: { glassMm: 31.75, heaterSetC: 24 } });
		const wrong = parseTankDraft(draft({ heaterSet: '77' }), 'metric', today);
		expect(wrong).toMatchObject({ ok: false, errors: { heaterSet: 'Enter a setting from 10 °C to 40 °C; check the number and its unit.' } });
	});

	test('the edit form shows the glass as the fraction it is sold as and the heater in the member’s unit', () => {
		const stored = parseTankDraft(draft({ glass: '10', heaterSet: '24' }), 'metric', today);
		if (!stored.ok) throw new Error('expected a valid draft');
		const profile = { ...stored.input, description: null, lights: [], filters: [], fertilisers: [], plants: [], livestock: [] };
		expect(draftFromTank(profile, 'us')).toMatchObject({ glass: '3/8', heaterSet: '75.2' });
		expect(draftFromTank(profile, 'metric')).toMatchObject({ glass: '10', heaterSet: '24' });
	});

	test('imperial gallons are the imperial member’s own (4.54609 L, Weights and Measures Act 1985)', () => {
		const result = parseTankDraft(draft({ waterVolume: '10' }), 'imperial', today);
		expect(result.ok && result.input.waterLitres).toBeCloseTo(45.46, 2);
	});

	test('missing and impossible values are reported per field', () => {
		const result = parseTankDraft(
			draft({
				name: '',
				length: '',
				height: '-3',
				setUpOn: '2026-04-01',
				visibility: 'everyone',
				lights: [{ id: '', label: 'bar', watts: '', hours: '30' }],
				plants: [{ id: '', speciesId: '', name: 'Moss', placement: 'ceiling', added: '2026-02-10', removed: '2026-02-01' }]
			}),
			'metric',
			today
		);
		expect(result.ok).toBe(false);
		if (result.ok) return;
		expect(result.errors).toMatchObject({
			name: 'This is needed.',
			length: 'This is needed.',
			height: 'Enter a value that is not negative.',
			setUpOn: 'That day has not come yet.',
			visibility: 'Choose who may see this tank.',
			'lights.0.watts': 'This is needed.',
			'lights.0.hours': 'Enter a number from 0 to 24.',
			'plants.0.placement': 'Choose where it grows.',
			'plants.0.removed': 'This is before the day it was added.'
		});
	});

	test('a measured PAR: a whole-number reading with the depth it was taken at, in the member’s length unit (15 in = 38.1 cm, NIST Handbook 44)', () => {
		expect(parseTankDraft(draft({ par: '95', parDepth: '32' }), 'metric', today)).toMatchObject({ ok: true, input: { parAtSubstrate: 95, parDepthCm: 32 } });
		expect(parseTankDraft(draft({ height: '16', par: '60', parDepth: '15' }), 'us', today)).toMatchObject({
			ok: true,
			input: { parAtSubstrate: 60, parDepthCm: 38.1 }
		});
		expect(parseTankDraft(draft(), 'metric', today)).toMatchObject({ ok: true, input: { parAtSubstrate: null, parDepthCm: null } });
		const refused = (overrides: Partial<TankDraft>) => {
			const result = parseTankDraft(draft(overrides), 'metric', today);
			return result.ok ? {} : result.errors;
		};
		expect(refused({ par: '95.5', parDepth: '30' }).par).toMatch(/whole number from 1 to 2,500/);
		expect(refused({ par: '0', parDepth: '30' }).par).toMatch(/whole number/);
		expect(refused({ par: '3000', parDepth: '30' }).par).toMatch(/whole number/);
		expect(refused({ par: '95' }).parDepth).toBe('Give the depth under the water surface the reading was taken at.');
		expect(refused({ parDepth: '30' }).par).toBe('Enter the reading, or leave the depth empty too.');
		// The tank is 36 cm tall.
		expect(refused({ par: '95', parDepth: '40' }).parDepth).toMatch(/deeper than the tank is tall/);
		expect(refused({ par: '95', parDepth: '0' }).parDepth).toBe('Enter a depth greater than zero.');
	});

	test('the edit form shows a stored PAR and its depth in the member’s unit', () => {
		const stored = parseTankDraft(draft({ par: '95', parDepth: '30.5' }), 'metric', today);
		if (!stored.ok) throw new Error('expected a valid draft');
		const profile = { ...stored.input, description: null, lights: [], filters: [], fertilisers: [], plants: [], livestock: [] };
		expect(draftFromTank(profile, 'metric')).toMatchObject({ par: '95', parDepth: '30.5' });
		// 30.5 cm ÷ 2.54 = 12.0079 in.
		expect(draftFromTank(profile, 'us')).toMatchObject({ par: '95', parDepth: '12.01' });
	});

	test('CO2 bubbles only count for pressurised CO2', () => {
		const off = parseTankDraft(draft({ co2Method: 'liquid', co2Bps: '2' }), 'metric', today);
		expect(off.ok && off.input.co2BubblesPerSecond).toBeNull();
		const on = parseTankDraft(draft({ co2Method: 'pressurised', co2Bps: '1,5' }), 'metric', today);
		expect(on.ok && on.input.co2BubblesPerSecond).toBe(1.5);
	});
});

describe('draftFromForm', () => {
	test('reads rows by index in order, keeps row ids, skips blank rows', () => {
		const form = new FormData();
		form.set('name', 'x');
		form.set('lights[2][label]', 'second');
		form.set('lights[2][watts]', '20');
		form.set('lights[2][hours]', '6');
		form.set('lights[0][id]', '17');
		form.set('lights[0][label]', 'first');
		form.set('lights[0][watts]', '30');
		form.set('lights[0][hours]', '7');
		form.set('lights[1][id]', '');
		form.set('lights[1][label]', '');
		form.set('lights[1][watts]', '');
		form.set('lights[1][hours]', '');
		form.set('filters[0][unit]', 'lph');
		const d = draftFromForm(form);
		expect(d.lights).toEqual([
			{ id: '17', label: 'first', watts: '30', hours: '7' },
			{ id: '', label: 'second', watts: '20', hours: '6' }
		]);
		expect(d.filters).toEqual([]);
	});
});

describe('lightingChange on the edit form (compareLighting; the worked example of calc/lighting.test.ts)', () => {
	const saved = { watts: 40, litres: 100 };
	test('70 W typed where 40 W were saved is almost twice as strong per litre, with the usual caution', () => {
		expect(lightingChange([{ watts: '40' }, { watts: '30' }], saved)).toBe(
			'Compared with the saved lights (40 W): these are almost twice as strong per litre. Raise the light in steps; algae use a sudden increase first (common practice).'
		);
	});
	test('less light says the saved ones were stronger; about the same says so', () => {
		expect(lightingChange([{ watts: '20' }], saved)).toBe('Compared with the saved lights (40 W): those were about twice as strong per litre.');
		expect(lightingChange([{ watts: '41,5' }], saved)).toBe('Compared with the saved lights (40 W): about as strong per litre.');
	});
	test('nothing to say when unchanged, when nothing valid is typed, or for a new tank', () => {
		expect(lightingChange([{ watts: '40' }], saved)).toBeNull();
		expect(lightingChange([{ watts: 'bright' }, { watts: '' }], saved)).toBeNull();
		expect(lightingChange([{ watts: '70' }], null)).toBeNull();
	});
});

describe('names with hidden characters', () => {
	test('a right-to-left override or a name of joiners only is refused at the field; an emoji is kept', () => {
		// U+202E RIGHT-TO-LEFT OVERRIDE, U+200D ZERO WIDTH JOINER (Unicode Character Database).
		expect(parseTankDraft(draft({ name: 'Tank\u202Eexe' }), 'metric', today)).toMatchObject({
			ok: false,
			errors: { name: expect.stringMatching(/direction/) }
		});
		expect(parseTankDraft(draft({ name: '\u200D\u200D' }), 'metric', today)).toMatchObject({ ok: false, errors: { name: expect.stringMatching(/invisible/) } });
		expect(parseTankDraft(draft({ name: 'Shrimp 🦐 corner' }), 'metric', today)).toMatchObject({ ok: true, input: { name: 'Shrimp 🦐 corner' } });
	});
});
