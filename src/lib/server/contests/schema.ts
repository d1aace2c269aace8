import { date, decimal, index, int, json, mediumtext, mysqlEnum, mysqlTable, primaryKey, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import { tanks } from '../journals/schema';
import { CONTEST_STATES } from '../../contests/lifecycle';
import { RANK_BASES } from '../../contests/results';
import type { CardFields } from '../../contests/card';
import type { PublishedResults } from '../../contests/published';

// Contests: the contest with its rubric and categories, the entries, the judging panel, the
// judges' conflicts and their scorecards. Entry windows are calendar days (UTC); see
// $lib/contests/lifecycle for what they mean.

const userRef = () => varchar({ length: 255 }).references(() => users.id);

export const AGGREGATION_METHODS = ['mean', 'median', 'trimmed-mean'] as const;

export const contests = mysqlTable(
	'contest',
	{
		id: id(),
		title: varchar({ length: 120 }).notNull(),
		rules: text().notNull(),
		/** The source rendered by $lib/server/markdown (sanitised), kept so reads do not render; rebuilt by the migration runner when the rules change. */
		rulesHtml: mediumtext(),
		state: mysqlEnum(CONTEST_STATES).notNull().default('draft'),
		entryOpensOn: date({ mode: 'string' }).notNull(),
		entryClosesOn: date({ mode: 'string' }).notNull(),
		judgingOpensOn: date({ mode: 'string' }).notNull(),
		judgingClosesOn: date({ mode: 'string' }).notNull(),
		entriesPerMember: int().notNull().default(1),
		aggregation: mysqlEnum(AGGREGATION_METHODS).notNull().default('mean'),
		/** Rank by the contest's aggregate of raw card totals, or by per-judge standardised scores. */
		rankBy: mysqlEnum(RANK_BASES).notNull().default('raw'),
		/** Counts corrections after publication; announcements are sent once per revision. */
		resultsRevision: int().notNull().default(0),
		announcedRevision: int(),
		createdBy: userRef(),
		createdAt: createdAt(),
		updatedAt: at(),
		openedAt: at(),
		judgingStartedAt: at(),
		publishedAt: at(),
		archivedAt: at()
	},
	(t) => [index('contest_state_idx').on(t.state)]
);

export const contestCriteria = mysqlTable(
	'contest_criterion',
	{
		id: id(),
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		position: int().notNull(),
		label: varchar({ length: 80 }).notNull(),
		/** What the judge looks for, shown beside the score field and on the rules page. */
		guidance: varchar({ length: 1000 }).notNull().default(''),
		maxPoints: decimal({ precision: 5, scale: 1, mode: 'number' }).notNull(),
		weight: decimal({ precision: 6, scale: 3, mode: 'number' }).notNull(),
		/** 1 = compared first when entries are level on score. */
		tieBreakRank: int().notNull()
	},
	(t) => [index('contest_criterion_contest_idx').on(t.contestId, t.position)]
);

export const contestCategories = mysqlTable(
	'contest_category',
	{
		id: id(),
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		position: int().notNull(),
		name: varchar({ length: 60 }).notNull(),
		description: varchar({ length: 500 }).notNull().default(''),
		minLitres: decimal({ precision: 8, scale: 1, mode: 'number' }),
		maxLitres: decimal({ precision: 8, scale: 1, mode: 'number' }),
		minAgeWeeks: int()
	},
	(t) => [index('contest_category_contest_idx').on(t.contestId, t.position)]
);

export const contestEntries = mysqlTable(
	'contest_entry',
	{
		id: id(),
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		categoryId: ref()
			.notNull()
			.references(() => contestCategories.id),
		entrantId: userRef().notNull(),
		/** The tank entered; kept as null if the member later deletes the tank (the figures stay). */
		tankId: ref().references(() => tanks.id, { onDelete: 'set null' }),
		/** Drawn at random when judging starts; judges know an entry only by it. */
		number: int(),
		statement: text().notNull(),
		/** The statement as judges read it: rendered without pictures (see markdown-fields.ts), and how many pictures it had. */
		statementHtml: mediumtext(),
		statementPictures: int(),
		/** The tank's figures when it was entered or last edited, as checked for eligibility. */
		litres: decimal({ precision: 8, scale: 1, mode: 'number' }),
		volumeSource: mysqlEnum(['measured', 'estimated']),
		ageWeeks: int(),
		createdAt: createdAt(),
		updatedAt: at()
	},
	(t) => [
		uniqueIndex('contest_entry_number_idx').on(t.contestId, t.number),
		uniqueIndex('contest_entry_tank_idx').on(t.contestId, t.tankId),
		index('contest_entry_entrant_idx').on(t.contestId, t.entrantId),
		index('contest_entry_category_idx').on(t.categoryId)
	]
);

export const contestJudges = mysqlTable(
	'contest_judge',
	{
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		judgeId: userRef().notNull(),
		assignedBy: userRef(),
		assignedAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.contestId, t.judgeId] })]
);

export const contestConflicts = mysqlTable(
	'contest_conflict',
	{
		entryId: ref()
			.notNull()
			.references(() => contestEntries.id, { onDelete: 'cascade' }),
		judgeId: userRef().notNull(),
		/** Seen by the admins only. */
		reason: varchar({ length: 300 }).notNull().default(''),
		declaredAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.entryId, t.judgeId] })]
);

export const CARD_STATUSES = ['draft', 'submitted'] as const;

export const contestCards = mysqlTable(
	'contest_card',
	{
		id: id(),
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		entryId: ref()
			.notNull()
			.references(() => contestEntries.id, { onDelete: 'cascade' }),
		judgeId: userRef().notNull(),
		status: mysqlEnum(CARD_STATUSES).notNull().default('draft'),
		fields: json().$type<CardFields>().notNull(),
		/** Raised by every save; a save based on an older version is refused. */
		version: int().notNull().default(1),
		/** The browser's id for the last save, so a retried request is recognised. */
		lastSaveId: varchar({ length: 64 }),
		createdAt: createdAt(),
		updatedAt: at().notNull(),
		submittedAt: at()
	},
	(t) => [uniqueIndex('contest_card_cell_idx').on(t.entryId, t.judgeId), index('contest_card_judge_idx').on(t.contestId, t.judgeId)]
);

/** The published results, one record per contest and results revision (see review.ts). */
export const contestResults = mysqlTable(
	'contest_result',
	{
		contestId: ref()
			.notNull()
			.references(() => contests.id, { onDelete: 'cascade' }),
		revision: int().notNull(),
		results: json().$type<PublishedResults>().notNull(),
		createdAt: createdAt()
	},
	(t) => [primaryKey({ columns: [t.contestId, t.revision] })]
);

export type ContestRow = typeof contests.$inferSelect;
export type CriterionRow = typeof contestCriteria.$inferSelect;
export type CategoryRow = typeof contestCategories.$inferSelect;
export type ContestEntryRow = typeof contestEntries.$inferSelect;
export type CardRow = typeof contestCards.$inferSelect;
