import { index, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id } from '../db/columns';

/**
 * Who did what to what, and when, with the changed values before and after: append-only. No code
 * updates or deletes a row, and the database refuses both (the triggers in migration 0007). The
 * actor is kept as a bare id with no foreign key, so removing a member keeps their rows, with an
 * id that no longer names anyone.
 */
export const auditLog = mysqlTable(
	'audit_log',
	{
		id: id(),
		actorId: varchar({ length: 255 }),
		action: varchar({ length: 64 }).notNull(),
		subjectType: varchar({ length: 32 }).notNull(),
		subjectId: varchar({ length: 255 }).notNull(),
		detail: json().$type<Record<string, unknown>>(),
		before: json().$type<Record<string, unknown>>(),
		after: json().$type<Record<string, unknown>>(),
		createdAt: createdAt()
	},
	(t) => [
		index('audit_subject_idx').on(t.subjectType, t.subjectId),
		index('audit_actor_idx').on(t.actorId, t.createdAt),
		index('audit_action_idx').on(t.action, t.createdAt),
		index('audit_created_idx').on(t.createdAt)
	]
);
