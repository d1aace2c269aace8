// The media pipeline against the running app, the real database and the bucket behind it.
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import * as media from '../../src/lib/server/media';
import { media as mediaTable } from '../../src/lib/server/media/schema';
import { bucketStore } from '../../src/lib/server/media/storage';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as tankDeletion from '../../src/lib/server/journals/tank-deletion';
import type { Viewer } from '../../src/lib/server/club/users';
import { request } from '../helpers/http';
import { bucketKeys, bucketObject, mediaRowsOf, ownerKeys, uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';

const viewerOf = (p: TestPerson): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units: 'metric' });

async function jpeg(width = 640, height = 480, colour = '#2f7a58') {
	return sharp({ create: { width, height, channels: 3, background: colour } })
		.jpeg({ quality: 80 })
		.toBuffer();
}

async function expectNothingStored(person: TestPerson) {
	expect(await mediaRowsOf(person.id)).toHaveLength(0);
	expect(await ownerKeys(person.id)).toEqual([]);
}

let owner: TestPerson;
let other: TestPerson;

beforeAll(async () => {
	owner = await makePerson({ label: 'media-owner' });
	other = await makePerson({ label: 'media-other' });
});

describe('uploads that are refused store nothing', () => {
	test('a text file named .jpg and sent as image/jpeg is not an image', async () => {
		const person = await makePerson({ label: 'not-image' });
		const response = await uploadFile(person, new TextEncoder().encode('These are my tank notes, not a photo.\n'.repeat(40)), 'notes.jpg', 'image/jpeg');
		expect(response.status).toBe(415);
		const body = await response.json();
		expect(body.code).toBe('not-an-image');
		expect(body.message).toMatch(/not a picture we can read/);
		await expectNothingStored(person);
	});

	test('an SVG is refused even though it could be drawn', async () => {
		const person = await makePerson({ label: 'svg' });
		const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><rect width="100" height="100" fill="green"/></svg>';
		const response = await uploadFile(person, new TextEncoder().encode(svg), 'plant.png', 'image/png');
		expect(response.status).toBe(415);
		expect((await response.json()).code).toBe('not-an-image');
		await expectNothingStored(person);
	});

	test('a file over 15 MB is too big', async () => {
		const person = await makePerson({ label: 'too-big' });
		// A real JPEG header followed by padding: the size is refused before anything is decoded.
		const head = await jpeg(64, 64);
		const bytes = new Uint8Array(15 * 1024 * 1024 + 200_000);
		bytes.set(head, 0);
		const response = await uploadFile(person, bytes);
		expect(response.status).toBe(413);
		const body = await response.json();
		expect(body.code).toBe('too-big');
		expect(body.message).toMatch(/at most 15\.0 MB/);
		await expectNothingStored(person);
	});

	test('a picture over 40 megapixels is refused from its header, before decoding', async () => {
		const person = await makePerson({ label: 'pixels' });
		const huge = await sharp({ create: { width: 6400, height: 6400, channels: 3, background: '#406080' } })
			.png({ compressionLevel: 9 })
			.toBuffer();
		expect(huge.byteLength).toBeLessThan(15 * 1024 * 1024);
		const response = await uploadFile(person, huge, 'big.png', 'image/png');
		expect(response.status).toBe(422);
		const body = await response.json();
		expect(body.code).toBe('too-many-pixels');
		expect(body.message).toContain('6400 × 6400');
		await expectNothingStored(person);
	});

	test('a truncated JPEG is refused (sharp fails on the damaged data)', async () => {
		const person = await makePerson({ label: 'truncated' });
		const whole = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#000000', noise: { type: 'gaussian', mean: 128, sigma: 40 } } })
			.jpeg()
			.toBuffer();
		const response = await uploadFile(person, whole.subarray(0, Math.floor(whole.byteLength / 2)));
		expect(response.status).toBe(415);
		expect((await response.json()).message).toMatch(/could not be read|not a picture/);
		await expectNothingStored(person);
	});

	test('signed-out visitors cannot upload', async () => {
		const response = await uploadFile(null, await jpeg());
		expect(response.status).toBe(401);
		expect(await response.json()).toHaveProperty('message');
	});
});

