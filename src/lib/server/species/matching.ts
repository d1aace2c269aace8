// Catalogue entries found by name for other features: which entry a picked id or a typed name
// means (so typing a name instead of picking it finds the same entry), and which entries a free-text
// search on common names includes.
import { and, eq, inArray, like, or, sql } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { ANIMAL_KINDS, type SpeciesKind } from '../../species/kinds';
import type { KindFilter } from './catalogue';
import { species } from './schema';

const kindsOf = (kind: KindFilter): SpeciesKind[] => (kind === 'animal' ? ANIMAL_KINDS : [kind]);

/**
 * The catalogue entry a form names: the picked id (if it is of the right kind), else an entry of
 * that kind whose scientific or common name is exactly what was typed (any case; scientific names
 * first), else the typed text alone (speciesId null).
 */
export async function resolveName(
	pick: { speciesId: number | null; speciesName: string },
	kind: KindFilter,
	context: Context = {}
): Promise<{ speciesId: number | null; speciesName: string }> {
	const { db } = resolve(context);
	const kinds = kindsOf(kind);
	if (pick.speciesId !== null) {
		const [row] = await db
			.select({ id: species.id, scientificName: species.scientificName })
			.from(species)
			.where(and(eq(species.id, pick.speciesId), inArray(species.kind, kinds)));
		if (row) return { speciesId: row.id, speciesName: row.scientificName };
	}
	const typed = pick.speciesName.trim();
	if (!typed) return { speciesId: null, speciesName: '' };
	// The collation compares without regard to case.
	const [match] = await db
		.select({ id: species.id, scientificName: species.scientificName })
		.from(species)
		.where(and(inArray(species.kind, kinds), or(eq(species.scientificName, typed), eq(species.commonName, typed))))
		.orderBy(sql`${species.scientificName} = ${typed} DESC`)
		.limit(1);
	return match ? { speciesId: match.id, speciesName: match.scientificName } : { speciesId: null, speciesName: typed };
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => '\\' + c);

/** The ids of the entries whose common name contains `text` (any case), for another feature's text search. */
export async function idsWithCommonName(text: string, context: Context = {}): Promise<number[]> {
	const words = text.trim();
	if (!words) return [];
	const { db } = resolve(context);
	const rows = await db
		.select({ id: species.id })
		.from(species)
		.where(like(species.commonName, `%${escapeLike(words)}%`));
	return rows.map((r) => r.id);
}
