import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { config } from '../config';
import * as schema from './schema';
import { countStatements } from './query-count';

export type Database = MySql2Database<typeof schema>;
/** A transaction handle; domain functions that must join the caller's transaction take one. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];
export type DbOrTx = Database | Tx;

function createPool(url: string) {
	const pool = mysql.createPool({
		uri: url,
		connectionLimit: 10,
		// All DATETIME values are UTC, in JavaScript and in the session.
		timezone: 'Z',
		dateStrings: false,
		charset: 'utf8mb4_unicode_ci',
		enableKeepAlive: true
	});
	pool.pool.on('connection', (conn) => {
		conn.query("SET time_zone = '+00:00'");
	});
	if (config().BENCH) countStatements(pool);
	return pool;
}

// The pool connects lazily, so importing this module (e.g. during `vite build`) opens nothing.
export const pool = createPool(config().DATABASE_URL);
export const db: Database = drizzle(pool, { schema, mode: 'default', casing: 'snake_case' });

/** A separate pool, for tests and workers that must not share connections with the app's. */
export function connect(url = config().DATABASE_URL) {
	const own = createPool(url);
	return {
		pool: own,
		db: drizzle(own, { schema, mode: 'default', casing: 'snake_case' }) as Database,
		close: () => own.end()
	};
}
