// The opt-in weekly upkeep reminder (the "upkeep" mail category set to weekly), queued through
// the outbox by a periodic job. It lists the upkeep due on the member's tanks and, unless they
// turned mail about followed tanks off, the week's entries in tanks they follow.
// One per member per week: a journal_digest row for (member, Monday) is written in the same
// transaction as the mail, and the mail's dedupe key says the same, so a second run adds nothing.
import { and, desc, eq, gte, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import * as directory from '../club/directory';
import type { DigestReader } from '../club/directory';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import * as preferences from '../mail/preferences';
import { absoluteUrl } from '../config';
import { digestContent, weekOf, type DigestEntry, type DigestTask } from '../../journals/digest-content';
import { journalDigests, journalEntries, tankFollows, tanks as tankTable } from './schema';
import * as tanks from './tanks';
import * as upkeep from './upkeep';

/** Upkeep due within this many days goes in the digest. */
export const DIGEST_DAYS_AHEAD = 7;
/** Members considered in one run; the hourly job takes the rest next time. */
export const DIGESTS_PER_RUN = 500;

/** What one member's digest says this week, or null when there is nothing to tell. */
export async function contentFor(member: Pick<DigestReader, 'id' | 'displayName'>, context: Context = {}) {
	const { db, now } = resolve(context);
	const withFollowed = (await preferences.of(member.id, context)).follows !== 'off';
	const scheduled = upkeep.dueWithin(await upkeep.scheduleOf(member, context), DIGEST_DAYS_AHEAD);
	const tasks: DigestTask[] = scheduled.map((s) => ({
		tankName: s.task.tankName,
		label: s.task.label,
		statusLabel: s.statusLabel,
		overdue: s.status.kind === 'overdue'
	}));
	const since = new Date(now.getTime() - 7 * 86_400_000);
	const rows = !withFollowed
		? []
		: await db
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

/** Members who asked for the digest and whose week has not been considered yet, up to `limit`. */
async function readersDue(week: string, limit: number, context: Context): Promise<DigestReader[]> {
	const { db } = resolve(context);
	const due: DigestReader[] = [];
	let afterId: string | undefined;
	while (due.length < limit) {
		const ids = await preferences.choosing('upkeep', 'weekly', { afterId, limit }, context);
		if (ids.length === 0) break;
		afterId = ids.at(-1)!;
		const page = await directory.digestReaders(ids, context);
		if (page.length === 0) continue;
		const considered = new Set(
			(
				await db
					.select({ userId: journalDigests.userId })
					.from(journalDigests)
					.where(
						and(
							eq(journalDigests.weekOf, week),
							inArray(
								journalDigests.userId,
								page.map((r) => r.id)
							)
						)
					)
			).map((r) => r.userId)
		);
		due.push(...page.filter((r) => !considered.has(r.id)));
	}
	return due.slice(0, limit);
}

/** Queues this week's digest for every member who asked for one and has not had it; returns how many were queued. */
export async function sendWeeklyDigests(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const week = weekOf(now);
	let queued = 0;
	for (const member of await readersDue(week, DIGESTS_PER_RUN, context)) {
		const content = await contentFor(member, { ...context, now });
		const sent = await db.transaction(async (tx) => {
			try {
				await tx.insert(journalDigests).values({ userId: member.id, weekOf: week, sentAt: content ? now : null });
			} catch (error) {
				// Another instance considered this member's week first.
				if (isDuplicate(error)) return false;
				throw error;
			}
			if (!content) return false;
			const { html, text } = renderMail({
				heading: content.heading,
				paragraphs: content.paragraphs,
				action: content.action,
				footer: content.footer,
				to: { memberId: member.id, category: 'upkeep' }
			});
			await enqueue(
				{
					to: member.email,
					subject: content.subject,
					html,
					text,
					category: 'upkeep',
					memberId: member.id,
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
