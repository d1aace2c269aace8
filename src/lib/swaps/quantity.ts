// How much is on offer, in a unit that fits what it is: plants come in the units their way of
// growing allows (stems of a stem plant, pieces of a rhizome, bulbs, portions or a piece of mat of
// a carpet or a moss, cups of floating plants); animals are counted one by one; stones, wood and
// equipment by the piece.

import { GROWTH_HABIT_NOUNS, type GrowthHabit } from '../species/kinds';
import type { ListingCategory } from './listing';

export const QUANTITY_UNITS = ['stems', 'plants', 'rhizome-pieces', 'bulbs', 'portions', 'cups', 'pots', 'mat-cm2', 'individuals', 'pieces'] as const;
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
	plants: {
		one: 'plant',
		many: 'plants',
		categories: ['plants'],
		hint: 'Whole plants with their roots, such as rosettes or a divided rhizome plant.',
		max: 200
	},
	'rhizome-pieces': {
		one: 'rhizome piece',
		many: 'rhizome pieces',
		categories: ['plants'],
		hint: 'Sections of rhizome with a few leaves each, as ferns and rhizome plants are divided.',
		max: 200
	},
	bulbs: { one: 'bulb or tuber', many: 'bulbs or tubers', categories: ['plants'], hint: 'Bulbs or tubers, counted one by one.', max: 200 },
	portions: {
		one: 'portion',
		many: 'portions',
		categories: ['plants', 'livestock'],
		hint: 'A handful of moss, carpet or floating plants, or a starter of a live-food culture.',
		max: 50
	},
	cups: { one: 'cup', many: 'cups', categories: ['plants'], hint: 'Floating plants by the cupful, scooped loosely.', max: 50 },
	pots: { one: 'pot', many: 'pots', categories: ['plants'], hint: 'Potted plants or cups of tissue-culture plants.', max: 100 },
	'mat-cm2': { one: 'cm² of mat', many: 'cm² of mat', categories: ['plants'], hint: 'Carpeting plants or moss grown as a mat, by area.', max: 10_000 },
	individuals: { one: 'animal', many: 'animals', categories: ['livestock'], hint: 'Fish, shrimp or snails, counted one by one.', max: 200 },
	pieces: {
		one: 'piece',
		many: 'pieces',
		categories: ['plants', 'hardscape', 'equipment'],
		hint: 'Plants grown on wood or stone, by the piece; stones and wood; equipment items.',
		max: 100
	}
};

/**
 * The units that fit each way a plant grows, the usual one first (our choice of words for how
 * keepers pass such plants on; common practice, no source).
 */
export const PLANT_UNITS: Readonly<Record<GrowthHabit, readonly QuantityUnit[]>> = {
	stem: ['stems', 'pots'],
	rosette: ['plants', 'pots'],
	rhizome: ['rhizome-pieces', 'plants', 'pieces', 'pots'],
	moss: ['portions', 'mat-cm2', 'pieces'],
	carpeting: ['portions', 'mat-cm2', 'pots'],
	floating: ['portions', 'cups'],
	bulb: ['bulbs', 'plants', 'pots']
};

/** Plants of no known way of growing (a name the catalogue does not have): every plant unit, whole plants first. */
const ANY_PLANT: readonly QuantityUnit[] = ['plants', ...QUANTITY_UNITS.filter((u) => u !== 'plants' && UNITS[u].categories.includes('plants'))];

/** The units offered for a category (and, for plants, the way the plant grows when known), the default first. */
export function unitsFor(category: ListingCategory, habit: GrowthHabit | null = null): QuantityUnit[] {
	if (category === 'plants') return [...(habit ? PLANT_UNITS[habit] : ANY_PLANT)];
	return QUANTITY_UNITS.filter((u) => UNITS[u].categories.includes(category));
}

/** The unit the form starts with, or keeps when it still fits. */
export function unitFitting(category: ListingCategory, habit: GrowthHabit | null, current: string): QuantityUnit {
	const fits = unitsFor(category, habit);
	return fits.find((u) => u === current) ?? fits[0]!;
}

export interface Quantity {
	amount: number;
	unit: QuantityUnit;
}

const choiceOf = (units: readonly QuantityUnit[]) => {
	const names = units.map((u) => UNITS[u].many);
	return names.length > 1 ? `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}` : names.join('');
};

/** Checks a quantity for a listing (a plant's unit against the way it grows, when known); returns a message for the form, or null when fine. */
export function checkQuantity(category: ListingCategory, quantity: { amount: number; unit: string }, habit: GrowthHabit | null = null): string | null {
	const unit = quantity.unit as QuantityUnit;
	if (!QUANTITY_UNITS.includes(unit)) return 'Choose a unit.';
	const info = UNITS[unit];
	if (!info.categories.includes(category)) return `"${info.many}" does not fit ${category}; choose ${choiceOf(unitsFor(category))}.`;
	const fits = unitsFor(category, habit);
	if (!fits.includes(unit)) return `"${info.many}" does not fit ${GROWTH_HABIT_NOUNS[habit!]}; choose ${choiceOf(fits)}.`;
	if (!Number.isInteger(quantity.amount)) return 'Enter a whole number.';
	if (quantity.amount < 1) return 'Enter at least 1.';
	if (quantity.amount > info.max) return `Enter at most ${info.max.toLocaleString('en-GB')} ${info.many} in one listing.`;
	return null;
}

/** The form field a message of checkQuantity belongs to. */
export const quantityFieldOf = (problem: string): 'unit' | 'amount' => (problem.startsWith('"') || problem === 'Choose a unit.' ? 'unit' : 'amount');

/** "1 stem", "12 stems", "400 cm² of mat", "1,200 cm² of mat". */
export function formatQuantity(quantity: Quantity): string {
	const info = UNITS[quantity.unit];
	return `${quantity.amount.toLocaleString('en-GB')} ${quantity.amount === 1 ? info.one : info.many}`;
}
