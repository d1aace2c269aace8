// The restricted species list and the club's jurisdictions. Which entries apply is decided here
// and nowhere else: entries of the jurisdictions the club has chosen (the `jurisdictions` setting).
import { and, asc, eq, inArray, or, sql } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { auditLog } from '../audit/schema';
import type { Viewer } from '../club/users';
import { species } from '../species/schema';
import type { SpeciesKind } from '../../species/kinds';
import { ANIMAL_KINDS } from '../../species/kinds';
import { assess, jurisdictionsOf, type Assessment, type CheckBasis, type Restriction, type RestrictionLevel } from '../../swaps/restrictions';
import { restrictedSpecies, swapSettings } from './schema';
import { SwapError } from './errors';

export type { Restriction, Assessment };

const JURISDICTIONS_SETTING = 'jurisdictions';

/** The jurisdictions whose entries apply to this club (none until an admin picks). */
export async function clubJurisdictions(database: DbOrTx = appDb): Promise<string[]> {
	const [row] = await database.select().from(swapSettings).where(eq(swapSettings.name, JURISDICTIONS_SETTING));
	const value = row?.value;
	return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : [];
}

export async function setClubJurisdictions(actor: Pick<Viewer, 'id'> | null, list: string[], database: DbOrTx = appDb): Promise<void> {
	const value = [...new Set(list.map((j) => j.trim()).filter(Boolean))].sort((a, b) => a.localeCompare(b, 'en'));
	await database.transaction(async (tx) => {
		await tx.insert(swapSettings).values({ name: JURISDICTIONS_SETTING, value }).onDuplicateKeyUpdate({ set: { value } });
		if (actor)
			await tx
				.insert(auditLog)
				.values({ actorId: actor.id, action: 'swaps.jurisdictions', subjectType: 'swap_setting', subjectId: JURISDICTIONS_SETTING, detail: { value } });
	});
}

const columns = {
	id: restrictedSpecies.id,
	speciesId: restrictedSpecies.speciesId,
	scientificName: species.scientificName,
	commonName: species.commonName,
	jurisdiction: restrictedSpecies.jurisdiction,
	level: restrictedSpecies.level,
	source: restrictedSpecies.source,
	note: restrictedSpecies.note,
	checkedOn: restrictedSpecies.checkedOn,
	checkBasis: restrictedSpecies.checkBasis
};

/** Every entry, by jurisdiction then name. */
export async function list(database: DbOrTx = appDb): Promise<Restriction[]> {
	return database
		.select(columns)
		.from(restrictedSpecies)
		.innerJoin(species, eq(species.id, restrictedSpecies.speciesId))
		.orderBy(asc(restrictedSpecies.jurisdiction), asc(species.scientificName));
}

/** The jurisdictions the list has entries for, for the club's setting. */
export async function jurisdictionsPresent(database: DbOrTx = appDb): Promise<string[]> {
	const rows = await database.selectDistinct({ jurisdiction: restrictedSpecies.jurisdiction }).from(restrictedSpecies);
	return jurisdictionsOf(rows);
}

/** What applies to each of these species in the club's jurisdictions. */
export async function assessMany(speciesIds: number[], database: DbOrTx = appDb): Promise<Map<number, Assessment>> {
	const result = new Map<number, Assessment>();
	const ids = [...new Set(speciesIds)];
	if (ids.length === 0) return result;
	const jurisdictions = await clubJurisdictions(database);
	if (jurisdictions.length === 0) return result;
	const rows = await database
		.select(columns)
		.from(restrictedSpecies)
		.innerJoin(species, eq(species.id, restrictedSpecies.speciesId))
		.where(and(inArray(restrictedSpecies.speciesId, ids), inArray(restrictedSpecies.jurisdiction, jurisdictions)));
	for (const id of ids) {
		const assessment = assess(
			rows.filter((r) => r.speciesId === id),
			jurisdictions
		);
		if (assessment.banned.length || assessment.cautioned.length) result.set(id, assessment);
	}
	return result;
}

