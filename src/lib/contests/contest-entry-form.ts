// The contest entry form: which tank, which category, a statement and 1–6 photos (the first is the
// whole tank from the front), and the tanks it offers with what each category says of them.
import { z } from 'zod';
import { fieldErrorsOf, invalid } from '../errors';
import { readPhotoFields, type PhotoField } from '../media/form';
import type { EligibilityCheck } from './eligibility';

export const ENTRY_PHOTOS_MIN = 1;
export const ENTRY_PHOTOS_MAX = 6;
export const STATEMENT_MAX = 3000;
export const ENTRY_PHOTOS_FIELD = 'photos';
export const FRONT_VIEW_LABEL = 'Whole tank, from the front';

export const contestEntryFieldsSchema = z.object({
	categoryId: z.coerce.number({ message: 'Choose a category.' }).int().positive('Choose a category.'),
	tankId: z.coerce.number({ message: 'Choose one of your tanks.' }).int().positive('Choose one of your tanks.'),
	statement: z
		.string()
		.trim()
		.min(1, 'Tell the judges about the layout in a few sentences.')
		.max(STATEMENT_MAX, `Keep the statement to ${STATEMENT_MAX} characters.`)
});

export type ContestEntryFields = z.infer<typeof contestEntryFieldsSchema>;

/** What an entry is saved from: the fields and the photos in their order. */
export interface ContestEntryInput extends ContestEntryFields {
	photos: PhotoField[];
}

/** The form's text fields as typed, to show again. */
export interface ContestEntryDraft {
	categoryId: string;
	tankId: string;
	statement: string;
}

export const contestEntryDraftOf = (data: FormData): ContestEntryDraft => ({
	categoryId: String(data.get('categoryId') ?? ''),
	tankId: String(data.get('tankId') ?? ''),
	statement: String(data.get('statement') ?? '')
});

/** The photos the form names, in order, or none when they cannot be read (to show again). */
export function contestEntryPhotosOf(data: FormData): PhotoField[] {
	const read = readPhotoFields(data, ENTRY_PHOTOS_FIELD, ENTRY_PHOTOS_MAX);
	return read.ok ? read.photos : [];
}

/** Reads the entry form, or throws the refusal that puts each message at its field. */
export function readContestEntryForm(data: FormData): ContestEntryInput {
	const parsed = contestEntryFieldsSchema.safeParse(contestEntryDraftOf(data));
	const photos = readPhotoFields(data, ENTRY_PHOTOS_FIELD, ENTRY_PHOTOS_MAX);
	const errors = parsed.success ? {} : fieldErrorsOf(parsed.error);
	if (!photos.ok) errors.photos = photos.error;
	else if (photos.photos.length < ENTRY_PHOTOS_MIN) errors.photos = 'Add at least one photo: the first shows the whole tank from the front.';
	if (!parsed.success || !photos.ok || errors.photos) throw invalid(errors);
	return { ...parsed.data, photos: photos.photos };
}

/** One of the member's tanks as the entry form offers it. */
export interface EntryTankChoice {
	id: number;
	name: string;
	thumb: string | null;
	/** Rounded as the tank's page shows it. */
	litres: number | null;
	/** The volume in the member's units, as shown. */
	volume: string | null;
	volumeSource: 'measured' | 'estimated' | null;
	ageLabel: string | null;
	retired: boolean;
	/** What each category (by id) says of the tank. */
	eligibility: Record<number, EligibilityCheck>;
	/** The member's entry in this contest that already holds this tank. */
	enteredAs: number | null;
}

/** A category as the entry form lists it. */
export interface EntryCategoryChoice {
	id: number;
	name: string;
	description: string;
	/** The eligibility rule in words. */
	rule: string;
}