describe('stored renditions', () => {
	test('carry no EXIF (GPS included), XMP or IPTC, and are turned upright', async () => {
		// A 400 × 200 picture with a red block at its top-left, tagged "rotate 90° clockwise to view"
		// (orientation 6) and carrying GPS coordinates and XMP, as a phone camera writes them.
		const red = await sharp({ create: { width: 80, height: 80, channels: 3, background: '#ff0000' } })
			.png()
			.toBuffer();
		const source = await sharp({ create: { width: 400, height: 200, channels: 3, background: '#33aa77' } })
			.composite([{ input: red, left: 0, top: 0 }])
			.jpeg()
			.withMetadata({ orientation: 6 })
			.withExif({
				IFD0: { ImageDescription: 'reedholme tank', Copyright: 'test' },
				IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '55/1 12/1 30/1', GPSLongitudeRef: 'E', GPSLongitude: '3/1 15/1 0/1' }
			})
			.withXmp(
				'<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description xmlns:dc="http://purl.org/dc/elements/1.1/"><dc:creator>someone</dc:creator></rdf:Description></rdf:RDF></x:xmpmeta>'
			)
			.toBuffer();
		const before = await sharp(source).metadata();
		expect(before.orientation).toBe(6);
		expect(before.xmp).toBeTruthy();
		// The GPS IFD pointer (tag 0x8825, little-endian in what libexif writes) is in the source.
		expect(before.exif!.includes(Buffer.from([0x25, 0x88])) || before.exif!.includes(Buffer.from([0x88, 0x25]))).toBe(true);

		const response = await uploadFile(owner, source, 'IMG_0001.JPG');
		expect(response.status).toBe(201);
		const uploaded = await response.json();
		expect(uploaded).toMatchObject({ width: 200, height: 400, urls: { thumb: `/media/${uploaded.id}/thumb` } });

		const [row] = await db.select().from(mediaTable).where(eq(mediaTable.id, uploaded.id));
		expect(row!.scope).toBeNull();
		const keys = await bucketKeys(row!.storageKey + '/');
		expect(keys.sort()).toEqual(['large', 'medium', 'thumb'].map((s) => `${row!.storageKey}/${s}.webp`));
		for (const key of keys) {
			const stored = await bucketObject(key);
			const meta = await sharp(stored).metadata();
			expect(meta.format).toBe('webp');
			expect(meta.exif).toBeUndefined();
			expect(meta.xmp).toBeUndefined();
			expect(meta.iptc).toBeUndefined();
			expect(meta.orientation).toBeUndefined();
			expect(stored.includes(Buffer.from('reedholme tank'))).toBe(false);
			// Upright: portrait, and the red block is now at the top-right corner.
			expect(meta.height).toBeGreaterThan(meta.width!);
			const { data, info } = await sharp(stored).raw().toBuffer({ resolveWithObject: true });
			const pixel = (x: number, y: number) => Array.from(data.subarray((y * info.width + x) * info.channels, (y * info.width + x) * info.channels + 3));
			const [r, g, b] = pixel(info.width - 5, 5);
			expect(r).toBeGreaterThan(200);
			expect(g).toBeLessThan(60);
			expect(b).toBeLessThan(60);
			expect(pixel(5, 5)[0]).toBeLessThan(120);
		}
		// A small original is never enlarged.
		expect(row!.renditions.thumb).toMatchObject({ width: 160, height: 320 });
		expect(row!.renditions.large).toMatchObject({ width: 200, height: 400 });
	});

	test('renditions are sized about 320, 960 and 1920 px on the long edge', async () => {
		const response = await uploadFile(owner, await jpeg(3000, 2000), 'wide.jpg');
		expect(response.status).toBe(201);
		const { id } = await response.json();
		const row = await media.getRow(id);
		expect(row!.renditions.thumb).toMatchObject({ width: 320, height: 213 });
		expect(row!.renditions.medium).toMatchObject({ width: 960, height: 640 });
		expect(row!.renditions.large).toMatchObject({ width: 1920, height: 1280 });
		expect(row!.byteSize).toBe(row!.renditions.thumb.bytes + row!.renditions.medium.bytes + row!.renditions.large.bytes);
	});
});

describe('failures part-way leave no row and no object', () => {
	test('when one object cannot be written, the ones written are deleted again', async () => {
		const person = await makePerson({ label: 'put-fails' });
		const real = bucketStore();
		let puts = 0;
		const flaky = {
			...real,
			async put(key: string, body: Uint8Array, type: string) {
				if (++puts === 2) throw new Error('simulated storage outage');
				await real.put(key, body, type);
			}
		};
		await expect(media.upload(person.id, await jpeg(), { store: flaky })).rejects.toMatchObject({ status: 503, code: 'storage-unavailable' });
		expect(puts).toBe(3);
		await expectNothingStored(person);
	});

	test('when the row cannot be inserted, the objects are deleted again', async () => {
		const ghost = crypto.randomUUID(); // no such user: the foreign key refuses the row
		await expect(media.upload(ghost, await jpeg())).rejects.toThrow();
		expect(await ownerKeys(ghost)).toEqual([]);
		expect(await mediaRowsOf(ghost)).toHaveLength(0);
	});
});

