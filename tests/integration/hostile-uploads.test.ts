// Hostile uploads beyond those in media.test.ts (a text file as JPEG, SVG, over 15 MB, a 40+
// megapixel header, a truncated JPEG, GPS EXIF stripped): a zero-byte file, an HTML polyglot with
// an image header, an animated image of thousands of frames, and a 100 MB body. Each is refused
// with a message or stored as a plain still picture; nothing is left of a refused one, and the
// app stays healthy.
import http from 'node:http';
import { beforeAll, describe, expect, test } from 'vitest';
import sharp from 'sharp';
import { bucketObject, mediaRowsOf, ownerKeys, uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { appUrl } from '../helpers/env';

async function expectRefused(response: Response, person: TestPerson, message: RegExp) {
	// 400 for what is not a picture we take, 415 for a file sent as something other than an image.
	expect([400, 415]).toContain(response.status);
	expect(((await response.json()) as { message: string }).message).toMatch(message);
	expect(await mediaRowsOf(person.id)).toHaveLength(0);
	expect(await ownerKeys(person.id)).toEqual([]);
}

/** A GIF of `frames` frames of one pixel each (GIF89a, one global colour table, LZW of a single index). */
function animatedGif(frames: number): Buffer {
	const header = Buffer.from('GIF89a', 'ascii');
	const screen = Buffer.from([1, 0, 1, 0, 0x80, 0, 0]); // 1×1, global table of 2 colours
	const palette = Buffer.from([0, 0x80, 0x40, 0xff, 0xff, 0xff]);
	const loop = Buffer.from([0x21, 0xff, 0x0b, ...Buffer.from('NETSCAPE2.0', 'ascii'), 3, 1, 0, 0, 0]);
	const frame = Buffer.from([
		...[0x21, 0xf9, 4, 0, 1, 0, 0, 0], // graphic control: 1/100 s
		...[0x2c, 0, 0, 0, 0, 1, 0, 1, 0, 0], // image descriptor 1×1
		...[2, 2, 0x44, 0x01, 0] // LZW minimum code size 2, one sub-block, end
	]);
	return Buffer.concat([header, screen, palette, loop, ...Array.from({ length: frames }, () => frame), Buffer.from([0x3b])]);
}

let person: TestPerson;
beforeAll(async () => {
	person = await makePerson({ label: 'hostile-upload' });
});

describe('hostile uploads', () => {
	test('a zero-byte file is refused with a message', async () => {
		const empty = await makePerson({ label: 'zero-byte' });
		await expectRefused(await uploadFile(empty, new Uint8Array(0), 'empty.jpg'), empty, /\w/);
	});

	test('an HTML page behind an image header is refused, or kept only as re-encoded pixels', async () => {
		const polyglot = await makePerson({ label: 'polyglot' });
		const gif = animatedGif(1);
		const html = Buffer.from('<html><body><script>alert(1)</script></body></html>', 'ascii');
		const bytes = Buffer.concat([gif.subarray(0, gif.length - 1), html, Buffer.from([0x3b])]);
		// Sent as a page it is refused by its type; sent as a GIF, what is kept are pixels only.
		await expectRefused(await uploadFile(polyglot, bytes, 'page.html', 'text/html'), polyglot, /\w/);
		const response = await uploadFile(polyglot, bytes, 'page.gif', 'image/gif');
		if (response.status !== 201) {
			await expectRefused(response, polyglot, /\w/);
			return;
		}
		expect(response.status).toBe(201);
		const keys = await ownerKeys(polyglot.id);
		expect(keys.length).toBeGreaterThan(0);
		for (const key of keys) {
			const stored = await bucketObject(key);
			expect(stored.toString('latin1')).not.toContain('<script');
			expect((await sharp(stored).metadata()).format).toMatch(/jpeg|webp|avif|png/);
		}
	});

	test('an animated image of 5,000 frames is stored as one still picture', async () => {
		const animated = await makePerson({ label: 'animated' });
		const response = await uploadFile(animated, animatedGif(5_000), 'many.gif', 'image/gif');
		if (response.status !== 201) {
			await expectRefused(response, animated, /\w/);
			return;
		}
		expect(response.status).toBe(201);
		for (const key of await ownerKeys(animated.id)) {
			const meta = await sharp(await bucketObject(key), { pages: -1 }).metadata();
			expect(meta.pages ?? 1).toBe(1);
		}
	});

	test('a 100 MB body is refused without being read, nothing is stored, and the app stays healthy', async () => {
		const big = await makePerson({ label: 'hundred-mb' });
		const url = new URL(appUrl() + '/api/media');
		const boundary = 'hostile-boundary';
		const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
		const total = 100 * 1024 * 1024;
		// On a connection of its own, written in chunks: the app may answer and close it before the end.
		const status = await new Promise<number>((resolve) => {
			const req = http.request(
				{
					host: url.hostname,
					port: url.port,
					path: url.pathname,
					method: 'POST',
					agent: false,
					headers: {
						host: url.host,
						origin: appUrl(),
						cookie: big.cookie,
						accept: 'application/json',
						'content-type': `multipart/form-data; boundary=${boundary}`,
						'content-length': String(total)
					}
				},
				(res) => {
					res.resume();
					resolve(res.statusCode ?? 0);
				}
			);
			req.on('error', () => resolve(-1));
			req.write(head);
			const chunk = Buffer.alloc(1024 * 1024, 0xff);
			let sent = head.length;
			const pump = () => {
				while (sent < total) {
					sent += chunk.length;
					if (!req.write(chunk)) return void req.once('drain', pump);
				}
				req.end();
			};
			pump();
		});
		// Refused with 413, or the connection reset unread.
		expect([413, -1]).toContain(status);
		expect(await mediaRowsOf(big.id)).toHaveLength(0);
		expect(await ownerKeys(big.id)).toEqual([]);
		expect((await fetch(appUrl() + '/healthz')).status).toBe(200);
		// And the next upload works.
		const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#2f7a58' } })
			.jpeg()
			.toBuffer();
		expect((await uploadFile(person, jpeg)).status).toBe(201);
	}, 120_000);
});
