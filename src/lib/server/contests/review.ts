// The server's arithmetic, done openly: loads a contest's entries, panel, conflicts and cards,
// hands them to $lib/contests (computeResults) and shapes what the admin's review, the progress
// matrix, the public results and each entrant's feedback show. Also the state transitions that
// depend on it (publication) and the corrections admins may make after publication.
import { and, asc, eq, sql } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as media from '../media';
import * as tanks from '../journals/tanks';
import type { Photo } from '../media';
import * as audit from '../audit';
import { conflict, DomainError, invalid, notFound } from '../../errors';
import { nameOf } from '../../club/names';
import { computeResults, type RankBasis, type ResultsInput, type ResultsReport, type EntryResult } from '../../contests/results';
import { checkDraftFields, normaliseFields, type CardFields } from '../../contests/card';
import { validateScorecard } from '../../contests/scoring';
import { AUDITED_REASON_MIN, TRANSITIONS, transitionProblems, type TransitionName } from '../../contests/lifecycle';
import type { MatrixCell, ProgressMatrix } from '../../contests/progress';
import type { PublishedCategory, PublishedEntry, PublishedResults } from '../../contests/published';
import { contestCards, contestConflicts, contestEntries, contestResults, contests, type CardRow, type ContestEntryRow } from './schema';
import { adminChange, assertAdmin, auditSubject, load, lockedRow, rubricOf, tieBreakOf, windowsOf, type ContestDetail } from './contests';
import { SCOPE } from './contest-entries';
import { panelIds } from './panel';

export interface ContestData {
	contest: ContestDetail;
	entries: ContestEntryRow[];
	panel: directory.Member[];
	conflicts: { entryId: number; judgeId: string; reason: string }[];
	cards: CardRow[];
	/** Entrants, judges, anyone with a card. */
	people: Map<string, directory.Member>;
}

export async function loadData(contestId: number, context: Context = {}): Promise<ContestData | null> {
	const { db: tx } = resolve(context);
	const contest = await load(contestId, context);
	if (!contest) return null;
	const [entries, judgeIds, conflicts, cards] = await Promise.all([
		tx.select().from(contestEntries).where(eq(contestEntries.contestId, contestId)).orderBy(asc(contestEntries.number), asc(contestEntries.id)),
		panelIds(contestId, context),
		tx
			.select({ entryId: contestConflicts.entryId, judgeId: contestConflicts.judgeId, reason: contestConflicts.reason })
			.from(contestConflicts)
			.innerJoin(contestEntries, eq(contestEntries.id, contestConflicts.entryId))
			.where(eq(contestEntries.contestId, contestId)),
		tx.select().from(contestCards).where(eq(contestCards.contestId, contestId)).orderBy(asc(contestCards.id))
	]);
	const who = await directory.byIds([...entries.map((e) => e.entrantId), ...judgeIds, ...cards.map((c) => c.judgeId)], context);
	const panel = judgeIds
		.map((id) => who.get(id))
		.filter((p): p is directory.Member => !!p)
		.sort((a, b) => a.name.localeCompare(b.name));
	return { contest, entries, panel, conflicts, cards: cards.filter((c) => c.version > 0), people: who };
}

export function inputOf(data: ContestData, rankBy: RankBasis = data.contest.rankBy): ResultsInput {
	return {
		rubric: rubricOf(data.contest.criteria),
		tieBreakOrder: tieBreakOf(data.contest.criteria),
		method: data.contest.aggregation,
		rankBy,
		categoryIds: data.contest.categories.map((c) => String(c.id)),
		entries: data.entries.map((e) => ({ entryId: String(e.id), categoryId: String(e.categoryId), entrantId: e.entrantId })),
		judgeIds: data.panel.map((p) => p.id),
		conflicts: data.conflicts.map((c) => ({ entryId: String(c.entryId), judgeId: c.judgeId })),
		cards: data.cards.map((c) => ({ cardId: String(c.id), entryId: String(c.entryId), judgeId: c.judgeId, status: c.status, scores: c.fields.scores }))
	};
}

/** A member's name in the contest's data: the entrant, a judge; "A member" for someone who left. */
export const nameIn = (data: ContestData, id: string) => data.people.get(id)?.name ?? nameOf(null);

