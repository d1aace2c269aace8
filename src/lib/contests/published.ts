// The published results as they are kept: computed once at publication and again at each
// correction (one record per contest and results revision), then served as stored. Names and
// photos are not part of the record; they are looked up when the results are shown.

export interface PublishedEntry {
	entryId: number;
	number: number | null;
	categoryId: number;
	entrantId: string;
	place: number | null;
	placeRaw: number | null;
	placeStandardised: number | null;
	sharedWith: number;
	tieBrokenBy: string | null;
	score: number | null;
	standardised: number | null;
	cardCount: number;
	method: string;
	methodNote: string | null;
	criteria: { id: string; label: string; maxPoints: number; value: number | null }[];
	/** The judges' overall comments meant for the entrant (never the notes for the panel). */
	comments: string[];
	litres: number | null;
	ageWeeks: number | null;
	/** The entered tank (records kept before this was added lack it). */
	tankId?: number | null;
}

export interface PublishedCategory {
	id: number;
	name: string;
	description: string;
	unevenPanel: boolean;
	entries: PublishedEntry[];
}

export interface PublishedResults {
	categories: PublishedCategory[];
	/** The judges on the panel, in the order shown (by name at publication). */
	panelIds: string[];
	unevenPanel: boolean;
}
