import { datetime, int, mysqlTable, varchar } from 'drizzle-orm/mysql-core';

/** Which demo-data steps have run on this database, so seeding twice adds nothing. */
export const seedRuns = mysqlTable('seed_run', {
	name: varchar({ length: 64 }).primaryKey(),
	ranAt: datetime({ mode: 'date', fsp: 3 }).notNull()
});

/** When each periodic job last ran, and who holds it now; lets several app instances share jobs. */
export const jobRuns = mysqlTable('job_run', {
	name: varchar({ length: 64 }).primaryKey(),
	lastRunAt: datetime({ mode: 'date', fsp: 3 }),
	lockedUntil: datetime({ mode: 'date', fsp: 3 }),
	lockedBy: varchar({ length: 120 }),
	lastError: varchar({ length: 1000 })
});

/** Per stored markdown field (`table.column`), the renderer version its HTML was made with; see markdown-fields.ts. */
export const markdownRenders = mysqlTable('markdown_render', {
	field: varchar({ length: 64 }).primaryKey(),
	version: int().notNull(),
	renderedAt: datetime({ mode: 'date', fsp: 3 }).notNull()
});
