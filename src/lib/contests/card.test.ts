import { describe, expect, test } from 'vitest';
import { DomainError } from '../errors';
import { checkDraftFields, emptyCardFields, normaliseFields, parseScoreText, readCardCorrection, sameFields } from './card';
import type { Rubric } from './rubric';

const rubric: Rubric = [
	{ id: '1', label: 'Depth', maxPoints: 10, weight: 2 },
	{ id: '2', label: 'Finish', maxPoints: 5, weight: 1 }
];

describe('scores as typed', () => {
	test('whole and half points, with a decimal point or comma', () => {
		expect(parseScoreText('7', 'Depth', 10)).toEqual({ value: 7, error: null });
		expect(parseScoreText(' 7.5 ', 'Depth', 10)).toEqual({ value: 7.5, error: null });
		expect(parseScoreText('7,5', 'Depth', 10)).toEqual({ value: 7.5, error: null });
		expect(parseScoreText('', 'Depth', 10)).toEqual({ value: null, error: null });
	});
	test('anything else is refused with the criterion named', () => {
		expect(parseScoreText('7.3', 'Depth', 10).error).toBe('Depth: score in whole or half points.');
		expect(parseScoreText('11', 'Depth', 10).error).toBe('Depth: the most is 10.');
		expect(parseScoreText('-1', 'Depth', 10).error).toMatch(/type a number/);
		expect(parseScoreText('seven', 'Depth', 10).value).toBeNull();
	});
});

describe('draft fields', () => {
	test('a partial draft is fine; values out of range or off the half-point grid are not', () => {
		const fields = { ...emptyCardFields(rubric), scores: { '1': 7.5, '2': null } };
		expect(checkDraftFields(rubric, fields).ok).toBe(true);
		const high = checkDraftFields(rubric, { ...fields, scores: { '1': 10.5, '2': null } });
		expect(high).toEqual({ ok: false, message: 'Depth: 10.5 is above the maximum of 10 points.' });
		expect(checkDraftFields(rubric, { ...fields, scores: { '1': 3.25 } }).ok).toBe(false);
	});
	test('a criterion outside the rubric is refused', () => {
		expect(checkDraftFields(rubric, { ...emptyCardFields(rubric), comments: { '9': 'hm' } }).ok).toBe(false);
	});
	test('normalising fills every criterion and nothing else; comparison sees every field', () => {
		const n = normaliseFields(rubric, { scores: { '1': 4 } });
		expect(n).toEqual({ scores: { '1': 4, '2': null }, comments: { '1': '', '2': '' }, entrantComment: '', panelNote: '' });
		expect(sameFields(n, { ...n, panelNote: 'x' })).toBe(false);
		expect(sameFields(n, { ...n, comments: { '1': '', '2': 'y' } })).toBe(false);
		expect(sameFields(n, normaliseFields(rubric, { scores: { '1': 4, '2': null } }))).toBe(true);
	});
});

describe('the admin’s correction form', () => {
	const form = (fields: Record<string, string>) => {
		const data = new FormData();
		for (const [k, v] of Object.entries(fields)) data.append(k, v);
		return data;
	};
	test('every criterion needs a score; the panel note is never the admin’s', () => {
		expect(readCardCorrection(rubric, form({ 'score-1': '8', 'score-2': '4,5', 'comment-1': 'Deep', entrantComment: 'Well done' }))).toEqual({
			scores: { '1': 8, '2': 4.5 },
			comments: { '1': 'Deep', '2': '' },
			entrantComment: 'Well done',
			panelNote: ''
		});
		expect(() => readCardCorrection(rubric, form({ 'score-1': '11' }))).toThrow(DomainError);
		try {
			readCardCorrection(rubric, form({ 'score-1': '11' }));
		} catch (e) {
			expect((e as DomainError).fields).toEqual({ 'score-1': 'Depth: the most is 10.', 'score-2': 'Finish: give a score.' });
		}
	});
});
