// The club's restricted species list: entries from published lists of invasive species (or the
// club's own rules), each for one jurisdiction. The club picks the jurisdictions it is in; only
// their entries apply. A banned species cannot be offered or asked for; a cautioned one can, with
// a warning shown to both members on the listing and in the conversation.
import { formatDate } from '../format';

export const RESTRICTION_LEVELS = ['banned', 'cautioned'] as const;
export type RestrictionLevel = (typeof RESTRICTION_LEVELS)[number];

export const RESTRICTION_LEVEL_LABELS: Readonly<Record<RestrictionLevel, string>> = {
	banned: 'Not allowed on the board',
	cautioned: 'Allowed, with a warning'
};

/** How the entry was last checked: against the published list, or written from memory. */
export const CHECK_BASES = ['source', 'memory'] as const;
export type CheckBasis = (typeof CHECK_BASES)[number];

export interface Restriction {
	id: number;
	speciesId: number;
	scientificName: string;
	commonName: string;
	jurisdiction: string;
	level: RestrictionLevel;
	/** The list the entry comes from, e.g. "Commission Implementing Regulation (EU) 2016/1141". */
	source: string;
	/** Why, in the club's words: what the rule says and what members should do. */
	note: string;
	/** YYYY-MM-DD */
	checkedOn: string;
	checkBasis: CheckBasis;
}

export interface Assessment {
	banned: Restriction[];
	cautioned: Restriction[];
}

/** The entries that apply in the club's jurisdictions, split by level. */
export function assess(entries: readonly Restriction[], jurisdictions: readonly string[]): Assessment {
	const applying = entries.filter((e) => jurisdictions.includes(e.jurisdiction));
	return { banned: applying.filter((e) => e.level === 'banned'), cautioned: applying.filter((e) => e.level === 'cautioned') };
}

const name = (e: Restriction) => (e.commonName ? `${e.scientificName} (${e.commonName})` : e.scientificName);

/** Why a listing is refused. */
export function refusalMessage(e: Restriction): string {
	return `${name(e)} cannot be offered or asked for on the board: it is banned in ${e.jurisdiction} (${e.source}).${e.note ? ' ' + e.note : ''}`;
}

/** The warning shown with an allowed but cautioned species. */
export function warningMessage(e: Restriction): string {
	return `${name(e)} is restricted in ${e.jurisdiction} (${e.source}).${e.note ? ' ' + e.note : ''}`;
}

/**
 * What members see beside an entry: "last checked 1 Dec 2026". How it was checked is provenance,
 * which the sources note (/sources#restricted) explains; the admins' list shows each entry's basis.
 */
export function checkedLabel(e: Pick<Restriction, 'checkedOn'>): string {
	return `last checked ${formatDate(e.checkedOn)}`;
}

/** The basis of a check, in words for the admins' list. */
export const CHECK_BASIS_LABELS: Readonly<Record<CheckBasis, string>> = {
	source: 'against the published list',
	memory: 'not yet against the published list'
};

/** The distinct jurisdictions of a list, in alphabetical order, for the club's setting. */
export function jurisdictionsOf(entries: readonly Pick<Restriction, 'jurisdiction'>[]): string[] {
	return [...new Set(entries.map((e) => e.jurisdiction))].sort((a, b) => a.localeCompare(b, 'en'));
}
