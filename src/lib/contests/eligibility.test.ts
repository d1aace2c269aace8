import { describe, expect, test } from 'vitest';
import { tankFigures, type TankMeasures } from '../journals/figures';
import { checkEligibility, describeRule, roundLitres, validateRule, type EligibilityRule } from './eligibility';

const nano: EligibilityRule = { minLitres: null, maxLitres: 40, minAgeWeeks: null };
const mature: EligibilityRule = { minLitres: 20, maxLitres: 120, minAgeWeeks: 8 };
const facts = (litres: number | null, ageWeeks: number | null, retired = false) => ({
	litres,
	volumeSource: litres === null ? null : ('measured' as const),
	ageWeeks,
	retired
});

describe('checkEligibility', () => {
	test('bounds are inclusive and compared on the litres as shown (one decimal)', () => {
		expect(checkEligibility(nano, facts(40, null)).eligible).toBe(true);
		expect(checkEligibility(nano, facts(40.04, null))).toMatchObject({ eligible: true, comparedLitres: 40 });
		expect(checkEligibility(nano, facts(40.05, null))).toMatchObject({ eligible: false, comparedLitres: 40.1 });
		expect(checkEligibility(nano, facts(40.05, null)).reasons).toEqual(['It holds 40.1 L of water; this category takes at most 40 L.']);
	});
	test('every unmet condition is named', () => {
		const result = checkEligibility(mature, facts(15, 3, true));
		expect(result.eligible).toBe(false);
		expect(result.reasons).toEqual([
			'The tank is retired; only running tanks can be entered.',
			'It holds 15 L of water; this category needs at least 20 L.',
			'It has been running 3 weeks; this category needs at least 8 weeks.'
		]);
	});
	test('missing figures are reasons too, but only when the category asks for them', () => {
		expect(checkEligibility(mature, facts(null, null)).reasons).toHaveLength(2);
		expect(checkEligibility({ minLitres: null, maxLitres: null, minAgeWeeks: null }, facts(null, null)).eligible).toBe(true);
	});
	test('with the figures of a tank profile: a 30 × 20 × 25 cm tank is a nano', () => {
		// Outer 30 × 20 × 25 cm, 4 mm glass: inner 29.2 × 19.2 × 24.6 cm = 13.79 L gross; the figures
		// module (tested against its own sources) takes off substrate and rock. Hand check of the
		// gross volume: 29.2 × 19.2 × 24.6 / 1000 = 13.792 L.
		const tank: TankMeasures = {
			lengthCm: 30,
			widthCm: 20,
			heightCm: 25,
			glassMm: 4,
			substrateKind: 'sand',
			substrateDepthCm: 3,
			hardscapeLitres: 0.8,
			waterLitres: null,
			heaterWatts: null,
			co2Method: 'none',
			setUpOn: '2026-01-05',
			lights: [],
			filters: []
		};
		const fig = tankFigures(tank, new Date('2026-03-09T12:00:00Z'));
		expect(fig.grossLitres).toBeCloseTo(13.792, 3);
		expect(fig.age!.weeks).toBe(9); // 63 days
		const check = checkEligibility(
			{ ...nano, minAgeWeeks: 8 },
			{ litres: fig.volume!.litres, volumeSource: fig.volume!.source, ageWeeks: fig.age!.weeks, retired: false }
		);
		expect(check.eligible).toBe(true);
		expect(check.comparedLitres).toBe(roundLitres(fig.volume!.litres));
	});
});

describe('rules as typed by an admin', () => {
	test('descriptions', () => {
		expect(describeRule(nano)).toBe('Up to 40 L of water');
		expect(describeRule(mature)).toBe('20–120 L of water, running at least 8 weeks');
		expect(describeRule({ minLitres: 60, maxLitres: null, minAgeWeeks: 1 })).toBe('At least 60 L of water, running at least 1 week');
		expect(describeRule({ minLitres: null, maxLitres: null, minAgeWeeks: null })).toBe('Any running tank');
	});
	test('members who use gallons read their own beside the litres the rule is set in (1 US gal = 3.785411784 L, NIST Handbook 44; 1 imp gal = 4.54609 L)', () => {
		// 40 / 3.785411784 = 10.57; 20 / 3.785… = 5.28, 120 / 3.785… = 31.7; 40 / 4.54609 = 8.80.
		expect(describeRule(nano, 'us')).toBe('Up to 40 L (10.6 US gal) of water');
		expect(describeRule(mature, 'us')).toBe('20–120 L (5.28–31.7 US gal) of water, running at least 8 weeks');
		expect(describeRule(nano, 'imperial')).toBe('Up to 40 L (8.8 imp gal) of water');
		expect(checkEligibility(nano, facts(50, null), 'us').reasons).toEqual([
			'It holds 50 L (13.2 US gal) of water; this category takes at most 40 L (10.6 US gal).'
		]);
	});
	test('validation', () => {
		expect(validateRule(mature)).toEqual({});
		expect(validateRule({ minLitres: 50, maxLitres: 40, minAgeWeeks: null })).toHaveProperty('maxLitres');
		expect(validateRule({ minLitres: -1, maxLitres: null, minAgeWeeks: 2.5 })).toEqual({
			minLitres: 'Give a volume of 0 litres or more.',
			minAgeWeeks: 'Give a whole number of weeks.'
		});
	});
});
