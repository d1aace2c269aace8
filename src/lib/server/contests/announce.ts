// The results announcement: one mail to every member who takes contest results (the "results"
// mail category; the outbox drops the others) and one personal mail to each entrant with their
// place and a link to their feedback. Queued through the outbox in one transaction, once per
// results revision: the dedupe keys make a second click (or a second admin) send nothing twice.
import { eq } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import { absoluteUrl } from '../config';
import { enqueue, type QueuedMail } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import * as preferences from '../mail/preferences';
import { deliverySummary, listOutbox } from '../mail/report';
import { conflict } from '../../errors';
import { formatPercent, formatPlace } from '../../contests/format';
import { contests } from './schema';
import { adminChange, assertAdmin, auditSubject } from './contests';
import { publicResults, type PublicEntry, type PublicResults } from './review';

export const topicPrefix = (contestId: number) => `contest:${contestId}:results:`;

const resultsUrl = (contestId: number) => absoluteUrl(`/contests/${contestId}`);
const feedbackUrl = (contestId: number, entryId: number) => absoluteUrl(`/contests/${contestId}/entries/${entryId}`);

function podium(results: PublicResults): string[] {
	return results.categories.map((cat) => {
		const top = cat.entries.filter((e) => e.place !== null && e.place <= 3);
		if (top.length === 0) return `${cat.name}: no placed entries.`;
		return `${cat.name}: ${top.map((e) => `${formatPlace(e.place)} ${e.entrantName} (${formatPercent(e.score)})`).join('; ')}.`;
	});
}

export function announcementMail(results: PublicResults, memberId: string) {
	const c = results.contest;
	const { html, text } = renderMail({
		heading: `Results of “${c.title}”`,
		paragraphs: [
			`The judges have finished and the results of “${c.title}” are out.`,
			...podium(results),
			`Every entry with its photos, scores by criterion and the judges’ comments is on the results page. Judged by ${results.panel.join(', ') || 'the club’s panel'}.`
		],
		action: { label: 'See the results', url: resultsUrl(c.id) },
		footer: 'You get this mail because you take contest results.',
		to: { memberId, category: 'results' }
	});
	return { subject: `Results: ${c.title}`, html, text, category: 'results' as const, memberId };
}

export function entrantMail(results: PublicResults, entry: PublicEntry, name: string, memberId: string) {
	const c = results.contest;
	const category = results.categories.find((k) => k.id === entry.categoryId)!;
	const placed =
		entry.place === null
			? `Your entry in ${category.name} could not be placed: no judge’s card counted for it.`
			: `Your entry in ${category.name}${entry.number ? ` (number ${entry.number})` : ''} placed ${formatPlace(entry.place, entry.sharedWith > 0)} of ${category.entries.length} with ${formatPercent(entry.score)}.`;
	const { html, text } = renderMail({
		heading: `Your result in “${c.title}”`,
		paragraphs: [`Hello ${name},`, placed, 'Each judge’s scores and comments for your entry are on your feedback page; the results page shows every entry.'],
		action: { label: 'Read your feedback', url: feedbackUrl(c.id, entry.entryId) },
		footer: 'You get this mail because you entered this contest.',
		to: { memberId, category: 'results' }
	});
	return { subject: `Your result in “${c.title}”`, html, text, category: 'results' as const, memberId };
}

export interface AnnouncementPlan {
	results: PublicResults;
	recipients: directory.Member[];
	entrants: { entry: PublicEntry; person: directory.Member }[];
	revision: number;
	announcedRevision: number | null;
}

async function plan(contestId: number, context: Context): Promise<AnnouncementPlan> {
	const results = await publicResults(contestId, context);
	if (!results) throw conflict('not-published', 'The results are not published yet.');
	const everyone = await directory.everyone(context);
	const settings = await preferences.ofMembers(
		everyone.map((m) => m.id),
		context
	);
	const recipients = everyone.filter((m) => settings.get(m.id)!.results === 'on');
	const entries = results.categories.flatMap((c) => c.entries);
	const who = await directory.byIds(
		entries.map((e) => e.entrantId),
		context
	);
	return {
		results,
		recipients,
		entrants: entries.flatMap((entry) => {
			const person = who.get(entry.entrantId);
			return person?.email && settings.get(person.id)?.results === 'on' ? [{ entry, person }] : [];
		}),
		revision: results.contest.resultsRevision,
		announcedRevision: results.contest.announcedRevision
	};
}

/** What would be sent, for the admin to read before sending. */
export async function preview(viewer: Viewer, contestId: number, context: Context = {}) {
	assertAdmin(viewer);
	const p = await plan(contestId, context);
	const sample = p.entrants[0];
	return {
		// The sample's unsubscribe link is the admin's own: never another member's working link.
		announcement: announcementMail(p.results, viewer.id),
		entrantSample: sample ? { name: sample.person.name, ...entrantMail(p.results, sample.entry, sample.person.name, viewer.id) } : null,
		recipients: p.recipients.length,
		entrants: p.entrants.length,
		revision: p.revision,
		announcedRevision: p.announcedRevision
	};
}

/** Queues the announcement and the entrants' mails for the current results revision. */
export async function send(viewer: Viewer, contestId: number, context: Context = {}): Promise<{ queued: number }> {
	const { now } = resolve(context);
	return adminChange(viewer, contestId, context, async ({ contest: locked, tx, context: inTx }) => {
		const p = await plan(contestId, inTx);
		const rev = `r${p.revision}`;
		// Entrants' own results first: with a large club the announcement takes a while to drain.
		const mails: QueuedMail[] = [
			...p.entrants.map(({ entry, person }) => ({
				to: person.email,
				...entrantMail(p.results, entry, person.name, person.id),
				topic: `${topicPrefix(contestId)}entrant`,
				dedupeKey: `contest:${contestId}:${rev}:entrant:${entry.entryId}`
			})),
			...p.recipients.map((person) => ({
				to: person.email,
				...announcementMail(p.results, person.id),
				topic: `${topicPrefix(contestId)}announce`,
				bulk: true,
				dedupeKey: `contest:${contestId}:${rev}:announce:${person.id}`
			}))
		];
		await enqueue(mails, { db: tx, now });
		if (locked.announcedRevision !== p.revision) {
			await tx.update(contests).set({ announcedRevision: p.revision }).where(eq(contests.id, contestId));
			await audit.record(
				{
					actorId: viewer.id,
					action: 'results.announce',
					subject: auditSubject(contestId),
					detail: { revision: p.revision, announcements: p.recipients.length, entrants: p.entrants.length }
				},
				inTx
			);
		}
		return { queued: mails.length };
	});
}

/** Per-recipient delivery of this contest's results mails, optionally for addresses containing `address`. */
export async function delivery(viewer: Viewer, contestId: number, page: number, address?: string) {
	assertAdmin(viewer);
	const [summary, listing] = await Promise.all([
		deliverySummary(topicPrefix(contestId)),
		listOutbox({ topic: topicPrefix(contestId), address: address || undefined, page })
	]);
	return { summary, ...listing };
}

/** Only the counts of `delivery`, for polling: one grouped count on the outbox's topic index. */
export async function deliveryCounts(viewer: Viewer, contestId: number) {
	assertAdmin(viewer);
	return deliverySummary(topicPrefix(contestId));
}
