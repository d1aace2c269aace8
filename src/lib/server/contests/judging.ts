// Judging: the panel, the judges' blind view of the entries, their conflicts and their cards.
//
// Blind judging is decided here: a judge reaches an entry only through access() below, by its
// number, and what comes back (BlindEntry) carries no entrant, no tank name or id, no photo owner
// and no entry id. A judge never reaches their own entry or one they declared a conflict on.
import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import type { Viewer } from '../club/users';
import * as media from '../media';
import { renderMarkdown } from '../markdown';
import { absoluteUrl } from '../config';
import { enqueue } from '../mail/outbox';
import { renderMail } from '../mail/templates';
import type { RenditionSize } from '../../media/urls';
import { cardsReopenable, type ContestState } from '../../contests/lifecycle';
import { checkDraftFields, emptyCardFields, normaliseFields, type CardFields, type CardSave } from '../../contests/card';
import { validateScorecard } from '../../contests/scoring';
import { judgingDuties } from '../../contests/readiness';
import type { ServerCard } from '../../contests/autosave';
import { contestCards, contestConflicts, contestEntries, contestJudges, contests, type CardRow, type ContestEntryRow } from './schema';
import { ContestError, ContestNotFound } from './errors';
import { assertAdmin, load, rubricOf, row, windowsOf, type ContestDetail } from './contests';
import { SCOPE } from './entries';
import * as people from './people';
import * as audit from './audit';

// ---- The panel ---------------------------------------------------------------------------

export async function panelIds(contestId: number, tx: DbOrTx = appDb): Promise<string[]> {
	return (await tx.select({ judgeId: contestJudges.judgeId }).from(contestJudges).where(eq(contestJudges.contestId, contestId))).map((r) => r.judgeId);
}

export async function panel(contestId: number, tx: DbOrTx = appDb): Promise<people.Person[]> {
	const byId = await people.byIds(await panelIds(contestId, tx), tx);
	return [...byId.values()].sort((a, b) => a.displayName.localeCompare(b.displayName));
}

const panelClosed = (state: ContestState) => state === 'published' || state === 'archived';

export async function assign(viewer: Viewer, contestId: number, judgeId: string, database: DbOrTx = appDb, now?: Date): Promise<void> {
	assertAdmin(viewer);
	await database.transaction(async (tx) => {
		const contest = await row(contestId, tx, true);
		if (!contest) throw new ContestNotFound('No such contest.');
		if (panelClosed(contest.state)) throw new ContestError(409, 'The results are out; the panel can no longer change.');
		const person = (await people.byIds([judgeId], tx)).get(judgeId);
		if (!person || person.role !== 'judge') throw new ContestError(400, 'Only members with the judge role can be assigned.', 'not-a-judge');
		const [existing] = await tx
			.select()
			.from(contestJudges)
			.where(and(eq(contestJudges.contestId, contestId), eq(contestJudges.judgeId, judgeId)));
		if (existing) return;
		await tx.insert(contestJudges).values({ contestId, judgeId, assignedBy: viewer.id, ...(now ? { assignedAt: now } : {}) });
		await audit.record(tx, viewer.id, 'panel.assign', contestId, { judgeId, judge: person.displayName }, now);
	});
}

/** Takes a judge off the panel; their cards are kept but no longer count. */
export async function unassign(viewer: Viewer, contestId: number, judgeId: string, database: DbOrTx = appDb): Promise<void> {
	assertAdmin(viewer);
	await database.transaction(async (tx) => {
		const contest = await row(contestId, tx, true);
		if (!contest) throw new ContestNotFound('No such contest.');
		if (panelClosed(contest.state)) throw new ContestError(409, 'The results are out; the panel can no longer change.');
		const [result] = await tx.delete(contestJudges).where(and(eq(contestJudges.contestId, contestId), eq(contestJudges.judgeId, judgeId)));
		if (result.affectedRows === 0) return;
		const person = (await people.byIds([judgeId], tx)).get(judgeId);
		await audit.record(tx, viewer.id, 'panel.unassign', contestId, { judgeId, judge: person?.displayName ?? null });
	});
}

// ---- What a judge sees ---------------------------------------------------------------------

