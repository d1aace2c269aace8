// Who may see a swap listing's photos (media scope 'listing'): whoever may see the listing.
// Registered with media by ../media-scopes.ts.
import { eq } from 'drizzle-orm';
import * as media from '../media';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import { listings } from './schema';
import { canView } from './listings';

/** The listing's own visibility; never cached by shared caches (members only). */
async function listingPhotoAudience(viewer: Viewer | null, listingId: number, context: Context = {}): Promise<media.MediaAudience | null> {
	const { db } = resolve(context);
	const [row] = await db.select().from(listings).where(eq(listings.id, listingId));
	if (!row || !canView(viewer, row)) return null;
	return 'restricted';
}

const listingPhotos: media.ScopeAccess = { audienceFor: listingPhotoAudience };

/** Tells media who may see listing photos; ../media-scopes.ts calls it at start-up. */
export function registerPhotoAccess(): void {
	media.registerScope('listing', listingPhotos);
}
