// The restricted species list and the club's jurisdictions. Which entries apply is decided here
// and nowhere else: entries of the jurisdictions the club has chosen (the `jurisdictions` setting).
// Changes are the admins' (or the system's, for the reference seed: actor null), and audited.
import { and, eq, inArray } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as catalogue from '../species/catalogue';
import * as audit from '../audit';
import { DomainError, forbidden, invalid, notFound } from '../../errors';
import { assess, jurisdictionsOf, type Assessment, type CheckBasis, type Restriction, type RestrictionLevel } from '../../swaps/restrictions';
import { restrictedSpecies, swapSettings } from './schema';

export type { Restriction, Assessment };

/** Who changes the list: an admin, or null for the system (the reference seed). */
type Actor = Pick<Viewer, 'id' | 'role'> | null;

const JURISDICTIONS_SETTING = 'jurisdictions';

function assertAdmin(actor: Actor): void {
	if (actor && actor.role !== 'admin') throw forbidden('Only the club’s admins change the restricted species list.');
}

/** The jurisdictions whose entries apply to this club (none until an admin picks). */
export async function clubJurisdictions(context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	const [row] = await db.select().from(swapSettings).where(eq(swapSettings.name, JURISDICTIONS_SETTING));
	const value = row?.value;
	return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : [];
}

export async function setClubJurisdictions(actor: Actor, list: string[], context: Context = {}): Promise<void> {
	assertAdmin(actor);
	const { db } = resolve(context);
	const value = [...new Set(list.map((j) => j.trim()).filter(Boolean))].sort((a, b) => a.localeCompare(b, 'en'));
	await db.transaction(async (tx) => {
		await tx.insert(swapSettings).values({ name: JURISDICTIONS_SETTING, value }).onDuplicateKeyUpdate({ set: { value } });
		if (actor)
			await audit.record(
				{ actorId: actor.id, action: 'swaps.jurisdictions', subject: { type: 'swap_setting', id: JURISDICTIONS_SETTING }, detail: { value } },
				{ db: tx }
			);
	});
}

type EntryRow = typeof restrictedSpecies.$inferSelect;

/** Entries with their species' names from the catalogue (one look-up for all of them). */
async function named(rows: EntryRow[], context: Context): Promise<Restriction[]> {
	if (rows.length === 0) return [];
	const species = await catalogue.getMany([...new Set(rows.map((r) => r.speciesId))], context);
	return rows.flatMap((r) => {
		const s = species.get(r.speciesId);
		if (!s) return [];
		return [
			{
				id: r.id,
				speciesId: r.speciesId,
				scientificName: s.scientificName,
				commonName: s.commonName,
				jurisdiction: r.jurisdiction,
				level: r.level,
				source: r.source,
				note: r.note,
				checkedOn: r.checkedOn,
				checkBasis: r.checkBasis
			}
		];
	});
}

const byJurisdictionThenName = (a: Restriction, b: Restriction) =>
	a.jurisdiction.localeCompare(b.jurisdiction, 'en', { sensitivity: 'base' }) ||
	a.scientificName.localeCompare(b.scientificName, 'en', { sensitivity: 'base' });

/** Every entry, by jurisdiction then name. */
export async function list(context: Context = {}): Promise<Restriction[]> {
	const { db } = resolve(context);
	return (await named(await db.select().from(restrictedSpecies), context)).sort(byJurisdictionThenName);
}

/** The jurisdictions the list has entries for, for the club's setting. */
export async function jurisdictionsPresent(context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	const rows = await db.selectDistinct({ jurisdiction: restrictedSpecies.jurisdiction }).from(restrictedSpecies);
	return jurisdictionsOf(rows);
}

/** What applies to each of these species in the club's jurisdictions. */
export async function assessMany(speciesIds: number[], context: Context = {}): Promise<Map<number, Assessment>> {
	const result = new Map<number, Assessment>();
	const ids = [...new Set(speciesIds)];
	if (ids.length === 0) return result;
	const { db } = resolve(context);
	const jurisdictions = await clubJurisdictions(context);
	if (jurisdictions.length === 0) return result;
	const rows = await named(
		await db
			.select()
			.from(restrictedSpecies)
			.where(and(inArray(restrictedSpecies.speciesId, ids), inArray(restrictedSpecies.jurisdiction, jurisdictions))),
		context
	);
	for (const id of ids) {
		const assessment = assess(
			rows.filter((r) => r.speciesId === id),
			jurisdictions
		);
		if (assessment.banned.length || assessment.cautioned.length) result.set(id, assessment);
	}
	return result;
}

export async function assessOne(speciesId: number | null, context: Context = {}): Promise<Assessment> {
	if (speciesId === null) return { banned: [], cautioned: [] };
	return (await assessMany([speciesId], context)).get(speciesId) ?? { banned: [], cautioned: [] };
}

export interface RestrictionInput {
	speciesId: number;
	jurisdiction: string;
	level: RestrictionLevel;
	source: string;
	note: string;
	checkedOn: string;
	checkBasis: CheckBasis;
}

export async function add(actor: Actor, input: RestrictionInput, context: Context = {}): Promise<number> {
	assertAdmin(actor);
	const { db } = resolve(context);
	return db.transaction(async (tx) => {
		if (!(await catalogue.get(input.speciesId, within(context, tx))))
			throw invalid({ speciesName: 'Pick the species from the catalogue.' }, undefined, 'no-species');
		const [existing] = await tx
			.select({ id: restrictedSpecies.id })
			.from(restrictedSpecies)
			.where(and(eq(restrictedSpecies.speciesId, input.speciesId), eq(restrictedSpecies.jurisdiction, input.jurisdiction)));
		if (existing) {
			const message = 'This species already has an entry for that jurisdiction; change that one instead.';
			throw new DomainError(409, 'duplicate', message, { speciesName: message });
		}
		const [result] = await tx.insert(restrictedSpecies).values(input);
		if (actor)
			await audit.record(
				{ actorId: actor.id, action: 'restricted.add', subject: { type: 'restricted_species', id: result.insertId }, detail: { ...input } },
				within(context, tx)
			);
		return result.insertId;
	});
}

export async function update(
	actor: Pick<Viewer, 'id' | 'role'>,
	id: number,
	changes: Pick<RestrictionInput, 'level' | 'note' | 'source' | 'checkedOn' | 'checkBasis'>,
	context: Context = {}
): Promise<void> {
	assertAdmin(actor);
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		const [result] = await tx.update(restrictedSpecies).set(changes).where(eq(restrictedSpecies.id, id));
		if (result.affectedRows === 0) throw notFound('That entry no longer exists.');
		await audit.record(
			{ actorId: actor.id, action: 'restricted.update', subject: { type: 'restricted_species', id }, detail: { ...changes } },
			within(context, tx)
		);
	});
}

export async function remove(actor: Pick<Viewer, 'id' | 'role'>, id: number, context: Context = {}): Promise<void> {
	assertAdmin(actor);
	const { db } = resolve(context);
	await db.transaction(async (tx) => {
		await tx.delete(restrictedSpecies).where(eq(restrictedSpecies.id, id));
		await audit.record({ actorId: actor.id, action: 'restricted.remove', subject: { type: 'restricted_species', id } }, within(context, tx));
	});
}
