// Uploads through the running app, and a look into the bucket behind it.
import { ListObjectsV2Command, GetObjectCommand } from '@aws-sdk/client-s3';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { media } from '../../src/lib/server/media/schema';
import { s3 } from '../../src/lib/server/media/storage';
import { config } from '../../src/lib/server/config';
import { appUrl } from './env';
import type { TestPerson } from './people';

export async function uploadFile(person: TestPerson | null, bytes: Uint8Array, name = 'photo.jpg', type = 'image/jpeg', base = appUrl()): Promise<Response> {
	const form = new FormData();
	form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
	const headers: Record<string, string> = { origin: appUrl(), accept: 'application/json' };
	if (person) headers.cookie = person.cookie;
	return fetch(base + '/api/media', { method: 'POST', body: form, headers, redirect: 'manual' });
}

/** Every object key in the bucket under a prefix. */
export async function bucketKeys(prefix: string): Promise<string[]> {
	const keys: string[] = [];
	let token: string | undefined;
	do {
		const page = await s3().send(new ListObjectsV2Command({ Bucket: config().S3_BUCKET, Prefix: prefix, ContinuationToken: token }));
		keys.push(...(page.Contents ?? []).map((o) => o.Key!));
		token = page.IsTruncated ? page.NextContinuationToken : undefined;
	} while (token);
	return keys;
}

/** Keys of everything stored for one person (the pipeline puts the owner's id first in each key). */
export const ownerKeys = (ownerId: string) => bucketKeys(`u/${ownerId}/`);

export async function bucketObject(key: string): Promise<Buffer> {
	const out = await s3().send(new GetObjectCommand({ Bucket: config().S3_BUCKET, Key: key }));
	return Buffer.from(await out.Body!.transformToByteArray());
}

export const mediaRowsOf = (ownerId: string) => db.select().from(media).where(eq(media.ownerId, ownerId));
