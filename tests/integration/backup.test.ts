// `npm run db:backup` and `npm run db:restore`, run as a server runs them (the built scripts, plain
// Node). The stack's seeded club is backed up while the other tests write to it and restored into
// an empty database and bucket of this test's own; that copy, which nothing else touches, is backed
// up and restored again, and both sides compared table by table (row counts and MariaDB's
// CHECKSUM TABLE) and object by object (key, size, ETag).
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CreateBucketCommand, DeleteBucketCommand, DeleteObjectCommand, ListObjectsV2Command } from '@aws-sdk/client-s3';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { s3 } from '../../src/lib/server/media/storage';
import type { Manifest } from '../../scripts/lib/backup';
import { scratchDatabase } from '../helpers/scratch-db';
import { checkoutRoot } from '../helpers/instance';
import { databaseUrl } from '../helpers/env';

type Scratch = Awaited<ReturnType<typeof scratchDatabase>>;

const runBuilt = (script: string, args: string[], env: NodeJS.ProcessEnv) =>
	new Promise<{ code: number | null; output: string }>((resolve) => {
		const child = spawn(process.execPath, [join(checkoutRoot, 'build', 'scripts', script), ...args], {
			cwd: checkoutRoot,
			env: { ...process.env, NODE_ENV: 'production', LOG_FORMAT: 'json', LOG_LEVEL: 'info', ...env },
			stdio: ['ignore', 'pipe', 'pipe']
		});
		let output = '';
		child.stdout.on('data', (d: Buffer) => (output += d.toString()));
		child.stderr.on('data', (d: Buffer) => (output += d.toString()));
		child.once('close', (code) => resolve({ code, output }));
	});

async function objectsOf(bucket: string) {
	const objects: { key: string; size: number; etag: string }[] = [];
	let token: string | undefined;
	do {
		const page = await s3().send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
		for (const o of page.Contents ?? []) objects.push({ key: o.Key!, size: o.Size!, etag: o.ETag! });
		token = page.IsTruncated ? page.NextContinuationToken : undefined;
	} while (token);
	return objects.sort((a, b) => a.key.localeCompare(b.key));
}

async function emptyAndDropBucket(bucket: string) {
	for (const o of await objectsOf(bucket).catch(() => [])) await s3().send(new DeleteObjectCommand({ Bucket: bucket, Key: o.key }));
	await s3()
		.send(new DeleteBucketCommand({ Bucket: bucket }))
		.catch(() => {});
}

/** Every table with its row count and CHECKSUM TABLE, by name. */
async function fingerprint(url: string) {
	const conn = await mysql.createConnection({ uri: url });
	try {
		const [tables] = await conn.query<mysql.RowDataPacket[]>(
			"SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name"
		);
		const result: Record<string, { rows: number; checksum: string }> = {};
		for (const { name } of tables as { name: string }[]) {
			const [[count]] = await conn.query<mysql.RowDataPacket[]>(`SELECT COUNT(*) AS n FROM \`${name}\``);
			const [[sum]] = await conn.query<mysql.RowDataPacket[]>(`CHECKSUM TABLE \`${name}\` EXTENDED`);
			result[name] = { rows: Number(count!.n), checksum: String(sum!.Checksum) };
		}
		return result;
	} finally {
		await conn.end();
	}
}

const suffix = Math.random().toString(36).slice(2, 8);
const firstBucket = `riparia-backup-first-${suffix}`;
const secondBucket = `riparia-backup-second-${suffix}`;
const workDir = mkdtempSync(join(tmpdir(), 'riparia-backup-test-'));
let first: Scratch;
let second: Scratch;

beforeAll(async () => {
	first = await scratchDatabase({ migrated: false });
	second = await scratchDatabase({ migrated: false });
	await s3().send(new CreateBucketCommand({ Bucket: firstBucket }));
	await s3().send(new CreateBucketCommand({ Bucket: secondBucket }));
});

afterAll(async () => {
	await first?.drop();
	await second?.drop();
	await emptyAndDropBucket(firstBucket);
	await emptyAndDropBucket(secondBucket);
	rmSync(workDir, { recursive: true, force: true });
});

