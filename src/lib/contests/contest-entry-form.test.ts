import { describe, expect, test } from 'vitest';
import { DomainError } from '../errors';
import { contestEntryPhotosOf, readContestEntryForm } from './contest-entry-form';

const form = (fields: Record<string, string>) => {
	const data = new FormData();
	for (const [k, v] of Object.entries(fields)) data.append(k, v);
	return data;
};
const photo = { 'photos[0][id]': '12', 'photos[0][alt]': 'Front', 'photos[0][caption]': '' };

describe('reading the contest entry form', () => {
	test('a complete form gives the entry with its photos in order', () => {
		expect(readContestEntryForm(form({ categoryId: '3', tankId: '9', statement: ' Stems behind a lawn. ', ...photo }))).toEqual({
			categoryId: 3,
			tankId: 9,
			statement: 'Stems behind a lawn.',
			photos: [{ id: 12, alt: 'Front', caption: '' }]
		});
	});

	test('every missing part is refused at its own field', () => {
		let refusal: unknown;
		try {
			readContestEntryForm(form({ categoryId: '', tankId: 'x', statement: '' }));
		} catch (e) {
			refusal = e;
		}
		expect(refusal).toBeInstanceOf(DomainError);
		expect((refusal as DomainError).status).toBe(400);
		expect(Object.keys((refusal as DomainError).fields).sort()).toEqual(['categoryId', 'photos', 'statement', 'tankId']);
		expect((refusal as DomainError).fields.photos).toMatch(/at least one photo/);
	});

	test('a photo named twice is refused; the photos to show again are then none', () => {
		const twice = form({
			categoryId: '3',
			tankId: '9',
			statement: 'A layout.',
			...photo,
			'photos[1][id]': '12',
			'photos[1][alt]': '',
			'photos[1][caption]': ''
		});
		expect(() => readContestEntryForm(twice)).toThrow(/same photo appears twice/);
		expect(contestEntryPhotosOf(twice)).toEqual([]);
		expect(contestEntryPhotosOf(form(photo))).toEqual([{ id: 12, alt: 'Front', caption: '' }]);
	});
});