export async function assessOne(speciesId: number | null, database: DbOrTx = appDb): Promise<Assessment> {
	if (speciesId === null) return { banned: [], cautioned: [] };
	return (await assessMany([speciesId], database)).get(speciesId) ?? { banned: [], cautioned: [] };
}

/**
 * The catalogue entry a listing names: the picked id (if it is of the right kind), else a
 * catalogue species whose scientific or common name is exactly what was typed (so typing a
 * restricted plant's name instead of picking it is caught too), else free text.
 */
export async function resolveSpecies(
	pick: { speciesId: number | null; speciesName: string },
	kind: 'plant' | 'animal',
	database: DbOrTx = appDb
): Promise<{ speciesId: number | null; speciesName: string }> {
	const kinds: SpeciesKind[] = kind === 'plant' ? ['plant'] : ANIMAL_KINDS;
	if (pick.speciesId !== null) {
		const [row] = await database
			.select({ id: species.id, scientificName: species.scientificName })
			.from(species)
			.where(and(eq(species.id, pick.speciesId), inArray(species.kind, kinds)));
		if (row) return { speciesId: row.id, speciesName: row.scientificName };
	}
	const typed = pick.speciesName.trim();
	if (!typed) return { speciesId: null, speciesName: '' };
	// The collation compares without regard to case.
	const [match] = await database
		.select({ id: species.id, scientificName: species.scientificName })
		.from(species)
		.where(and(inArray(species.kind, kinds), or(eq(species.scientificName, typed), eq(species.commonName, typed))))
		.orderBy(sql`${species.scientificName} = ${typed} DESC`)
		.limit(1);
	return match ? { speciesId: match.id, speciesName: match.scientificName } : { speciesId: null, speciesName: typed };
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

export async function add(actor: Pick<Viewer, 'id'> | null, input: RestrictionInput, database: DbOrTx = appDb): Promise<number> {
	return database.transaction(async (tx) => {
		const [plant] = await tx.select({ id: species.id }).from(species).where(eq(species.id, input.speciesId));
		if (!plant) throw new SwapError(400, 'no-species', 'Pick the species from the catalogue.', 'speciesName');
		const [existing] = await tx
			.select({ id: restrictedSpecies.id })
			.from(restrictedSpecies)
			.where(and(eq(restrictedSpecies.speciesId, input.speciesId), eq(restrictedSpecies.jurisdiction, input.jurisdiction)));
		if (existing) throw new SwapError(409, 'duplicate', 'This species already has an entry for that jurisdiction; change that one instead.', 'speciesName');
		const [result] = await tx.insert(restrictedSpecies).values(input);
		if (actor)
			await tx
				.insert(auditLog)
				.values({ actorId: actor.id, action: 'restricted.add', subjectType: 'restricted_species', subjectId: String(result.insertId), detail: { ...input } });
		return result.insertId;
	});
}

export async function update(
	actor: Pick<Viewer, 'id'>,
	id: number,
	changes: Pick<RestrictionInput, 'level' | 'note' | 'source' | 'checkedOn' | 'checkBasis'>,
	database: DbOrTx = appDb
): Promise<void> {
	await database.transaction(async (tx) => {
		const [result] = await tx.update(restrictedSpecies).set(changes).where(eq(restrictedSpecies.id, id));
		if (result.affectedRows === 0) throw new SwapError(404, 'not-found', 'That entry no longer exists.');
		await tx
			.insert(auditLog)
			.values({ actorId: actor.id, action: 'restricted.update', subjectType: 'restricted_species', subjectId: String(id), detail: { ...changes } });
	});
}

export async function remove(actor: Pick<Viewer, 'id'>, id: number, database: DbOrTx = appDb): Promise<void> {
	await database.transaction(async (tx) => {
		await tx.delete(restrictedSpecies).where(eq(restrictedSpecies.id, id));
		await tx.insert(auditLog).values({ actorId: actor.id, action: 'restricted.remove', subjectType: 'restricted_species', subjectId: String(id) });
	});
}
