// The opt-in weekly digest (users.weekly_digest), queued through the outbox by a periodic job.
// One per member per week: a journal_digest row for (member, Monday) is written in the same
// transaction as the mail, and the mail's dedupe key says the same, so a second run adds nothing.
import { and, desc, eq, gte, inArray, isNotNull, sql } from 'drizzle-orm';
import { db as appDb, type Database } from '../db';
import { users } from '../club/schema';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { unsubscribeHeaders, unsubscribeUrl } from '../mail/unsubscribe';
import { absoluteUrl } from '../config';
import { digestContent, weekOf, type DigestEntry, type DigestTask } from '../../journals/digest';
import { journalDigests, journalEntries, tankFollows, tanks as tankTable } from './schema';
import * as tanks from './tanks';
import * as upkeep from './upkeep';

/** Upkeep due within this many days goes in the digest. */
export const DIGEST_DAYS_AHEAD = 7;

interface Member {
	id: string;
	email: string | null;
	displayName: string | null;
	unsubscribeToken: string;
}

/** What one member's digest says this week, or null when there is nothing to tell. */
export async function contentFor(member: Member, now: Date, database: Database = appDb) {
	const scheduled = upkeep.dueWithin(await upkeep.scheduleOf(member, now, database), DIGEST_DAYS_AHEAD);
	const tasks: DigestTask[] = scheduled.map((s) => ({
		tankName: s.task.tankName,
		label: s.task.label,
		statusLabel: s.statusLabel,
		overdue: s.status.kind === 'overdue'
	}));
	const since = new Date(now.getTime() - 7 * 86_400_000);
	const rows = await database
		.select({ entry: journalEntries, tank: tankTable })
		.from(tankFollows)
		.innerJoin(tankTable, eq(tankTable.id, tankFollows.tankId))
		.innerJoin(journalEntries, eq(journalEntries.tankId, tankTable.id))
		.where(and(eq(tankFollows.userId, member.id), gte(journalEntries.createdAt, since)))
		.orderBy(desc(journalEntries.createdAt))
		.limit(20);
	const followed: DigestEntry[] = rows
		.filter((r) => r.tank.ownerId !== member.id && tanks.canView(member, r.tank))
		.map((r) => ({ tankName: r.tank.name, title: r.entry.title, entryOn: r.entry.entryOn, url: absoluteUrl(`/journals/${r.tank.id}/entries/${r.entry.id}`) }));
	return digestContent({ name: member.displayName, weekOf: weekOf(now), tasks, followed, homeUrl: absoluteUrl('/') });
}

const isDuplicate = (error: unknown): boolean => {
	const e = error as { code?: string; errno?: number; cause?: unknown } | null;
	return !!e && (e.code === 'ER_DUP_ENTRY' || e.errno === 1062 || (e.cause !== undefined && isDuplicate(e.cause)));
};

/** Queues this week's digest for every member who asked for one and has not had it; returns how many were queued. */
export async function sendWeeklyDigests(now = new Date(), database: Database = appDb): Promise<number> {
	const week = weekOf(now);
	const members = await database
		.select({ id: users.id, email: users.email, displayName: users.displayName, unsubscribeToken: users.unsubscribeToken })
		.from(users)
		.where(
			and(
				eq(users.weeklyDigest, true),
				isNotNull(users.email),
				sql`NOT EXISTS (SELECT 1 FROM ${journalDigests} WHERE ${journalDigests.userId} = ${users.id} AND ${journalDigests.weekOf} = ${week})`
			)
		)
		.limit(500);
	let queued = 0;
	for (const member of members) {
		const content = await contentFor(member, now, database);
		const sent = await database.transaction(async (tx) => {
			try {
				await tx.insert(journalDigests).values({ userId: member.id, weekOf: week, sentAt: content ? now : null });
			} catch (error) {
				// Another instance considered this member's week first.
				if (isDuplicate(error)) return false;
				throw error;
			}
			if (!content || !member.email) return false;
			const unsubscribe = unsubscribeUrl(member.unsubscribeToken, 'digest');
			const { html, text } = renderMail({
				heading: content.heading,
				paragraphs: content.paragraphs,
				action: content.action,
				footer: content.footer,
				unsubscribeUrl: unsubscribe
			});
			await enqueue(
				{
					to: member.email,
					subject: content.subject,
					html,
					text,
					headers: unsubscribeHeaders(member.unsubscribeToken, 'digest'),
					topic: 'journal-digest',
					bulk: true,
					dedupeKey: `journal-digest:${member.id}:${week}`
				},
				{ db: tx, now }
			);
			return true;
		});
		if (sent) queued++;
	}
	return queued;
}

/** Ids of members whose digest for the week of `now` has been considered (for tests and the admin). */
export async function consideredFor(now: Date, ids: string[], database: Database = appDb) {
	if (!ids.length) return [];
	return database
		.select()
		.from(journalDigests)
		.where(and(eq(journalDigests.weekOf, weekOf(now)), inArray(journalDigests.userId, ids)));
}