export function progressMatrix(data: ContestData, report: ResultsReport): ProgressMatrix {
	const excluded = new Map(report.duties.excluded.map((x) => [`${x.entryId}|${x.judgeId}`, x.reason]));
	const cardState = new Map(data.cards.map((c) => [`${c.entryId}|${c.judgeId}`, c.status]));
	const categoryName = new Map(data.contest.categories.map((c) => [c.id, c.name]));
	const order = new Map(data.contest.categories.map((c, i) => [c.id, i]));
	const rows = [...data.entries]
		.sort((a, b) => order.get(a.categoryId)! - order.get(b.categoryId)! || (a.number ?? a.id) - (b.number ?? b.id))
		.map((e) => ({
			entryId: e.id,
			number: e.number,
			category: categoryName.get(e.categoryId) ?? '',
			entrant: nameIn(data, e.entrantId),
			cells: data.panel.map((j): MatrixCell => {
				const reason = excluded.get(`${e.id}|${j.id}`);
				if (reason) return reason === 'self-entry' ? 'self' : 'conflicted';
				return cardState.get(`${e.id}|${j.id}`) ?? 'empty';
			})
		}));
	const byJudge = new Map(report.readiness.byJudge.map((j) => [j.judgeId, j]));
	return {
		judges: data.panel.map((j) => ({
			id: j.id,
			name: j.name,
			submitted: byJudge.get(j.id)?.submitted ?? 0,
			expected: byJudge.get(j.id)?.expected ?? 0
		})),
		rows
	};
}

/** Everything the admin's review page shows. */
export async function review(viewer: Viewer, contestId: number, context: Context = {}) {
	assertAdmin(viewer);
	const data = await loadData(contestId, context);
	if (!data) return null;
	const report = computeResults(inputOf(data));
	return { data, report, matrix: progressMatrix(data, report) };
}

// ---- Transitions -------------------------------------------------------------------------

/** Random entry numbers 1…n, so the order of numbers tells judges nothing about who entered when. */
function shuffledNumbers(n: number): number[] {
	const numbers = Array.from({ length: n }, (_, i) => i + 1);
	for (let i = n - 1; i > 0; i--) {
		const j = crypto.getRandomValues(new Uint32Array(1))[0]! % (i + 1);
		[numbers[i], numbers[j]] = [numbers[j]!, numbers[i]!];
	}
	return numbers;
}

export interface TransitionOptions {
	/** Why the admin publishes with cards missing (kept in the log). */
	overrideReason?: string | null;
}

/** Takes one admin step in the contest's life, after the confirmation step; recorded in the audit log. */
export async function transition(
	viewer: Viewer,
	contestId: number,
	name: TransitionName,
	options: TransitionOptions = {},
	context: Context = {}
): Promise<void> {
	const { now } = resolve(context);
	await adminChange(viewer, contestId, context, async ({ contest: locked, tx, context: inTx }) => {
		const data = (await loadData(contestId, inTx))!;
		const report = computeResults(inputOf(data));
		const override = report.readiness.ready ? null : (options.overrideReason ?? '').trim() || null;
		const problems = transitionProblems(name, {
			state: locked.state,
			title: locked.title,
			windows: windowsOf(locked),
			rubric: rubricOf(data.contest.criteria),
			categories: data.contest.categories.length,
			entries: data.entries.length,
			judges: data.panel.length,
			judgingComplete: report.readiness.ready,
			overrideReason: override
		});
		if (problems.length) throw conflict('not-ready', problems.join(' '));
		const to = TRANSITIONS[name].to;
		const stamp =
			name === 'open-entries'
				? { openedAt: now }
				: name === 'start-judging'
					? { judgingStartedAt: now }
					: name === 'publish'
						? { publishedAt: now }
						: { archivedAt: now };
		await tx
			.update(contests)
			.set({ state: to, ...stamp, updatedAt: now })
			.where(eq(contests.id, contestId));
		if (name === 'start-judging') {
			const numbers = shuffledNumbers(data.entries.length);
			for (const [i, entry] of data.entries.entries()) {
				await tx.update(contestEntries).set({ number: numbers[i]! }).where(eq(contestEntries.id, entry.id));
			}
		}
		const detail: Record<string, unknown> = { from: locked.state, to };
		if (name === 'start-judging') detail.entries = data.entries.length;
		if (name === 'publish') {
			detail.cards = report.readiness.overall;
			if (override) {
				detail.overrideReason = override;
				detail.missing = report.readiness.missing.map((m) => ({
					number: data.entries.find((e) => String(e.id) === m.entryId)?.number ?? null,
					judge: data.people.get(m.judgeId)?.name ?? m.judgeId,
					state: m.state
				}));
			}
		}
		if (name === 'publish') await keepResults(contestId, locked.resultsRevision, inTx, { data, report });
		await audit.record({ actorId: viewer.id, action: `contest.${name}`, subject: auditSubject(contestId), detail }, { ...inTx, now });
	});
}

