import { sql } from 'drizzle-orm';
import { type AnyMySqlColumn, date, datetime, decimal, index, int, mediumtext, mysqlEnum, mysqlTable, primaryKey, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import { species } from '../species/schema';
import { PLACEMENTS } from '../../species/kinds';
import { CO2_METHODS, FLOW_UNITS, TANK_VISIBILITIES } from '../../journals/tank-vocabulary';
import { ALGAE_KINDS, DOSE_UNITS, EVENT_KINDS, FILTER_PARTS, TASK_KINDS } from '../../journals/journal-vocabulary';

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
		/** What the heater is set to, °C. */
		heaterSetC: decimal({ precision: 4, scale: 1, mode: 'number' }),
		heaterNote: varchar({ length: 160 }).notNull().default(''),
		co2Method: mysqlEnum(CO2_METHODS).notNull().default('none'),
		co2BubblesPerSecond: decimal({ precision: 4, scale: 1, mode: 'number' }),
		/** A measured water volume, when the keeper has one; it wins over the estimate. */
		waterLitres: decimal({ precision: 8, scale: 2, mode: 'number' }),
		/** PAR measured at the substrate with all the tank's lights on, µmol·m⁻²·s⁻¹, when the keeper has a meter reading. */
		parAtSubstrate: int(),
		/** How deep under the water surface that reading was taken, cm. */
		parDepthCm: decimal({ precision: 5, scale: 1, mode: 'number' }),
		description: text(),
		/** The source rendered by $lib/server/markdown (sanitised), kept so reads do not render; rebuilt by the migration runner when the rules change. */
		descriptionHtml: mediumtext(),
		visibility: mysqlEnum(TANK_VISIBILITIES).notNull().default('club'),
		retiredOn: date({ mode: 'string' }),
		retiredNote: varchar({ length: 300 }).notNull().default(''),
		/** The volume the figures use (measured, else estimated), kept for the showcase's size filter. */
		volumeLitres: decimal({ precision: 8, scale: 2, mode: 'number' }),
		/** Last change to the profile or its journal (entries, events, tests): "recently updated". */
		activityAt: at(),
		createdAt: createdAt(),
		updatedAt: at(),
		/** The showcase's "recently updated" order (last activity, else creation), kept by the database so an index serves it. */
		recentAt: datetime({ mode: 'date', fsp: 3 }).generatedAlwaysAs(sql`coalesce(activity_at, created_at)`, { mode: 'stored' })
	},
	(t) => [
		index('tank_owner_idx').on(t.ownerId, t.retiredOn),
		index('tank_activity_idx').on(t.visibility, t.activityAt),
		// The showcase: running public tanks in each order it offers, and its style list.
		index('tank_showcase_recent_idx').on(t.visibility, t.retiredOn, t.recentAt),
		index('tank_showcase_new_idx').on(t.visibility, t.retiredOn, t.createdAt),
		index('tank_showcase_style_idx').on(t.visibility, t.retiredOn, t.style)
	]
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

// The journal: dated entries with photos (media scope 'entry'), the events they record (or that
// the schedule's "done today" records on its own), water tests, the upkeep schedule, and what
// other members do with a tank (admire, follow, comment).

export const journalEntries = mysqlTable(
	'journal_entry',
	{
		id: id(),
		tankId: tankRef(),
		authorId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id),
		entryOn: date({ mode: 'string' }).notNull(),
		title: varchar({ length: 120 }).notNull().default(''),
		/** Markdown, rendered through $lib/server/markdown. */
		body: mediumtext().notNull(),
		/** The source rendered by $lib/server/markdown (sanitised), kept so reads do not render; rebuilt by the migration runner when the rules change. */
		bodyHtml: mediumtext(),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [index('journal_entry_timeline_idx').on(t.tankId, t.entryOn, t.createdAt)]
);

