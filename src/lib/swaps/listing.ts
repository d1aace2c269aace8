// What a swap-board listing is: an offer of something, or a post asking for something, in one of
// four categories, available until a date.

export const LISTING_KINDS = ['offer', 'wanted'] as const;
export type ListingKind = (typeof LISTING_KINDS)[number];

export const LISTING_CATEGORIES = ['plants', 'livestock', 'hardscape', 'equipment'] as const;
export type ListingCategory = (typeof LISTING_CATEGORIES)[number];

export const DAY_MS = 86_400_000;

/**
 * Default days a new listing stays available. Plants: 7, since cuttings do not keep well out of
 * the tank (common practice, no source). The others are our choice, no source: livestock 14 (long
 * enough to arrange a pickup, short enough that the offer still stands), hardscape and equipment
 * 30 (they keep).
 */
export const DEFAULT_AVAILABLE_DAYS: Readonly<Record<ListingCategory, number>> = {
	plants: 7,
	livestock: 14,
	hardscape: 30,
	equipment: 30
};

/** The longest a listing may be made available for at once (our choice): stale posts mislead. */
export const MAX_AVAILABLE_DAYS = 90;

/** `from` plus the category's default days (or the club's own, via `days`). */
export function defaultAvailableUntil(category: ListingCategory, from: Date, days: Partial<Record<ListingCategory, number>> = {}): Date {
	const n = days[category] ?? DEFAULT_AVAILABLE_DAYS[category];
	if (!(n > 0) || n > MAX_AVAILABLE_DAYS) throw new RangeError(`Listings stay available for 1 to ${MAX_AVAILABLE_DAYS} days.`);
	return new Date(from.getTime() + n * DAY_MS);
}

/** Checks a date chosen by a member for "available until". Returns a message, or null when fine. */
export function checkAvailableUntil(until: Date, now: Date): string | null {
	if (Number.isNaN(until.getTime())) return 'Choose a date.';
	if (until.getTime() <= now.getTime()) return 'Choose a date in the future.';
	if (until.getTime() > now.getTime() + MAX_AVAILABLE_DAYS * DAY_MS) return `Choose a date at most ${MAX_AVAILABLE_DAYS} days from now.`;
	return null;
}

/**
 * The usual cautions shown with every listing of a category, to both sides (on the listing and in
 * its conversation). Common practice of the hobby, no single source; local rules on keeping,
 * moving, selling and releasing plants and animals come first, and licensed practice for
 * electrical and gas equipment.
 */
export const CATEGORY_CAUTIONS: Readonly<Record<ListingCategory, readonly string[]>> = {
	plants: [
		'Never release plants, trimmings or tank water into ponds, rivers or drains, and never plant them outdoors.',
		'Dry out unwanted trimmings and put them in the bin, not down the sink.',
		'Rinse new plants, or dip them, before they go in your tank: snails, their eggs and other pests travel on leaves and roots.',
		'Some aquarium plants are restricted or banned where you live. Check the local rules, which take precedence over anything here.'
	],
	livestock: [
		'Carry animals in insulated bags or a cool box, with enough water and air, out of heat and cold; keep the journey short.',
		'Settle them in slowly: float the bag, then add tank water little by little before moving them across.',
		'Never release animals, plants or tank water into ponds, rivers or drains.',
		'Rules on keeping, moving and passing on animals differ from place to place. Check the local rules, which take precedence.'
	],
	hardscape: [
		'Scrub and rinse stones and wood before use; some stones raise the hardness of the water, so test a piece in a bucket first.',
		'Stones and wood from someone else’s tank can carry snails and algae: rinse them well.'
	],
	equipment: [
		'Check mains equipment before use: no cracked casings, cut cables or damaged seals. Use a residual-current device (RCD/GFCI) and drip loops, and leave repairs to a qualified electrician.',
		'A second-hand CO2 cylinder or regulator must be inspected and, where required, retested by a licensed supplier before it is filled again; keep cylinders upright and secured.',
		'A filled tank weighs about 1 kg per litre of water plus the glass and substrate: carry tanks empty and check the floor and stand.'
	]
};

/** Shown beside the pickup arrangement in every conversation (common practice, no source). */
export const PICKUP_CAUTION =
	'Meet somewhere public, such as a library, a café or a club meeting, in daylight. You never need to give your home address; tell someone where you are going.';