describe('backup and restore', () => {
	test('a backup of the running club restores into an empty database and bucket; a backup of that restores with every row and object the same', async () => {
		// The stack's club, while the other test files write to it.
		const live = join(workDir, 'live');
		const backedUp = await runBuilt('backup.js', [live], {});
		expect(backedUp.code, backedUp.output).toBe(0);
		const restored = await runBuilt('restore.js', [live], { DATABASE_URL: first.url, S3_BUCKET: firstBucket });
		expect(restored.code, restored.output).toBe(0);

		const [club, copy] = [await fingerprint(databaseUrl()), await fingerprint(first.url)];
		expect(Object.keys(copy)).toEqual(Object.keys(club));
		// Tables no test writes to are identical to the club's; the demo club is in the copy.
		for (const table of ['__drizzle_migrations', 'seed_run', 'species', 'restricted_species']) expect(copy[table], table).toEqual(club[table]);
		for (const table of ['user', 'tank', 'journal_entry', 'listing', 'swap_message', 'contest_card', 'media'])
			expect(copy[table]?.rows, table).toBeGreaterThan(0);
		const manifest = JSON.parse(readFileSync(join(live, 'manifest.json'), 'utf8')) as Manifest;
		expect(manifest.objects.length).toBeGreaterThan(10);
		expect((await objectsOf(firstBucket)).map((o) => o.key)).toEqual(manifest.objects.map((o) => o.key));

		// The copy, which nothing else touches, round-trips exactly.
		const again = join(workDir, 'again');
		const backedUpAgain = await runBuilt('backup.js', [again], { DATABASE_URL: first.url, S3_BUCKET: firstBucket });
		expect(backedUpAgain.code, backedUpAgain.output).toBe(0);
		const restoredAgain = await runBuilt('restore.js', [again], { DATABASE_URL: second.url, S3_BUCKET: secondBucket });
		expect(restoredAgain.code, restoredAgain.output).toBe(0);
		expect(await fingerprint(second.url)).toEqual(copy);
		const [firstObjects, secondObjects] = [await objectsOf(firstBucket), await objectsOf(secondBucket)];
		expect(firstObjects.length).toBe(manifest.objects.length);
		expect(secondObjects).toEqual(firstObjects);
	}, 240_000);

	test('a restore refuses a database or bucket that is not empty, and a damaged backup, and changes nothing', async () => {
		const before = await fingerprint(second.url);
		const objectsBefore = await objectsOf(secondBucket);

		const intoFull = await runBuilt('restore.js', [join(workDir, 'again')], { DATABASE_URL: second.url, S3_BUCKET: secondBucket });
		expect(intoFull.code).toBe(1);
		expect(intoFull.output).toMatch(/is not empty/);

		const emptyDb = await scratchDatabase({ migrated: false });
		try {
			const intoFullBucket = await runBuilt('restore.js', [join(workDir, 'again')], { DATABASE_URL: emptyDb.url, S3_BUCKET: secondBucket });
			expect(intoFullBucket.code).toBe(1);
			expect(intoFullBucket.output).toMatch(/Bucket riparia-backup-second-\w+ is not empty/);
			expect(await fingerprint(emptyDb.url)).toEqual({});

			// A copy that no longer matches its checksum is refused before anything is written.
			const emptyBucket = `riparia-backup-empty-${suffix}`;
			await s3().send(new CreateBucketCommand({ Bucket: emptyBucket }));
			const manifestNow = JSON.parse(readFileSync(join(workDir, 'again', 'manifest.json'), 'utf8')) as Manifest;
			const damagedFile = join(workDir, 'again', 'objects', manifestNow.objects[0]!.key);
			const original = readFileSync(damagedFile);
			writeFileSync(damagedFile, Buffer.concat([original, Buffer.from('x')]));
			try {
				const damaged = await runBuilt('restore.js', [join(workDir, 'again')], { DATABASE_URL: emptyDb.url, S3_BUCKET: emptyBucket });
				expect(damaged.code).toBe(1);
				expect(damaged.output).toMatch(/does not match the manifest/);
				expect(await fingerprint(emptyDb.url)).toEqual({});
				expect(await objectsOf(emptyBucket)).toEqual([]);
			} finally {
				writeFileSync(damagedFile, original);
				await emptyAndDropBucket(emptyBucket);
			}

			// A manifest whose key climbs out of the folder is refused before anything is read or written.
			const manifestFile = join(workDir, 'again', 'manifest.json');
			const manifest = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
			writeFileSync(manifestFile, JSON.stringify({ ...manifest, objects: [{ ...manifest.objects[0], key: '../../outside' }] }));
			const altered = await runBuilt('restore.js', [join(workDir, 'again')], { DATABASE_URL: emptyDb.url, S3_BUCKET: firstBucket + '-none' });
			expect(altered.code).toBe(1);
			expect(altered.output).toMatch(/does not stay inside the backup folder/);
			expect(await fingerprint(emptyDb.url)).toEqual({});
		} finally {
			await emptyDb.drop();
		}
		expect(await fingerprint(second.url)).toEqual(before);
		expect(await objectsOf(secondBucket)).toEqual(objectsBefore);
	}, 120_000);

	test('a backup never overwrites a folder that exists', async () => {
		const again = await runBuilt('backup.js', [join(workDir, 'again')], { DATABASE_URL: first.url, S3_BUCKET: firstBucket });
		expect(again.code).toBe(1);
		expect(again.output).toMatch(/already exists/);
	});
});
