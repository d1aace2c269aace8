import { inArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { species } from '../../src/lib/server/species/schema';
import { restrictedSpecies } from '../../src/lib/server/swaps/schema';
import { catalogueRow } from './species';
import { CHECKED_ON, RESTRICTED, RESTRICTED_PLANTS } from './restricted-data';

/**
 * The restricted species list (reference data): the plants it needs, added to the catalogue if
 * missing, and one entry per list and jurisdiction, marked as written from memory.
 */
export async function seedRestrictedSpecies(db: DbOrTx): Promise<void> {
	await db
		.insert(species)
		.values(RESTRICTED_PLANTS.map(catalogueRow))
		// An entry the catalogue already has is left as it is.
		.onDuplicateKeyUpdate({ set: { scientificName: sql`scientific_name` } });
	const names = [...new Set(RESTRICTED.map((r) => r.scientificName))];
	const ids = new Map(
		(await db.select({ id: species.id, name: species.scientificName }).from(species).where(inArray(species.scientificName, names))).map((s) => [s.name, s.id])
	);
	await db
		.insert(restrictedSpecies)
		.values(
			RESTRICTED.map((r) => ({
				speciesId: ids.get(r.scientificName)!,
				jurisdiction: r.jurisdiction,
				level: r.level,
				source: r.source,
				note: r.note,
				checkedOn: CHECKED_ON,
				checkBasis: 'memory' as const
			}))
		)
		.onDuplicateKeyUpdate({ set: { jurisdiction: sql`jurisdiction` } });
}
