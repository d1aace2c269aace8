// The admin's contest form: settings, the rubric (reorderable criteria with a tie-break order)
// and the categories, as typed (strings, kept on error) and as validated input.
import { invalid } from '../errors';
import { validateRule } from './eligibility';
import { addDays, validateWindows, type ContestWindows } from './lifecycle';
import { isOnScoreStep, validateRubric } from './rubric';
import type { AggregationMethod } from './aggregate';

export const AGGREGATION_LABELS: Record<AggregationMethod, string> = {
	mean: 'Mean of the judges’ cards',
	median: 'Median of the judges’ cards',
	'trimmed-mean': 'Trimmed mean: drop the highest and the lowest card when five or more judges scored'
};

export const TITLE_MAX = 120;
export const RULES_MAX = 20_000;
export const CRITERIA_MAX = 12;
export const CATEGORIES_MAX = 8;
export const LABEL_MAX = 80;
export const GUIDANCE_MAX = 1000;
export const CATEGORY_NAME_MAX = 60;
export const CATEGORY_DESCRIPTION_MAX = 500;
export const ENTRIES_PER_MEMBER_MAX = 10;
export const MAX_POINTS_LIMIT = 100;
export const WEIGHT_LIMIT = 100;

export interface CriterionDraft {
	/** Database id of a saved criterion, '' for a new one. */
	id: string;
	/** Stable key in the form, so the tie-break list can name criteria not saved yet. */
	key: string;
	label: string;
	guidance: string;
	maxPoints: string;
	weight: string;
}

export interface CategoryDraft {
	id: string;
	key: string;
	name: string;
	description: string;
	minLitres: string;
	maxLitres: string;
	minAgeWeeks: string;
}

export interface ContestDraft extends ContestWindows {
	title: string;
	rules: string;
	entriesPerMember: string;
	aggregation: string;
	criteria: CriterionDraft[];
	/** Criterion keys, first compared first. */
	tieBreak: string[];
	categories: CategoryDraft[];
}

export interface CriterionInput {
	id: number | null;
	key: string;
	label: string;
	guidance: string;
	maxPoints: number;
	weight: number;
}

export interface CategoryInput {
	id: number | null;
	name: string;
	description: string;
	minLitres: number | null;
	maxLitres: number | null;
	minAgeWeeks: number | null;
}

export interface ContestInput extends ContestWindows {
	title: string;
	rules: string;
	entriesPerMember: number;
	aggregation: AggregationMethod;
	criteria: CriterionInput[];
	/** Keys of `criteria`, in tie-break order. */
	tieBreak: string[];
	categories: CategoryInput[];
}

export type ContestFormResult = { ok: true; input: ContestInput } | { ok: false; errors: Record<string, string> };

const METHODS: AggregationMethod[] = ['mean', 'median', 'trimmed-mean'];

export const criterionField = (i: number, f: keyof CriterionDraft) => `criteria[${i}][${f}]`;
export const categoryField = (i: number, f: keyof CategoryDraft) => `categories[${i}][${f}]`;
export const tieBreakField = (i: number) => `tieBreak[${i}]`;

const CRITERION_FIELDS: (keyof CriterionDraft)[] = ['id', 'key', 'label', 'guidance', 'maxPoints', 'weight'];
const CATEGORY_FIELDS: (keyof CategoryDraft)[] = ['id', 'key', 'name', 'description', 'minLitres', 'maxLitres', 'minAgeWeeks'];

const text = (form: FormData, name: string) => {
	const v = form.get(name);
	return typeof v === 'string' ? v : '';
};

function indexes(form: FormData, list: string): number[] {
	const found = new Set<number>();
	const pattern = new RegExp(`^${list}\\[(\\d{1,2})\\]`);
	for (const key of form.keys()) {
		const m = pattern.exec(key);
		if (m) found.add(Number(m[1]));
	}
	return [...found].sort((a, b) => a - b);
}

