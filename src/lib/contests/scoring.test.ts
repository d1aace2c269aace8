import * as ss from 'simple-statistics';
import { describe, expect, test } from 'vitest';
import { validateRubric, type Rubric } from './rubric';
import { cardTotal, validateScorecard } from './scoring';

// An invented three-criterion rubric with unequal maxima and weights.
const rubric: Rubric = [
	{ id: 'arrangement', label: 'Arrangement', maxPoints: 10, weight: 3 },
	{ id: 'condition', label: 'Plant condition', maxPoints: 10, weight: 2 },
	{ id: 'clarity', label: 'Water clarity', maxPoints: 5, weight: 1 }
];

describe('validateRubric', () => {
	test('accepts a sound rubric', () => {
		expect(validateRubric(rubric)).toEqual([]);
	});
	test('reports an empty rubric, duplicates, unnamed criteria, bad maxima and weights', () => {
		expect(validateRubric([]).map((p) => p.message)).toEqual(['Add at least one criterion.']);
		const problems = validateRubric([
			{ id: 'a', label: 'Arrangement', maxPoints: 10, weight: 1 },
			{ id: 'a', label: 'Arrangement', maxPoints: 7.3, weight: 0 },
			{ id: 'b', label: ' ', maxPoints: 0, weight: Number.NaN }
		]);
		expect(problems.map((p) => p.message)).toEqual([
			'Arrangement: the criterion appears twice.',
			'Arrangement: the maximum must be a positive whole or half number of points.',
			'Arrangement: the weight must be a positive number.',
			'Every criterion needs a name.',
			'b: the maximum must be a positive whole or half number of points.',
			'b: the weight must be a positive number.'
		]);
	});
});

describe('validateScorecard', () => {
	test('a full card on the half-point grid can be submitted', () => {
		const check = validateScorecard(rubric, { arrangement: 8.5, condition: 0, clarity: 5 });
		expect(check).toEqual({ valid: true, complete: true, submittable: true, errors: [] });
	});
	test('a draft with gaps is valid but not complete', () => {
		const check = validateScorecard(rubric, { arrangement: 7, condition: null });
		expect(check.valid).toBe(true);
		expect(check.complete).toBe(false);
		expect(check.submittable).toBe(false);
		expect(check.errors).toEqual([
			{ criterionId: 'condition', code: 'missing', message: 'Plant condition: give a score from 0 to 10.' },
			{ criterionId: 'clarity', code: 'missing', message: 'Water clarity: give a score from 0 to 5.' }
		]);
	});
	test('each kind of bad score gets its own message naming the criterion', () => {
		const check = validateScorecard(rubric, { arrangement: 10.5, condition: -1, clarity: 2.25 });
		expect(check.valid).toBe(false);
		expect(check.errors.map((e) => [e.criterionId, e.code, e.message])).toEqual([
			['arrangement', 'above-max', 'Arrangement: 10.5 is above the maximum of 10 points.'],
			['condition', 'below-zero', 'Plant condition: -1 is below 0; scores run from 0 to 10.'],
			['clarity', 'not-on-step', 'Water clarity: score in whole or half points (for example 2 or 2.5).']
		]);
		expect(validateScorecard(rubric, { arrangement: Number.NaN, condition: 1, clarity: 1 }).errors[0]?.code).toBe('not-a-number');
	});
	test('a score for a criterion no longer in the rubric is reported', () => {
		const check = validateScorecard(rubric, { arrangement: 1, condition: 1, clarity: 1, lighting: 4 });
		expect(check.submittable).toBe(false);
		expect(check.errors).toEqual([
			{ criterionId: 'lighting', code: 'unknown-criterion', message: 'A score was given for a criterion that is no longer in the rubric.' }
		]);
	});
	test('the maximum itself and 0 are allowed; 0.1 steps are not', () => {
		expect(validateScorecard(rubric, { arrangement: 10, condition: 0.5, clarity: 0 }).valid).toBe(true);
		expect(validateScorecard(rubric, { arrangement: 9.9, condition: 1, clarity: 1 }).errors[0]?.code).toBe('not-on-step');
	});
});

describe('cardTotal', () => {
	test('hand-checked: (3·8 + 2·7.5 + 1·4) / (3·10 + 2·10 + 1·5) × 100 = 43/55 × 100', () => {
		expect(cardTotal(rubric, { arrangement: 8, condition: 7.5, clarity: 4 })).toBeCloseTo((43 / 55) * 100, 12);
	});
	test('equals the weighted mean of score/max with weights weight·max (simple-statistics weightedMean)', () => {
		// Σwᵢsᵢ / Σwᵢmᵢ = Σ (wᵢmᵢ)(sᵢ/mᵢ) / Σ wᵢmᵢ: the definition of a weighted arithmetic mean.
		let seed = 7;
		const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
		for (let trial = 0; trial < 200; trial++) {
			const r: Rubric = Array.from({ length: 1 + Math.floor(next() * 6) }, (_, i) => ({
				id: `c${i}`,
				label: `C${i}`,
				maxPoints: (1 + Math.floor(next() * 40)) / 2,
				weight: 0.1 + next() * 5
			}));
			const scores = Object.fromEntries(r.map((c) => [c.id, Math.floor(next() * (c.maxPoints * 2 + 1)) / 2]));
			const expected =
				100 *
				ss.weightedMean(
					r.map((c) => scores[c.id]! / c.maxPoints),
					r.map((c) => c.weight * c.maxPoints)
				);
			expect(cardTotal(r, scores)).toBeCloseTo(expected, 9);
		}
	});
	test('a perfect card is 100 and an empty-handed one 0', () => {
		expect(cardTotal(rubric, { arrangement: 10, condition: 10, clarity: 5 })).toBe(100);
		expect(cardTotal(rubric, { arrangement: 0, condition: 0, clarity: 0 })).toBe(0);
	});
	test('refuses an incomplete or invalid card', () => {
		expect(() => cardTotal(rubric, { arrangement: 8, condition: 7 })).toThrow(/Water clarity/);
		expect(() => cardTotal(rubric, { arrangement: 11, condition: 7, clarity: 1 })).toThrow(/Arrangement/);
	});
});