/** A photo without its owner: what a judge may know of it. */
export interface BlindPhoto {
	id: number;
	alt: string;
	caption: string;
	width: number;
	height: number;
	urls: Record<RenditionSize, string>;
	renditions: Record<RenditionSize, { width: number; height: number }>;
}

export const blindPhoto = (p: media.Photo): BlindPhoto => ({
	id: p.id,
	alt: p.alt,
	caption: p.caption,
	width: p.width,
	height: p.height,
	urls: p.urls,
	renditions: {
		thumb: { width: p.renditions.thumb.width, height: p.renditions.thumb.height },
		medium: { width: p.renditions.medium.width, height: p.renditions.medium.height },
		large: { width: p.renditions.large.width, height: p.renditions.large.height }
	}
});

/** An entry as a judge sees it: by number, with photos, statement and the tank's figures only. */
export interface BlindEntry {
	number: number;
	categoryName: string;
	categoryDescription: string;
	statementHtml: string;
	photos: BlindPhoto[];
	litres: number | null;
	volumeSource: 'measured' | 'estimated' | null;
	ageWeeks: number | null;
}

export type CellState = 'empty' | 'draft' | 'submitted' | 'conflicted';

const isJudgeOn = async (tx: DbOrTx, viewer: Viewer, contestId: number) =>
	viewer.role === 'judge' &&
	(
		await tx
			.select({ id: contestJudges.judgeId })
			.from(contestJudges)
			.where(and(eq(contestJudges.contestId, contestId), eq(contestJudges.judgeId, viewer.id)))
	).length > 0;

export interface JudgeContest {
	id: number;
	title: string;
	state: ContestState;
	judgingOpensOn: string;
	judgingClosesOn: string;
	toScore: number;
	submitted: number;
	drafts: number;
	conflicts: number;
}

/** The contests the viewer is on the panel of, with their progress. */
export async function myContests(viewer: Viewer, tx: DbOrTx = appDb): Promise<JudgeContest[]> {
	if (viewer.role !== 'judge') return [];
	const rows = await tx
		.select({ contest: contests })
		.from(contestJudges)
		.innerJoin(contests, eq(contests.id, contestJudges.contestId))
		.where(and(eq(contestJudges.judgeId, viewer.id), inArray(contests.state, ['open', 'judging', 'published'])))
		.orderBy(asc(contests.judgingClosesOn), asc(contests.id));
	const result: JudgeContest[] = [];
	for (const { contest } of rows) {
		const cells = contest.state === 'open' ? [] : await myCells(tx, viewer, contest.id);
		result.push({
			id: contest.id,
			title: contest.title,
			state: contest.state,
			judgingOpensOn: contest.judgingOpensOn,
			judgingClosesOn: contest.judgingClosesOn,
			toScore: cells.filter((c) => c.state !== 'conflicted').length,
			submitted: cells.filter((c) => c.state === 'submitted').length,
			drafts: cells.filter((c) => c.state === 'draft').length,
			conflicts: cells.filter((c) => c.state === 'conflicted').length
		});
	}
	return result;
}

interface MyCell {
	entryId: number;
	number: number | null;
	categoryId: number;
	state: CellState;
	card: CardRow | null;
}

/** Every entry of the contest the viewer may judge or has a conflict on (never their own). */
async function myCells(tx: DbOrTx, viewer: Viewer, contestId: number): Promise<MyCell[]> {
	const [entries, conflicts, cards] = await Promise.all([
		tx
			.select({ id: contestEntries.id, number: contestEntries.number, categoryId: contestEntries.categoryId, entrantId: contestEntries.entrantId })
			.from(contestEntries)
			.where(eq(contestEntries.contestId, contestId))
			.orderBy(asc(contestEntries.number)),
		tx
			.select({ entryId: contestConflicts.entryId })
			.from(contestConflicts)
			.innerJoin(contestEntries, eq(contestEntries.id, contestConflicts.entryId))
			.where(and(eq(contestEntries.contestId, contestId), eq(contestConflicts.judgeId, viewer.id))),
		tx
			.select()
			.from(contestCards)
			.where(and(eq(contestCards.contestId, contestId), eq(contestCards.judgeId, viewer.id)))
	]);
	const conflicted = new Set(conflicts.map((c) => c.entryId));
	const cardOf = new Map(cards.map((c) => [c.entryId, c]));
	return entries
		.filter((e) => e.entrantId !== viewer.id)
		.map((e) => {
			const card = cardOf.get(e.id) ?? null;
			const state: CellState = conflicted.has(e.id) ? 'conflicted' : card?.status === 'submitted' ? 'submitted' : card ? 'draft' : 'empty';
			return { entryId: e.id, number: e.number, categoryId: e.categoryId, state, card: state === 'conflicted' ? null : card };
		});
}

