// The photo store away while a member uploads: the upload is refused with a plain message (503,
// "storage-unavailable", not the database's outage page nor an unexpected error), no row and no
// object are left of it, and the same photo uploads once the store is back. Runs an app instance
// with a storage fake of its own, so the stack's bucket is never touched.
import type { ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { appUrl } from '../helpers/env';
import { killHard, startFakeProcess } from '../helpers/fake-process';
import { checkoutRoot, startInstance, type AppInstance } from '../helpers/instance';
import { mediaRowsOf, uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { freePort } from '../helpers/ports';
import { databaseUrl } from '../helpers/env';

const home = join(checkoutRoot, '.data', 'test', 'faults-storage');
const bucket = process.env.S3_BUCKET ?? 'riparia-media';
let port: number;
let fake: ChildProcess | null = null;
let app: AppInstance | null = null;
let member: TestPerson;

async function startFake() {
	fake = await startFakeProcess('storage', port, { STORAGE_FAKE_PORT: String(port), STORAGE_FAKE_DIR: join(home, 's3'), S3_BUCKET: bucket });
}

async function stopFake() {
	await killHard(fake);
	fake = null;
}

/** Every object the store holds for one member (keys start with the owner's id). */
async function objectsOf(ownerId: string): Promise<string[]> {
	const client = new S3Client({
		endpoint: `http://127.0.0.1:${port}`,
		region: process.env.S3_REGION ?? 'us-east-1',
		forcePathStyle: true,
		credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }
	});
	try {
		const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: `u/${ownerId}/` }));
		return (page.Contents ?? []).map((o) => o.Key!);
	} finally {
		client.destroy();
	}
}

beforeAll(async () => {
	rmSync(home, { recursive: true, force: true });
	port = await freePort();
	member = await makePerson({ label: 'storage-outage' });
	await startFake();
	app = await startInstance({
		databaseUrl: databaseUrl(),
		logName: 'faults-storage-app',
		// The stack's ORIGIN, so requests made as the stack's browser pass the origin check here too.
		env: { ORIGIN: appUrl(), S3_ENDPOINT: `http://127.0.0.1:${port}`, OUTBOX_WORKER: '0' }
	});
}, 120_000);

afterAll(async () => {
	await app?.stop();
	await stopFake();
	rmSync(home, { recursive: true, force: true });
}, 60_000);

describe('the photo store away during an upload', () => {
	test('the member is told plainly, nothing is left, and the same upload works once it is back', async () => {
		const photo = await sharp({ create: { width: 900, height: 600, channels: 3, background: '#3d7a55' } })
			.jpeg({ quality: 85 })
			.toBuffer();

		await stopFake();
		const refused = await uploadFile(member, photo, 'tank.jpg', 'image/jpeg', app!.url);
		expect(refused.status).toBe(503);
		const body = (await refused.json()) as { code: string; message: string };
		expect(body.code).toBe('storage-unavailable');
		expect(body.message).toMatch(/photo store/);
		expect(body.message).not.toMatch(/database/);
		expect(await mediaRowsOf(member.id)).toEqual([]);

		// The app is otherwise fine while the store is away.
		expect((await fetch(`${app!.url}/healthz`)).status).toBe(200);

		await startFake();
		expect(await objectsOf(member.id), 'objects left by the refused upload').toEqual([]);

		const stored = await uploadFile(member, photo, 'tank.jpg', 'image/jpeg', app!.url);
		expect(stored.status).toBe(201);
		const { id } = (await stored.json()) as { id: number };
		const rows = await mediaRowsOf(member.id);
		expect(rows.map((r) => r.id)).toEqual([id]);
		const keys = await objectsOf(member.id);
		expect(keys.length).toBe(Object.keys(rows[0]!.renditions).length);
		expect(keys.every((k) => k.startsWith(rows[0]!.storageKey))).toBe(true);
	});
});
