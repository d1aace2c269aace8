// What a member asks in return. Nothing is paid through Riparia: a token price changes hands in
// person at the pickup.

export const LISTING_TERMS = ['free', 'swap', 'token'] as const;
export type ListingTerms = (typeof LISTING_TERMS)[number];

export const TERMS_LABELS: Readonly<Record<ListingTerms, string>> = {
	free: 'Free',
	swap: 'Swap for something',
	token: 'Small price, paid in person'
};

export const TERMS_NOTE_MAX = 160;

/** What the note field asks for under each choice. */
export const TERMS_NOTE_HINTS: Readonly<Record<ListingTerms, string>> = {
	free: 'Optional, e.g. “bring a bag with some tank water”.',
	swap: 'What you would like in return, e.g. “any carpeting plant or a few snails”.',
	token: 'The price and what it covers, with its currency, e.g. “the price of a coffee, to cover the bags”. Paid at the pickup; never through the site.'
};

/** Checks the terms and their note; returns a message for the form, or null when fine. */
export function checkTerms(terms: string, note: string): string | null {
	if (!LISTING_TERMS.includes(terms as ListingTerms)) return 'Choose what you ask in return.';
	if (note.length > TERMS_NOTE_MAX) return `Keep this to ${TERMS_NOTE_MAX} characters.`;
	if (terms === 'swap' && note.trim() === '') return 'Say what you would like in return.';
	if (terms === 'token' && note.trim() === '') return 'Give the price you ask, to be paid in person.';
	return null;
}

/** "Free", "Swap for: any moss", "Small price, paid in person: 2 for the lot". */
export function describeTerms(terms: ListingTerms, note: string): string {
	const n = note.trim();
	if (terms === 'free') return n ? `Free (${n})` : 'Free';
	if (terms === 'swap') return n ? `Swap for: ${n}` : 'Swap for something';
	return n ? `Small price, paid in person: ${n}` : TERMS_LABELS.token;
}