export interface BlindListing {
	contest: { id: number; title: string; state: ContestState; judgingClosesOn: string; rulesHtml: string };
	categories: { id: number; name: string; description: string }[];
	entries: { number: number; categoryId: number; state: CellState }[];
	/** Entries of the viewer's own in this contest, which they do not judge. */
	ownEntries: number;
}

/** The judge's list of entries by number and the state of their card for each. */
export async function blindList(viewer: Viewer, contestId: number, tx: DbOrTx = appDb): Promise<BlindListing> {
	const contest = await load(contestId, tx);
	if (!contest || !(await isJudgeOn(tx, viewer, contestId)) || contest.state !== 'judging') throw new ContestNotFound('No such contest to judge.');
	const cells = await myCells(tx, viewer, contestId);
	const [own] = await tx
		.select({ n: count() })
		.from(contestEntries)
		.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.entrantId, viewer.id)));
	return {
		contest: { id: contest.id, title: contest.title, state: contest.state, judgingClosesOn: contest.judgingClosesOn, rulesHtml: renderMarkdown(contest.rules) },
		categories: contest.categories.map((c) => ({ id: c.id, name: c.name, description: c.description })),
		entries: cells.filter((c) => c.number !== null).map((c) => ({ number: c.number!, categoryId: c.categoryId, state: c.state })),
		ownEntries: own?.n ?? 0
	};
}

interface Access {
	contest: ContestDetail;
	entry: ContestEntryRow;
}

/**
 * The one way a judge reaches an entry: on the panel (with the judge role), the contest being
 * judged, the entry not their own and not one they declared a conflict on. Anything else is
 * "not found", so a judge cannot even tell their own entry's number from a missing one.
 */
async function access(tx: DbOrTx, viewer: Viewer, contestId: number, number: number): Promise<Access> {
	const contest = await load(contestId, tx);
	if (!contest || contest.state !== 'judging' || !(await isJudgeOn(tx, viewer, contestId))) throw new ContestNotFound('No such entry to judge.');
	const [entry] = await tx
		.select()
		.from(contestEntries)
		.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.number, number)))
		.limit(1);
	if (!entry || entry.entrantId === viewer.id) throw new ContestNotFound('No such entry to judge.');
	const [conflict] = await tx
		.select({ judgeId: contestConflicts.judgeId })
		.from(contestConflicts)
		.where(and(eq(contestConflicts.entryId, entry.id), eq(contestConflicts.judgeId, viewer.id)));
	if (conflict) throw new ContestNotFound('No such entry to judge.');
	return { contest, entry };
}

export interface ScorecardPage {
	contest: { id: number; title: string; judgingClosesOn: string };
	entry: BlindEntry;
	rubric: { id: string; label: string; guidance: string; maxPoints: number; weight: number }[];
	/** Numbers of the entries before and after this one that the judge may score. */
	previous: number | null;
	next: number | null;
	/** The other judges' notes for the panel, once this judge has submitted their own card. */
	panelNotes: string[];
}

