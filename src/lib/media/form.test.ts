import { describe, expect, test } from 'vitest';
import { readPhotoFields, readWithPhotos } from './form';

const form = (entries: [string, string][]) => {
	const f = new FormData();
	for (const [k, v] of entries) f.append(k, v);
	return f;
};

describe('readPhotoFields', () => {
	test('reads the uploader fields in order, trimming text', () => {
		const result = readPhotoFields(
			form([
				['photos[0][id]', '12'],
				['photos[0][alt]', ' Front view '],
				['photos[0][caption]', ''],
				['photos[1][id]', '7'],
				['photos[1][alt]', ''],
				['photos[1][caption]', 'After the trim']
			]),
			'photos',
			12
		);
		expect(result).toEqual({
			ok: true,
			photos: [
				{ id: 12, alt: 'Front view', caption: '' },
				{ id: 7, alt: '', caption: 'After the trim' }
			]
		});
	});

	test('refuses more than max, a repeated id, a bad id and over-long text', () => {
		const three = form([1, 2, 3].flatMap((i) => [[`p[${i - 1}][id]`, String(i)]] as [string, string][]));
		expect(readPhotoFields(three, 'p', 2)).toEqual({ ok: false, error: 'Add at most 2 photos.' });
		expect(
			readPhotoFields(
				form([
					['p[0][id]', '4'],
					['p[1][id]', '4']
				]),
				'p',
				6
			)
		).toMatchObject({ ok: false, error: 'The same photo appears twice.' });
		expect(readPhotoFields(form([['p[0][id]', 'x']]), 'p', 6).ok).toBe(false);
		expect(
			readPhotoFields(
				form([
					['p[0][id]', '4'],
					['p[0][alt]', 'a'.repeat(301)]
				]),
				'p',
				6
			)
		).toMatchObject({ ok: false, error: 'Keep the description to 300 characters.' });
	});

	test('no fields is no photos; other prefixes are ignored', () => {
		expect(readPhotoFields(form([['cover[0][id]', '3']]), 'photos', 6)).toEqual({ ok: true, photos: [] });
	});
});

describe('readWithPhotos', () => {
	const parse = (photos: { id: number }[]) =>
		photos.length ? { ok: true as const, input: 'fine' } : { ok: false as const, errors: { body: 'Write something or add a photo.' } };
	test('the input and the photos when both read', () => {
		expect(readWithPhotos(form([['cover[0][id]', '3']]), 'cover', 1, parse)).toEqual({ ok: true, input: 'fine', photos: [{ id: 3, alt: '', caption: '' }] });
	});
	test('each mistake at its field, the photos’ at the uploader’s name', () => {
		expect(readWithPhotos(form([]), 'photos', 2, parse)).toEqual({ ok: false, errors: { body: 'Write something or add a photo.' } });
		expect(
			readWithPhotos(
				form([
					['cover[0][id]', '3'],
					['cover[1][id]', '4']
				]),
				'cover',
				1,
				parse
			)
		).toEqual({ ok: false, errors: { body: 'Write something or add a photo.', cover: 'Add at most 1 photo.' } });
	});
});
