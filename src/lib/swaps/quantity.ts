// How much is on offer, in a unit that fits what it is: plants come as stems, portions, pots or a
// piece of mat; animals are counted one by one; stones, wood and equipment by the piece.

import type { ListingCategory } from './listing';

export const QUANTITY_UNITS = ['stems', 'portions', 'pots', 'mat-cm2', 'individuals', 'pieces'] as const;
export type QuantityUnit = (typeof QUANTITY_UNITS)[number];

export interface UnitInfo {
	/** Singular and plural, as in "1 stem" and "12 stems". */
	one: string;
	many: string;
	/** Categories the unit fits, with what it is for. */
	categories: readonly ListingCategory[];
	hint: string;
	/** Largest amount one listing may offer (our choice, no source: it catches typing slips). */
	max: number;
}

export const UNITS: Readonly<Record<QuantityUnit, UnitInfo>> = {
	stems: { one: 'stem', many: 'stems', categories: ['plants'], hint: 'Stem plants, counted as cuttings.', max: 500 },
	portions: {
		one: 'portion',
		many: 'portions',
		categories: ['plants', 'livestock'],
		hint: 'A handful of moss or floating plants, or a starter of a live-food culture.',
		max: 50
	},
	pots: { one: 'pot', many: 'pots', categories: ['plants'], hint: 'Potted plants or cups of tissue-culture plants.', max: 100 },
	'mat-cm2': { one: 'cm² of mat', many: 'cm² of mat', categories: ['plants'], hint: 'Carpeting plants or moss grown as a mat, by area.', max: 10_000 },
	individuals: { one: 'animal', many: 'animals', categories: ['livestock'], hint: 'Fish, shrimp or snails, counted one by one.', max: 200 },
	pieces: {
		one: 'piece',
		many: 'pieces',
		categories: ['plants', 'hardscape', 'equipment'],
		hint: 'Plants on wood or stone and rhizome sections; stones and wood; equipment items.',
		max: 100
	}
};

/** The units offered for a category, in display order. */
export function unitsFor(category: ListingCategory): QuantityUnit[] {
	return QUANTITY_UNITS.filter((u) => UNITS[u].categories.includes(category));
}

export interface Quantity {
	amount: number;
	unit: QuantityUnit;
}

/** Checks a quantity for a listing; returns a message for the form, or null when fine. */
export function checkQuantity(category: ListingCategory, quantity: { amount: number; unit: string }): string | null {
	const unit = quantity.unit as QuantityUnit;
	if (!QUANTITY_UNITS.includes(unit)) return 'Choose a unit.';
	const info = UNITS[unit];
	if (!info.categories.includes(category)) {
		const fits = unitsFor(category).map((u) => UNITS[u].many);
		const choices = fits.length > 1 ? `${fits.slice(0, -1).join(', ')} or ${fits[fits.length - 1]}` : fits.join('');
		return `"${info.many}" does not fit ${category}; choose ${choices}.`;
	}
	if (!Number.isInteger(quantity.amount)) return 'Enter a whole number.';
	if (quantity.amount < 1) return 'Enter at least 1.';
	if (quantity.amount > info.max) return `Enter at most ${info.max.toLocaleString('en-GB')} ${info.many} in one listing.`;
	return null;
}

/** "1 stem", "12 stems", "400 cm² of mat", "1,200 cm² of mat". */
export function formatQuantity(quantity: Quantity): string {
	const info = UNITS[quantity.unit];
	return `${quantity.amount.toLocaleString('en-GB')} ${quantity.amount === 1 ? info.one : info.many}`;
}
