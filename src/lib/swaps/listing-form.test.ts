import { describe, expect, test } from 'vitest';
import { emptyDraft, parseListingDraft, untilEndOf, type ListingDraft } from './listing-form';

const now = new Date('2031-03-01T09:30:00Z');
const draft = (over: Partial<ListingDraft> = {}): ListingDraft => ({
	...emptyDraft('plants', now, 4),
	title: 'Rotala tops',
	amount: '12',
	unit: 'stems',
	...over
});

// The form's rules are ours (no source); the day arithmetic follows the Gregorian calendar.
describe('the listing form', () => {
	test('a new plant listing defaults to 7 days, the first plant unit and the member’s area', () => {
		expect(emptyDraft('plants', now, 4)).toMatchObject({ kind: 'offer', unit: 'plants', availableUntil: '2031-03-08', pickupAreaId: '4', terms: 'free' });
		expect(emptyDraft('equipment', now, null)).toMatchObject({ unit: 'pieces', availableUntil: '2031-03-31', pickupAreaId: '' });
	});

	test('a valid draft becomes the input', () => {
		const parsed = parseListingDraft(draft({ speciesId: '17', speciesName: ' Rotala  rotundifolia ', tankId: '3' }), now);
		expect(parsed).toEqual({
			ok: true,
			input: {
				kind: 'offer',
				category: 'plants',
				title: 'Rotala tops',
				speciesId: 17,
				speciesName: 'Rotala rotundifolia',
				quantity: { amount: 12, unit: 'stems' },
				condition: '',
				description: '',
				terms: 'free',
				termsNote: '',
				pickupAreaId: 4,
				availableUntil: new Date('2031-03-08T23:59:59.999Z'),
				tankId: 3
			}
		});
	});

	test('hardscape and equipment carry no species; wanted posts no tank', () => {
		const stone = parseListingDraft(draft({ category: 'hardscape', unit: 'pieces', amount: '3', speciesId: '9', speciesName: 'Rotala' }), now);
		expect(stone).toMatchObject({ ok: true, input: { speciesId: null, speciesName: '' } });
		expect(parseListingDraft(draft({ kind: 'wanted', tankId: '3' }), now)).toMatchObject({ ok: true, input: { tankId: null } });
	});

	test('field errors', () => {
		const parsed = parseListingDraft(
			draft({ title: 'ab', amount: '2.5', terms: 'token', termsNote: '', availableUntil: '2031-02-30', pickupAreaId: 'x' }),
			now
		);
		expect(parsed).toEqual({
			ok: false,
			errors: {
				title: 'Give the listing a title of at least 3 characters.',
				amount: 'Enter a whole number.',
				termsNote: 'Give the price you ask, to be paid in person.',
				availableUntil: 'Give the day as YYYY-MM-DD.',
				pickupAreaId: 'Choose one of the club areas.'
			}
		});
		expect(parseListingDraft(draft({ unit: 'individuals' }), now)).toMatchObject({
			ok: false,
			errors: { unit: '"animals" does not fit plants; choose plants, stems, rhizome pieces, bulbs or tubers, portions, cups, pots, cm² of mat or pieces.' }
		});
		expect(parseListingDraft(draft({ kind: 'sale', category: 'boats' }), now)).toMatchObject({
			ok: false,
			errors: { kind: 'Choose an offer or a wanted post.', category: 'Choose a category.' }
		});
	});

	test('the day must be in the future and within 90 days; the last allowed day works all day', () => {
		expect(parseListingDraft(draft({ availableUntil: '2031-02-28' }), now)).toMatchObject({
			ok: false,
			errors: { availableUntil: 'Choose a date in the future.' }
		});
		// 1 March + 90 days = 30 May 2031.
		expect(untilEndOf('2031-05-30', now)).toEqual(new Date('2031-05-30T09:30:00.000Z'));
		expect(parseListingDraft(draft({ availableUntil: '2031-05-30' }), now).ok).toBe(true);
		expect(untilEndOf('2031-05-31', now)).toEqual(new Date('2031-05-30T09:30:00.000Z'));
		expect(untilEndOf('2031-03-01', now)).toEqual(new Date('2031-03-01T23:59:59.999Z'));
		expect(untilEndOf('1 March', now)).toBeNull();
	});
});

describe('titles with hidden characters', () => {
	test('a right-to-left override (U+202E) is refused at the field; emoji stay', () => {
		expect(parseListingDraft(draft({ title: 'Stems \u202Eexe.gpj' }), now)).toMatchObject({ ok: false, errors: { title: expect.stringMatching(/direction/) } });
		expect(parseListingDraft(draft({ title: 'Stems 🌿 for all' }), now)).toMatchObject({ ok: true, input: { title: 'Stems 🌿 for all' } });
	});
});
