// Applies the committed migrations with one connection (not a pool), as Drizzle's migrator expects
// on MySQL/MariaDB. Run from source (`node --import tsx scripts/migrate.ts`, tests) it reads
// drizzle/; built (`npm run build` → build/scripts/migrate.js, run by `npm run db:migrate`) it
// reads build/drizzle/, the copy made with that build. Then it renders stored markdown whose
// renderer version is out of date (markdown-fields.ts).
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';
import { join } from 'node:path';
import { component, reason } from '../src/lib/server/ops/log';
import { renderStoredMarkdown } from '../src/lib/server/markdown-fields';

const log = component('migrate');

export async function applyMigrations(url: string): Promise<void> {
	const connection = await mysql.createConnection({ uri: url, timezone: 'Z' });
	try {
		await migrate(drizzle(connection), { migrationsFolder: join(import.meta.dirname, '..', 'drizzle') });
		// A data step after the schema: stored HTML of members' markdown that is missing or was
		// made by an older renderer version is rendered again from source.
		const rendered = Object.entries(await renderStoredMarkdown(connection)).filter(([, n]) => n > 0);
		if (rendered.length) log.info({ rendered: Object.fromEntries(rendered) }, 'stored markdown rendered');
	} finally {
		await connection.end();
	}
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const url = process.env.DATABASE_URL;
	if (!url) {
		log.fatal('DATABASE_URL is not set.');
		process.exit(1);
	}
	// MariaDB runs DDL outside transactions, so a migration stopped half-way would leave tables the
	// next run tries to create again: on Ctrl-C or SIGTERM the migrator finishes, then stops.
	let interrupted = false;
	for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
		process.on(signal, () => {
			if (!interrupted) log.warn({ signal }, 'finishing the migrations before stopping');
			interrupted = true;
		});
	}
	try {
		await applyMigrations(url);
		log.info('migrations applied');
		if (interrupted) process.exit(130);
	} catch (error) {
		const cause = error instanceof Error && error.cause instanceof Error ? error.cause.message : undefined;
		log.fatal({ reason: reason(error), cause }, 'migration failed');
		process.exit(1);
	}
}
