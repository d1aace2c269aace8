// `npm run db:restore <folder>`: loads a folder written by `npm run db:backup` into the empty
// database of DATABASE_URL and the empty bucket of S3_BUCKET (it refuses anything else). Run it with
// the app stopped, then `npm run db:migrate` to bring an older backup up to this release.
import { config } from '../src/lib/server/config';
import { s3 } from '../src/lib/server/media/storage';
import { component, reason } from '../src/lib/server/ops/log';
import { BackupError, restore } from './lib/backup';

const log = component('restore');

const [from, ...rest] = process.argv.slice(2);
if (!from || rest.length || from.startsWith('-')) {
	log.fatal('usage: npm run db:restore <folder written by npm run db:backup>');
	process.exit(2);
}
try {
	const c = config();
	const manifest = await restore({ databaseUrl: c.DATABASE_URL, s3: s3(), bucket: c.S3_BUCKET, from, log: (message) => log.info(message) });
	log.info(
		{ from, takenAt: manifest.createdAt, tables: manifest.database.tables, objects: manifest.bucket.objects },
		'backup restored; run `npm run db:migrate` if this release is newer than the backup'
	);
} catch (error) {
	log.fatal({ reason: reason(error), fix: error instanceof BackupError ? error.fix : undefined }, 'restore failed');
	process.exit(1);
}
