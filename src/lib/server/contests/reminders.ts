// Reminders by mail about a contest's calendar. Periodically (the `contest-reminders` job), admins
// hear when a window's date passed while the contest's state did not move (dates never move a
// contest by themselves), and judges with open cards hear as the judging window closes and once
// more if it closed with their cards still open. Each of those mails has a dedupe key naming the
// day it is about, so a run every few minutes sends each one once; moving the date lets a new
// reminder go out. An admin may also remind judges by hand (remindJudges), once an hour at most.
import { eq, inArray } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import { absoluteUrl } from '../config';
import { enqueue, type QueuedMail } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { conflict } from '../../errors';
import { judgeReminderKind, overdueAdminReminder } from '../../contests/lifecycle';
import { judgingDuties } from '../../contests/readiness';
import { contestCards, contestConflicts, contestEntries, contests } from './schema';
import { adminChange, auditSubject, windowsOf, type ContestDetail } from './contests';
import { panelIds } from './panel';

/** Cards each judge of the panel still owes (empty or draft), by judge id. */
async function openDuties(contestId: number, context: Context = {}): Promise<Map<string, number>> {
	const { db } = resolve(context);
	const [judges, entries, conflicts, cards] = await Promise.all([
		panelIds(contestId, context),
		db.select({ entryId: contestEntries.id, entrantId: contestEntries.entrantId }).from(contestEntries).where(eq(contestEntries.contestId, contestId)),
		db
			.select({ entryId: contestConflicts.entryId, judgeId: contestConflicts.judgeId })
			.from(contestConflicts)
			.innerJoin(contestEntries, eq(contestEntries.id, contestConflicts.entryId))
			.where(eq(contestEntries.contestId, contestId)),
		db
			.select({ entryId: contestCards.entryId, judgeId: contestCards.judgeId, status: contestCards.status })
			.from(contestCards)
			.where(eq(contestCards.contestId, contestId))
	]);
	const { duties } = judgingDuties(
		entries.map((e) => ({ entryId: String(e.entryId), entrantId: e.entrantId })),
		judges,
		conflicts.map((c) => ({ entryId: String(c.entryId), judgeId: c.judgeId }))
	);
	const done = new Set(cards.filter((c) => c.status === 'submitted').map((c) => `${c.entryId}|${c.judgeId}`));
	const open = new Map<string, number>(judges.map((j) => [j, 0]));
	for (const d of duties) if (!done.has(`${d.entryId}|${d.judgeId}`)) open.set(d.judgeId, (open.get(d.judgeId) ?? 0) + 1);
	return open;
}

function judgeReminderMail(contest: Pick<ContestDetail, 'id' | 'title' | 'judgingClosesOn'>, judgeId: string, judgeName: string, open: number, lead: string) {
	const cards = `${open} ${open === 1 ? 'card' : 'cards'}`;
	const { html, text } = renderMail({
		heading: `${cards} to finish for “${contest.title}”`,
		paragraphs: [
			`Hello ${judgeName},`,
			`${lead} You still have ${cards} to score and submit for “${contest.title}”. The judging window ends with ${contest.judgingClosesOn} (UTC).`,
			'Your drafts are saved as you type; a card counts once you submit it.'
		],
		action: { label: 'Go to your cards', url: absoluteUrl(`/judging/${contest.id}`) },
		footer: 'You get this mail because you are on this contest’s judging panel.',
		to: { memberId: judgeId, category: 'judging' }
	});
	return { subject: `Judging: ${cards} to finish for “${contest.title}”`, html, text, category: 'judging' as const, memberId: judgeId };
}

/** The judges of a contest who owe cards, with how many and their address (`only` narrows them). */
async function owing(contestId: number, only: string[] | null, context: Context) {
	const open = await openDuties(contestId, context);
	const targets = [...open.entries()].filter(([id, n]) => n > 0 && (!only || only.includes(id)));
	const who = await directory.byIds(
		targets.map(([id]) => id),
		context
	);
	return targets.map(([id, open]) => ({ id, judge: who.get(id), open }));
}

/** Queues the periodic reminders that are due at `context.now`; answers how many mails. */
export async function sendDueReminders(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const active = await db
		.select()
		.from(contests)
		.where(inArray(contests.state, ['draft', 'open', 'judging']));
	if (active.length === 0) return 0;
	const admins = await directory.withRole('admin', context);
	const mails: QueuedMail[] = [];
	for (const contest of active) {
		const windows = windowsOf(contest);
		const overdue = overdueAdminReminder(contest.title, contest.state, windows, now);
		if (overdue) {
			for (const admin of admins) {
				const { html, text } = renderMail({
					heading: overdue.subject,
					paragraphs: [overdue.text, 'Nothing changes by itself: each step is yours to take on the contest’s admin page.'],
					action: { label: 'Open the contest', url: absoluteUrl(`/admin/contests/${contest.id}`) },
					footer: 'You get this mail because you are an admin of the club.',
					to: { memberId: admin.id, category: 'judging' }
				});
				mails.push({
					to: admin.email,
					category: 'judging',
					memberId: admin.id,
					subject: overdue.subject,
					html,
					text,
					topic: `contest:${contest.id}:reminder`,
					dedupeKey: `contest:${contest.id}:overdue:${overdue.kind}:${overdue.day}:${admin.id}`
				});
			}
		}
		const kind = judgeReminderKind(contest.state, windows, now);
		if (kind) {
			const lead = kind === 'closing-soon' ? 'The judging window closes soon.' : 'The judging window has closed, and the results wait for your cards.';
			for (const { judge, open } of await owing(contest.id, null, context)) {
				if (!judge?.email || judge.role !== 'judge') continue;
				mails.push({
					to: judge.email,
					...judgeReminderMail(contest, judge.id, judge.name, open, lead),
					topic: `contest:${contest.id}:reminder`,
					dedupeKey: `contest:${contest.id}:judge-${kind}:${contest.judgingClosesOn}:${judge.id}`
				});
			}
		}
	}
	return enqueue(mails, { db, now });
}

/**
 * The admin reminds judges (all with open cards, or the ones named) by mail through the outbox.
 * One reminder per judge per hour: a double click sends nothing twice.
 */
export async function remindJudges(viewer: Viewer, contestId: number, judgeIds: string[] | null, context: Context = {}): Promise<number> {
	const { now } = resolve(context);
	return adminChange(viewer, contestId, context, async ({ contest, tx, context: inTx }) => {
		if (contest.state !== 'judging') throw conflict('not-judging', 'Judges can be reminded while the contest is being judged.');
		const targets = await owing(contestId, judgeIds, inTx);
		// The hour (UTC) the reminder is sent in names it, so a second one within the hour is dropped.
		const hour = now.toISOString().slice(0, 13);
		const mails = targets.flatMap(({ judge, open }) =>
			judge?.email
				? [
						{
							to: judge.email,
							...judgeReminderMail(contest, judge.id, judge.name, open, 'A reminder from the contest admins.'),
							topic: `contest:${contestId}:nudge`,
							dedupeKey: `contest:${contestId}:nudge:${judge.id}:${hour}`
						}
					]
				: []
		);
		// A judge who turned judging reminders off gets none, even from an admin.
		const queued = await enqueue(mails, { db: tx, now });
		if (queued) {
			await audit.record(
				{
					actorId: viewer.id,
					action: 'panel.remind',
					subject: auditSubject(contestId),
					detail: { judges: targets.map((t) => t.judge?.name ?? t.id) }
				},
				inTx
			);
		}
		return queued;
	});
}
