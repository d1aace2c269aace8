// Contests, their rubric and categories. Every read takes the viewer: a contest in preparation is
// the admins' alone (anyone else gets null, so the page answers 404); from the moment it opens
// its rules, categories and dates are public.
import { and, asc, count, desc, eq, inArray, notInArray } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import type { Viewer } from '../club/users';
import type { Rubric } from '../../contests/rubric';
import type { ContestWindows, ContestState } from '../../contests/lifecycle';
import type { ContestDraft, ContestInput } from '../../contests/contest-form';
import type { EligibilityRule } from '../../contests/eligibility';
import { contestCategories, contestCriteria, contestEntries, contests, type CategoryRow, type ContestRow, type CriterionRow } from './schema';
import { ContestError } from './errors';
import * as audit from './audit';

export interface ContestDetail extends ContestRow {
	criteria: CriterionRow[];
	categories: CategoryRow[];
}

export const isAdminViewer = (viewer: Pick<Viewer, 'role'> | null | undefined) => viewer?.role === 'admin';

export function assertAdmin(viewer: Viewer): void {
	if (viewer.role !== 'admin') throw new ContestError(403, 'Only admins can do this.', 'forbidden');
}

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

export async function row(id: number, tx: DbOrTx = appDb, lock = false): Promise<ContestRow | undefined> {
	const query = tx.select().from(contests).where(eq(contests.id, id)).limit(1);
	const [found] = lock ? await query.for('update') : await query;
	return found;
}

export async function load(id: number, tx: DbOrTx = appDb): Promise<ContestDetail | null> {
	const found = await row(id, tx);
	if (!found) return null;
	const [criteria, categories] = await Promise.all([
		tx.select().from(contestCriteria).where(eq(contestCriteria.contestId, id)).orderBy(asc(contestCriteria.position), asc(contestCriteria.id)),
		tx.select().from(contestCategories).where(eq(contestCategories.contestId, id)).orderBy(asc(contestCategories.position), asc(contestCategories.id))
	]);
	return { ...found, criteria, categories };
}

/** The contest with its rubric and categories, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, tx: DbOrTx = appDb): Promise<ContestDetail | null> {
	const found = await load(id, tx);
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
export async function list(viewer: Viewer | null, options: { page: number }, tx: DbOrTx = appDb) {
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
export async function listAll(viewer: Viewer, tx: DbOrTx = appDb): Promise<ContestSummary[]> {
	assertAdmin(viewer);
	return summarise(await tx.select().from(contests).orderBy(desc(contests.id)), tx);
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

export async function create(viewer: Viewer, input: ContestInput, database: DbOrTx = appDb, now?: Date): Promise<number> {
	assertAdmin(viewer);
	return database.transaction(async (tx) => {
		const [result] = await tx.insert(contests).values({
			...settings(input),
			entriesPerMember: input.entriesPerMember,
			aggregation: input.aggregation,
			createdBy: viewer.id,
			updatedAt: now ?? new Date(),
			...(now ? { createdAt: now } : {})
		});
		const id = result.insertId;
		await writeRubricAndCategories(tx, id, input);
		await audit.record(tx, viewer.id, 'contest.create', id, { title: input.title }, now);
		return id;
	});
}

/**
 * Saves the admin's changes. Once the contest has opened, the rubric, categories, aggregation and
 * entry limit are fixed and only the title, rules and dates change; an archived contest changes no more.
 */
export async function update(viewer: Viewer, id: number, input: ContestInput, database: DbOrTx = appDb): Promise<void> {
	assertAdmin(viewer);
	await database.transaction(async (tx) => {
		const found = await row(id, tx, true);
		if (!found) throw new ContestError(404, 'No such contest.', 'not-found');
		if (found.state === 'archived') throw new ContestError(409, 'An archived contest cannot be changed.');
		const locked = found.state !== 'draft';
		await tx
			.update(contests)
			.set({ ...settings(input), ...(locked ? {} : { entriesPerMember: input.entriesPerMember, aggregation: input.aggregation }), updatedAt: new Date() })
			.where(eq(contests.id, id));
		if (!locked) await writeRubricAndCategories(tx, id, input);
		const changed = Object.entries(settings(input))
			.filter(([k, v]) => found[k as keyof ContestRow] !== v)
			.map(([k]) => k);
		await audit.record(tx, viewer.id, 'contest.edit', id, { changed: locked ? changed : [...changed, 'rubric', 'categories'], state: found.state });
	});
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