export async function scorecardPage(viewer: Viewer, contestId: number, number: number, tx: DbOrTx = appDb): Promise<ScorecardPage> {
	const { contest, entry } = await access(tx, viewer, contestId, number);
	const category = contest.categories.find((c) => c.id === entry.categoryId)!;
	const photos = await media.listFor(SCOPE, entry.id, tx);
	const cells = (await myCells(tx, viewer, contestId)).filter((c) => c.state !== 'conflicted' && c.number !== null).sort((a, b) => a.number! - b.number!);
	const at = cells.findIndex((c) => c.number === number);
	const mine = cells[at]?.card;
	const notes =
		mine?.status === 'submitted'
			? (
					await tx
						.select({ fields: contestCards.fields, judgeId: contestCards.judgeId })
						.from(contestCards)
						.where(and(eq(contestCards.entryId, entry.id), eq(contestCards.status, 'submitted')))
				)
					.filter((c) => c.judgeId !== viewer.id && c.fields.panelNote.trim())
					.map((c) => c.fields.panelNote.trim())
			: [];
	return {
		contest: { id: contest.id, title: contest.title, judgingClosesOn: contest.judgingClosesOn },
		entry: {
			number,
			categoryName: category.name,
			categoryDescription: category.description,
			statementHtml: renderMarkdown(entry.statement),
			photos: photos.map(blindPhoto),
			litres: entry.litres,
			volumeSource: entry.volumeSource,
			ageWeeks: entry.ageWeeks
		},
		rubric: contest.criteria.map((c) => ({ id: String(c.id), label: c.label, guidance: c.guidance, maxPoints: c.maxPoints, weight: c.weight })),
		previous: at > 0 ? cells[at - 1]!.number : null,
		next: at >= 0 && at < cells.length - 1 ? cells[at + 1]!.number : null,
		panelNotes: notes
	};
}

// ---- Cards ---------------------------------------------------------------------------------

export interface CardView extends ServerCard {
	status: 'draft' | 'submitted';
	submittedAt: string | null;
	/** A submitted card may be reopened now. */
	reopenable: boolean;
}

/** A save based on a version older than the stored one. */
export class VersionConflict extends ContestError {
	constructor(readonly current: CardView) {
		super(409, 'This card was saved from another window or device in the meantime.', 'version-conflict');
	}
}

function view(contest: ContestDetail, card: CardRow | null, now: Date): CardView {
	const rubric = rubricOf(contest.criteria);
	if (!card || card.version === 0) {
		return { version: 0, fields: emptyCardFields(rubric), lastSaveId: null, updatedAt: null, status: 'draft', submittedAt: null, reopenable: false };
	}
	return {
		version: card.version,
		fields: normaliseFields(rubric, card.fields),
		lastSaveId: card.lastSaveId,
		updatedAt: card.updatedAt.toISOString(),
		status: card.status,
		submittedAt: card.submittedAt?.toISOString() ?? null,
		reopenable: card.status === 'submitted' && cardsReopenable(contest.state, windowsOf(contest), now)
	};
}

async function cardRow(tx: DbOrTx, entryId: number, judgeId: string, lock: boolean): Promise<CardRow | null> {
	const query = tx
		.select()
		.from(contestCards)
		.where(and(eq(contestCards.entryId, entryId), eq(contestCards.judgeId, judgeId)))
		.limit(1);
	const [found] = lock ? await query.for('update') : await query;
	return found ?? null;
}

export async function getCard(viewer: Viewer, contestId: number, number: number, now = new Date(), tx: DbOrTx = appDb): Promise<CardView> {
	const { contest, entry } = await access(tx, viewer, contestId, number);
	return view(contest, await cardRow(tx, entry.id, viewer.id, false), now);
}

const DEADLOCK = 1213;
const isDeadlock = (e: unknown) => (e as { errno?: number })?.errno === DEADLOCK || (e as { cause?: { errno?: number } })?.cause?.errno === DEADLOCK;

/** Runs a short card transaction, once more if InnoDB picked it as a deadlock victim. */
async function cardTransaction<T>(database: DbOrTx, work: (tx: DbOrTx) => Promise<T>): Promise<T> {
	try {
		return await database.transaction(work);
	} catch (error) {
		if (!isDeadlock(error)) throw error;
		return database.transaction(work);
	}
}

/**
 * Saves a draft. Refused when the card is submitted, when the save is based on an older version
 * than the stored one (VersionConflict, with the stored card), or when a score is out of range.
 * A repeat of the last save (same save id) answers as the first time did and changes nothing.
 */
