// The periodic reminders: admins hear when a window's date passed while the contest's state did
// not move (dates never move a contest by themselves), and judges with open cards hear as the
// judging window closes and once more if it closed with their cards still open. Each mail has a
// dedupe key naming the day it is about, so a run every few minutes sends each one once; moving
// the date lets a new reminder go out.
import { inArray } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { absoluteUrl } from '../config';
import { enqueue, type QueuedMail } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import { judgeReminderKind, overdueAdminReminder } from '../../contests/lifecycle';
import { contests } from './schema';
import { windowsOf } from './contests';
import { judgeReminderMail, openDuties } from './judging';
import * as people from './people';

export async function sendDueReminders(now: Date, tx: DbOrTx = appDb): Promise<number> {
	const active = await tx
		.select()
		.from(contests)
		.where(inArray(contests.state, ['draft', 'open', 'judging']));
	if (active.length === 0) return 0;
	const admins = await people.withRole('admin', tx);
	const mails: QueuedMail[] = [];
	for (const contest of active) {
		const windows = windowsOf(contest);
		const overdue = overdueAdminReminder(contest.title, contest.state, windows, now);
		if (overdue) {
			const { html, text } = renderMail({
				heading: overdue.subject,
				paragraphs: [overdue.text, 'Nothing changes by itself: each step is yours to take on the contest’s admin page.'],
				action: { label: 'Open the contest', url: absoluteUrl(`/admin/contests/${contest.id}`) },
				footer: 'You get this mail because you are an admin of the club.'
			});
			for (const admin of admins) {
				mails.push({
					to: admin.email,
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
			const open = await openDuties(contest.id, tx);
			const owing = [...open.entries()].filter(([, n]) => n > 0);
			const who = await people.byIds(
				owing.map(([id]) => id),
				tx
			);
			const lead = kind === 'closing-soon' ? 'The judging window closes soon.' : 'The judging window has closed, and the results wait for your cards.';
			for (const [id, n] of owing) {
				const person = who.get(id);
				if (!person?.email || person.role !== 'judge') continue;
				mails.push({
					to: person.email,
					...judgeReminderMail(contest, person.displayName, n, lead),
					topic: `contest:${contest.id}:reminder`,
					dedupeKey: `contest:${contest.id}:judge-${kind}:${contest.judgingClosesOn}:${id}`
				});
			}
		}
	}
	await enqueue(mails, { db: tx, now });
	return mails.length;
}