/** The draft as the browser sent it, rows in the order they were shown. */
export function draftFromForm(form: FormData): ContestDraft {
	const rows = <T>(list: string, fields: (keyof T)[], name: (i: number, f: keyof T) => string) =>
		indexes(form, list).map((i) => Object.fromEntries(fields.map((f) => [f, text(form, name(i, f)).trim()])) as T);
	return {
		title: text(form, 'title').trim(),
		rules: text(form, 'rules'),
		entryOpensOn: text(form, 'entryOpensOn').trim(),
		entryClosesOn: text(form, 'entryClosesOn').trim(),
		judgingOpensOn: text(form, 'judgingOpensOn').trim(),
		judgingClosesOn: text(form, 'judgingClosesOn').trim(),
		entriesPerMember: text(form, 'entriesPerMember').trim(),
		aggregation: text(form, 'aggregation').trim(),
		criteria: rows<CriterionDraft>('criteria', CRITERION_FIELDS, criterionField),
		tieBreak: indexes(form, 'tieBreak').map((i) => text(form, tieBreakField(i)).trim()),
		categories: rows<CategoryDraft>('categories', CATEGORY_FIELDS, categoryField)
	};
}

const decimal = (s: string) => {
	const t = s.replace(',', '.');
	return /^\d+(\.\d+)?$/.test(t) ? Number(t) : NaN;
};
const optionalNumber = (s: string) => (s === '' ? null : decimal(s));
const savedId = (s: string) => (/^[1-9]\d{0,15}$/.test(s) ? Number(s) : null);

/**
 * Validates the whole form. With `locked` (the contest has opened), only the title, rules and
 * windows are read; the rest is ignored by the caller.
 */