// ---- Public results and feedback ---------------------------------------------------------------

export interface PublicEntry extends PublishedEntry {
	entrantName: string;
	photos: Photo[];
	/** The entered tank, only while its journal is public (for a link from the results). */
	publicTankId: number | null;
}

export interface PublicCategory extends Omit<PublishedCategory, 'entries'> {
	entries: PublicEntry[];
}

export const PUBLIC_CORRECTION_ACTIONS = ['results.amend-card', 'results.rank-by'];

function shape(data: ContestData, result: EntryResult): PublishedEntry {
	const entry = data.entries.find((e) => String(e.id) === result.entryId)!;
	const criteria = data.contest.criteria;
	const cards = new Map(data.cards.map((c) => [String(c.id), c]));
	const separated = result.separatedFromAbove ? (criteria.find((c) => String(c.id) === result.separatedFromAbove!.criterionId)?.label ?? null) : null;
	return {
		entryId: entry.id,
		number: entry.number,
		categoryId: entry.categoryId,
		entrantId: entry.entrantId,
		place: result.place,
		placeRaw: result.placeRaw,
		placeStandardised: result.placeStandardised,
		sharedWith: result.sharedWith.length,
		tieBrokenBy: separated,
		score: result.score,
		standardised: result.standardised,
		cardCount: result.cards.length,
		method: result.aggregate?.total.used ?? data.contest.aggregation,
		methodNote: result.aggregate?.total.note ?? null,
		criteria: criteria.map((c) => ({
			id: String(c.id),
			label: c.label,
			maxPoints: c.maxPoints,
			value: result.aggregate?.criteria[String(c.id)]?.value ?? null
		})),
		comments: result.cards.map((c) => cards.get(c.cardId)?.fields.entrantComment.trim() ?? '').filter(Boolean),
		litres: entry.litres,
		ageWeeks: entry.ageWeeks,
		tankId: entry.tankId
	};
}

/** The results as they are kept: computed from the cards, without names or photos. */
function recordOf(data: ContestData, report: ResultsReport): PublishedResults {
	return {
		categories: data.contest.categories.map((category, i) => {
			const cat = report.categories[i]!;
			return {
				id: category.id,
				name: category.name,
				description: category.description,
				unevenPanel: cat.unevenPanel,
				entries: cat.entries.map((r) => shape(data, r))
			};
		}),
		panelIds: data.panel.map((p) => p.id),
		unevenPanel: report.unevenPanel
	};
}

/**
 * Computes the contest's results from its cards and keeps them as the record of `revision`: at
 * publication and after each correction, inside the change's transaction. A record already kept
 * for that revision stays (results do not change within a revision).
 */
async function keepResults(contestId: number, revision: number, context: Context, computed?: { data: ContestData; report: ResultsReport }) {
	const { db } = resolve(context);
	const data = computed?.data ?? (await loadData(contestId, context))!;
	const report = computed?.report ?? computeResults(inputOf(data));
	const results = recordOf(data, report);
	await db
		.insert(contestResults)
		.values({ contestId, revision, results })
		.onDuplicateKeyUpdate({ set: { contestId: sql`contest_id` } });
	return results;
}

/** The kept record of the contest's current results revision; one computed and kept when there is none yet (results published before records were kept). */
async function keptResults(contest: ContestDetail, context: Context): Promise<PublishedResults> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ results: contestResults.results })
		.from(contestResults)
		.where(and(eq(contestResults.contestId, contest.id), eq(contestResults.revision, contest.resultsRevision)))
		.limit(1);
	return row?.results ?? keepResults(contest.id, contest.resultsRevision, context);
}

