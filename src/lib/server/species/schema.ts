import { decimal, index, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id } from '../db/columns';
import { GROWTH_HABITS, GROWTH_SPEEDS, PLACEMENTS, SPECIES_KINDS, TEMPERAMENTS } from '../../species/kinds';

/** The club's shared catalogue of plants and animals, used by tank journals and the swap board. */
export const species = mysqlTable(
	'species',
	{
		id: id(),
		kind: mysqlEnum(SPECIES_KINDS).notNull(),
		scientificName: varchar({ length: 160 }).notNull().unique(),
		/** The usual common name, and other common names separated by commas. */
		commonName: varchar({ length: 120 }).notNull().default(''),
		otherNames: varchar({ length: 300 }).notNull().default(''),
		placement: mysqlEnum(PLACEMENTS),
		growthHabit: mysqlEnum(GROWTH_HABITS),
		growthSpeed: mysqlEnum(GROWTH_SPEEDS),
		adultSizeCm: decimal({ precision: 5, scale: 1, mode: 'number' }),
		temperament: mysqlEnum(TEMPERAMENTS),
		note: varchar({ length: 300 }).notNull().default(''),
		createdAt: createdAt()
	},
	(t) => [index('species_kind_idx').on(t.kind), index('species_common_idx').on(t.commonName)]
);

export type SpeciesRow = typeof species.$inferSelect;
