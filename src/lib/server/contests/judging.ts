// Judging, from the judge's side: the blind view of the entries, their conflicts and their
// versioned cards. (The panel is in ./panel.ts, reminders to judges in ./reminders.ts.)
//
// Blind judging is decided here: a judge reaches an entry only through access() below, by its
// number, and what comes back (BlindEntry) carries no entrant, no tank name or id, no photo owner,
// photo id or photo text, no entry id and no exact figure of the tank. A judge never reaches their
// own entry or one they declared a conflict on.
import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as media from '../media';
import * as audit from '../audit';
import { statementShown, storedHtml } from '../markdown';
import { conflict, DomainError, notFound } from '../../errors';
import type { RenditionSize } from '../../media/urls';
import type { UnitSystem } from '../../club/roles';
import { cardsReopenable, type ContestState } from '../../contests/lifecycle';
import { checkDraftFields, emptyCardFields, normaliseFields, type CardSave } from '../../contests/card';
import { validateScorecard } from '../../contests/scoring';
import { aspectOf, blindFigures, type BlindFigures } from '../../contests/blind';
import type { CardView } from '../../contests/scorecard-autosave';
import { contestCards, contestConflicts, contestEntries, contestJudges, contests, type CardRow, type CategoryRow, type ContestEntryRow } from './schema';
import { auditSubject, load, rubricOf, ruleOf, windowsOf, type ContestDetail } from './contests';
import { SCOPE } from './contest-entries';

// ---- What a judge sees ---------------------------------------------------------------------

/**
 * A photo of an entry as a judge gets it. Entry photos are rows of their own (an upload attaches to
 * one thing only, so no tank photo is ever an entry photo), but /media/<id> would still give the
 * judge the photo's id, and ids are handed out in upload order: an entry photo's id sits next to
 * the ids of the photos its entrant put on their public journal in the same sitting, and those
 * pages name the tank. So judges get each photo at an address made of the entry's number and the
 * photo's place, /judging/<contest>/<number>/photos/<n>/<size>, checked by access() like
 * everything else a judge reaches (see entryPhoto below). The entrant's description and caption are
 * left out too: they are often copied from the tank's journal, and would match it. The shape is an
 * aspect ratio; the pixel size of a cropped photo could be matched as well.
 */
export interface BlindPhoto {
	/** 1 for the whole-tank photo. */
	position: number;
	urls: Record<RenditionSize, string>;
	/** Width ÷ height, to two decimals. */
	aspect: number;
	alt: string;
}

export const blindPhotoUrl = (contestId: number, number: number, position: number, size: RenditionSize) =>
	`/judging/${contestId}/${number}/photos/${position}/${size}`;

function blindPhotos(contestId: number, number: number, photos: media.Photo[]): BlindPhoto[] {
	return photos.map((p, i) => {
		const position = i + 1;
		const url = (size: RenditionSize) => blindPhotoUrl(contestId, number, position, size);
		return {
			position,
			urls: { thumb: url('thumb'), medium: url('medium'), large: url('large') },
			aspect: aspectOf(p.width, p.height),
			alt: `Entry ${number}, photo ${position} of ${photos.length}${position === 1 ? ': the whole tank from the front' : ''}`
		};
	});
}

/**
 * An entry as a judge sees it: by number, with photos and statement, and of the tank only what
 * judging needs in a form no tank page shows: the category's rule it met and banded figures
 * ($lib/contests/blind). Exact figures would match the tank's page.
 */
export interface BlindEntry {
	number: number;
	categoryName: string;
	categoryDescription: string;
	/** Without pictures: a picture's address in the statement could name the tank. */
	statementHtml: string;
	/** Pictures of the statement that were left out. */
	statementPictures: number;
	photos: BlindPhoto[];
	figures: BlindFigures;
}

/**
 * What judges read of an entry besides its photos: the statement without pictures and the tank's
 * figures as the category's rule and bands in the reader's units. Also shown to the entrant, so they
 * see what the judges see.
 */