export interface PublicResults {
	contest: ContestDetail;
	categories: PublicCategory[];
	panel: string[];
	corrections: audit.AuditEntry[];
	unevenPanel: boolean;
}

/** The published results: ranked entries with names revealed; null before publication. */
export async function publicResults(contestId: number, context: Context = {}): Promise<PublicResults | null> {
	const contest = await load(contestId, context);
	return contest ? publishedResultsOf(contest, context) : null;
}

/** The published results of a contest already loaded (with its rubric and categories); null before publication. */
export async function publishedResultsOf(contest: ContestDetail, context: Context = {}): Promise<PublicResults | null> {
	if (contest.state !== 'published' && contest.state !== 'archived') return null;
	const kept = await keptResults(contest, context);
	const entries = kept.categories.flatMap((c) => c.entries);
	const [people, photos, corrections, publicTanks] = await Promise.all([
		directory.byIds([...entries.map((e) => e.entrantId), ...kept.panelIds], context),
		media.listForMany(
			SCOPE,
			entries.map((e) => e.entryId),
			context
		),
		audit.trail(auditSubject(contest.id), PUBLIC_CORRECTION_ACTIONS, context),
		tanks.publicIds(
			entries.flatMap((e) => (e.tankId == null ? [] : [e.tankId])),
			context
		)
	]);
	return {
		contest,
		categories: kept.categories.map((category) => ({
			...category,
			entries: category.entries.map((e) => ({
				...e,
				entrantName: people.get(e.entrantId)?.name ?? nameOf(null),
				photos: photos.get(e.entryId) ?? [],
				publicTankId: e.tankId != null && publicTanks.has(e.tankId) ? e.tankId : null
			}))
		})),
		panel: kept.panelIds.map((id) => people.get(id)?.name ?? nameOf(null)),
		corrections,
		unevenPanel: kept.unevenPanel
	};
}

export interface Feedback {
	entry: PublicEntry;
	categoryName: string;
	entriesInCategory: number;
	cards: {
		label: string;
		total: number;
		dropped: 'low' | 'high' | null;
		scores: { label: string; maxPoints: number; score: number | null; comment: string }[];
		comment: string;
	}[];
}

/** An entrant's full feedback on their entry (or an admin's view of it), after publication. */
export async function feedback(viewer: Viewer, entryId: number, context: Context = {}): Promise<Feedback | null> {
	const { db: tx } = resolve(context);
	const [entry] = await tx.select().from(contestEntries).where(eq(contestEntries.id, entryId)).limit(1);
	if (!entry || (entry.entrantId !== viewer.id && viewer.role !== 'admin')) return null;
	const data = await loadData(entry.contestId, context);
	if (!data || (data.contest.state !== 'published' && data.contest.state !== 'archived')) return null;
	const report = computeResults(inputOf(data));
	const index = data.contest.categories.findIndex((c) => c.id === entry.categoryId);
	const cat = report.categories[index]!;
	const result = cat.entries.find((e) => e.entryId === String(entryId))!;
	const [photos, publicTanks] = await Promise.all([
		media.listForMany(SCOPE, [entryId], { db: tx }),
		tanks.publicIds(entry.tankId === null ? [] : [entry.tankId], { db: tx })
	]);
	const cards = new Map(data.cards.map((c) => [String(c.id), c]));
	return {
		entry: {
			...shape(data, result),
			entrantName: nameIn(data, entry.entrantId),
			photos: photos.get(entryId) ?? [],
			publicTankId: entry.tankId !== null && publicTanks.has(entry.tankId) ? entry.tankId : null
		},
		categoryName: data.contest.categories[index]!.name,
		entriesInCategory: cat.entries.length,
		cards: result.cards.map((c, i) => {
			const fields = cards.get(c.cardId)!.fields;
			return {
				label: `Judge ${i + 1}`,
				total: c.total,
				dropped: c.dropped,
				comment: fields.entrantComment,
				scores: data.contest.criteria.map((k) => ({
					label: k.label,
					maxPoints: k.maxPoints,
					score: fields.scores[String(k.id)] ?? null,
					comment: fields.comments[String(k.id)] ?? ''
				}))
			};
		})
	};
}

// ---- Corrections after publication --------------------------------------------------------------