describe('who may see a photo', () => {
	async function uploaded(person: TestPerson) {
		const response = await uploadFile(person, await jpeg(500, 400, '#1d6f8c'));
		expect(response.status).toBe(201);
		return (await response.json()) as { id: number };
	}
	const fetchAs = (path: string, person: TestPerson | null) => request(path, { cookie: person?.cookie, accept: 'image/webp,*/*' });

	test('a pending upload is its owner’s alone, with private caching', async () => {
		const { id } = await uploaded(owner);
		const mine = await fetchAs(`/media/${id}/thumb`, owner);
		expect(mine.status).toBe(200);
		expect(mine.headers.get('content-type')).toBe('image/webp');
		// Private photos are kept briefly and asked for again, so losing access ends their display.
		expect(mine.headers.get('cache-control')).toBe('private, max-age=60, must-revalidate');
		expect((await sharp(Buffer.from(await mine.arrayBuffer())).metadata()).format).toBe('webp');
		expect((await fetchAs(`/media/${id}/thumb`, other)).status).toBe(404);
		expect((await fetchAs(`/media/${id}/large`, null)).status).toBe(404);
	});

	test.each([
		['private', { owner: 200, other: 404, anonymous: 404 }, 'private'],
		['club', { owner: 200, other: 200, anonymous: 404 }, 'private'],
		['public', { owner: 200, other: 200, anonymous: 200 }, 'public']
	] as const)('a %s tank’s cover follows the tank', async (visibility, expected, caching) => {
		const { id } = await uploaded(owner);
		const tankId = await tanks.create(viewerOf(owner), tankInput({ visibility, name: `${visibility} cover tank` }), [{ id, alt: 'Front view', caption: '' }]);
		expect((await media.listFor('tank', tankId)).map((p) => p.id)).toEqual([id]);
		for (const [who, person] of [
			['owner', owner],
			['other', other],
			['anonymous', null]
		] as const) {
			const response = await fetchAs(`/media/${id}/medium`, person);
			expect(response.status, `${who} fetching a ${visibility} tank's photo`).toBe(expected[who]);
			if (response.status === 200) expect(response.headers.get('cache-control')).toMatch(new RegExp(`^${caching},`));
		}
	});

	test('an unknown id or size answers 404', async () => {
		expect((await fetchAs('/media/999999999/thumb', owner)).status).toBe(404);
		const { id } = await uploaded(owner);
		expect((await fetchAs(`/media/${id}/original`, owner)).status).toBe(404);
	});

	test('a repeated request with the ETag gets 304', async () => {
		const { id } = await uploaded(owner);
		const first = await fetchAs(`/media/${id}/thumb`, owner);
		const etag = first.headers.get('etag')!;
		const again = await request(`/media/${id}/thumb`, { cookie: owner.cookie, headers: { 'if-none-match': etag } });
		expect(again.status).toBe(304);
	});
});

