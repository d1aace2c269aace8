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
export function defaultAvailableUntil(
	category: ListingCategory,
	from: Date,
	days: Partial<Record<ListingCategory, number>> = {}
): Date {
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
 * Cautions to show with a listing (the usual ones; local rules on keeping, moving and selling
 * plants and animals come first).
 */
export const CATEGORY_CAUTIONS: Readonly<Partial<Record<ListingCategory, string>>> = {
	plants:
		'Never release plants, trimmings or tank water into the wild. Some aquarium plants are restricted or banned where you live: check the local list before you swap.',
	livestock:
		'Carry animals in enough water with room to breathe, keep them out of heat and cold, and settle them in slowly. Never release animals or tank water into the wild, and follow local rules on keeping and moving animals.'
};
