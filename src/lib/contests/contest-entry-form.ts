// The entry form: which tank, which category, a statement and 1–6 photos (the first is the
// full-front view of the whole tank).
import { z } from 'zod';

export const ENTRY_PHOTOS_MIN = 1;
export const ENTRY_PHOTOS_MAX = 6;
export const STATEMENT_MAX = 3000;
export const ENTRY_PHOTOS_FIELD = 'photos';
export const FRONT_VIEW_LABEL = 'Full-front view';

export const entryFieldsSchema = z.object({
	categoryId: z.coerce.number({ message: 'Choose a category.' }).int().positive('Choose a category.'),
	tankId: z.coerce.number({ message: 'Choose one of your tanks.' }).int().positive('Choose one of your tanks.'),
	statement: z
		.string()
		.trim()
		.min(1, 'Tell the judges about the layout in a few sentences.')
		.max(STATEMENT_MAX, `Keep the statement to ${STATEMENT_MAX} characters.`)
});

export type EntryFields = z.infer<typeof entryFieldsSchema>;

export interface EntryDraft {
	categoryId: string;
	tankId: string;
	statement: string;
}