describe('removing photos removes their objects', () => {
	test('the owner discards a pending upload through the API; nobody else can', async () => {
		const person = await makePerson({ label: 'discard' });
		const { id } = await (await uploadFile(person, await jpeg())).json();
		expect(await ownerKeys(person.id)).toHaveLength(3);
		const refused = await request(`/api/media/${id}`, { method: 'DELETE', cookie: other.cookie, accept: 'application/json' });
		expect(refused.status).toBe(404);
		const done = await request(`/api/media/${id}`, { method: 'DELETE', cookie: person.cookie, accept: 'application/json' });
		expect(done.status).toBe(204);
		await expectNothingStored(person);
	});

	test('replacing a tank’s cover deletes the old one; deleting the tank deletes the rest', async () => {
		const person = await makePerson({ label: 'replace' });
		const viewer = viewerOf(person);
		const first = await (await uploadFile(person, await jpeg())).json();
		const tankId = await tanks.create(viewer, tankInput(), [{ id: first.id, alt: '', caption: '' }]);
		const second = await (await uploadFile(person, await jpeg(300, 300))).json();
		await tanks.update(viewer, tankId, tankInput(), [{ id: second.id, alt: 'New cover', caption: 'After the trim' }]);
		expect(await media.getRow(first.id)).toBeUndefined();
		const keys = await ownerKeys(person.id);
		expect(keys).toHaveLength(3);
		const secondKey = (await media.getRow(second.id))!.storageKey;
		expect(keys.every((k) => k.startsWith(secondKey + '/'))).toBe(true);
		const [cover] = await media.listFor('tank', tankId);
		expect(cover).toMatchObject({ id: second.id, alt: 'New cover', caption: 'After the trim' });

		await tankDeletion.deleteTank(viewer, tankId);
		await expectNothingStored(person);
	});

	test('setPhotos orders, describes and drops one thing’s photos', async () => {
		const person = await makePerson({ label: 'arrange' });
		const tankId = await tanks.create(viewerOf(person), tankInput());
		const ids: number[] = [];
		for (let i = 0; i < 3; i++) ids.push((await (await uploadFile(person, await jpeg(200 + i * 10, 150))).json()).id);
		const set = (photos: { id: number; alt: string; caption: string }[], scopeId = tankId) =>
			db.transaction((tx) => media.setPhotos(person.id, 'tank', scopeId, photos, { max: 3 }, { db: tx }));
		expect(await set(ids.map((id) => ({ id, alt: `photo ${id}`, caption: '' })))).toEqual([]);
		expect((await media.listFor('tank', tankId)).map((p) => p.id)).toEqual(ids);
		await set([ids[2]!, ids[0]!, ids[1]!].map((id) => ({ id, alt: id === ids[0] ? 'Left side' : `photo ${id}`, caption: id === ids[0] ? 'Week two' : '' })));
		expect((await media.listFor('tank', tankId)).map((p) => p.id)).toEqual([ids[2], ids[0], ids[1]]);
		expect((await media.listFor('tank', tankId)).find((p) => p.id === ids[0])).toMatchObject({ alt: 'Left side', caption: 'Week two' });
		// A photo of one thing cannot be taken over by another: it is no longer pending.
		const other = await tanks.create(viewerOf(person), tankInput());
		await expect(set([{ id: ids[0]!, alt: '', caption: '' }], other)).rejects.toMatchObject({
			status: 400,
			code: 'photo-unavailable',
			fields: { photos: expect.stringMatching(/no longer available/) }
		});
		await expect(set(ids.concat(ids[0]!).map((id) => ({ id, alt: '', caption: '' })))).rejects.toMatchObject({ status: 400, code: 'too-many-photos' });
		const keys = await set([ids[2]!, ids[0]!].map((id) => ({ id, alt: '', caption: '' })));
		expect(keys).toHaveLength(3);
		expect(await bucketKeys(keys[0]!)).toHaveLength(1);
		await media.purge(keys);
		expect(await bucketKeys(keys[0]!)).toEqual([]);
		expect((await media.listFor('tank', tankId)).map((p) => p.id)).toEqual([ids[2], ids[0]]);
		await tankDeletion.deleteTank(viewerOf(person), tankId);
		await tankDeletion.deleteTank(viewerOf(person), other);
		await expectNothingStored(person);
	});

	test('photos cannot be attached to a scope no feature registered', async () => {
		const { id } = await (await uploadFile(owner, await jpeg())).json();
		await expect(
			db.transaction((tx) => media.setPhotos(owner.id, 'nobody-owns-this', 1, [{ id, alt: '', caption: '' }], { max: 1 }, { db: tx }))
		).rejects.toThrow(/not registered/);
		expect((await media.getRow(id))!.scope).toBeNull();
	});

	test('a photo of someone else cannot be attached to your tank', async () => {
		const { id } = await (await uploadFile(other, await jpeg())).json();
		await expect(tanks.create(viewerOf(owner), tankInput(), [{ id, alt: '', caption: '' }])).rejects.toThrow(/no longer available/);
		expect((await media.getRow(id))!.scope).toBeNull();
	});

	test('pending uploads older than a day are swept with their objects; attached photos stay', async () => {
		const person = await makePerson({ label: 'sweep' });
		const stale = await (await uploadFile(person, await jpeg())).json();
		const fresh = await (await uploadFile(person, await jpeg())).json();
		const kept = await (await uploadFile(person, await jpeg())).json();
		await tanks.create(viewerOf(person), tankInput(), [{ id: kept.id, alt: '', caption: '' }]);
		const twoDaysAgo = new Date(Date.now() - 2 * 86_400_000);
		await db.update(mediaTable).set({ createdAt: twoDaysAgo }).where(eq(mediaTable.id, stale.id));
		await db.update(mediaTable).set({ createdAt: twoDaysAgo }).where(eq(mediaTable.id, kept.id));
		const staleKey = (await media.getRow(stale.id))!.storageKey;

		expect(await media.sweepPending()).toBeGreaterThanOrEqual(1);
		expect(await media.getRow(stale.id)).toBeUndefined();
		expect(await bucketKeys(staleKey + '/')).toEqual([]);
		expect(await media.getRow(fresh.id)).toBeDefined();
		expect(await media.getRow(kept.id)).toBeDefined();
		expect(await ownerKeys(person.id)).toHaveLength(6);
	});
});
