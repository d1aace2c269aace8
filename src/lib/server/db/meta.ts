import { datetime, mysqlTable, varchar } from 'drizzle-orm/mysql-core';

/** Which demo-data steps have run on this database, so seeding twice adds nothing. */
export const seedRuns = mysqlTable('seed_run', {
	name: varchar({ length: 64 }).primaryKey(),
	ranAt: datetime({ mode: 'date', fsp: 3 }).notNull()
});
