// Who may see a swap listing's photos (media scope 'listing'): whoever may see the listing; the
// check itself is listings.photoAudience. Registered with media by ../media-scopes.ts.
import * as media from '../media';
import { photoAudience } from './listings';

const listingPhotos: media.ScopeAccess = { audienceFor: photoAudience };

/** Tells media who may see listing photos; ../media-scopes.ts calls it at start-up. */
export function registerPhotoAccess(): void {
	media.registerScope('listing', listingPhotos);
}
