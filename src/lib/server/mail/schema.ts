import { index, int, json, mediumtext, mysqlEnum, tinyint, mysqlTable, boolean, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref } from '../db/columns';
import { users } from '../club/schema';
import { CHOICES, DEFAULT_PREFERENCES, type MailCategory } from '../../mail/categories';

export const OUTBOX_STATES = ['queued', 'sending', 'sent', 'failed'] as const;
export type OutboxState = (typeof OUTBOX_STATES)[number];

/**
 * Application mail waits here until a worker delivers it. Rows are written in the same
 * transaction as the change that causes them, so a rolled-back action sends nothing.
 */
export const outbox = mysqlTable(
	'outbox',
	{
		id: id(),
		toAddress: varchar({ length: 255 }).notNull(),
		subject: varchar({ length: 255 }).notNull(),
		textBody: mediumtext().notNull(),
		htmlBody: mediumtext().notNull(),
		headers: json().$type<Record<string, string>>(),
		/** Which of the member's settings it falls under ($lib/mail/categories); "account" is always sent. */
		category: varchar({ length: 16 }).$type<MailCategory>().notNull().default('account'),
		/** What the message is about, e.g. "swap-thread:42"; lets features batch and report delivery. */
		topic: varchar({ length: 120 }),
		/** Set when one logical message must be queued at most once (e.g. a results mail per entrant). */
		dedupeKey: varchar({ length: 190 }).unique(),
		messageId: varchar({ length: 190 }).notNull(),
		/** Lower goes first: one person's mail (a message, a sign-up) before a club-wide announcement. */
		priority: tinyint({ unsigned: true }).notNull().default(5),
		state: mysqlEnum(OUTBOX_STATES).notNull().default('queued'),
		attempts: int().notNull().default(0),
		nextAttemptAt: at().notNull(),
		leaseUntil: at(),
		lastError: text(),
		sentAt: at(),
		createdAt: createdAt()
	},
	(t) => [index('outbox_due_idx').on(t.state, t.nextAttemptAt), index('outbox_topic_idx').on(t.topic)]
);

/** Every delivery attempt, successful or not, for the admin's delivery report. */
export const outboxAttempts = mysqlTable(
	'outbox_attempt',
	{
		id: id(),
		outboxId: ref()
			.notNull()
			.references(() => outbox.id, { onDelete: 'cascade' }),
		worker: varchar({ length: 64 }).notNull(),
		ok: boolean().notNull(),
		error: text(),
		at: at().notNull()
	},
	(t) => [index('outbox_attempt_outbox_idx').on(t.outboxId)]
);

/**
 * Which mail a member takes, one column per category of $lib/mail/categories. A member without a
 * row has the defaults; the row is written on the first change.
 */
export const mailPreferences = mysqlTable('mail_preference', {
	userId: varchar({ length: 255 })
		.primaryKey()
		.references(() => users.id, { onDelete: 'cascade' }),
	swaps: mysqlEnum(CHOICES.swaps).notNull().default(DEFAULT_PREFERENCES.swaps),
	comments: mysqlEnum(CHOICES.comments).notNull().default(DEFAULT_PREFERENCES.comments),
	follows: mysqlEnum(CHOICES.follows).notNull().default(DEFAULT_PREFERENCES.follows),
	upkeep: mysqlEnum(CHOICES.upkeep).notNull().default(DEFAULT_PREFERENCES.upkeep),
	news: mysqlEnum(CHOICES.news).notNull().default(DEFAULT_PREFERENCES.news),
	results: mysqlEnum(CHOICES.results).notNull().default(DEFAULT_PREFERENCES.results),
	judging: mysqlEnum(CHOICES.judging).notNull().default(DEFAULT_PREFERENCES.judging),
	updatedAt: at()
});
