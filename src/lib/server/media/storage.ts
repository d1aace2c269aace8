import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, NoSuchKey, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { config } from '../config';

/** The bucket as the media pipeline sees it; tests pass a wrapper to simulate failures. */
export interface ObjectStore {
	put(key: string, body: Uint8Array, contentType: string): Promise<void>;
	/** The object's bytes as a web stream, or null when there is no such object. */
	get(key: string): Promise<{ body: ReadableStream<Uint8Array>; length: number | undefined; contentType: string | undefined } | null>;
	/** Deletes each key; a key that is already gone is not an error. */
	remove(keys: string[]): Promise<void>;
}

let client: S3Client | undefined;

/** One S3 client per process, configured from S3_* (locally the storage fake). */
export function s3(): S3Client {
	if (!client) {
		const c = config();
		client = new S3Client({
			endpoint: c.S3_ENDPOINT,
			region: c.S3_REGION,
			forcePathStyle: c.S3_FORCE_PATH_STYLE,
			credentials: { accessKeyId: c.S3_ACCESS_KEY_ID, secretAccessKey: c.S3_SECRET_ACCESS_KEY },
			// Checksums only where the API demands them: S3-compatible stores (and the local fake)
			// do not all understand the newer default checksum headers.
			requestChecksumCalculation: 'WHEN_REQUIRED',
			responseChecksumValidation: 'WHEN_REQUIRED'
		});
	}
	return client;
}

const missing = (error: unknown) =>
	error instanceof NoSuchKey || (error instanceof S3ServiceException && (error.name === 'NoSuchKey' || error.$metadata.httpStatusCode === 404));

export function bucketStore(bucket = config().S3_BUCKET, s3Client: S3Client = s3()): ObjectStore {
	return {
		async put(key, body, contentType) {
			await s3Client.send(
				new PutObjectCommand({
					Bucket: bucket,
					Key: key,
					Body: body,
					ContentType: contentType,
					ContentLength: body.byteLength,
					CacheControl: 'private, max-age=31536000, immutable'
				})
			);
		},
		async get(key) {
			try {
				const out = await s3Client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
				if (!out.Body) return null;
				return { body: out.Body.transformToWebStream(), length: out.ContentLength, contentType: out.ContentType };
			} catch (error) {
				if (missing(error)) return null;
				throw error;
			}
		},
		async remove(keys) {
			// One request per key: multi-object delete needs a Content-MD5 that not every store accepts.
			const results = await Promise.allSettled(keys.map((key) => s3Client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }))));
			const failed = results.find((r): r is PromiseRejectedResult => r.status === 'rejected' && !missing(r.reason));
			if (failed) throw failed.reason;
		}
	};
}

let defaultStore: ObjectStore | undefined;
export const store = () => (defaultStore ??= bucketStore());

/** Resolves when the bucket answers (HeadBucket: it exists and the keys may use it); for /readyz. */
export async function checkBucket(signal: AbortSignal, bucket = config().S3_BUCKET, s3Client: S3Client = s3()): Promise<void> {
	await s3Client.send(new HeadBucketCommand({ Bucket: bucket }), { abortSignal: signal });
}
