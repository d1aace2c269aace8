// Who may see an attached photo follows what owns it, and only the owning feature knows that.
// Media knows no feature: each feature registers its scopes here at start-up (see
// ../media-scopes.ts, which the app, the seed and the tests call before anything else), e.g.
//
//   media.registerScope('listing', { audienceFor: (viewer, listingId, context) => … });
//
// and then passes its scope name to media.setPhotos / listFor / deleteFor. A check answers
// 'public' (anyone; may be kept by shared caches), 'restricted' (this viewer only; private
// caching) or null (not visible: the photo answers 404).
import type { Context } from '../context';
import type { MediaRow } from './schema';

/** The name a feature gives the things its photos belong to ('tank', 'listing', …). */
export type MediaScope = string;

export type MediaAudience = 'public' | 'restricted';

/** Who is asking, as the app resolved them (`locals.user`); media itself needs only the id. */
export interface MediaViewer {
	id: string;
	role: string;
}

export interface ScopeAccess {
	/** Who may see the photos of one thing of this scope. */
	audienceFor(viewer: MediaViewer | null, scopeId: number, context?: Context): Promise<MediaAudience | null>;
}

const scopes = new Map<MediaScope, ScopeAccess>();

/** Registers the visibility check of a scope. Registering the same check again does nothing; another feature's claim on a taken scope is a mistake. */
export function registerScope(scope: MediaScope, access: ScopeAccess): void {
	const known = scopes.get(scope);
	if (known && known !== access) throw new Error(`The photo scope '${scope}' is registered twice.`);
	scopes.set(scope, access);
}

/** For writes: a photo attached to a scope nobody registered could never be seen again. */
export function requireScope(scope: MediaScope): void {
	if (!scopes.has(scope))
		throw new Error(`The photo scope '${scope}' is not registered: call registerMediaScopes() (src/lib/server/media-scopes.ts) at start-up.`);
}

/**
 * Whether `viewer` may see this photo, and how it may be cached. A pending upload is its owner's
 * alone; a photo whose scope has no registered check is seen by nobody.
 */
export async function audienceFor(
	viewer: MediaViewer | null,
	row: Pick<MediaRow, 'ownerId' | 'scope' | 'scopeId'>,
	context: Context = {}
): Promise<MediaAudience | null> {
	if (row.scope === null || row.scopeId === null) return viewer?.id === row.ownerId ? 'restricted' : null;
	const access = scopes.get(row.scope);
	return access ? access.audienceFor(viewer, row.scopeId, context) : null;
}
