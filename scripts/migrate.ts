// Applies the committed migrations in drizzle/ with one connection (not a pool), as Drizzle's
// migrator expects on MySQL/MariaDB.
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import { join } from 'node:path';

export async function applyMigrations(url: string): Promise<void> {
	const connection = await mysql.createConnection({ uri: url, timezone: 'Z' });
	try {
		await migrate(drizzle(connection), { migrationsFolder: join(import.meta.dirname, '..', 'drizzle') });
	} finally {
		await connection.end();
	}
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const url = process.env.DATABASE_URL;
	if (!url) {
		console.error('DATABASE_URL is not set.');
		process.exit(1);
	}
	try {
		await applyMigrations(url);
		console.log('  migrations applied');
	} catch (error) {
		const cause = error instanceof Error && error.cause instanceof Error ? `\n  cause: ${error.cause.message}` : '';
		console.error('Migration failed:', error instanceof Error ? error.message : error, cause);
		process.exit(1);
	}
}
