// Contests, their rubric and categories. Every read takes the viewer: a contest in preparation is
// the admins' alone (anyone else gets null, so the page answers 404); from the moment it opens
// its rules, categories and dates are public.
import { and, asc, count, desc, eq, inArray, notInArray } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import { conflict, forbidden, notFound } from '../../errors';
import type { Rubric } from '../../contests/rubric';
import { entriesAccepted, type ContestWindows, type ContestState } from '../../contests/lifecycle';
import type { ContestDraft, ContestInput } from '../../contests/contest-form';
import type { EligibilityRule } from '../../contests/eligibility';
import { contestCategories, contestCriteria, contestEntries, contests, type CategoryRow, type ContestRow, type CriterionRow } from './schema';

export interface ContestDetail extends ContestRow {
	criteria: CriterionRow[];
	categories: CategoryRow[];
}
import { renderMarkdown } from '../markdown';

export const isAdminViewer = (viewer: Pick<Viewer, 'role'> | null | undefined) => viewer?.role === 'admin';

/** Every admin command of the contests checks the role itself, whatever the route checked. */
export function assertAdmin(viewer: Viewer): void {
	if (viewer.role !== 'admin') throw forbidden('Only admins can do this.');
}

/** The audit log's subject for a contest: its state steps, panel, conflicts, corrections. */
export const auditSubject = (contestId: number) => ({ type: 'contest', id: contestId });

export const canSee = (viewer: Pick<Viewer, 'role'> | null | undefined, contest: Pick<ContestRow, 'state'>) =>
	contest.state !== 'draft' || isAdminViewer(viewer);

/** The rubric as the judging functions take it: criterion ids as strings, in display order. */
export const rubricOf = (criteria: readonly CriterionRow[]): Rubric =>
	[...criteria].sort((a, b) => a.position - b.position).map((c) => ({ id: String(c.id), label: c.label, maxPoints: c.maxPoints, weight: c.weight }));

/** Criterion ids in the order they break ties. */
export const tieBreakOf = (criteria: readonly CriterionRow[]): string[] =>
	[...criteria].sort((a, b) => a.tieBreakRank - b.tieBreakRank || a.position - b.position).map((c) => String(c.id));

export const windowsOf = (c: Pick<ContestRow, 'entryOpensOn' | 'entryClosesOn' | 'judgingOpensOn' | 'judgingClosesOn'>): ContestWindows => ({
	entryOpensOn: c.entryOpensOn,
	entryClosesOn: c.entryClosesOn,
	judgingOpensOn: c.judgingOpensOn,
	judgingClosesOn: c.judgingClosesOn
});

export const ruleOf = (c: Pick<CategoryRow, 'minLitres' | 'maxLitres' | 'minAgeWeeks'>): EligibilityRule => ({
	minLitres: c.minLitres,
	maxLitres: c.maxLitres,
	minAgeWeeks: c.minAgeWeeks
});

/** Members may enter, change or withdraw entries now. */
export const acceptingEntries = (contest: Pick<ContestRow, 'state' | 'entryClosesOn'>, context: Context = {}) =>
	entriesAccepted(contest.state, contest, resolve(context).now);

export async function row(id: number, context: Context = {}): Promise<ContestRow | undefined> {
	const { db } = resolve(context);
	const [found] = await db.select().from(contests).where(eq(contests.id, id)).limit(1);
	return found;
}

/** The contest's row, locked for the rest of the caller's transaction (`context.db`). */
export async function lockedRow(id: number, context: Context): Promise<ContestRow | undefined> {
	const { db } = resolve(context);
	const [found] = await db.select().from(contests).where(eq(contests.id, id)).limit(1).for('update');
	return found;
}

export interface AdminStep {
	/** The contest's row, locked until the step commits. */
	contest: ContestRow;
	tx: DbOrTx;
	/** The caller's context inside the transaction. */
	context: Context;
}

/**
 * An admin's change to a contest: the role checked here (whatever the route checked), one
 * transaction, the contest's row locked so two admins' steps queue; "not found" without it.
 */
export async function adminChange<T>(viewer: Viewer, contestId: number, context: Context, step: (on: AdminStep) => Promise<T>): Promise<T> {
	assertAdmin(viewer);
	const { db } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within(context, tx);
		const contest = await lockedRow(contestId, inTx);
		if (!contest) throw notFound('No such contest.');
		return step({ contest, tx, context: inTx });
	});
}

export async function load(id: number, context: Context = {}): Promise<ContestDetail | null> {
	const { db: tx } = resolve(context);
	const found = await row(id, context);
	if (!found) return null;
	const [criteria, categories] = await Promise.all([
		tx.select().from(contestCriteria).where(eq(contestCriteria.contestId, id)).orderBy(asc(contestCriteria.position), asc(contestCriteria.id)),
		tx.select().from(contestCategories).where(eq(contestCategories.contestId, id)).orderBy(asc(contestCategories.position), asc(contestCategories.id))
	]);
	return { ...found, criteria, categories };
}

