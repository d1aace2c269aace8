import { date, index, json, mediumtext, mysqlEnum, mysqlTable, primaryKey, uniqueIndex, varchar, char } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import { journalEntries, tanks } from '../journals/schema';
import { FEEDING_CHOICES, LIGHTING_CHOICES, SITTER_STATES, VISIT_MAIL_CHOICES } from '../../away/vocabulary';

// Away care: a keeper's care plan for one tank over the days they are away, the members asked to
// look in, and the visits those who said yes logged. A visit's text and photos are a journal
// entry on the tank, written by the sitter; the visit row ties it to the plan.

export const awayPlans = mysqlTable(
	'away_plan',
	{
		id: id(),
		tankId: ref()
			.notNull()
			.references(() => tanks.id, { onDelete: 'cascade' }),
		keeperId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		/** The first day nobody is home. */
		startsOn: date({ mode: 'string' }).notNull(),
		/** The day the keeper is back; a sitter's access ends when it begins. */
		endsOn: date({ mode: 'string' }).notNull(),
		feeding: mysqlEnum(FEEDING_CHOICES).notNull(),
		lighting: mysqlEnum(LIGHTING_CHOICES).notNull(),
		keeperPhone: varchar({ length: 40 }).notNull().default(''),
		/** How the keeper hears of visits: a mail after each, or one a day. */
		visitMail: mysqlEnum(VISIT_MAIL_CHOICES).notNull().default('each'),
		/** The keeper's day (in their zone) the last daily digest of visits went out. */
		digestSentOn: date({ mode: 'string' }),
		/** The plan as the keeper edited it (markdown). */
		body: mediumtext().notNull(),
		/** The plan rendered once when written (see ../markdown-fields.ts). */
		bodyHtml: mediumtext(),
		/** SHA-256 of the private link's token, hex; null when no link was made. */
		shareTokenHash: char({ length: 64 }),
		/** When the keeper was sent the summary after the period. */
		summarySentAt: at(),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [
		index('away_plan_tank_idx').on(t.tankId, t.startsOn),
		index('away_plan_keeper_idx').on(t.keeperId, t.endsOn),
		uniqueIndex('away_plan_share_idx').on(t.shareTokenHash)
	]
);

export const awaySitters = mysqlTable(
	'away_sitter',
	{
		id: id(),
		planId: ref()
			.notNull()
			.references(() => awayPlans.id, { onDelete: 'cascade' }),
		sitterId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		state: mysqlEnum(SITTER_STATES).notNull().default('asked'),
		askedAt: createdAt(),
		answeredAt: at()
	},
	(t) => [uniqueIndex('away_sitter_plan_idx').on(t.planId, t.sitterId), index('away_sitter_sitter_idx').on(t.sitterId, t.state)]
);

export const awayVisits = mysqlTable(
	'away_visit',
	{
		id: id(),
		planId: ref()
			.notNull()
			.references(() => awayPlans.id, { onDelete: 'cascade' }),
		sitterId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		visitedOn: date({ mode: 'string' }).notNull(),
		/** The journal entry the visit wrote on the tank. */
		entryId: ref().references(() => journalEntries.id, { onDelete: 'set null' }),
		/** What was ticked, as the plan's lines read. */
		done: json().$type<string[]>().notNull(),
		note: varchar({ length: 1000 }).notNull().default(''),
		/** When the keeper was mailed about it (at once, or in a daily digest); null while it waits. */
		keeperMailedAt: at(),
		createdAt: createdAt()
	},
	(t) => [index('away_visit_plan_idx').on(t.planId, t.visitedOn)]
);

/** A missed visit day a sitter was reminded of: one row per plan, sitter and day, so each is sent once. */
export const awayReminders = mysqlTable(
	'away_reminder',
	{
		planId: ref()
			.notNull()
			.references(() => awayPlans.id, { onDelete: 'cascade' }),
		sitterId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		/** The visit day, in the sitter's zone. */
		day: date({ mode: 'string' }).notNull(),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.planId, t.sitterId, t.day] })]
);

/** Members who said they can look after tanks near them. */
export const awayHelpers = mysqlTable(
	'away_helper',
	{
		userId: varchar({ length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.userId] })]
);

export type AwayPlanRow = typeof awayPlans.$inferSelect;
export type AwaySitterRow = typeof awaySitters.$inferSelect;
export type AwayVisitRow = typeof awayVisits.$inferSelect;
