// The shared species catalogue: search for pickers (tank plants and livestock, swap listings)
// and look-ups by id. Anyone signed in may read it.
import { and, asc, eq, inArray, like, or, sql } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { ANIMAL_KINDS, type SpeciesHit, type SpeciesKind } from '../../species/kinds';
import { species, type SpeciesRow } from './schema';

export type { SpeciesRow };

/** A kind, or 'animal' for every kind that is not a plant. */
export type KindFilter = SpeciesKind | 'animal';

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => '\\' + c);

/**
 * Species whose scientific or common names contain the words of `query`, best first: names that
 * start with it, then names with a word that starts with it, then the rest.
 */
export async function search(query: string, options: { kind?: KindFilter; limit?: number } = {}, context: Context = {}): Promise<SpeciesHit[]> {
	const q = query.trim().replace(/\s+/g, ' ').slice(0, 60);
	if (q.length < 1) return [];
	const contains = `%${escapeLike(q)}%`;
	const starts = `${escapeLike(q)}%`;
	const wordStarts = `% ${escapeLike(q)}%`;
	const kinds = options.kind === 'animal' ? ANIMAL_KINDS : options.kind ? [options.kind] : null;
	const rank = sql<number>`CASE
		WHEN ${species.scientificName} LIKE ${starts} OR ${species.commonName} LIKE ${starts} THEN 0
		WHEN ${species.scientificName} LIKE ${wordStarts} OR ${species.commonName} LIKE ${wordStarts} THEN 1
		ELSE 2 END`;
	const rows = await resolve(context)
		.db.select({
			id: species.id,
			kind: species.kind,
			scientificName: species.scientificName,
			commonName: species.commonName,
			otherNames: species.otherNames,
			placement: species.placement,
			growthHabit: species.growthHabit,
			temperament: species.temperament
		})
		.from(species)
		.where(
			and(
				kinds ? inArray(species.kind, kinds) : undefined,
				or(like(species.scientificName, contains), like(species.commonName, contains), like(species.otherNames, contains))
			)
		)
		.orderBy(rank, asc(species.scientificName))
		.limit(Math.min(Math.max(options.limit ?? 10, 1), 25));
	return rows;
}

/** One species of the catalogue, or undefined. */
export async function get(id: number, context: Context = {}): Promise<SpeciesRow | undefined> {
	const [row] = await resolve(context).db.select().from(species).where(eq(species.id, id)).limit(1);
	return row;
}

/** Species by id in one query (ids not in the catalogue are left out), keyed by id. */
export async function getMany(ids: number[], context: Context = {}): Promise<Map<number, SpeciesRow>> {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map();
	const rows = await resolve(context).db.select().from(species).where(inArray(species.id, unique));
	return new Map(rows.map((r) => [r.id, r]));
}