export function blindText(
	entry: Pick<ContestEntryRow, 'statement' | 'statementHtml' | 'statementPictures' | 'litres' | 'ageWeeks'>,
	category: Pick<CategoryRow, 'minLitres' | 'maxLitres' | 'minAgeWeeks'>,
	units: UnitSystem
): Pick<BlindEntry, 'statementHtml' | 'statementPictures' | 'figures'> {
	return {
		...(entry.statementHtml !== null && entry.statementPictures !== null
			? { statementHtml: entry.statementHtml, statementPictures: entry.statementPictures }
			: statementShown(entry.statement)),
		figures: blindFigures(entry, ruleOf(category), units)
	};
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
export async function myContests(viewer: Viewer, context: Context = {}): Promise<JudgeContest[]> {
	if (viewer.role !== 'judge') return [];
	const { db: tx } = resolve(context);
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
export async function blindList(viewer: Viewer, contestId: number, context: Context = {}): Promise<BlindListing> {
	const { db: tx } = resolve(context);
	const contest = await load(contestId, context);
	if (!contest || !(await isJudgeOn(tx, viewer, contestId)) || contest.state !== 'judging') throw notFound('No such contest to judge.');
	const cells = await myCells(tx, viewer, contestId);
	const [own] = await tx
		.select({ n: count() })
		.from(contestEntries)
		.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.entrantId, viewer.id)));
	return {
		contest: {
			id: contest.id,
			title: contest.title,
			state: contest.state,
			judgingClosesOn: contest.judgingClosesOn,
			rulesHtml: storedHtml(contest.rulesHtml, contest.rules)
		},
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
	// The checks are read side by side; whichever fails, the answer is the same "not found".
	const [contest, onPanel, [entry], [declared]] = await Promise.all([
		load(contestId, { db: tx }),
		isJudgeOn(tx, viewer, contestId),
		tx
			.select()
			.from(contestEntries)
			.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.number, number)))
			.limit(1),
		tx
			.select({ judgeId: contestConflicts.judgeId })
			.from(contestConflicts)
			.innerJoin(contestEntries, eq(contestEntries.id, contestConflicts.entryId))
			.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.number, number), eq(contestConflicts.judgeId, viewer.id)))
			.limit(1)
	]);
	if (!contest || contest.state !== 'judging' || !onPanel) throw notFound('No such entry to judge.');
	if (!entry || entry.entrantId === viewer.id || declared) throw notFound('No such entry to judge.');
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

export async function scorecardPage(viewer: Viewer, contestId: number, number: number, context: Context = {}): Promise<ScorecardPage> {
	const { db: tx } = resolve(context);
	const { contest, entry } = await access(tx, viewer, contestId, number);
	const category = contest.categories.find((c) => c.id === entry.categoryId)!;
	const photos = await media.listFor(SCOPE, entry.id, { db: tx });
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
			...blindText(entry, category, viewer.units),
			photos: blindPhotos(contest.id, number, photos)
		},
		rubric: contest.criteria.map((c) => ({ id: String(c.id), label: c.label, guidance: c.guidance, maxPoints: c.maxPoints, weight: c.weight })),
		previous: at > 0 ? cells[at - 1]!.number : null,
		next: at >= 0 && at < cells.length - 1 ? cells[at + 1]!.number : null,
		panelNotes: notes
	};
}

/** One rendition of an entry's photo (`position` 1 is the whole-tank photo), for a judge who may reach the entry. */
export async function entryPhoto(
	viewer: Viewer,
	contestId: number,
	number: number,
	position: number,
	size: RenditionSize,
	context: Context = {}
): Promise<media.RenditionHandle> {
	const { db } = resolve(context);
	const { entry } = await access(db, viewer, contestId, number);
	const rendition = await media.renditionAt(SCOPE, entry.id, position - 1, size);
	if (!rendition) throw notFound('No such photo.');
	return rendition;
}

// ---- Cards ---------------------------------------------------------------------------------

/** A save based on a version older than the stored one; the browser's save queue acts on the code and `current`. */
const versionConflict = (current: CardView) => conflict('version-conflict', 'This card was saved from another window or device in the meantime.', { current });

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

