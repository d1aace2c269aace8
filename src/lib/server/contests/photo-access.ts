// Who may see a contest entry's photos at /media/<id> (media scope 'contest-entry'); the check
// itself is contest-entries.photoAudience. Registered with media by ../media-scopes.ts.
import * as media from '../media';
import { photoAudience, SCOPE } from './contest-entries';

const entryPhotos: media.ScopeAccess = { audienceFor: photoAudience };

/** Tells media who may see contest entry photos; ../media-scopes.ts calls it at start-up. */
export function registerPhotoAccess(): void {
	media.registerScope(SCOPE, entryPhotos);
}
