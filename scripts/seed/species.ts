import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { species } from '../../src/lib/server/species/schema';
import { SPECIES, type SpeciesSeed } from './species-data';

/** A seed entry as a catalogue row; fields a kind does not use stay empty. */
export const catalogueRow = (s: SpeciesSeed) => ({
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
});

/** The shared species catalogue (reference data: every club gets it). */
export async function seedSpecies(db: DbOrTx): Promise<void> {
	await db
		.insert(species)
		.values(SPECIES.map(catalogueRow))
		// A catalogue entry a club added by hand under the same name is left as it is.
		.onDuplicateKeyUpdate({ set: { scientificName: sql`scientific_name` } });
}
