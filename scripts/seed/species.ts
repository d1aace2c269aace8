import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { species } from '../../src/lib/server/species/schema';
import { SPECIES } from './species-data';

/** The shared species catalogue (reference data: every club gets it). */
export async function seedSpecies(db: DbOrTx): Promise<void> {
	await db
		.insert(species)
		.values(
			SPECIES.map((s) => ({
				kind: s.kind,
				scientificName: s.scientificName,
				commonName: s.commonName,
				otherNames: s.otherNames ?? '',
				placement: s.placement ?? null,
				growthHabit: s.growthHabit ?? null,
				growthSpeed: s.growthSpeed ?? null,
				adultSizeCm: s.adultSizeCm ?? null,
				temperament: s.temperament ?? null,
				note: s.note ?? ''
			}))
		)
		// A catalogue entry a club added by hand under the same name is left as it is.
		.onDuplicateKeyUpdate({ set: { scientificName: sql`scientific_name` } });
}
