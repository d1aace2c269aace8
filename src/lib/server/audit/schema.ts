import { index, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { createdAt, id } from '../db/columns';
import { users } from '../club/schema';

/** Who did what to what, for actions that change other people's data or the club's state. */
export const auditLog = mysqlTable(
	'audit_log',
	{
		id: id(),
		actorId: varchar({ length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		action: varchar({ length: 64 }).notNull(),
		subjectType: varchar({ length: 32 }).notNull(),
		subjectId: varchar({ length: 255 }).notNull(),
		detail: json().$type<Record<string, unknown>>(),
		createdAt: createdAt()
	},
	(t) => [index('audit_subject_idx').on(t.subjectType, t.subjectId)]
);