function requireReason(reason: string | null | undefined): string {
	const r = (reason ?? '').trim();
	if (r.length < AUDITED_REASON_MIN) {
		throw invalid({ reason: 'Give a reason.' }, `Give a reason of at least ${AUDITED_REASON_MIN} characters; it is shown with the results.`, 'reason');
	}
	return r;
}

/** Ranking basis: before publication a setting; after it a correction with a reason, shown publicly. */
export async function setRankBy(viewer: Viewer, contestId: number, rankBy: RankBasis, reason: string | null, context: Context = {}): Promise<void> {
	const { now } = resolve(context);
	await adminChange(viewer, contestId, context, async ({ contest: c, tx, context: inTx }) => {
		if (c.rankBy === rankBy) return;
		if (c.state === 'archived') throw conflict('archived', 'An archived contest cannot be changed.');
		const published = c.state === 'published';
		const why = published ? requireReason(reason) : null;
		await tx
			.update(contests)
			.set({ rankBy, updatedAt: now, ...(published ? { resultsRevision: c.resultsRevision + 1 } : {}) })
			.where(eq(contests.id, contestId));
		if (published) await keepResults(contestId, c.resultsRevision + 1, inTx);
		await audit.record(
			{
				actorId: viewer.id,
				action: published ? 'results.rank-by' : 'contest.rank-by',
				subject: auditSubject(contestId),
				detail: { from: c.rankBy, to: rankBy, ...(why ? { reason: why } : {}) }
			},
			inTx
		);
	});
}

/** A card of the contest as the admin's correction form shows it; null when there is no such card. */
export async function cardToCorrect(viewer: Viewer, contestId: number, cardId: number, context: Context = {}) {
	assertAdmin(viewer);
	const data = await loadData(contestId, context);
	const card = data?.cards.find((c) => c.id === cardId);
	if (!data || !card) return null;
	const entry = data.entries.find((e) => e.id === card.entryId)!;
	return {
		contest: data.contest,
		card,
		fields: normaliseFields(rubricOf(data.contest.criteria), card.fields),
		judge: nameIn(data, card.judgeId),
		number: entry.number,
		entrant: nameIn(data, entry.entrantId)
	};
}

/** An admin corrects a submitted card after publication (say a judge reports a slip), with a reason. */
export async function amendCard(viewer: Viewer, cardId: number, fields: CardFields, reason: string, context: Context = {}): Promise<number> {
	assertAdmin(viewer);
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const [card] = await tx.select().from(contestCards).where(eq(contestCards.id, cardId)).for('update');
		if (!card) throw notFound('No such card.');
		const c = await lockedRow(card.contestId, { db: tx });
		if (!c || c.state !== 'published') {
			throw conflict('not-published', 'Cards can be corrected only while the results are published (not before, and not once archived).');
		}
		if (card.status !== 'submitted') throw conflict('not-submitted', 'Only submitted cards count, so only they can be corrected.');
		const why = requireReason(reason);
		const detail = (await load(c.id, { db: tx }))!;
		const rubric = rubricOf(detail.criteria);
		const checked = checkDraftFields(rubric, fields);
		if (!checked.ok) throw new DomainError(400, 'invalid', checked.message);
		if (!validateScorecard(rubric, checked.fields.scores).submittable) throw new DomainError(400, 'incomplete', 'Every criterion needs a score.');
		const before = normaliseFields(rubric, card.fields);
		await tx
			.update(contestCards)
			.set({ fields: { ...checked.fields, panelNote: before.panelNote }, version: card.version + 1, updatedAt: now })
			.where(eq(contestCards.id, cardId));
		await tx
			.update(contests)
			.set({ resultsRevision: c.resultsRevision + 1, updatedAt: now })
			.where(eq(contests.id, c.id));
		await keepResults(c.id, c.resultsRevision + 1, within(context, tx));
		const [entry] = await tx.select({ number: contestEntries.number }).from(contestEntries).where(eq(contestEntries.id, card.entryId));
		await audit.record(
			{
				actorId: viewer.id,
				action: 'results.amend-card',
				subject: auditSubject(c.id),
				detail: { reason: why, cardId, entryNumber: entry?.number ?? null, before: before.scores, after: checked.fields.scores }
			},
			within(context, tx)
		);
		return c.id;
	});
}
