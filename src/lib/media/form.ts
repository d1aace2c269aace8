// The fields a PhotoUploader adds to its enclosing form, and how the server reads them back:
//   <name>[0][id], <name>[0][alt], <name>[0][caption], <name>[1][id], … in display order.
import { z } from 'zod';

export const ALT_MAX = 300;
export const CAPTION_MAX = 500;

export interface PhotoField {
	id: number;
	alt: string;
	caption: string;
}

/** A photo as the PhotoUploader shows it (also when a form comes back with errors). */
export interface UploaderPhoto {
	id: number;
	alt: string;
	caption: string;
	urls: { thumb: string; medium: string; large: string };
}

export const photoFieldName = (name: string, index: number, part: 'id' | 'alt' | 'caption') => `${name}[${index}][${part}]`;

const photoSchema = z.object({
	id: z.coerce.number().int().positive(),
	alt: z.string().trim().max(ALT_MAX, `Keep the description to ${ALT_MAX} characters.`),
	caption: z.string().trim().max(CAPTION_MAX, `Keep the caption to ${CAPTION_MAX} characters.`)
});

export type PhotoFieldsResult = { ok: true; photos: PhotoField[] } | { ok: false; error: string };

/** Reads the uploader's fields in order; at most `max` photos, each id once. */
export function readPhotoFields(form: FormData, name: string, max: number): PhotoFieldsResult {
	const photos: PhotoField[] = [];
	for (let i = 0; form.has(photoFieldName(name, i, 'id')); i++) {
		const parsed = photoSchema.safeParse({
			id: form.get(photoFieldName(name, i, 'id')),
			alt: String(form.get(photoFieldName(name, i, 'alt')) ?? ''),
			caption: String(form.get(photoFieldName(name, i, 'caption')) ?? '')
		});
		if (!parsed.success) return { ok: false, error: parsed.error.issues[0]?.message ?? 'A photo field is not valid.' };
		if (photos.some((p) => p.id === parsed.data.id)) return { ok: false, error: 'The same photo appears twice.' };
		photos.push(parsed.data);
	}
	if (photos.length > max) return { ok: false, error: `Add at most ${max} photo${max === 1 ? '' : 's'}.` };
	return { ok: true, photos };
}

export type ParsedWithPhotos<I> = { ok: true; input: I; photos: PhotoField[] } | { ok: false; errors: Record<string, string> };

/**
 * Reads a form that has an uploader field: `parse` reads the rest (it is told the photos, as some
 * forms accept a photo instead of text), and a mistake in either puts its message at its field.
 */
export function readWithPhotos<I>(
	form: FormData,
	name: string,
	max: number,
	parse: (photos: PhotoField[]) => { ok: true; input: I } | { ok: false; errors: Record<string, string> }
): ParsedWithPhotos<I> {
	const photos = readPhotoFields(form, name, max);
	const parsed = parse(photos.ok ? photos.photos : []);
	if (parsed.ok && photos.ok) return { ok: true, input: parsed.input, photos: photos.photos };
	return { ok: false, errors: { ...(parsed.ok ? {} : parsed.errors), ...(photos.ok ? {} : { [name]: photos.error }) } };
}
