import { date, decimal, index, int, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import { species } from '../species/schema';
import { PLACEMENTS } from '../../species/kinds';
import { CO2_METHODS, FLOW_UNITS, TANK_VISIBILITIES } from '../../journals/tank-vocabulary';

// A tank profile and its repeatable parts. Every measure is stored metric (cm, litres, watts,
// L/h for a flow typed in L/h); a member's unit preference only changes how it is typed and shown.
// Calendar dates are plain DATE strings ("2026-03-14"): a set-up day has no time zone.

export const tanks = mysqlTable(
	'tank',
	{
		id: id(),
		ownerId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id),
		name: varchar({ length: 80 }).notNull(),
		style: varchar({ length: 40 }).notNull().default(''),
		setUpOn: date({ mode: 'string' }),
		lengthCm: decimal({ precision: 7, scale: 2, mode: 'number' }).notNull(),
		widthCm: decimal({ precision: 7, scale: 2, mode: 'number' }).notNull(),
		heightCm: decimal({ precision: 7, scale: 2, mode: 'number' }).notNull(),
		glassMm: decimal({ precision: 5, scale: 2, mode: 'number' }),
		/** One of the calculator's substrate kinds (nutrient-soil, sand, gravel), 'other' or ''. */
		substrateKind: varchar({ length: 40 }).notNull().default(''),
		substrateNote: varchar({ length: 120 }).notNull().default(''),
		substrateDepthCm: decimal({ precision: 6, scale: 2, mode: 'number' }),
		hardscape: varchar({ length: 500 }).notNull().default(''),
		hardscapeLitres: decimal({ precision: 8, scale: 2, mode: 'number' }),
		heaterWatts: decimal({ precision: 6, scale: 1, mode: 'number' }),
		heaterNote: varchar({ length: 160 }).notNull().default(''),
		co2Method: mysqlEnum(CO2_METHODS).notNull().default('none'),
		co2BubblesPerSecond: decimal({ precision: 4, scale: 1, mode: 'number' }),
		/** A measured water volume, when the keeper has one; it wins over the estimate. */
		waterLitres: decimal({ precision: 8, scale: 2, mode: 'number' }),
		description: text(),
		visibility: mysqlEnum(TANK_VISIBILITIES).notNull().default('club'),
		retiredOn: date({ mode: 'string' }),
		retiredNote: varchar({ length: 300 }).notNull().default(''),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [index('tank_owner_idx').on(t.ownerId, t.retiredOn), index('tank_visibility_idx').on(t.visibility)]
);

const tankRef = () =>
	ref()
		.notNull()
		.references(() => tanks.id, { onDelete: 'cascade' });

export const tankLights = mysqlTable(
	'tank_light',
	{
		id: id(),
		tankId: tankRef(),
		position: int().notNull().default(0),
		label: varchar({ length: 120 }).notNull().default(''),
		watts: decimal({ precision: 6, scale: 1, mode: 'number' }).notNull(),
		hoursPerDay: decimal({ precision: 4, scale: 2, mode: 'number' }).notNull()
	},
	(t) => [index('tank_light_tank_idx').on(t.tankId, t.position)]
);

export const tankFilters = mysqlTable(
	'tank_filter',
	{
		id: id(),
		tankId: tankRef(),
		position: int().notNull().default(0),
		label: varchar({ length: 120 }).notNull().default(''),
		/** The rated flow as printed on the filter, in the unit it was given in. */
		ratedFlow: decimal({ precision: 8, scale: 1, mode: 'number' }),
		flowUnit: mysqlEnum(FLOW_UNITS).notNull().default('lph'),
		mediaNotes: varchar({ length: 300 }).notNull().default('')
	},
	(t) => [index('tank_filter_tank_idx').on(t.tankId, t.position)]
);

export const tankFertilisers = mysqlTable(
	'tank_fertiliser',
	{
		id: id(),
		tankId: tankRef(),
		position: int().notNull().default(0),
		item: varchar({ length: 120 }).notNull(),
		amount: varchar({ length: 60 }).notNull().default(''),
		frequency: varchar({ length: 60 }).notNull().default('')
	},
	(t) => [index('tank_fertiliser_tank_idx').on(t.tankId, t.position)]
);

export const tankPlants = mysqlTable(
	'tank_plant',
	{
		id: id(),
		tankId: tankRef(),
		position: int().notNull().default(0),
		speciesId: ref().references(() => species.id, { onDelete: 'set null' }),
		/** The catalogue's scientific name when picked from it, or what the keeper typed. */
		name: varchar({ length: 160 }).notNull(),
		placement: mysqlEnum(PLACEMENTS),
		addedOn: date({ mode: 'string' }),
		removedOn: date({ mode: 'string' })
	},
	(t) => [index('tank_plant_tank_idx').on(t.tankId, t.position)]
);

export const tankLivestock = mysqlTable(
	'tank_livestock',
	{
		id: id(),
		tankId: tankRef(),
		position: int().notNull().default(0),
		speciesId: ref().references(() => species.id, { onDelete: 'set null' }),
		name: varchar({ length: 160 }).notNull(),
		count: int().notNull().default(1),
		addedOn: date({ mode: 'string' }),
		removedOn: date({ mode: 'string' })
	},
	(t) => [index('tank_livestock_tank_idx').on(t.tankId, t.position)]
);

export type TankRow = typeof tanks.$inferSelect;
