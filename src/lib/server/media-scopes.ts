// Which feature decides who may see the photos of each media scope. Media knows no feature, so
// the features register with it here, once, before anything is served or written: the app's
// hooks, the seed and the tests (integration setup, e2e fixtures) call registerMediaScopes() first. A feature with
// photos adds its own photo-access module and one line below.
import { registerPhotoAccess as journals } from './journals/photo-access';
import { registerPhotoAccess as swaps } from './swaps/photo-access';
import { registerPhotoAccess as contests } from './contests/photo-access';

/** Registers every feature's photo scopes with media (tank, entry, listing, contest-entry). Calling it again does nothing. */
export function registerMediaScopes(): void {
	journals();
	swaps();
	contests();
}
