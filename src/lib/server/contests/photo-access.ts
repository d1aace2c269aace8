// Who may see a contest entry's photos (media scope 'contest-entry'). Registered with media by
// ../media-scopes.ts.
import { and, eq } from 'drizzle-orm';
import * as media from '../media';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import { contestConflicts, contestEntries, contestJudges, contests } from './schema';
import { isAdminViewer } from './contests';
import { SCOPE } from './entries';

/**
 * The entrant and admins always; during judging the contest's judges who did not declare a
 * conflict on the entry (a judge's own entry is theirs as entrant); everyone once the results
 * are published.
 */
async function entryPhotoAudience(viewer: Viewer | null, entryId: number, context: Context = {}): Promise<media.MediaAudience | null> {
	const { db: appDb } = resolve(context);
	const [found] = await appDb
		.select({ entrantId: contestEntries.entrantId, contestId: contestEntries.contestId, state: contests.state })
		.from(contestEntries)
		.innerJoin(contests, eq(contests.id, contestEntries.contestId))
		.where(eq(contestEntries.id, entryId))
		.limit(1);
	if (!found) return null;
	if (found.state === 'published' || found.state === 'archived') return 'public';
	if (!viewer) return null;
	if (viewer.id === found.entrantId || isAdminViewer(viewer)) return 'restricted';
	if (found.state !== 'judging' || viewer.role !== 'judge') return null;
	const [onPanel] = await appDb
		.select({ judgeId: contestJudges.judgeId })
		.from(contestJudges)
		.where(and(eq(contestJudges.contestId, found.contestId), eq(contestJudges.judgeId, viewer.id)));
	if (!onPanel) return null;
	const [conflict] = await appDb
		.select({ judgeId: contestConflicts.judgeId })
		.from(contestConflicts)
		.where(and(eq(contestConflicts.entryId, entryId), eq(contestConflicts.judgeId, viewer.id)));
	return conflict ? null : 'restricted';
}

const entryPhotos: media.ScopeAccess = { audienceFor: entryPhotoAudience };

/** Tells media who may see contest entry photos; ../media-scopes.ts calls it at start-up. */
export function registerPhotoAccess(): void {
	media.registerScope(SCOPE, entryPhotos);
}