/** The contest with its rubric and categories, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, context: Context = {}): Promise<ContestDetail | null> {
	const found = await load(id, context);
	if (!found || !canSee(viewer, found)) return null;
	return found;
}

export interface ContestSummary {
	id: number;
	title: string;
	state: ContestState;
	entryOpensOn: string;
	entryClosesOn: string;
	judgingClosesOn: string;
	publishedAt: Date | null;
	entries: number;
	categories: string[];
}

export const RESULTS_PAGE_SIZE = 10;

async function summarise(rows: ContestRow[], tx: DbOrTx): Promise<ContestSummary[]> {
	if (rows.length === 0) return [];
	const ids = rows.map((r) => r.id);
	const [counts, cats] = await Promise.all([
		tx
			.select({ contestId: contestEntries.contestId, n: count() })
			.from(contestEntries)
			.where(inArray(contestEntries.contestId, ids))
			.groupBy(contestEntries.contestId),
		tx
			.select({ contestId: contestCategories.contestId, name: contestCategories.name })
			.from(contestCategories)
			.where(inArray(contestCategories.contestId, ids))
			.orderBy(asc(contestCategories.position))
	]);
	const countOf = new Map(counts.map((c) => [c.contestId, c.n]));
	return rows.map((r) => ({
		id: r.id,
		title: r.title,
		state: r.state,
		entryOpensOn: r.entryOpensOn,
		entryClosesOn: r.entryClosesOn,
		judgingClosesOn: r.judgingClosesOn,
		publishedAt: r.publishedAt,
		entries: countOf.get(r.id) ?? 0,
		categories: cats.filter((c) => c.contestId === r.id).map((c) => c.name)
	}));
}

/** The contests page: open for entries, being judged, results (paged), and for admins the ones in preparation. */
export async function list(viewer: Viewer | null, options: { page: number }, context: Context = {}) {
	const { db: tx } = resolve(context);
	const byState = (states: ContestState[]) =>
		tx.select().from(contests).where(inArray(contests.state, states)).orderBy(asc(contests.entryClosesOn), asc(contests.id));
	const [open, judging, drafts, [total]] = await Promise.all([
		byState(['open']),
		byState(['judging']),
		isAdminViewer(viewer) ? byState(['draft']) : Promise.resolve([]),
		tx
			.select({ n: count() })
			.from(contests)
			.where(inArray(contests.state, ['published', 'archived']))
	]);
	const results = await tx
		.select()
		.from(contests)
		.where(inArray(contests.state, ['published', 'archived']))
		.orderBy(desc(contests.publishedAt), desc(contests.id))
		.limit(RESULTS_PAGE_SIZE)
		.offset((options.page - 1) * RESULTS_PAGE_SIZE);
	return {
		open: await summarise(open, tx),
		judging: await summarise(judging, tx),
		drafts: await summarise(drafts, tx),
		results: await summarise(results, tx),
		resultPages: Math.max(1, Math.ceil((total?.n ?? 0) / RESULTS_PAGE_SIZE))
	};
}

/** Every contest for the admin list, newest first. */
export async function listAll(viewer: Viewer, context: Context = {}): Promise<ContestSummary[]> {
	assertAdmin(viewer);
	const { db } = resolve(context);
	return summarise(await db.select().from(contests).orderBy(desc(contests.id)), db);
}

function settings(input: ContestInput) {
	return {
		title: input.title,
		rules: input.rules,
		entryOpensOn: input.entryOpensOn,
		entryClosesOn: input.entryClosesOn,
		judgingOpensOn: input.judgingOpensOn,
		judgingClosesOn: input.judgingClosesOn
	};
}

/**
 * Brings the criteria and categories in line with the form. Only while the contest is in
 * preparation, when no entry or card can point at them yet.
 */
async function writeRubricAndCategories(tx: DbOrTx, contestId: number, input: ContestInput) {
	const rank = new Map(input.tieBreak.map((key, i) => [key, i + 1]));
	const existingCriteria = new Set(
		(await tx.select({ id: contestCriteria.id }).from(contestCriteria).where(eq(contestCriteria.contestId, contestId))).map((r) => r.id)
	);
	const keptCriteria: number[] = [];
	for (const [position, c] of input.criteria.entries()) {
		const values = { position, label: c.label, guidance: c.guidance, maxPoints: c.maxPoints, weight: c.weight, tieBreakRank: rank.get(c.key) ?? position + 1 };
		if (c.id !== null && existingCriteria.has(c.id)) {
			await tx.update(contestCriteria).set(values).where(eq(contestCriteria.id, c.id));
			keptCriteria.push(c.id);
		} else {
			const [result] = await tx.insert(contestCriteria).values({ ...values, contestId });
			keptCriteria.push(result.insertId);
		}
	}
	await tx
		.delete(contestCriteria)
		.where(
			keptCriteria.length
				? and(eq(contestCriteria.contestId, contestId), notInArray(contestCriteria.id, keptCriteria))
				: eq(contestCriteria.contestId, contestId)
		);

	const existingCategories = new Set(
		(await tx.select({ id: contestCategories.id }).from(contestCategories).where(eq(contestCategories.contestId, contestId))).map((r) => r.id)
	);
	const keptCategories: number[] = [];
	for (const [position, c] of input.categories.entries()) {
		const values = { position, name: c.name, description: c.description, minLitres: c.minLitres, maxLitres: c.maxLitres, minAgeWeeks: c.minAgeWeeks };
		if (c.id !== null && existingCategories.has(c.id)) {
			await tx.update(contestCategories).set(values).where(eq(contestCategories.id, c.id));
			keptCategories.push(c.id);
		} else {
			const [result] = await tx.insert(contestCategories).values({ ...values, contestId });
			keptCategories.push(result.insertId);
		}
	}
	await tx
		.delete(contestCategories)
		.where(
			keptCategories.length
				? and(eq(contestCategories.contestId, contestId), notInArray(contestCategories.id, keptCategories))
				: eq(contestCategories.contestId, contestId)
		);
}

