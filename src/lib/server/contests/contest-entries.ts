// Members' entries: which tank in which category, its photos and statement, the tank's figures
// as checked for eligibility. Entries are made, changed and withdrawn only while the contest takes
// entries; judges never reach them through here (see ./judging.ts for the blind view).
import { and, asc, count, countDistinct, eq, inArray, ne } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as media from '../media';
import type { Photo } from '../media';
import * as tanks from '../journals/tanks';
import * as audit from '../audit';
import { statementShown } from '../markdown';
import { conflict, DomainError, invalid, isDomainError, notFound } from '../../errors';
import { checkEligibility, type EligibilityCheck, type TankFacts } from '../../contests/eligibility';
import { entriesAccepted } from '../../contests/lifecycle';
import { ENTRY_PHOTOS_MAX, ENTRY_PHOTOS_MIN, type ContestEntryInput } from '../../contests/contest-entry-form';
import { contestCategories, contestEntries, contests, type ContestEntryRow } from './schema';
import { auditSubject, isAdminViewer, load, lockedRow, ruleOf, windowsOf, type ContestDetail } from './contests';

export const SCOPE = 'contest-entry' as const;

export interface TankOption {
	id: number;
	name: string;
	cover: Photo | null;
	facts: TankFacts;
	ageLabel: string | null;
	/** Keyed by category id. */
	eligibility: Record<number, EligibilityCheck>;
	/** Already entered in this contest (by another of the member's entries). */
	enteredAs: number | null;
}

/** The tank's figures as eligibility reads them, on the day of `context.now`. */
export function factsOf(tank: tanks.Tank, context: Context = {}): { facts: TankFacts; ageLabel: string | null } {
	const figures = tanks.tankFigures(tank, { now: resolve(context).now });
	return {
		facts: {
			litres: figures.volume?.litres ?? null,
			volumeSource: figures.volume?.source ?? null,
			ageWeeks: figures.age?.weeks ?? null,
			retired: tank.retiredOn !== null
		},
		ageLabel: figures.age?.label ?? null
	};
}

/** The member's tanks with their figures and what each category says about them. */
export async function tankOptions(viewer: Viewer, contest: ContestDetail, context: Context = {}): Promise<TankOption[]> {
	const { db } = resolve(context);
	const own = await tanks.listOwn(viewer, {}, { db });
	const entered = await db
		.select({ id: contestEntries.id, tankId: contestEntries.tankId })
		.from(contestEntries)
		.where(and(eq(contestEntries.contestId, contest.id), eq(contestEntries.entrantId, viewer.id)));
	const enteredAs = new Map(entered.filter((e) => e.tankId !== null).map((e) => [e.tankId!, e.id]));
	const options: TankOption[] = [];
	for (const summary of own) {
		const tank = await tanks.getOwn(viewer, summary.id, { db });
		if (!tank) continue;
		const { facts, ageLabel } = factsOf(tank, context);
		options.push({
			id: tank.id,
			name: tank.name,
			cover: summary.cover,
			facts,
			ageLabel,
			eligibility: Object.fromEntries(contest.categories.map((c) => [c.id, checkEligibility(ruleOf(c), facts, viewer.units)])),
			enteredAs: enteredAs.get(tank.id) ?? null
		});
	}
	return options;
}

