// One judge's scorecard for one entry: validation while it is filled in, and its total.

import { isOnScoreStep, type Criterion, type Rubric } from './rubric';

/** Scores keyed by criterion id; a missing or null value means "not scored yet". */
export type ScoreSheet = Readonly<Record<string, number | null | undefined>>;

export type ScoreErrorCode = 'missing' | 'not-a-number' | 'below-zero' | 'above-max' | 'not-on-step' | 'unknown-criterion';

export interface ScoreError {
	criterionId: string;
	code: ScoreErrorCode;
	/** A sentence for the judge, naming the criterion. */
	message: string;
}

export interface ScorecardCheck {
	/** No score is out of range or off the half-point grid (missing scores are fine in a draft). */
	valid: boolean;
	/** Every criterion of the rubric has a score. */
	complete: boolean;
	/** valid && complete: the card may be submitted. */
	submittable: boolean;
	/** Problems with given scores, plus one "missing" entry per unscored criterion. */
	errors: ScoreError[];
}

function checkOne(criterion: Criterion, score: number): ScoreError | null {
	const at = (code: ScoreErrorCode, message: string): ScoreError => ({ criterionId: criterion.id, code, message });
	if (!Number.isFinite(score)) return at('not-a-number', `${criterion.label}: enter a number of points.`);
	if (score < 0) return at('below-zero', `${criterion.label}: ${score} is below 0; scores run from 0 to ${criterion.maxPoints}.`);
	if (score > criterion.maxPoints) {
		return at('above-max', `${criterion.label}: ${score} is above the maximum of ${criterion.maxPoints} points.`);
	}
	if (!isOnScoreStep(score)) {
		return at('not-on-step', `${criterion.label}: score in whole or half points (for example ${Math.floor(score)} or ${Math.floor(score) + 0.5}).`);
	}
	return null;
}

/**
 * Checks a card against its rubric. Drafts may be incomplete, so "missing" errors do not make a
 * card invalid; they stop it from being submitted. Scores for criteria that are not in the rubric
 * (a rubric edited after a draft was saved) are reported so they are not silently dropped.
 */
export function validateScorecard(rubric: Rubric, scores: ScoreSheet): ScorecardCheck {
	const errors: ScoreError[] = [];
	let valid = true;
	let complete = true;
	for (const criterion of rubric) {
		const score = scores[criterion.id];
		if (score === null || score === undefined) {
			complete = false;
			errors.push({ criterionId: criterion.id, code: 'missing', message: `${criterion.label}: give a score from 0 to ${criterion.maxPoints}.` });
			continue;
		}
		const problem = checkOne(criterion, score);
		if (problem) {
			valid = false;
			errors.push(problem);
		}
	}
	const known = new Set(rubric.map((c) => c.id));
	for (const id of Object.keys(scores)) {
		if (!known.has(id) && scores[id] !== null && scores[id] !== undefined) {
			valid = false;
			errors.push({ criterionId: id, code: 'unknown-criterion', message: 'A score was given for a criterion that is no longer in the rubric.' });
		}
	}
	return { valid, complete, submittable: valid && complete, errors };
}

/** The scores of a submitted card, one per criterion of the rubric. */
export type CompleteScoreSheet = Readonly<Record<string, number>>;

/**
 * Card total as a weighted percentage: Σ wᵢ·sᵢ / Σ wᵢ·maxᵢ × 100. Expressing it as a percentage
 * of the best possible card keeps totals comparable when the rubric's maxima change between contests.
 * Throws on an incomplete or invalid card: only submitted (validated) cards are totalled.
 */
export function cardTotal(rubric: Rubric, scores: CompleteScoreSheet): number {
	let earned = 0;
	let possible = 0;
	for (const criterion of rubric) {
		const score = scores[criterion.id];
		if (score === undefined || checkOne(criterion, score)) {
			throw new RangeError(`Card cannot be totalled: ${criterion.label} has no valid score.`);
		}
		earned += criterion.weight * score;
		possible += criterion.weight * criterion.maxPoints;
	}
	if (!(possible > 0)) throw new RangeError('Card cannot be totalled: the rubric has no points to earn.');
	return (earned / possible) * 100;
}