export async function create(viewer: Viewer, input: ContestInput, context: Context = {}): Promise<number> {
	assertAdmin(viewer);
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const [result] = await tx.insert(contests).values({
			...settings(input),
			rulesHtml: renderMarkdown(input.rules),
			entriesPerMember: input.entriesPerMember,
			aggregation: input.aggregation,
			createdBy: viewer.id,
			updatedAt: now,
			...(context.now ? { createdAt: context.now } : {})
		});
		const id = result.insertId;
		await writeRubricAndCategories(tx, id, input);
		await audit.record({ actorId: viewer.id, action: 'contest.create', subject: auditSubject(id), detail: { title: input.title } }, within(context, tx));
		return id;
	});
}

/**
 * Saves the admin's changes. Once the contest has opened, the rubric, categories, aggregation and
 * entry limit are fixed and only the title, rules and dates change; an archived contest changes no more.
 */
export async function update(viewer: Viewer, id: number, input: ContestInput, context: Context = {}): Promise<void> {
	const { now } = resolve(context);
	await adminChange(viewer, id, context, async ({ contest: found, tx, context: inTx }) => {
		if (found.state === 'archived') throw conflict('archived', 'An archived contest cannot be changed.');
		const locked = found.state !== 'draft';
		await tx
			.update(contests)
			.set({
				...settings(input),
				rulesHtml: renderMarkdown(input.rules),
				...(locked ? {} : { entriesPerMember: input.entriesPerMember, aggregation: input.aggregation }),
				updatedAt: now
			})
			.where(eq(contests.id, id));
		if (!locked) await writeRubricAndCategories(tx, id, input);
		const changed = Object.entries(settings(input))
			.filter(([k, v]) => found[k as keyof ContestRow] !== v)
			.map(([k]) => k);
		await audit.record(
			{
				actorId: viewer.id,
				action: 'contest.edit',
				subject: auditSubject(id),
				detail: { changed: locked ? changed : [...changed, 'rubric', 'categories'], state: found.state }
			},
			inTx
		);
	});
}

export interface LogEntry extends audit.AuditEntry {
	/** Null for the system (a periodic job) or a former member. */
	actorName: string | null;
}

/** The contest's audit log for its admins, newest first, at most `limit` entries. */
export async function log(viewer: Viewer, contestId: number, limit: number, context: Context = {}): Promise<LogEntry[]> {
	assertAdmin(viewer);
	const entries = (await audit.trail(auditSubject(contestId), undefined, context)).reverse().slice(0, limit);
	const names = await directory.names(
		entries.flatMap((e) => (e.actorId ? [e.actorId] : [])),
		context
	);
	return entries.map((e) => ({ ...e, actorName: e.actorId ? (names.get(e.actorId) ?? null) : null }));
}

/** The contest as its edit form shows it. */
export function draftOf(c: ContestDetail): ContestDraft {
	const key = (prefix: string, id: number) => `${prefix}${id}`;
	return {
		...windowsOf(c),
		title: c.title,
		rules: c.rules,
		entriesPerMember: String(c.entriesPerMember),
		aggregation: c.aggregation,
		criteria: c.criteria.map((k) => ({
			id: String(k.id),
			key: key('c', k.id),
			label: k.label,
			guidance: k.guidance,
			maxPoints: String(k.maxPoints),
			weight: String(k.weight)
		})),
		tieBreak: [...c.criteria].sort((a, b) => a.tieBreakRank - b.tieBreakRank).map((k) => key('c', k.id)),
		categories: c.categories.map((k) => ({
			id: String(k.id),
			key: key('g', k.id),
			name: k.name,
			description: k.description,
			minLitres: k.minLitres === null ? '' : String(k.minLitres),
			maxLitres: k.maxLitres === null ? '' : String(k.maxLitres),
			minAgeWeeks: k.minAgeWeeks === null ? '' : String(k.minAgeWeeks)
		}))
	};
}