export async function saveCard(
	viewer: Viewer,
	contestId: number,
	number: number,
	save: CardSave,
	options: { now?: Date; database?: DbOrTx } = {}
): Promise<CardView> {
	const now = options.now ?? new Date();
	return cardTransaction(options.database ?? appDb, async (tx) => {
		const { contest, entry } = await access(tx, viewer, contestId, number);
		if (save.baseVersion === 0) {
			// Make the row first (a no-op when it exists), so two first saves queue on one row lock
			// instead of both locking the gap where the row would go.
			await tx
				.insert(contestCards)
				.values({
					contestId,
					entryId: entry.id,
					judgeId: viewer.id,
					status: 'draft',
					fields: emptyCardFields(rubricOf(contest.criteria)),
					version: 0,
					updatedAt: now
				})
				.onDuplicateKeyUpdate({ set: { id: sql`id` } });
		}
		const card = await cardRow(tx, entry.id, viewer.id, true);
		const current = view(contest, card, now);
		if (card && card.lastSaveId === save.saveId) return current;
		if (card?.status === 'submitted') throw new ContestError(409, 'This card is submitted. Reopen it to change it.', 'submitted');
		if (!card || card.version !== save.baseVersion) throw new VersionConflict(current);
		const checked = checkDraftFields(rubricOf(contest.criteria), save.fields);
		if (!checked.ok) throw new ContestError(400, checked.message, 'invalid');
		await tx
			.update(contestCards)
			.set({ fields: checked.fields, version: card.version + 1, lastSaveId: save.saveId, updatedAt: now })
			.where(eq(contestCards.id, card.id));
		return { ...current, version: card.version + 1, fields: checked.fields, lastSaveId: save.saveId, updatedAt: now.toISOString() };
	});
}

/** Submits the card the judge last saw (its version); every criterion needs a score. */
export async function submitCard(
	viewer: Viewer,
	contestId: number,
	number: number,
	version: number,
	options: { now?: Date; database?: DbOrTx } = {}
): Promise<CardView> {
	const now = options.now ?? new Date();
	return cardTransaction(options.database ?? appDb, async (tx) => {
		const { contest, entry } = await access(tx, viewer, contestId, number);
		const card = await cardRow(tx, entry.id, viewer.id, true);
		const current = view(contest, card, now);
		if (!card || card.version === 0) throw new ContestError(400, 'Score every criterion first.', 'incomplete');
		if (card.status === 'submitted') return current;
		if (card.version !== version) throw new VersionConflict(current);
		const check = validateScorecard(rubricOf(contest.criteria), card.fields.scores);
		if (!check.submittable) throw new ContestError(400, check.errors.map((e) => e.message).join(' '), 'incomplete');
		await tx
			.update(contestCards)
			.set({ status: 'submitted', submittedAt: now, updatedAt: now, version: card.version + 1 })
			.where(eq(contestCards.id, card.id));
		return view(contest, { ...card, status: 'submitted', submittedAt: now, updatedAt: now, version: card.version + 1 }, now);
	});
}

/** Reopens a submitted card while the judging window lasts. */
export async function reopenCard(viewer: Viewer, contestId: number, number: number, options: { now?: Date; database?: DbOrTx } = {}): Promise<CardView> {
	const now = options.now ?? new Date();
	return cardTransaction(options.database ?? appDb, async (tx) => {
		const { contest, entry } = await access(tx, viewer, contestId, number);
		const card = await cardRow(tx, entry.id, viewer.id, true);
		if (!card || card.status !== 'submitted') return view(contest, card, now);
		if (!cardsReopenable(contest.state, windowsOf(contest), now)) {
			throw new ContestError(409, `The judging window closed on ${contest.judgingClosesOn}; submitted cards can no longer be reopened.`, 'closed');
		}
		await tx
			.update(contestCards)
			.set({ status: 'draft', submittedAt: null, updatedAt: now, version: card.version + 1 })
			.where(eq(contestCards.id, card.id));
		return view(contest, { ...card, status: 'draft', submittedAt: null, updatedAt: now, version: card.version + 1 }, now);
	});
}

export const CONFLICT_REASON_MAX = 300;

/**
 * The judge declares a conflict (they know the entrant or the tank, helped with it …): they are
 * taken off the entry for good and any card of theirs for it is deleted. The reason is for the admins.
 */
