// Who may see an attached photo follows what owns it. Each scope maps to a check the owning
// feature provides: it answers 'public' (anyone; may be cached by shared caches), 'restricted'
// (this viewer only; private caching) or null (not visible: the photo answers 404).
//
// A feature that owns photos adds ONE entry here, e.g.
//   listing: swaps.photoAudience,
// and then passes its scope name to media.attach / setPhotos / listFor / deleteFor.
import type { Viewer } from '../club/users';
import * as tanks from '../journals/tanks';
import * as entries from '../journals/entries';
import * as listings from '../swaps/listings';
import * as contestEntries from '../contests/contest-entries';
import type { MediaRow } from './schema';

export type MediaAudience = 'public' | 'restricted';
export type ScopeCheck = (viewer: Viewer | null, scopeId: number) => Promise<MediaAudience | null>;

const scopes = {
	tank: tanks.photoAudience,
	entry: entries.photoAudience,
	listing: listings.photoAudience,
	'contest-entry': contestEntries.photoAudience
} satisfies Record<string, ScopeCheck>;

export type MediaScope = keyof typeof scopes;

export const isMediaScope = (value: string): value is MediaScope => Object.hasOwn(scopes, value);

/**
 * Whether `viewer` may see this photo, and how it may be cached. A pending upload is its owner's
 * alone; a photo whose scope has no registered check is seen by nobody.
 */
export async function audienceFor(viewer: Viewer | null, row: Pick<MediaRow, 'ownerId' | 'scope' | 'scopeId'>): Promise<MediaAudience | null> {
	if (row.scope === null || row.scopeId === null) return viewer?.id === row.ownerId ? 'restricted' : null;
	if (!isMediaScope(row.scope)) return null;
	return scopes[row.scope](viewer, row.scopeId);
}
