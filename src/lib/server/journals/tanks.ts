// Tank profiles. Every read takes the viewer and goes through canView, so who may see a tank
// (and its photos, see ./photo-access.ts) is decided here and nowhere else. Deleting a tank,
// which takes its journal with it, is ./tank-deletion.ts.
import { and, asc, count, desc, eq, inArray, isNull, isNotNull, ne, notInArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import * as media from '../media';
import type { Photo, Purge } from '../media';
import type { PhotoField } from '../../media/form';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as catalogue from '../species/catalogue';
import { notFound } from '../../errors';
import { renderMarkdown } from '../markdown';
import { UNNAMED_MEMBER } from '../../club/names';
import type { TankInput } from '../../journals/tank-input';
import { TANK_COVER_MAX } from '../../journals/tank-vocabulary';
import { tankFigures as figuresOf } from '../../journals/figures';
import { tankFertilisers, tankFilters, tankLights, tankLivestock, tankPlants, tanks, type TankRow } from './schema';

export type { TankRow };

/** Who may see a tank: public → anyone; club → any signed-in member; private → its owner only. */
export function canView(viewer: Pick<Viewer, 'id'> | null | undefined, tank: Pick<TankRow, 'ownerId' | 'visibility'>): boolean {
	if (tank.visibility === 'public') return true;
	if (!viewer) return false;
	if (tank.visibility === 'club') return true;
	return viewer.id === tank.ownerId;
}

export const isOwner = (viewer: Pick<Viewer, 'id'> | null | undefined, tank: Pick<TankRow, 'ownerId'>) => !!viewer && viewer.id === tank.ownerId;

export type LightRow = typeof tankLights.$inferSelect;
export type FilterRow = typeof tankFilters.$inferSelect;
export type FertiliserRow = typeof tankFertilisers.$inferSelect;
export type PlantRow = typeof tankPlants.$inferSelect & { commonName: string | null };
export type LivestockRow = typeof tankLivestock.$inferSelect & { commonName: string | null };

export interface Tank extends TankRow {
	ownerName: string;
	cover: Photo | null;
	lights: LightRow[];
	filters: FilterRow[];
	fertilisers: FertiliserRow[];
	plants: PlantRow[];
	livestock: LivestockRow[];
}

export interface TankSummary {
	id: number;
	name: string;
	style: string;
	visibility: TankRow['visibility'];
	setUpOn: string | null;
	retiredOn: string | null;
	lengthCm: number;
	widthCm: number;
	heightCm: number;
	cover: Photo | null;
}

/** What a refusal says when the tank does not exist or is not the viewer's to see or change. */
export const tankNotFound = () => notFound('We could not find that tank.');

async function row(id: number, db: DbOrTx): Promise<TankRow | undefined> {
	const [found] = await db.select().from(tanks).where(eq(tanks.id, id)).limit(1);
	return found;
}

async function load(found: TankRow, context: Context): Promise<Tank> {
	const { db } = resolve(context);
	const [owner, lights, filters, fertilisers, plants, livestock, photos] = await Promise.all([
		directory.names([found.ownerId], context),
		db.select().from(tankLights).where(eq(tankLights.tankId, found.id)).orderBy(asc(tankLights.position), asc(tankLights.id)),
		db.select().from(tankFilters).where(eq(tankFilters.tankId, found.id)).orderBy(asc(tankFilters.position), asc(tankFilters.id)),
		db.select().from(tankFertilisers).where(eq(tankFertilisers.tankId, found.id)).orderBy(asc(tankFertilisers.position), asc(tankFertilisers.id)),
		db.select().from(tankPlants).where(eq(tankPlants.tankId, found.id)).orderBy(asc(tankPlants.position), asc(tankPlants.id)),
		db.select().from(tankLivestock).where(eq(tankLivestock.tankId, found.id)).orderBy(asc(tankLivestock.position), asc(tankLivestock.id)),
		media.listFor('tank', found.id, context)
	]);
	const known = await catalogue.getMany(
		[...plants, ...livestock].flatMap((r) => (r.speciesId === null ? [] : [r.speciesId])),
		context
	);
	const commonName = (speciesId: number | null) => (speciesId === null ? null : (known.get(speciesId)?.commonName ?? null));
	return {
		...found,
		ownerName: owner.get(found.ownerId) ?? UNNAMED_MEMBER,
		cover: photos[0] ?? null,
		lights,
		filters,
		fertilisers,
		plants: plants.map((p) => ({ ...p, commonName: commonName(p.speciesId) })),
		livestock: livestock.map((a) => ({ ...a, commonName: commonName(a.speciesId) }))
	};
}

/** Which of these tanks anyone may see (public ones), for other features' links; one query. */
export async function publicIds(ids: number[], context: Context = {}): Promise<Set<number>> {
	if (ids.length === 0) return new Set();
	const rows = await resolve(context)
		.db.select({ id: tanks.id })
		.from(tanks)
		.where(and(inArray(tanks.id, ids), eq(tanks.visibility, 'public')));
	return new Set(rows.map((r) => r.id));
}

/** The bare row of a tank the viewer may see (no lists or photos), or null. */
export async function findVisible(viewer: Pick<Viewer, 'id'> | null, id: number, context: Context = {}): Promise<TankRow | null> {
	const found = await row(id, resolve(context).db);
	return found && canView(viewer, found) ? found : null;
}

/** The bare row of one of the viewer's own tanks, or null. */
export async function findOwn(viewer: Pick<Viewer, 'id'>, id: number, context: Context = {}): Promise<TankRow | null> {
	const found = await row(id, resolve(context).db);
	return found && found.ownerId === viewer.id ? found : null;
}

/**
 * The viewer's own tank, locked for the rest of the transaction in `context` (writes to its
 * journal go through this, so two of them queue); "not found" for anyone else's.
 */
export async function lockOwn(viewer: Pick<Viewer, 'id'>, id: number, context: Context = {}): Promise<TankRow> {
	const { db } = resolve(context);
	const [found] = await db.select().from(tanks).where(eq(tanks.id, id)).for('update');
	if (!found || found.ownerId !== viewer.id) throw tankNotFound();
	return found;
}

/** Notes new journal activity (an entry, event or test) for "recently updated". */
/**
 * Tanks' names by id, for a feature that has already decided the viewer may know them (away care
 * names the tank to the member asked to look in). Ids of no tank are missing.
 */
export async function namesOf(ids: Iterable<number>, context: Context = {}): Promise<Map<number, string>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const rows = await resolve(context).db.select({ id: tanks.id, name: tanks.name }).from(tanks).where(inArray(tanks.id, unique));
	return new Map(rows.map((r) => [r.id, r.name]));
}

