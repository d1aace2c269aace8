// A throwaway database with every migration applied (unless asked otherwise), for tests that must
// see only their own rows (the app's own outbox worker never looks at it).
import { randomBytes } from 'node:crypto';
import mysql from 'mysql2/promise';
import { connect } from '../../src/lib/server/db';
import { applyMigrations } from '../../scripts/migrate';
import { databaseUrl } from './env';

/** `migrated: false` leaves it empty, for a test that runs the migrations its own way. */
export async function scratchDatabase(options: { migrated?: boolean } = {}) {
	const name = `riparia_scratch_${randomBytes(4).toString('hex')}`;
	const base = new URL(databaseUrl());
	const admin = await mysql.createConnection({ uri: base.toString() });
	await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
	await admin.end();
	const url = new URL(base);
	url.pathname = `/${name}`;
	if (options.migrated !== false) await applyMigrations(url.toString());
	const handle = connect(url.toString());
	return {
		...handle,
		url: url.toString(),
		async drop() {
			await handle.close();
			const conn = await mysql.createConnection({ uri: base.toString() });
			await conn.query(`DROP DATABASE IF EXISTS \`${name}\``);
			await conn.end();
		}
	};
}