export function parseContestDraft(draft: ContestDraft, options: { locked?: boolean } = {}): ContestFormResult {
	const errors: Record<string, string> = {};
	if (!draft.title) errors.title = 'Give the contest a title.';
	else if (draft.title.length > TITLE_MAX) errors.title = `Keep the title to ${TITLE_MAX} characters.`;
	if (draft.rules.length > RULES_MAX) errors.rules = `Keep the rules to ${RULES_MAX} characters.`;
	Object.assign(errors, validateWindows(draft));

	const entriesPerMember = Number(draft.entriesPerMember);
	const aggregation = draft.aggregation as AggregationMethod;
	const criteria: CriterionInput[] = [];
	const categories: CategoryInput[] = [];
	if (!options.locked) {
		if (!Number.isInteger(entriesPerMember) || entriesPerMember < 1 || entriesPerMember > ENTRIES_PER_MEMBER_MAX) {
			errors.entriesPerMember = `Give a whole number from 1 to ${ENTRIES_PER_MEMBER_MAX}.`;
		}
		if (!METHODS.includes(aggregation)) errors.aggregation = 'Choose how the judges’ cards are combined.';

		if (draft.criteria.length === 0) errors.criteria = 'Add at least one criterion.';
		if (draft.criteria.length > CRITERIA_MAX) errors.criteria = `Use at most ${CRITERIA_MAX} criteria.`;
		const keys = new Set<string>();
		draft.criteria.forEach((c, i) => {
			const at = (f: string) => `criteria.${i}.${f}`;
			if (!c.key || keys.has(c.key)) errors[at('label')] = 'This row is duplicated; remove it and add it again.';
			keys.add(c.key);
			if (!c.label) errors[at('label')] = 'Name the criterion.';
			else if (c.label.length > LABEL_MAX) errors[at('label')] = `Keep the name to ${LABEL_MAX} characters.`;
			if (c.guidance.length > GUIDANCE_MAX) errors[at('guidance')] = `Keep the guidance to ${GUIDANCE_MAX} characters.`;
			const max = decimal(c.maxPoints);
			if (!(max > 0) || max > MAX_POINTS_LIMIT || !isOnScoreStep(max))
				errors[at('maxPoints')] = `Give a whole or half number of points above 0, at most ${MAX_POINTS_LIMIT}.`;
			const weight = decimal(c.weight);
			if (!(weight > 0) || weight > WEIGHT_LIMIT || Math.round(weight * 1000) !== weight * 1000) {
				errors[at('weight')] = `Give a weight above 0 and at most ${WEIGHT_LIMIT}, with at most three decimals.`;
			}
			criteria.push({ id: savedId(c.id), key: c.key, label: c.label, guidance: c.guidance, maxPoints: max, weight });
		});
		const labels = criteria.map((c) => c.label.toLowerCase());
		labels.forEach((l, i) => {
			if (l && labels.indexOf(l) !== i) errors[`criteria.${i}.label`] = 'Two criteria have this name; judges could not tell them apart.';
		});
		const order = draft.tieBreak.filter((k) => keys.has(k));
		if (new Set(order).size !== order.length || order.length !== keys.size) {
			// The list is rebuilt by the page from the criteria; a mismatch means the form was tampered with or stale.
			errors.tieBreak = 'Put every criterion in the tie-break order once.';
		}
		if (!Object.keys(errors).some((k) => k.startsWith('criteria'))) {
			const problems = validateRubric(criteria.map((c) => ({ id: c.key, label: c.label, maxPoints: c.maxPoints, weight: c.weight })));
			if (problems.length) errors.criteria = problems[0]!.message;
		}

		if (draft.categories.length === 0) errors.categories = 'Add at least one category.';
		if (draft.categories.length > CATEGORIES_MAX) errors.categories = `Use at most ${CATEGORIES_MAX} categories.`;
		draft.categories.forEach((c, i) => {
			const at = (f: string) => `categories.${i}.${f}`;
			if (!c.name) errors[at('name')] = 'Name the category.';
			else if (c.name.length > CATEGORY_NAME_MAX) errors[at('name')] = `Keep the name to ${CATEGORY_NAME_MAX} characters.`;
			if (c.description.length > CATEGORY_DESCRIPTION_MAX) errors[at('description')] = `Keep the description to ${CATEGORY_DESCRIPTION_MAX} characters.`;
			const rule = {
				minLitres: optionalNumber(c.minLitres),
				maxLitres: optionalNumber(c.maxLitres),
				minAgeWeeks: c.minAgeWeeks === '' ? null : Number(c.minAgeWeeks)
			};
			const ruleErrors = validateRule(rule);
			for (const [f, message] of Object.entries(ruleErrors)) errors[at(f)] = message;
			categories.push({ id: savedId(c.id), name: c.name, description: c.description, ...rule });
		});
		const names = categories.map((c) => c.name.toLowerCase());
		names.forEach((n, i) => {
			if (n && names.indexOf(n) !== i) errors[`categories.${i}.name`] = 'Two categories have this name.';
		});
	}

	if (Object.keys(errors).length) return { ok: false, errors };
	return {
		ok: true,
		input: {
			title: draft.title,
			rules: draft.rules,
			entryOpensOn: draft.entryOpensOn,
			entryClosesOn: draft.entryClosesOn,
			judgingOpensOn: draft.judgingOpensOn,
			judgingClosesOn: draft.judgingClosesOn,
			entriesPerMember: options.locked ? 1 : entriesPerMember,
			aggregation: options.locked ? 'mean' : aggregation,
			criteria,
			tieBreak: options.locked ? [] : draft.tieBreak,
			categories
		}
	};
}

/** Reads the contest form, or throws the refusal that puts each message at its field (the draft is what the form shows again). */
export function readContestForm(data: FormData, options: { locked?: boolean } = {}): ContestInput {
	const parsed = parseContestDraft(draftFromForm(data), options);
	if (!parsed.ok) throw invalid(parsed.errors);
	return parsed.input;
}

let keyCounter = 0;
/** A key for a new row, unique within the page. */
export const newKey = (prefix: string) => `${prefix}${Date.now().toString(36)}${(++keyCounter).toString(36)}`;

export function emptyContestDraft(today: string): ContestDraft {
	const day = (offset: number) => addDays(today, offset);
	return {
		title: '',
		rules: '',
		entryOpensOn: day(7),
		entryClosesOn: day(37),
		judgingOpensOn: day(38),
		judgingClosesOn: day(52),
		entriesPerMember: '1',
		aggregation: 'mean',
		criteria: [],
		tieBreak: [],
		categories: []
	};
}