export async function touch(id: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.update(tanks).set({ activityAt: now }).where(eq(tanks.id, id));
}

/** Works the stored volume out again for tanks that lack it (rows written before it was kept). */
export async function refreshVolumes(context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const missing = await db.select().from(tanks).where(isNull(tanks.volumeLitres));
	for (const t of missing) {
		const litres = figuresOf({ ...t, lights: [], filters: [] }).volume?.litres;
		if (litres !== undefined && Number.isFinite(litres)) {
			await db
				.update(tanks)
				.set({ volumeLitres: Math.round(litres * 100) / 100, activityAt: t.activityAt ?? t.updatedAt ?? t.createdAt })
				.where(eq(tanks.id, t.id));
		}
	}
	return missing.length;
}

/** A tank with everything on its profile, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, context: Context = {}): Promise<Tank | null> {
	const found = await row(id, resolve(context).db);
	if (!found || !canView(viewer, found)) return null;
	return load(found, context);
}

/** The tank for its owner's edit form; null for anyone else. */
export async function getOwn(viewer: Pick<Viewer, 'id'>, id: number, context: Context = {}): Promise<Tank | null> {
	const found = await row(id, resolve(context).db);
	if (!found || found.ownerId !== viewer.id) return null;
	return load(found, context);
}

function summaries(rows: TankRow[], covers: Map<number, Photo[]>): TankSummary[] {
	return rows.map((t) => ({
		id: t.id,
		name: t.name,
		style: t.style,
		visibility: t.visibility,
		setUpOn: t.setUpOn,
		retiredOn: t.retiredOn,
		lengthCm: t.lengthCm,
		widthCm: t.widthCm,
		heightCm: t.heightCm,
		cover: covers.get(t.id)?.[0] ?? null
	}));
}