export async function getCard(viewer: Viewer, contestId: number, number: number, context: Context = {}): Promise<CardView> {
	const { db: tx, now } = resolve(context);
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
 * than the stored one ('version-conflict', with the stored card as `current`), or when a score is
 * out of range. A repeat of the last save (same save id) answers as the first time did and changes nothing.
 */
export async function saveCard(viewer: Viewer, contestId: number, number: number, save: CardSave, context: Context = {}): Promise<CardView> {
	const { db, now } = resolve(context);
	return cardTransaction(db, async (tx) => {
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
		if (card?.status === 'submitted') throw conflict('submitted', 'This card is submitted. Reopen it to change it.');
		if (!card || card.version !== save.baseVersion) throw versionConflict(current);
		const checked = checkDraftFields(rubricOf(contest.criteria), save.fields);
		if (!checked.ok) throw new DomainError(400, 'invalid', checked.message);
		await tx
			.update(contestCards)
			.set({ fields: checked.fields, version: card.version + 1, lastSaveId: save.saveId, updatedAt: now })
			.where(eq(contestCards.id, card.id));
		return { ...current, version: card.version + 1, fields: checked.fields, lastSaveId: save.saveId, updatedAt: now.toISOString() };
	});
}

/** The audit log's subject for a judge's card; its submissions and reopenings are recorded there. */
const cardAuditSubject = (cardId: number) => ({ type: 'contest-card', id: cardId });

/** Moves a card to `status` as a new version, recorded in the audit log; answers the card as it now is. */
async function setStatus(
	tx: DbOrTx,
	viewer: Viewer,
	{ contest, entry }: Access,
	card: CardRow,
	status: CardRow['status'],
	context: Context
): Promise<CardView> {
	const { now } = resolve(context);
	const changed = { status, submittedAt: status === 'submitted' ? now : null, updatedAt: now, version: card.version + 1 };
	await tx.update(contestCards).set(changed).where(eq(contestCards.id, card.id));
	await audit.record(
		{
			actorId: viewer.id,
			action: status === 'submitted' ? 'card.submit' : 'card.reopen',
			subject: cardAuditSubject(card.id),
			detail: { contestId: contest.id, entryId: entry.id, number: entry.number, version: changed.version }
		},
		within(context, tx)
	);
	return view(contest, { ...card, ...changed }, now);
}

/** Submits the card the judge last saw (its version); every criterion needs a score. */
export async function submitCard(viewer: Viewer, contestId: number, number: number, version: number, context: Context = {}): Promise<CardView> {
	const { db, now } = resolve(context);
	return cardTransaction(db, async (tx) => {
		const reached = await access(tx, viewer, contestId, number);
		const card = await cardRow(tx, reached.entry.id, viewer.id, true);
		const current = view(reached.contest, card, now);
		if (!card || card.version === 0) throw new DomainError(400, 'incomplete', 'Score every criterion first.');
		if (card.status === 'submitted') return current;
		if (card.version !== version) throw versionConflict(current);
		const check = validateScorecard(rubricOf(reached.contest.criteria), card.fields.scores);
		if (!check.submittable) throw new DomainError(400, 'incomplete', check.errors.map((e) => e.message).join(' '));
		return setStatus(tx, viewer, reached, card, 'submitted', { ...context, now });
	});
}

/** Reopens a submitted card while the judging window lasts. */
export async function reopenCard(viewer: Viewer, contestId: number, number: number, context: Context = {}): Promise<CardView> {
	const { db, now } = resolve(context);
	return cardTransaction(db, async (tx) => {
		const reached = await access(tx, viewer, contestId, number);
		const { contest } = reached;
		const card = await cardRow(tx, reached.entry.id, viewer.id, true);
		if (!card || card.status !== 'submitted') return view(contest, card, now);
		if (!cardsReopenable(contest.state, windowsOf(contest), now)) {
			throw conflict('closed', `The judging window closed on ${contest.judgingClosesOn}; submitted cards can no longer be reopened.`);
		}
		return setStatus(tx, viewer, reached, card, 'draft', { ...context, now });
	});
}

export const CONFLICT_REASON_MAX = 300;

/**
 * The judge declares a conflict (they know the entrant or the tank, helped with it …): they are
 * taken off the entry for good and any card of theirs for it is deleted. The reason is for the admins.
 */
export async function declareConflict(viewer: Viewer, contestId: number, number: number, reason: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const { entry } = await access(tx, viewer, contestId, number);
		const kept = reason.slice(0, CONFLICT_REASON_MAX);
		await tx.insert(contestConflicts).values({ entryId: entry.id, judgeId: viewer.id, reason: kept, ...(context.now ? { declaredAt: context.now } : {}) });
		await tx.delete(contestCards).where(and(eq(contestCards.entryId, entry.id), eq(contestCards.judgeId, viewer.id)));
		await audit.record(
			{ actorId: viewer.id, action: 'judge.conflict', subject: auditSubject(contestId), detail: { entryId: entry.id, number, reason: kept } },
			within(context, tx)
		);
	});
}
