// What a scorecard holds, as the browser edits it and the autosave endpoint receives it.
import { z } from 'zod';
import { invalid, type FieldErrors } from '../errors';
import { isOnScoreStep, type Rubric } from './rubric';
import { validateScorecard, type ScoreSheet } from './scoring';

export const CRITERION_COMMENT_MAX = 2000;
export const ENTRANT_COMMENT_MAX = 4000;
export const PANEL_NOTE_MAX = 2000;

export interface CardFields {
	/** Keyed by criterion id; null while not scored. */
	scores: Record<string, number | null>;
	/** Per-criterion comment for the entrant, keyed by criterion id. */
	comments: Record<string, string>;
	/** Shown to the entrant with the results. */
	entrantComment: string;
	/** Seen by the other judges of the contest and the admins only, never by the entrant. */
	panelNote: string;
}

export const emptyCardFields = (rubric: Rubric): CardFields => ({
	scores: Object.fromEntries(rubric.map((c) => [c.id, null])),
	comments: Object.fromEntries(rubric.map((c) => [c.id, ''])),
	entrantComment: '',
	panelNote: ''
});

/** The stored fields brought in line with the rubric: every criterion present, nothing else. */
export function normaliseFields(rubric: Rubric, fields: Partial<CardFields>): CardFields {
	return {
		scores: Object.fromEntries(rubric.map((c) => [c.id, fields.scores?.[c.id] ?? null])),
		comments: Object.fromEntries(rubric.map((c) => [c.id, fields.comments?.[c.id] ?? ''])),
		entrantComment: fields.entrantComment ?? '',
		panelNote: fields.panelNote ?? ''
	};
}

export function sameFields(a: CardFields, b: CardFields): boolean {
	const keys = new Set([...Object.keys(a.scores), ...Object.keys(b.scores), ...Object.keys(a.comments), ...Object.keys(b.comments)]);
	for (const k of keys) {
		if ((a.scores[k] ?? null) !== (b.scores[k] ?? null)) return false;
		if ((a.comments[k] ?? '') !== (b.comments[k] ?? '')) return false;
	}
	return a.entrantComment === b.entrantComment && a.panelNote === b.panelNote;
}

export const cardFieldsSchema = z.object({
	scores: z.record(z.string().max(20), z.number().finite().nullable()),
	comments: z.record(z.string().max(20), z.string().max(CRITERION_COMMENT_MAX, `Keep each comment to ${CRITERION_COMMENT_MAX} characters.`)),
	entrantComment: z.string().max(ENTRANT_COMMENT_MAX, `Keep the comment for the entrant to ${ENTRANT_COMMENT_MAX} characters.`),
	panelNote: z.string().max(PANEL_NOTE_MAX, `Keep the note for the panel to ${PANEL_NOTE_MAX} characters.`)
});

/** One autosave: the version the browser last saw, and an id so a retried request is recognised. */
export const cardSaveSchema = z.object({
	baseVersion: z.number().int().min(0),
	saveId: z.string().regex(/^[A-Za-z0-9-]{8,64}$/),
	fields: cardFieldsSchema
});
export type CardSave = z.infer<typeof cardSaveSchema>;

export type FieldsProblem = { ok: true; fields: CardFields } | { ok: false; message: string };

/**
 * A draft may leave scores out, but every given score must be in range and on the half-point
 * grid, and only the rubric's criteria may appear.
 */
export function checkDraftFields(rubric: Rubric, fields: z.infer<typeof cardFieldsSchema>): FieldsProblem {
	const known = new Set(rubric.map((c) => c.id));
	const stray = [...Object.keys(fields.scores), ...Object.keys(fields.comments)].find((k) => !known.has(k));
	if (stray) return { ok: false, message: 'The card names a criterion that is not in this contest’s rubric. Reload the page.' };
	const check = validateScorecard(rubric, fields.scores as ScoreSheet);
	if (!check.valid) return { ok: false, message: check.errors.find((e) => e.code !== 'missing')!.message };
	return { ok: true, fields: normaliseFields(rubric, fields) };
}

export interface ScoreText {
	value: number | null;
	error: string | null;
}

/**
 * Reads a score as typed on a phone or a keyboard: "7", "7.5", "7,5" (decimal comma) or empty.
 * Anything else keeps its text on screen with the reason; only valid scores are sent.
 */
export function parseScoreText(text: string, label: string, maxPoints: number): ScoreText {
	const t = text.trim().replace(',', '.');
	if (t === '') return { value: null, error: null };
	if (!/^\d+(\.\d+)?$/.test(t)) return { value: null, error: `${label}: type a number such as 7 or 7.5.` };
	const value = Number(t);
	if (value > maxPoints) return { value: null, error: `${label}: the most is ${maxPoints}.` };
	if (!isOnScoreStep(value)) return { value: null, error: `${label}: score in whole or half points.` };
	return { value, error: null };
}

/** The field names of the admin's correction form: a score and a comment per criterion. */
export const scoreFieldName = (criterionId: string) => `score-${criterionId}`;
export const commentFieldName = (criterionId: string) => `comment-${criterionId}`;

/**
 * Reads the admin's correction of a card (every criterion needs a score; the note for the panel
 * is not the admin's to change), or throws the refusal that puts each message at its score.
 */
export function readCardCorrection(criteria: readonly { id: string; label: string; maxPoints: number }[], data: FormData): CardFields {
	const errors: FieldErrors = {};
	const fields: CardFields = { scores: {}, comments: {}, entrantComment: String(data.get('entrantComment') ?? ''), panelNote: '' };
	for (const k of criteria) {
		const read = parseScoreText(String(data.get(scoreFieldName(k.id)) ?? ''), k.label, k.maxPoints);
		if (read.error) errors[scoreFieldName(k.id)] = read.error;
		else if (read.value === null) errors[scoreFieldName(k.id)] = `${k.label}: give a score.`;
		fields.scores[k.id] = read.value;
		fields.comments[k.id] = String(data.get(commentFieldName(k.id)) ?? '');
	}
	if (Object.keys(errors).length) throw invalid(errors);
	return fields;
}
