// Tank profiles. Every read takes the viewer and goes through canView, so who may see a tank
// (and its photos, see ../media/access.ts) is decided here and nowhere else.
import { and, asc, desc, eq, inArray, isNull, isNotNull, notInArray, sql } from 'drizzle-orm';
import { db as appDb, type Database, type DbOrTx } from '../db';
import * as media from '../media';
import type { Photo, Purge } from '../media';
import type { PhotoField } from '../../media/form';
import type { Viewer } from '../club/users';
import { users } from '../club/schema';
import { species } from '../species/schema';
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

/** Thrown by the write functions when the tank does not exist or is not the viewer's. */
export class TankNotFound extends Error {
	constructor() {
		super('No such tank.');
	}
}

async function row(id: number, tx: DbOrTx = appDb): Promise<TankRow | undefined> {
	const [found] = await tx.select().from(tanks).where(eq(tanks.id, id)).limit(1);
	return found;
}

async function load(found: TankRow, tx: DbOrTx = appDb): Promise<Tank> {
	const [owner, lights, filters, fertilisers, plants, livestock, photos] = await Promise.all([
		tx.select({ displayName: users.displayName }).from(users).where(eq(users.id, found.ownerId)),
		tx.select().from(tankLights).where(eq(tankLights.tankId, found.id)).orderBy(asc(tankLights.position), asc(tankLights.id)),
		tx.select().from(tankFilters).where(eq(tankFilters.tankId, found.id)).orderBy(asc(tankFilters.position), asc(tankFilters.id)),
		tx.select().from(tankFertilisers).where(eq(tankFertilisers.tankId, found.id)).orderBy(asc(tankFertilisers.position), asc(tankFertilisers.id)),
		tx
			.select({ plant: tankPlants, commonName: species.commonName })
			.from(tankPlants)
			.leftJoin(species, eq(species.id, tankPlants.speciesId))
			.where(eq(tankPlants.tankId, found.id))
			.orderBy(asc(tankPlants.position), asc(tankPlants.id)),
		tx
			.select({ animal: tankLivestock, commonName: species.commonName })
			.from(tankLivestock)
			.leftJoin(species, eq(species.id, tankLivestock.speciesId))
			.where(eq(tankLivestock.tankId, found.id))
			.orderBy(asc(tankLivestock.position), asc(tankLivestock.id)),
		media.listFor('tank', found.id, tx)
	]);
	return {
		...found,
		ownerName: owner[0]?.displayName ?? 'A member',
		cover: photos[0] ?? null,
		lights,
		filters,
		fertilisers,
		plants: plants.map((p) => ({ ...p.plant, commonName: p.commonName })),
		livestock: livestock.map((a) => ({ ...a.animal, commonName: a.commonName }))
	};
}

/** The bare row of a tank the viewer may see (no lists or photos), or null. */
export async function findVisible(viewer: Pick<Viewer, 'id'> | null, id: number, tx: DbOrTx = appDb): Promise<TankRow | null> {
	const found = await row(id, tx);
	return found && canView(viewer, found) ? found : null;
}

/** The bare row of one of the viewer's own tanks, or null. */
export async function findOwn(viewer: Pick<Viewer, 'id'>, id: number, tx: DbOrTx = appDb): Promise<TankRow | null> {
	const found = await row(id, tx);
	return found && found.ownerId === viewer.id ? found : null;
}

/** Notes new journal activity (an entry, event or test) for "recently updated". */
export async function touch(tx: DbOrTx, id: number, now = new Date()): Promise<void> {
	await tx.update(tanks).set({ activityAt: now }).where(eq(tanks.id, id));
}

/** Works the stored volume out again for tanks that lack it (rows written before it was kept). */
export async function refreshVolumes(tx: DbOrTx = appDb): Promise<number> {
	const missing = await tx.select().from(tanks).where(isNull(tanks.volumeLitres));
	for (const t of missing) {
		const litres = figuresOf({ ...t, lights: [], filters: [] }).volume?.litres;
		if (litres !== undefined && Number.isFinite(litres)) {
			await tx
				.update(tanks)
				.set({ volumeLitres: Math.round(litres * 100) / 100, activityAt: t.activityAt ?? t.updatedAt ?? t.createdAt })
				.where(eq(tanks.id, t.id));
		}
	}
	return missing.length;
}