/** Checks an entry against the contest's rules inside the transaction that saves it. */
async function vet(tx: DbOrTx, viewer: Viewer, contestId: number, input: ContestEntryInput, entryId: number | null, now: Date) {
	const contest = await lockedRow(contestId, { db: tx });
	if (!contest || contest.state === 'draft') throw notFound('No such contest.');
	if (!entriesAccepted(contest.state, windowsOf(contest), now)) throw conflict('closed', 'This contest is not taking entries or changes any more.');
	const [category] = await tx
		.select()
		.from(contestCategories)
		.where(and(eq(contestCategories.id, input.categoryId), eq(contestCategories.contestId, contestId)));
	if (!category) throw invalid({ categoryId: 'Choose one of this contest’s categories.' }, undefined, 'bad-category');
	const tank = await tanks.getOwn(viewer, input.tankId, { db: tx });
	if (!tank) throw invalid({ tankId: 'Choose one of your own tanks.' }, undefined, 'bad-tank');
	const { facts } = factsOf(tank, { now });
	const check = checkEligibility(ruleOf(category), facts, viewer.units);
	if (!check.eligible) {
		throw invalid({ tankId: check.reasons.join(' ') }, `“${tank.name}” cannot be entered in ${category.name}: ${check.reasons.join(' ')}`, 'ineligible');
	}
	const others = and(
		eq(contestEntries.contestId, contestId),
		eq(contestEntries.entrantId, viewer.id),
		entryId === null ? undefined : ne(contestEntries.id, entryId)
	);
	const [mine] = await tx.select({ n: count() }).from(contestEntries).where(others);
	if ((mine?.n ?? 0) >= contest.entriesPerMember) {
		throw conflict('limit', `Each member may enter ${contest.entriesPerMember} ${contest.entriesPerMember === 1 ? 'tank' : 'tanks'} in this contest.`);
	}
	const [sameTank] = await tx
		.select({ id: contestEntries.id })
		.from(contestEntries)
		.where(and(others, eq(contestEntries.tankId, tank.id)));
	if (sameTank) {
		const taken = 'This tank is already entered in this contest.';
		throw new DomainError(409, 'tank-entered', taken, { tankId: taken });
	}
	if (input.photos.length < ENTRY_PHOTOS_MIN || input.photos.length > ENTRY_PHOTOS_MAX) {
		throw invalid(
			{ photos: `Add ${ENTRY_PHOTOS_MIN} to ${ENTRY_PHOTOS_MAX} photos; the first one shows the whole tank from the front.` },
			`Add ${ENTRY_PHOTOS_MIN} to ${ENTRY_PHOTOS_MAX} photos.`,
			'photos'
		);
	}
	return {
		contest,
		values: {
			categoryId: category.id,
			tankId: tank.id,
			statement: input.statement,
			...statementShown(input.statement),
			litres: check.comparedLitres,
			volumeSource: facts.volumeSource,
			ageWeeks: facts.ageWeeks,
			updatedAt: now
		}
	};
}

/** A photo media refuses (not the member's, gone), at the photos field. */
const wrapMedia = (error: unknown): never => {
	if (isDomainError(error)) throw new DomainError(error.status, 'photos', error.message, { photos: error.message });
	throw error;
};

export async function create(viewer: Viewer, contestId: number, input: ContestEntryInput, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const { values } = await vet(tx, viewer, contestId, input, null, now);
		const [result] = await tx.insert(contestEntries).values({ ...values, contestId, entrantId: viewer.id });
		await media.setPhotos(viewer.id, SCOPE, result.insertId, input.photos, { max: ENTRY_PHOTOS_MAX }, { db: tx, now }).catch(wrapMedia);
		return result.insertId;
	});
}

async function ownEntry(tx: DbOrTx, viewer: Viewer, entryId: number): Promise<ContestEntryRow> {
	const [entry] = await tx.select().from(contestEntries).where(eq(contestEntries.id, entryId)).limit(1);
	if (!entry || entry.entrantId !== viewer.id) throw notFound('No such entry.');
	return entry;
}

export async function update(viewer: Viewer, entryId: number, input: ContestEntryInput, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const purge = await db.transaction(async (tx) => {
		const entry = await ownEntry(tx, viewer, entryId);
		const { values } = await vet(tx, viewer, entry.contestId, input, entry.id, now);
		await tx.update(contestEntries).set(values).where(eq(contestEntries.id, entry.id));
		return media.setPhotos(viewer.id, SCOPE, entry.id, input.photos, { max: ENTRY_PHOTOS_MAX }, { db: tx, now }).catch(wrapMedia);
	});
	await media.purgeAfterCommit(purge, { contestEntryId: entryId, what: 'replaced photos' });
}

export async function withdraw(viewer: Viewer, entryId: number, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const { contestId, purge } = await db.transaction(async (tx) => {
		const entry = await ownEntry(tx, viewer, entryId);
		const contest = await lockedRow(entry.contestId, { db: tx });
		if (!contest || !entriesAccepted(contest.state, windowsOf(contest), now)) {
			throw conflict('closed', 'Entries can no longer be withdrawn: the entry window has closed.');
		}
		const keys = await media.deleteFor(SCOPE, entry.id, { db: tx });
		await tx.delete(contestEntries).where(eq(contestEntries.id, entry.id));
		await audit.record(
			{ actorId: viewer.id, action: 'entry.withdraw', subject: auditSubject(entry.contestId), detail: { entryId: entry.id } },
			within(context, tx)
		);
		return { contestId: entry.contestId, purge: keys };
	});
	await media.purgeAfterCommit(purge, { contestEntryId: entryId, what: 'photos of a withdrawn entry' });
	return contestId;
}