export async function declareConflict(viewer: Viewer, contestId: number, number: number, reason: string, database: DbOrTx = appDb, now?: Date): Promise<void> {
	await database.transaction(async (tx) => {
		const { entry } = await access(tx, viewer, contestId, number);
		await tx
			.insert(contestConflicts)
			.values({ entryId: entry.id, judgeId: viewer.id, reason: reason.slice(0, CONFLICT_REASON_MAX), ...(now ? { declaredAt: now } : {}) });
		await tx.delete(contestCards).where(and(eq(contestCards.entryId, entry.id), eq(contestCards.judgeId, viewer.id)));
		await audit.record(tx, viewer.id, 'judge.conflict', contestId, { entryId: entry.id, number, reason: reason.slice(0, CONFLICT_REASON_MAX) }, now);
	});
}

// ---- Reminding judges ------------------------------------------------------------------------

/** Cards each judge of the panel still owes (empty or draft), for reminders. */
export async function openDuties(contestId: number, tx: DbOrTx = appDb): Promise<Map<string, number>> {
	const [judges, entries, conflicts, cards] = await Promise.all([
		panelIds(contestId, tx),
		tx.select({ entryId: contestEntries.id, entrantId: contestEntries.entrantId }).from(contestEntries).where(eq(contestEntries.contestId, contestId)),
		tx
			.select({ entryId: contestConflicts.entryId, judgeId: contestConflicts.judgeId })
			.from(contestConflicts)
			.innerJoin(contestEntries, eq(contestEntries.id, contestConflicts.entryId))
			.where(eq(contestEntries.contestId, contestId)),
		tx
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

export function judgeReminderMail(contest: Pick<ContestDetail, 'id' | 'title' | 'judgingClosesOn'>, judgeName: string, open: number, lead: string) {
	const cards = `${open} ${open === 1 ? 'card' : 'cards'}`;
	const { html, text } = renderMail({
		heading: `${cards} to finish for “${contest.title}”`,
		paragraphs: [
			`Hello ${judgeName},`,
			`${lead} You still have ${cards} to score and submit for “${contest.title}”. The judging window ends with ${contest.judgingClosesOn} (UTC).`,
			'Your drafts are saved as you type; a card counts once you submit it.'
		],
		action: { label: 'Go to your cards', url: absoluteUrl(`/judging/${contest.id}`) },
		footer: 'You get this mail because you are on this contest’s judging panel.'
	});
	return { subject: `Judging: ${cards} to finish for “${contest.title}”`, html, text };
}

/**
 * The admin reminds judges (all with open cards, or the ones named) by mail through the outbox.
 * One reminder per judge per hour: a double click sends nothing twice.
 */
export async function remindJudges(
	viewer: Viewer,
	contestId: number,
	judgeIds: string[] | null,
	options: { now?: Date; database?: DbOrTx } = {}
): Promise<number> {
	assertAdmin(viewer);
	const now = options.now ?? new Date();
	return (options.database ?? appDb).transaction(async (tx) => {
		const contest = await load(contestId, tx);
		if (!contest) throw new ContestNotFound('No such contest.');
		if (contest.state !== 'judging') throw new ContestError(409, 'Judges can be reminded while the contest is being judged.');
		const open = await openDuties(contestId, tx);
		const targets = [...open.entries()].filter(([id, n]) => n > 0 && (!judgeIds || judgeIds.includes(id)));
		const who = await people.byIds(
			targets.map(([id]) => id),
			tx
		);
		const hour = now.toISOString().slice(0, 13);
		const mails = targets.flatMap(([id, n]) => {
			const person = who.get(id);
			if (!person?.email) return [];
			return [
				{
					to: person.email,
					...judgeReminderMail(contest, person.displayName, n, 'A reminder from the contest admins.'),
					topic: `contest:${contestId}:nudge`,
					dedupeKey: `contest:${contestId}:nudge:${id}:${hour}`
				}
			];
		});
		await enqueue(mails, { db: tx, now });
		if (mails.length) await audit.record(tx, viewer.id, 'panel.remind', contestId, { judges: targets.map(([id]) => who.get(id)?.displayName ?? id) });
		return mails.length;
	});
}

export type { CardFields };
