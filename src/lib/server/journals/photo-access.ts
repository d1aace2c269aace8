// Who may see the journal's photos: a tank's cover (scope 'tank') and an entry's photos (scope
// 'entry') follow the tank's visibility. Registered with media by ../media-scopes.ts.
import { eq } from 'drizzle-orm';
import * as media from '../media';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import { journalEntries, tanks as tankTable } from './schema';
import { canView } from './tanks';

/** Scope 'tank': the tank's own visibility; public tanks' photos may be cached by anyone. */
async function tankPhotoAudience(viewer: Viewer | null, tankId: number, context: Context = {}): Promise<media.MediaAudience | null> {
	const { db } = resolve(context);
	const [found] = await db.select({ ownerId: tankTable.ownerId, visibility: tankTable.visibility }).from(tankTable).where(eq(tankTable.id, tankId)).limit(1);
	if (!found || !canView(viewer, found)) return null;
	return found.visibility === 'public' ? 'public' : 'restricted';
}

/** Scope 'entry': the visibility of the entry's tank; besides, its author (a member who looked in while the keeper was away). */
async function entryPhotoAudience(viewer: Viewer | null, entryId: number, context: Context = {}): Promise<media.MediaAudience | null> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ tankId: journalEntries.tankId, authorId: journalEntries.authorId })
		.from(journalEntries)
		.where(eq(journalEntries.id, entryId));
	if (!row) return null;
	const audience = await tankPhotoAudience(viewer, row.tankId, context);
	return audience ?? (viewer !== null && viewer.id === row.authorId ? 'restricted' : null);
}

const tankPhotos: media.ScopeAccess = { audienceFor: tankPhotoAudience };
const entryPhotos: media.ScopeAccess = { audienceFor: entryPhotoAudience };

/** Tells media who may see the journal's photos; ../media-scopes.ts calls it at start-up. */
export function registerPhotoAccess(): void {
	media.registerScope('tank', tankPhotos);
	media.registerScope('entry', entryPhotos);
}
