// Names and titles members give things, shown to others: characters that reorder or hide text are
// refused (a right-to-left override can make "gpj.exe" read as "exe.jpg"), and text is kept in
// its composed form (NFC), so a name typed with combining accents is the same as one typed with
// precomposed letters. Bidirectional controls from Unicode Standard Annex #9 (explicit
// embeddings, overrides and isolates, and the implicit marks).
const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069\u200E\u200F\u061C]/u;
/** Marks, format characters (zero-width joiners and the like) and spaces: nothing to read on its own. */
const NOTHING_TO_READ = /^[\p{M}\p{Cf}\p{Z}\s]*$/u;

/** A field message for a name or title, or null when it may be shown as it is. */
export function nameProblem(value: string): string | null {
	if (BIDI_CONTROLS.test(value)) return 'Remove the hidden characters that change the direction of the text.';
	if (value && NOTHING_TO_READ.test(value)) return 'Use letters or numbers, not only invisible characters.';
	return null;
}

/** The composed (NFC) form, trimmed. */
export const composed = (value: string) => value.normalize('NFC').trim();
