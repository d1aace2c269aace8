// The listing form: what the member typed (kept as text, so a failed save shows it again) and
// the checked input the server saves.
import { composed, nameProblem } from '../text';
import {
	checkAvailableUntil,
	DAY_MS,
	defaultAvailableUntil,
	LISTING_CATEGORIES,
	LISTING_KINDS,
	MAX_AVAILABLE_DAYS,
	type ListingCategory,
	type ListingKind
} from './listing';
import { dayOf } from '$lib/dates';
import { checkQuantity, quantityFieldOf, unitsFor, type Quantity } from './quantity';
import { checkTerms, type ListingTerms } from './terms';

export const TITLE_MAX = 120;
export const CONDITION_MAX = 500;
export const DESCRIPTION_MAX = 5000;
export const LISTING_PHOTOS_MAX = 6;

/** Categories whose listings name a plant or an animal from the catalogue (or in free text). */
export const hasSpecies = (category: ListingCategory) => category === 'plants' || category === 'livestock';
/** The catalogue kind the species picker searches for a category. */
export const speciesKindFor = (category: ListingCategory) => (category === 'plants' ? 'plant' : 'animal');

export interface ListingDraft {
	kind: string;
	category: string;
	title: string;
	speciesId: string;
	speciesName: string;
	amount: string;
	unit: string;
	condition: string;
	description: string;
	terms: string;
	termsNote: string;
	pickupAreaId: string;
	availableUntil: string;
	tankId: string;
	/** How the picked plant grows, so the form offers its units; the server looks it up again itself. */
	speciesHabit: string;
}

export interface ListingInput {
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesId: number | null;
	speciesName: string;
	quantity: Quantity;
	condition: string;
	description: string;
	terms: ListingTerms;
	termsNote: string;
	pickupAreaId: number | null;
	availableUntil: Date;
	tankId: number | null;
}

const FIELDS: (keyof ListingDraft)[] = [
	'kind',
	'category',
	'title',
	'speciesId',
	'speciesName',
	'amount',
	'unit',
	'condition',
	'description',
	'terms',
	'termsNote',
	'pickupAreaId',
	'availableUntil',
	'tankId',
	'speciesHabit'
];

export function draftFromForm(form: FormData): ListingDraft {
	return Object.fromEntries(FIELDS.map((f) => [f, String(form.get(f) ?? '')])) as unknown as ListingDraft;
}

export function emptyDraft(category: ListingCategory, now: Date, pickupAreaId: number | null): ListingDraft {
	return {
		kind: 'offer',
		category,
		title: '',
		speciesId: '',
		speciesName: '',
		amount: '1',
		unit: unitsFor(category)[0]!,
		condition: '',
		description: '',
		terms: 'free',
		termsNote: '',
		pickupAreaId: pickupAreaId === null ? '' : String(pickupAreaId),
		availableUntil: dayOf(defaultAvailableUntil(category, now)),
		tankId: '',
		speciesHabit: ''
	};
}

/**
 * "Available until" a chosen day means to the end of that day (UTC), but never past the longest
 * allowed, so choosing the last allowed day works whatever the time now.
 */
export function untilEndOf(day: string, now: Date): Date | null {
	const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
	if (!m) return null;
	const start = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
	if (dayOf(new Date(start)) !== day) return null;
	return new Date(Math.min(start + DAY_MS - 1, now.getTime() + MAX_AVAILABLE_DAYS * DAY_MS));
}

const optionalId = (text: string): number | null | 'bad' => {
	const t = text.trim();
	if (t === '') return null;
	return /^\d{1,12}$/.test(t) && Number(t) > 0 ? Number(t) : 'bad';
};

export type ParsedListing = { ok: true; input: ListingInput } | { ok: false; errors: Record<string, string> };

export function parseListingDraft(d: ListingDraft, now: Date): ParsedListing {
	const errors: Record<string, string> = {};
	const kind = LISTING_KINDS.find((k) => k === d.kind);
	if (!kind) errors.kind = 'Choose an offer or a wanted post.';
	const category = LISTING_CATEGORIES.find((c) => c === d.category);
	if (!category) errors.category = 'Choose a category.';
	const title = composed(d.title).replace(/\s+/g, ' ');
	if (title.length < 3) errors.title = 'Give the listing a title of at least 3 characters.';
	else if (title.length > TITLE_MAX) errors.title = `Keep the title to ${TITLE_MAX} characters.`;
	else if (nameProblem(title)) errors.title = nameProblem(title)!;

	const withSpecies = category ? hasSpecies(category) : false;
	const speciesId = withSpecies ? optionalId(d.speciesId) : null;
	const speciesName = withSpecies ? d.speciesName.trim().replace(/\s+/g, ' ') : '';
	if (speciesId === 'bad') errors.speciesName = 'Pick the species again from the list, or type its name.';
	if (speciesName.length > 160) errors.speciesName = 'Keep the name to 160 characters.';

	const amountText = d.amount.trim();
	const amount = /^\d+$/.test(amountText) ? Number(amountText) : Number.NaN;
	if (category) {
		const problem = checkQuantity(category, { amount, unit: d.unit });
		if (problem) errors[quantityFieldOf(problem)] = problem;
	}

	const condition = d.condition.trim();
	if (condition.length > CONDITION_MAX) errors.condition = `Keep the notes to ${CONDITION_MAX} characters.`;
	const description = d.description.trim();
	if (description.length > DESCRIPTION_MAX) errors.description = `Keep the description to ${DESCRIPTION_MAX} characters.`;

	const termsNote = d.termsNote.trim();
	const termsProblem = checkTerms(d.terms, termsNote);
	if (termsProblem) errors[termsProblem === 'Choose what you ask in return.' ? 'terms' : 'termsNote'] = termsProblem;

	const pickupAreaId = optionalId(d.pickupAreaId);
	if (pickupAreaId === 'bad') errors.pickupAreaId = 'Choose one of the club areas.';

	const until = untilEndOf(d.availableUntil.trim(), now);
	if (until === null) errors.availableUntil = 'Give the day as YYYY-MM-DD.';
	else {
		const problem = checkAvailableUntil(until, now);
		if (problem) errors.availableUntil = problem;
	}

	const tankId = kind === 'offer' ? optionalId(d.tankId) : null;
	if (tankId === 'bad') errors.tankId = 'Choose one of your tanks.';

	if (Object.keys(errors).length > 0) return { ok: false, errors };
	return {
		ok: true,
		input: {
			kind: kind!,
			category: category!,
			title,
			speciesId: speciesId as number | null,
			speciesName,
			quantity: { amount, unit: d.unit as Quantity['unit'] },
			condition,
			description,
			terms: d.terms as ListingTerms,
			termsNote,
			pickupAreaId: pickupAreaId as number | null,
			availableUntil: until!,
			tankId: tankId as number | null
		}
	};
}
