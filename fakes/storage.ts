// Local stand-in for an S3 bucket (s3rver), on loopback, with the bucket created at start.
// The app reaches it only through @aws-sdk/client-s3, exactly as it reaches a hosted bucket.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

export interface StorageFakeOptions {
	port: number;
	directory: string;
	bucket: string;
	host?: string;
}

export async function startStorageFake(options: StorageFakeOptions) {
	mkdirSync(options.directory, { recursive: true });
	const server = new S3rver({
		port: options.port,
		address: options.host ?? '127.0.0.1',
		directory: options.directory,
		silent: true,
		configureBuckets: [{ name: options.bucket, configs: [] }]
	});
	await server.run();
	return {
		port: options.port,
		close: () => server.close()
	};
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const port = Number(process.env.STORAGE_FAKE_PORT ?? 4569);
	const directory = process.env.STORAGE_FAKE_DIR ?? '.data/s3';
	const bucket = process.env.S3_BUCKET ?? 'riparia-media';
	const fake = await startStorageFake({ port, directory, bucket });
	console.log(`storage fake: S3 on http://127.0.0.1:${port}/ (bucket ${bucket}, files in ${directory})`);
	const stop = () => void fake.close().then(() => process.exit(0));
	process.on('SIGTERM', stop);
	process.on('SIGINT', stop);
}
