import { describe, expect, test } from 'vitest';
import { categoryField, criterionField, draftFromForm, emptyContestDraft, parseContestDraft, tieBreakField, type ContestDraft } from './contest-form';

function form(entries: Record<string, string>) {
	const f = new FormData();
	for (const [k, v] of Object.entries(entries)) f.append(k, v);
	return f;
}

const valid = (): ContestDraft => ({
	...emptyContestDraft('2026-03-01'),
	title: 'Test scapes',
	criteria: [
		{ id: '', key: 'a', label: 'Depth', guidance: 'Front to back', maxPoints: '10', weight: '2' },
		{ id: '12', key: 'b', label: 'Finish', guidance: '', maxPoints: '5', weight: '1' }
	],
	tieBreak: ['b', 'a'],
	categories: [{ id: '', key: 'n', name: 'Small', description: '', minLitres: '', maxLitres: '40', minAgeWeeks: '6' }]
});

describe('the contest form', () => {
	test('reads rows in the order shown, whatever their indexes', () => {
		const draft = draftFromForm(
			form({
				title: ' Spring ',
				[criterionField(5, 'key')]: 'x',
				[criterionField(5, 'label')]: 'Second',
				[criterionField(2, 'key')]: 'y',
				[criterionField(2, 'label')]: 'First',
				[tieBreakField(1)]: 'x',
				[tieBreakField(0)]: 'y',
				[categoryField(0, 'name')]: 'Open'
			})
		);
		expect(draft.title).toBe('Spring');
		expect(draft.criteria.map((c) => c.label)).toEqual(['First', 'Second']);
		expect(draft.tieBreak).toEqual(['y', 'x']);
		expect(draft.categories[0]!.name).toBe('Open');
	});
	test('a valid draft becomes typed input', () => {
		const result = parseContestDraft(valid());
		expect(result.ok).toBe(true);
		if (!result.ok) return;
		expect(result.input.criteria).toEqual([
			{ id: null, key: 'a', label: 'Depth', guidance: 'Front to back', maxPoints: 10, weight: 2 },
			{ id: 12, key: 'b', label: 'Finish', guidance: '', maxPoints: 5, weight: 1 }
		]);
		expect(result.input.tieBreak).toEqual(['b', 'a']);
		expect(result.input.categories[0]).toEqual({ id: null, name: 'Small', description: '', minLitres: null, maxLitres: 40, minAgeWeeks: 6 });
	});
	test('field errors are keyed by row and field', () => {
		const draft = valid();
		draft.criteria[0]!.maxPoints = '7.25';
		draft.criteria[1]!.weight = '0';
		draft.criteria[1]!.label = 'depth';
		draft.categories[0]!.minLitres = '50';
		draft.tieBreak = ['a'];
		draft.entriesPerMember = '0';
		const result = parseContestDraft(draft);
		expect(result.ok).toBe(false);
		if (result.ok) return;
		expect(Object.keys(result.errors).sort()).toEqual(
			['categories.0.maxLitres', 'criteria.0.maxPoints', 'criteria.1.label', 'criteria.1.weight', 'entriesPerMember', 'tieBreak'].sort()
		);
	});
	test('an empty rubric or no category is refused', () => {
		const result = parseContestDraft({ ...valid(), criteria: [], tieBreak: [], categories: [] });
		expect(result.ok || result.errors).toMatchObject({ criteria: 'Add at least one criterion.', categories: 'Add at least one category.' });
	});
	test('once the contest has opened, only title, rules and dates are checked', () => {
		const result = parseContestDraft({ ...valid(), criteria: [], categories: [], entriesPerMember: 'x' }, { locked: true });
		expect(result.ok).toBe(true);
	});
	test('the default dates follow each other as the windows require', () => {
		const d = emptyContestDraft('2026-12-30');
		expect([d.entryOpensOn, d.entryClosesOn, d.judgingOpensOn, d.judgingClosesOn]).toEqual(['2027-01-06', '2027-02-05', '2027-02-06', '2027-02-20']);
	});
});