export const maintenanceTasks = mysqlTable(
	'maintenance_task',
	{
		id: id(),
		tankId: tankRef(),
		kind: mysqlEnum(TASK_KINDS).notNull(),
		/** For filter cleans: which part this task is about; null resets on any part. */
		filterPart: mysqlEnum(FILTER_PARTS),
		label: varchar({ length: 80 }).notNull(),
		intervalDays: int().notNull(),
		/** Latest day a matching event or test was logged; worked out again when one is removed. */
		lastDoneOn: date({ mode: 'string' }),
		position: int().notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [index('maintenance_task_tank_idx').on(t.tankId, t.position)]
);

export const journalEvents = mysqlTable(
	'journal_event',
	{
		id: id(),
		tankId: tankRef(),
		/** The entry that recorded it; null for a quick "done today" from the schedule. */
		entryId: ref().references(() => journalEntries.id, { onDelete: 'cascade' }),
		kind: mysqlEnum(EVENT_KINDS).notNull(),
		occurredOn: date({ mode: 'string' }).notNull(),
		position: int().notNull().default(0),
		/** Water change: share of the water changed. */
		percent: decimal({ precision: 4, scale: 1, mode: 'number' }),
		filterPart: mysqlEnum(FILTER_PARTS),
		/** Dose or media change: what; upkeep: the task's name; trim: which plants. */
		what: varchar({ length: 160 }).notNull().default(''),
		amount: decimal({ precision: 10, scale: 3, mode: 'number' }),
		amountUnit: mysqlEnum(DOSE_UNITS),
		/** A dry salt of the dose calculator, so the page can say what the dose adds. */
		saltId: varchar({ length: 24 }),
		speciesId: ref().references(() => species.id, { onDelete: 'set null' }),
		speciesName: varchar({ length: 160 }).notNull().default(''),
		count: int(),
		algaeKind: mysqlEnum(ALGAE_KINDS),
		note: varchar({ length: 1000 }).notNull().default(''),
		/** The list row a plant or livestock event added or closed. */
		tankPlantId: ref().references(() => tankPlants.id, { onDelete: 'set null' }),
		tankLivestockId: ref().references(() => tankLivestock.id, { onDelete: 'set null' }),
		/** The schedule task a "done today" was for. */
		taskId: ref().references(() => maintenanceTasks.id, { onDelete: 'set null' }),
		createdAt: createdAt()
	},
	(t) => [
		index('journal_event_date_idx').on(t.tankId, t.occurredOn, t.createdAt),
		// Events logged on their own, newest first, for the timeline.
		index('journal_event_standalone_idx').on(t.tankId, t.entryId, t.occurredOn, t.createdAt),
		index('journal_event_entry_idx').on(t.entryId, t.position)
	]
);

export const AMMONIA_BASES = ['NH3', 'NH4', 'N'] as const;

/** One water test; every reading is optional. Temperatures are °C, the rest mg/L unless named. */
export const waterTests = mysqlTable(
	'water_test',
	{
		id: id(),
		tankId: tankRef(),
		testedOn: date({ mode: 'string' }).notNull(),
		ph: decimal({ precision: 4, scale: 2, mode: 'number' }),
		/** °dKH and °dH. */
		kh: decimal({ precision: 5, scale: 2, mode: 'number' }),
		gh: decimal({ precision: 5, scale: 2, mode: 'number' }),
		no3: decimal({ precision: 7, scale: 2, mode: 'number' }),
		po4: decimal({ precision: 6, scale: 2, mode: 'number' }),
		k: decimal({ precision: 7, scale: 2, mode: 'number' }),
		fe: decimal({ precision: 6, scale: 3, mode: 'number' }),
		/** Total ammonia as the kit reads it, on the basis the kit prints. */
		ammonia: decimal({ precision: 6, scale: 3, mode: 'number' }),
		ammoniaBasis: mysqlEnum(AMMONIA_BASES).notNull().default('NH3'),
		no2: decimal({ precision: 6, scale: 3, mode: 'number' }),
		temperatureC: decimal({ precision: 4, scale: 1, mode: 'number' }),
		tds: int(),
		note: varchar({ length: 500 }).notNull().default(''),
		createdAt: createdAt(),
		/** When the keeper last changed the test after logging it; null for a test as first logged. */
		editedAt: at()
	},
	(t) => [index('water_test_timeline_idx').on(t.tankId, t.testedOn, t.createdAt)]
);

export const entryComments = mysqlTable(
	'entry_comment',
	{
		id: id(),
		entryId: ref()
			.notNull()
			.references(() => journalEntries.id, { onDelete: 'cascade' }),
		authorId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id),
		/** The comment this one answers (replies go one level deep); its replies go with it. */
		parentId: ref().references((): AnyMySqlColumn => entryComments.id, { onDelete: 'cascade' }),
		body: text().notNull(),
		/** The source rendered by $lib/server/markdown (sanitised), kept so reads do not render; rebuilt by the migration runner when the rules change. */
		bodyHtml: mediumtext(),
		createdAt: createdAt(),
		/** When its author last changed it; null for a comment as first posted. */
		editedAt: at()
	},
	(t) => [index('entry_comment_entry_idx').on(t.entryId, t.createdAt), index('entry_comment_parent_idx').on(t.parentId)]
);

export const tankAdmires = mysqlTable(
	'tank_admire',
	{
		tankId: tankRef(),
		userId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.tankId, t.userId] }), index('tank_admire_user_idx').on(t.userId)]
);

export const tankFollows = mysqlTable(
	'tank_follow',
	{
		tankId: tankRef(),
		userId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		/** When the last "new entry" mail was queued for this follower: at most one a day. */
		lastMailedAt: at(),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.tankId, t.userId] }), index('tank_follow_user_idx').on(t.userId)]
);

/** One row per member and week (its Monday) once the weekly digest was considered. */
export const journalDigests = mysqlTable(
	'journal_digest',
	{
		userId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		weekOf: date({ mode: 'string' }).notNull(),
		/** Null when there was nothing to tell that week, so nothing was sent. */
		sentAt: at(),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.userId, t.weekOf] })]
);

export type EntryRow = typeof journalEntries.$inferSelect;
export type EventRow = typeof journalEvents.$inferSelect;
export type WaterTestRow = typeof waterTests.$inferSelect;
export type TaskRow = typeof maintenanceTasks.$inferSelect;
export type CommentRow = typeof entryComments.$inferSelect;