/** The viewer's own tanks, running ones first (newest set-up first), then retired ones. */
export async function listOwn(viewer: Pick<Viewer, 'id'>, options: { retired?: boolean } = {}, context: Context = {}): Promise<TankSummary[]> {
	const conditions = [eq(tanks.ownerId, viewer.id)];
	if (options.retired === false) conditions.push(isNull(tanks.retiredOn));
	if (options.retired === true) conditions.push(isNotNull(tanks.retiredOn));
	const rows = await resolve(context)
		.db.select()
		.from(tanks)
		.where(and(...conditions))
		.orderBy(sql`${tanks.retiredOn} IS NOT NULL`, desc(tanks.setUpOn), desc(tanks.id));
	return summaries(
		rows,
		await media.listForMany(
			'tank',
			rows.map((r) => r.id),
			context
		)
	);
}

/** Another member's tanks that the viewer may see (running ones), e.g. for a profile or a contest entry form. */
export async function listVisibleOf(viewer: Pick<Viewer, 'id'> | null, ownerId: string, context: Context = {}): Promise<TankSummary[]> {
	const rows = (
		await resolve(context)
			.db.select()
			.from(tanks)
			.where(and(eq(tanks.ownerId, ownerId), isNull(tanks.retiredOn)))
			.orderBy(desc(tanks.setUpOn), desc(tanks.id))
	).filter((t) => canView(viewer, t));
	return summaries(
		rows,
		await media.listForMany(
			'tank',
			rows.map((r) => r.id),
			context
		)
	);
}

/** The volume the figures use, kept on the row for the showcase's size filter. */
function figureLitres(input: TankInput): number | null {
	const litres = figuresOf(input).volume?.litres;
	return litres === undefined || !Number.isFinite(litres) ? null : Math.round(litres * 100) / 100;
}

function columns(input: TankInput) {
	return {
		volumeLitres: figureLitres(input),
		name: input.name,
		style: input.style,
		setUpOn: input.setUpOn,
		lengthCm: input.lengthCm,
		widthCm: input.widthCm,
		heightCm: input.heightCm,
		glassMm: input.glassMm,
		substrateKind: input.substrateKind,
		substrateNote: input.substrateNote,
		substrateDepthCm: input.substrateDepthCm,
		hardscape: input.hardscape,
		hardscapeLitres: input.hardscapeLitres,
		heaterWatts: input.heaterWatts,
		heaterSetC: input.heaterSetC,
		heaterNote: input.heaterNote,
		co2Method: input.co2Method,
		co2BubblesPerSecond: input.co2Method === 'pressurised' ? input.co2BubblesPerSecond : null,
		waterLitres: input.waterLitres,
		description: input.description || null,
		descriptionHtml: input.description ? renderMarkdown(input.description) : null,
		visibility: input.visibility
	};
}

/** Plants and animals picked from the catalogue take its scientific name; unknown ids become free text. */
async function resolveSpecies<T extends { speciesId: number | null; name: string }>(rows: T[], context: Context): Promise<T[]> {
	const known = await catalogue.getMany(
		rows.flatMap((r) => (r.speciesId === null ? [] : [r.speciesId])),
		context
	);
	return rows.map((r) => {
		if (r.speciesId === null) return r;
		const name = known.get(r.speciesId)?.scientificName;
		return name ? { ...r, name } : { ...r, speciesId: null };
	});
}

type ChildTable = typeof tankLights | typeof tankFilters | typeof tankFertilisers | typeof tankPlants | typeof tankLivestock;

/**
 * Brings one repeatable list in line with the form: rows with an id of this tank are updated in
 * place (so later records that point at them stay valid), new rows are inserted, the rest deleted.
 */
async function syncChildren<R extends { id?: number }>(tx: DbOrTx, table: ChildTable, tankId: number, rows: R[], values: (r: R) => object) {
	const existing = new Set((await tx.select({ id: table.id }).from(table).where(eq(table.tankId, tankId))).map((r) => r.id));
	const kept: number[] = [];
	for (const [position, r] of rows.entries()) {
		const set = { ...values(r), position };
		if (r.id !== undefined && existing.has(r.id)) {
			kept.push(r.id);
			await tx
				.update(table)
				.set(set)
				.where(and(eq(table.id, r.id), eq(table.tankId, tankId)));
		} else {
			const [result] = await tx.insert(table).values({ ...set, tankId } as typeof table.$inferInsert);
			kept.push(result.insertId);
		}
	}
	await tx.delete(table).where(kept.length ? and(eq(table.tankId, tankId), notInArray(table.id, kept)) : eq(table.tankId, tankId));
}

