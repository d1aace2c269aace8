// A contest's rubric: the criteria judges score, each out of a maximum number of points and with
// a weight that says how much it counts towards the card total.

/** Judges score in whole and half points; finer steps suggest a precision nobody judges with. */
export const SCORE_STEP = 0.5;

export interface Criterion {
	id: string;
	/** What the judge and the public read, e.g. "Composition". */
	label: string;
	/** Highest score a judge may give on this criterion; a positive multiple of SCORE_STEP. */
	maxPoints: number;
	/** Relative weight in the card total; any positive number (weights need not sum to 1). */
	weight: number;
}

export type Rubric = readonly Criterion[];

export interface RubricProblem {
	criterionId: string | null;
	message: string;
}

/** True when `value` is a whole number of SCORE_STEPs (exact for the binary fraction 0.5). */
export function isOnScoreStep(value: number): boolean {
	return Number.isFinite(value) && Number.isInteger(value / SCORE_STEP);
}

/** Problems that would make totals meaningless: call before a contest opens for judging. */
export function validateRubric(rubric: Rubric): RubricProblem[] {
	const problems: RubricProblem[] = [];
	if (rubric.length === 0) problems.push({ criterionId: null, message: 'Add at least one criterion.' });
	const seen = new Set<string>();
	for (const c of rubric) {
		const name = c.label.trim() || c.id;
		if (seen.has(c.id)) problems.push({ criterionId: c.id, message: `${name}: the criterion appears twice.` });
		seen.add(c.id);
		if (!c.label.trim()) problems.push({ criterionId: c.id, message: 'Every criterion needs a name.' });
		if (!(c.maxPoints > 0) || !isOnScoreStep(c.maxPoints)) {
			problems.push({ criterionId: c.id, message: `${name}: the maximum must be a positive whole or half number of points.` });
		}
		if (!(c.weight > 0) || !Number.isFinite(c.weight)) {
			problems.push({ criterionId: c.id, message: `${name}: the weight must be a positive number.` });
		}
	}
	return problems;
}