/** A tank with everything on its profile, or null when it does not exist or the viewer may not see it. */
export async function get(viewer: Viewer | null, id: number, tx: DbOrTx = appDb): Promise<Tank | null> {
	const found = await row(id, tx);
	if (!found || !canView(viewer, found)) return null;
	return load(found, tx);
}

/** The tank for its owner's edit form; null for anyone else. */
export async function getOwn(viewer: Viewer, id: number, tx: DbOrTx = appDb): Promise<Tank | null> {
	const found = await row(id, tx);
	if (!found || found.ownerId !== viewer.id) return null;
	return load(found, tx);
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
export async function listOwn(viewer: Viewer, options: { retired?: boolean } = {}, tx: DbOrTx = appDb): Promise<TankSummary[]> {
	const conditions = [eq(tanks.ownerId, viewer.id)];
	if (options.retired === false) conditions.push(isNull(tanks.retiredOn));
	if (options.retired === true) conditions.push(isNotNull(tanks.retiredOn));
	const rows = await tx
		.select()
		.from(tanks)
		.where(and(...conditions))
		.orderBy(sql`${tanks.retiredOn} IS NOT NULL`, desc(tanks.setUpOn), desc(tanks.id));
	return summaries(
		rows,
		await media.listForMany(
			'tank',
			rows.map((r) => r.id),
			tx
		)
	);
}

/** Another member's tanks that the viewer may see (running ones), e.g. for a profile or a contest entry form. */
export async function listVisibleOf(viewer: Viewer | null, ownerId: string, tx: DbOrTx = appDb): Promise<TankSummary[]> {
	const rows = (
		await tx
			.select()
			.from(tanks)
			.where(and(eq(tanks.ownerId, ownerId), isNull(tanks.retiredOn)))
			.orderBy(desc(tanks.setUpOn), desc(tanks.id))
	).filter((t) => canView(viewer, t));
	return summaries(
		rows,
		await media.listForMany(
			'tank',
			rows.map((r) => r.id),
			tx
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
		heaterNote: input.heaterNote,
		co2Method: input.co2Method,
		co2BubblesPerSecond: input.co2Method === 'pressurised' ? input.co2BubblesPerSecond : null,
		waterLitres: input.waterLitres,
		description: input.description || null,
		visibility: input.visibility
	};
}

/** Plants and animals picked from the catalogue take its scientific name; unknown ids become free text. */
async function resolveSpecies<T extends { speciesId: number | null; name: string }>(tx: DbOrTx, rows: T[]): Promise<T[]> {
	const ids = [...new Set(rows.map((r) => r.speciesId).filter((id): id is number => id !== null))];
	if (ids.length === 0) return rows;
	const found = await tx.select({ id: species.id, scientificName: species.scientificName }).from(species).where(inArray(species.id, ids));
	const names = new Map(found.map((s) => [s.id, s.scientificName]));
	return rows.map((r) => {
		if (r.speciesId === null) return r;
		const name = names.get(r.speciesId);
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
	await syncChildren(tx, tankPlants, tankId, await resolveSpecies(tx, input.plants), (p) => ({
		speciesId: p.speciesId,
		name: p.name,
		placement: p.placement,
		addedOn: p.addedOn,
		removedOn: p.removedOn
	}));
	await syncChildren(tx, tankLivestock, tankId, await resolveSpecies(tx, input.livestock), (a) => ({
		speciesId: a.speciesId,
		name: a.name,
		count: a.count,
		addedOn: a.addedOn,
		removedOn: a.removedOn
	}));
}

/** Creates a tank for the viewer with its cover photo (a pending upload of theirs, or none). */
export async function create(viewer: Pick<Viewer, 'id'>, input: TankInput, cover: PhotoField[] = [], database: DbOrTx = appDb): Promise<number> {
	return database.transaction(async (tx) => {
		const now = new Date();
		const [result] = await tx.insert(tanks).values({ ...columns(input), ownerId: viewer.id, updatedAt: now, activityAt: now });
		const id = result.insertId;
		await writeChildren(tx, id, input);
		// A new tank has no photos yet, so nothing can be dropped here.
		await media.setPhotos(tx, viewer.id, 'tank', id, cover, { max: TANK_COVER_MAX });
		return id;
	});
}

/** Saves the owner's changes; TankNotFound for anyone else. */
export async function update(viewer: Viewer, id: number, input: TankInput, cover: PhotoField[], database: Database = appDb): Promise<void> {
	const purge: Purge = await database.transaction(async (tx) => {
		const [found] = await tx.select().from(tanks).where(eq(tanks.id, id)).for('update');
		if (!found || found.ownerId !== viewer.id) throw new TankNotFound();
		await tx
			.update(tanks)
			.set({ ...columns(input), updatedAt: new Date(), activityAt: new Date() })
			.where(eq(tanks.id, id));
		await writeChildren(tx, id, input);
		return media.setPhotos(tx, viewer.id, 'tank', id, cover, { max: TANK_COVER_MAX });
	});
	await media.purgeAfterCommit(purge, { tankId: id, what: 'replaced photos' });
}

/** Retires a running tank: it stays on the profile with all its history, marked as taken down. */
export async function retire(viewer: Viewer, id: number, on: string, note = '', database: Database = appDb): Promise<void> {
	const [result] = await database
		.update(tanks)
		.set({ retiredOn: on, retiredNote: note, updatedAt: new Date() })
		.where(and(eq(tanks.id, id), eq(tanks.ownerId, viewer.id), isNull(tanks.retiredOn)));
	if (result.affectedRows === 0) {
		const found = await row(id, database);
		if (!found || found.ownerId !== viewer.id) throw new TankNotFound();
	}
}

/** Sets a retired tank running again. */
export async function reopen(viewer: Viewer, id: number, database: Database = appDb): Promise<void> {
	const [result] = await database
		.update(tanks)
		.set({ retiredOn: null, retiredNote: '', updatedAt: new Date() })
		.where(and(eq(tanks.id, id), eq(tanks.ownerId, viewer.id)));
	if (result.affectedRows === 0) throw new TankNotFound();
}

/**
 * Deletes a tank for good, its lists and its photos (rows in the transaction, objects after it).
 * Features that attach records to a tank delete theirs first in the same transaction: pass them
 * as `before`.
 */
export async function remove(
	viewer: Viewer,
	id: number,
	options: { before?: (tx: DbOrTx, tankId: number) => Promise<Purge | void> } = {},
	database: Database = appDb
): Promise<void> {
	const purge = await database.transaction(async (tx) => {
		const [found] = await tx.select().from(tanks).where(eq(tanks.id, id)).for('update');
		if (!found || found.ownerId !== viewer.id) throw new TankNotFound();
		const extra = (await options.before?.(tx, id)) ?? [];
		const keys = await media.deleteFor(tx, 'tank', id);
		await tx.delete(tanks).where(eq(tanks.id, id));
		return [...extra, ...keys];
	});
	await media.purgeAfterCommit(purge, { tankId: id, what: 'photos of a deleted tank' });
}

/** Media access for scope 'tank' (registered in ../media/access.ts): the tank's own visibility. */
export async function photoAudience(viewer: Viewer | null, tankId: number): Promise<'public' | 'restricted' | null> {
	const found = await row(tankId);
	if (!found || !canView(viewer, found)) return null;
	return found.visibility === 'public' ? 'public' : 'restricted';
}

/** The computed figures of a tank (volume, weight, light, turnover, age, cautions); see $lib/journals/figures. */
export const tankFigures = (tank: Tank, now = new Date()) => figuresOf(tank, now);