async function writeChildren(tx: DbOrTx, tankId: number, input: TankInput) {
	await syncChildren(tx, tankLights, tankId, input.lights, (l) => ({ label: l.label, watts: l.watts, hoursPerDay: l.hoursPerDay }));
	await syncChildren(tx, tankFilters, tankId, input.filters, (f) => ({
		label: f.label,
		ratedFlow: f.ratedFlow,
		flowUnit: f.flowUnit,
		mediaNotes: f.mediaNotes
	}));
	await syncChildren(tx, tankFertilisers, tankId, input.fertilisers, (f) => ({ item: f.item, amount: f.amount, frequency: f.frequency }));
	await syncChildren(tx, tankPlants, tankId, await resolveSpecies(input.plants, { db: tx }), (p) => ({
		speciesId: p.speciesId,
		name: p.name,
		placement: p.placement,
		addedOn: p.addedOn,
		removedOn: p.removedOn
	}));
	await syncChildren(tx, tankLivestock, tankId, await resolveSpecies(input.livestock, { db: tx }), (a) => ({
		speciesId: a.speciesId,
		name: a.name,
		count: a.count,
		addedOn: a.addedOn,
		removedOn: a.removedOn
	}));
}

/** Cover photos: one, refused at the form's "cover" field. */
const COVER_RULES = { max: TANK_COVER_MAX, field: 'cover' };

/** Creates a tank for the viewer with its cover photo (a pending upload of theirs, or none). */
export async function create(viewer: Pick<Viewer, 'id'>, input: TankInput, cover: PhotoField[] = [], context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const [result] = await tx.insert(tanks).values({ ...columns(input), ownerId: viewer.id, updatedAt: now, activityAt: now });
		const id = result.insertId;
		await writeChildren(tx, id, input);
		// A new tank has no photos yet, so nothing can be dropped here.
		await media.setPhotos(viewer.id, 'tank', id, cover, COVER_RULES, within(context, tx));
		return id;
	});
}

/** Saves the owner's changes; "not found" for anyone else. */
export async function update(viewer: Pick<Viewer, 'id'>, id: number, input: TankInput, cover: PhotoField[], context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const purge: Purge = await db.transaction(async (tx) => {
		await lockOwn(viewer, id, { db: tx });
		await tx
			.update(tanks)
			.set({ ...columns(input), updatedAt: now, activityAt: now })
			.where(eq(tanks.id, id));
		await writeChildren(tx, id, input);
		return media.setPhotos(viewer.id, 'tank', id, cover, COVER_RULES, within(context, tx));
	});
	await media.purgeAfterCommit(purge, { tankId: id, what: 'replaced photos' });
}

/** Retires a running tank: it stays on the profile with all its history, marked as taken down. */
export async function retire(viewer: Pick<Viewer, 'id'>, id: number, on: string, note = '', context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const [result] = await db
		.update(tanks)
		.set({ retiredOn: on, retiredNote: note, updatedAt: now })
		.where(and(eq(tanks.id, id), eq(tanks.ownerId, viewer.id), isNull(tanks.retiredOn)));
	if (result.affectedRows === 0) {
		const found = await row(id, db);
		if (!found || found.ownerId !== viewer.id) throw tankNotFound();
	}
}

/** Sets a retired tank running again. */
export async function reopen(viewer: Pick<Viewer, 'id'>, id: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const [result] = await db
		.update(tanks)
		.set({ retiredOn: null, retiredNote: '', updatedAt: now })
		.where(and(eq(tanks.id, id), eq(tanks.ownerId, viewer.id)));
	if (result.affectedRows === 0) throw tankNotFound();
}

/** The computed figures of a tank (volume, weight, light, turnover, age, cautions) on the day of `context.now`; see $lib/journals/figures. */
export const tankFigures = (tank: Tank, context: Context = {}) => figuresOf(tank, context.now ?? new Date());

/** How many running tanks each of these members shows other members (not private ones), by member id. */
export async function sharedCounts(ownerIds: readonly string[], context: Context = {}): Promise<Map<string, number>> {
	if (ownerIds.length === 0) return new Map();
	const rows = await resolve(context)
		.db.select({ ownerId: tanks.ownerId, n: count() })
		.from(tanks)
		.where(and(inArray(tanks.ownerId, [...ownerIds]), isNull(tanks.retiredOn), ne(tanks.visibility, 'private')))
		.groupBy(tanks.ownerId);
	return new Map(rows.map((r) => [r.ownerId, r.n]));
}
