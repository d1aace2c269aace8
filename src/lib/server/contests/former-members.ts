// What contests keep of a member who deletes their account. Published results stay as they were
// announced: an entry in a contest whose results are out (published or archived) keeps its
// scores, statement and the judges' cards, shown under "Former member" (the member's id stays as
// an opaque tombstone). Everything not yet settled goes: entries in contests still in draft, open
// or being judged (with their cards and conflicts), and the member's seats on such panels with
// the cards and conflicts they wrote there. Photos go with all of the member's photos.
import { and, eq, inArray, notInArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { contestCards, contestConflicts, contestEntries, contestJudges, contests } from './schema';

const SETTLED = ['published', 'archived'] as const;

/** Deletes the member's unsettled contest rows. Call it inside the deletion's transaction. */
export async function forget(memberId: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const unsettled = (
		await db
			.select({ id: contests.id })
			.from(contests)
			.where(notInArray(contests.state, [...SETTLED]))
	).map((c) => c.id);
	if (unsettled.length === 0) return;
	await db.delete(contestEntries).where(and(eq(contestEntries.entrantId, memberId), inArray(contestEntries.contestId, unsettled)));
	await db.delete(contestCards).where(and(eq(contestCards.judgeId, memberId), inArray(contestCards.contestId, unsettled)));
	const entryIds = (await db.select({ id: contestEntries.id }).from(contestEntries).where(inArray(contestEntries.contestId, unsettled))).map((e) => e.id);
	if (entryIds.length) await db.delete(contestConflicts).where(and(eq(contestConflicts.judgeId, memberId), inArray(contestConflicts.entryId, entryIds)));
	await db.delete(contestJudges).where(and(eq(contestJudges.judgeId, memberId), inArray(contestJudges.contestId, unsettled)));
}
