// `npm run db:backup [folder]`: the database (mariadb-dump --single-transaction) and every object of
// the photo bucket into a new folder, by default backups/riparia-<UTC time>. Reads DATABASE_URL and
// S3_* like the app. Built into build/scripts/backup.js (see scripts/lib/backup.ts).
import { join } from 'node:path';
import { config } from '../src/lib/server/config';
import { s3 } from '../src/lib/server/media/storage';
import { component, reason } from '../src/lib/server/ops/log';
import { BackupError, backup } from './lib/backup';

const log = component('backup');

const [into = join('backups', `riparia-${new Date().toISOString().replace(/[:.]/g, '-')}`), ...rest] = process.argv.slice(2);
if (rest.length || into.startsWith('-')) {
	log.fatal('usage: npm run db:backup [folder]  (the folder must not exist yet)');
	process.exit(2);
}
try {
	const c = config();
	const manifest = await backup({ databaseUrl: c.DATABASE_URL, s3: s3(), bucket: c.S3_BUCKET, into, log: (message) => log.info(message) });
	log.info(
		{
			folder: into,
			tables: manifest.database.tables,
			dumpBytes: manifest.database.bytes,
			objects: manifest.bucket.objects,
			objectBytes: manifest.bucket.bytes
		},
		'backup written'
	);
} catch (error) {
	log.fatal({ reason: reason(error), fix: error instanceof BackupError ? error.fix : undefined }, 'backup failed');
	process.exit(1);
}