export interface OwnEntry extends ContestEntryRow {
	categoryName: string;
	tankName: string | null;
	photos: Photo[];
}

/** The viewer's entries in a contest, oldest first. */
export async function listOwn(viewer: Viewer, contestId: number, context: Context = {}): Promise<OwnEntry[]> {
	const { db: tx } = resolve(context);
	const rows = await tx
		.select({ entry: contestEntries, categoryName: contestCategories.name })
		.from(contestEntries)
		.innerJoin(contestCategories, eq(contestCategories.id, contestEntries.categoryId))
		.where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.entrantId, viewer.id)))
		.orderBy(asc(contestEntries.id));
	const photos = await media.listForMany(
		SCOPE,
		rows.map((r) => r.entry.id),
		{ db: tx }
	);
	const names = new Map((await tanks.listOwn(viewer, {}, { db: tx })).map((t) => [t.id, t.name]));
	return rows.map((r) => ({
		...r.entry,
		categoryName: r.categoryName,
		tankName: r.entry.tankId ? (names.get(r.entry.tankId) ?? null) : null,
		photos: photos.get(r.entry.id) ?? []
	}));
}

/** One entry for its entrant (or an admin), with its contest; null for anyone else. */
export async function getOwn(viewer: Viewer, entryId: number, context: Context = {}): Promise<{ entry: OwnEntry; contest: ContestDetail } | null> {
	const { db: tx } = resolve(context);
	const [found] = await tx
		.select({ entry: contestEntries, categoryName: contestCategories.name })
		.from(contestEntries)
		.innerJoin(contestCategories, eq(contestCategories.id, contestEntries.categoryId))
		.where(eq(contestEntries.id, entryId))
		.limit(1);
	if (!found || (found.entry.entrantId !== viewer.id && !isAdminViewer(viewer))) return null;
	const contest = await load(found.entry.contestId, context);
	if (!contest) return null;
	const tank = found.entry.tankId && found.entry.entrantId === viewer.id ? await tanks.getOwn(viewer, found.entry.tankId, { db: tx }) : null;
	return {
		entry: { ...found.entry, categoryName: found.categoryName, tankName: tank?.name ?? null, photos: await media.listFor(SCOPE, entryId, { db: tx }) },
		contest
	};
}

/**
 * Media access for scope 'contest-entry' (registered in ../media/access.ts) at /media/<id>: the
 * entrant and admins always, everyone once the results are published. Judges are not on this list:
 * while judging they see an entry's photos only at addresses of the entry's number and the photo's
 * place (judging.entryPhoto, behind judging's access check), so they never learn a photo's id.
 */
export async function photoAudience(viewer: Viewer | null, entryId: number, context: Context = {}): Promise<'public' | 'restricted' | null> {
	const { db } = resolve(context);
	const [found] = await db
		.select({ entrantId: contestEntries.entrantId, state: contests.state })
		.from(contestEntries)
		.innerJoin(contests, eq(contests.id, contestEntries.contestId))
		.where(eq(contestEntries.id, entryId))
		.limit(1);
	if (!found) return null;
	if (found.state === 'published' || found.state === 'archived') return 'public';
	if (!viewer) return null;
	return viewer.id === found.entrantId || isAdminViewer(viewer) ? 'restricted' : null;
}

/** How many contests each of these members has entered, by member id (for the member directory). */
export async function contestsEnteredBy(memberIds: readonly string[], context: Context = {}): Promise<Map<string, number>> {
	if (memberIds.length === 0) return new Map();
	const rows = await resolve(context)
		.db.select({ id: contestEntries.entrantId, n: countDistinct(contestEntries.contestId) })
		.from(contestEntries)
		.where(inArray(contestEntries.entrantId, [...memberIds]))
		.groupBy(contestEntries.entrantId);
	return new Map(rows.map((r) => [r.id, r.n]));
}
