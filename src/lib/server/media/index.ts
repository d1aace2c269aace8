// The media pipeline: uploads, the photos attached to things, and their removal. Features that
// own photos (tanks, journal entries, swap listings, contest entries) call these functions inside
// their own transactions and register a visibility check in ./access.ts.
import { createHash, randomUUID } from 'node:crypto';
import { and, asc, count, eq, inArray, isNull, lt } from 'drizzle-orm';
import { db as appDb, type Database, type DbOrTx } from '../db';
import { mediaUrls, RENDITION_SIZES, type RenditionSize } from '../../media/urls';
import type { PhotoField, UploaderPhoto } from '../../media/form';
import { resolve, type Context } from '../context';
import { media, type MediaRow, type StoredRendition } from './schema';
import { MediaError, prepareImage } from './process';
import { store as defaultStore, type ObjectStore } from './storage';
import type { MediaScope } from './access';
import { component, reason } from '../ops/log';
import { uploadSeconds } from '../ops/metrics';

const log = component('media');

export { MediaError } from './process';
export type { MediaScope } from './access';

/** Uploads a member may hold unattached at once (each is swept after a day anyway). */
export const MAX_PENDING_PER_OWNER = 60;
/** Pending uploads older than this are deleted by the sweeper. */
export const PENDING_TTL_MS = 24 * 60 * 60_000;

export interface Photo {
	id: number;
	ownerId: string;
	width: number;
	height: number;
	alt: string;
	caption: string;
	position: number;
	urls: Record<RenditionSize, string>;
	renditions: Record<RenditionSize, StoredRendition>;
}

export interface UploadResult {
	id: number;
	width: number;
	height: number;
	urls: Record<RenditionSize, string>;
}

export const objectKey = (storageKey: string, size: RenditionSize) => `${storageKey}/${size}.webp`;
const objectKeys = (storageKey: string) => RENDITION_SIZES.map((size) => objectKey(storageKey, size));

export function toPhoto(row: MediaRow): Photo {
	return {
		id: row.id,
		ownerId: row.ownerId,
		width: row.width,
		height: row.height,
		alt: row.altText,
		caption: row.caption,
		position: row.position,
		urls: mediaUrls(row.id),
		renditions: row.renditions
	};
}

interface Deps {
	db?: DbOrTx;
	store?: ObjectStore;
}

/**
 * Checks, converts and stores one uploaded file as a pending photo of `ownerId`. Nothing is left
 * behind when it fails: objects already written are deleted again if a later write or the
 * insert fails.
 */
export async function upload(ownerId: string, bytes: Uint8Array, deps: Deps = {}): Promise<UploadResult> {
	const started = performance.now();
	let outcome = 'error';
	try {
		const result = await storeUpload(ownerId, bytes, deps);
		outcome = 'ok';
		return result;
	} catch (error) {
		if (error instanceof MediaError) outcome = 'rejected';
		throw error;
	} finally {
		uploadSeconds.observe({ outcome }, (performance.now() - started) / 1000);
	}
}

async function storeUpload(ownerId: string, bytes: Uint8Array, deps: Deps): Promise<UploadResult> {
	const database = deps.db ?? appDb;
	const bucket = deps.store ?? defaultStore();
	const [pending] = await database
		.select({ n: count() })
		.from(media)
		.where(and(eq(media.ownerId, ownerId), isNull(media.scope)));
	if ((pending?.n ?? 0) >= MAX_PENDING_PER_OWNER) {
		throw new MediaError(
			429,
			'too-many-pending',
			`You have ${MAX_PENDING_PER_OWNER} photos uploaded but not yet saved with anything. Save or remove some first.`
		);
	}

	const prepared = await prepareImage(bytes);
	// The owner's id leads the key so everything of one person can be listed (and removed) together.
	const storageKey = `u/${ownerId}/${randomUUID()}`;
	const written: string[] = [];
	try {
		// Wait for every write to settle before judging, so a late write cannot land after the cleanup.
		const puts = await Promise.allSettled(
			prepared.renditions.map((r) => {
				const key = objectKey(storageKey, r.size);
				written.push(key);
				return bucket.put(key, r.data, 'image/webp');
			})
		);
		const failed = puts.find((p): p is PromiseRejectedResult => p.status === 'rejected');
		if (failed) throw failed.reason;
		const renditions = Object.fromEntries(prepared.renditions.map((r) => [r.size, { width: r.width, height: r.height, bytes: r.data.byteLength }])) as Record<
			RenditionSize,
			StoredRendition
		>;
		const [result] = await database.insert(media).values({
			ownerId,
			storageKey,
			uploadBytes: bytes.byteLength,
			byteSize: prepared.renditions.reduce((sum, r) => sum + r.data.byteLength, 0),
			width: prepared.width,
			height: prepared.height,
			renditions
		});
		return { id: result.insertId, width: prepared.width, height: prepared.height, urls: mediaUrls(result.insertId) };
	} catch (error) {
		await bucket.remove(written).catch((cleanup: unknown) => {
			log.error({ objects: written.length, storageKey, reason: reason(cleanup) }, 'objects of a failed upload could not be removed');
		});
		throw error;
	}
}

/** Object keys to delete once the transaction that removed their rows has committed. */
export type Purge = string[];

/** Deletes the objects of removed photos; call it after the transaction has committed. */
export async function purge(keys: Purge, deps: Deps = {}): Promise<void> {
	if (keys.length === 0) return;
	await (deps.store ?? defaultStore()).remove(keys);
}

/**
 * purge() after a member's change has committed: a failure is logged with what it was about
 * (e.g. `{ tankId: 4, what: 'replaced photos' }`) and does not undo or fail the change.
 */
export async function purgeAfterCommit(keys: Purge, about: Record<string, string | number>): Promise<void> {
	await purge(keys).catch((error: unknown) => log.error({ ...about, objects: keys.length, reason: reason(error) }, 'removing photos from the bucket failed'));
}

/** The photos of one thing, in order. */
export async function listFor(scope: MediaScope, scopeId: number, tx: DbOrTx = appDb): Promise<Photo[]> {
	const rows = await tx
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.orderBy(asc(media.position), asc(media.id));
	return rows.map(toPhoto);
}

/** The photos of many things at once (for lists showing a cover each), keyed by scope id. */
export async function listForMany(scope: MediaScope, scopeIds: number[], tx: DbOrTx = appDb): Promise<Map<number, Photo[]>> {
	const map = new Map<number, Photo[]>();
	if (scopeIds.length === 0) return map;
	const rows = await tx
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), inArray(media.scopeId, scopeIds)))
		.orderBy(asc(media.position), asc(media.id));
	for (const row of rows) {
		const list = map.get(row.scopeId!) ?? [];
		list.push(toPhoto(row));
		map.set(row.scopeId!, list);
	}
	return map;
}

/** A member's own pending uploads among `ids` (e.g. to show them again after a failed form). */
export async function pendingOf(ownerId: string, ids: number[], tx: DbOrTx = appDb): Promise<Photo[]> {
	if (ids.length === 0) return [];
	const rows = await tx
		.select()
		.from(media)
		.where(and(eq(media.ownerId, ownerId), isNull(media.scope), inArray(media.id, ids)));
	return rows.map(toPhoto);
}

/**
 * Attaches pending uploads of `ownerId` to a thing, after the photos it already has. Refuses
 * (MediaError 400) an id that is not a pending upload of that owner.
 */
export async function attach(tx: DbOrTx, ownerId: string, scope: MediaScope, scopeId: number, photos: PhotoField[], now = new Date()): Promise<void> {
	if (photos.length === 0) return;
	const ids = photos.map((p) => p.id);
	const rows = await tx
		.select({ id: media.id })
		.from(media)
		.where(and(inArray(media.id, ids), eq(media.ownerId, ownerId), isNull(media.scope)))
		.for('update');
	if (rows.length !== new Set(ids).size) throw unavailable();
	const [last] = await tx
		.select({ n: count() })
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)));
	let position = last?.n ?? 0;
	for (const p of photos) {
		await tx.update(media).set({ scope, scopeId, position: position++, altText: p.alt, caption: p.caption, attachedAt: now }).where(eq(media.id, p.id));
	}
}

const unavailable = () =>
	new MediaError(400, 'photo-unavailable', 'One of the photos is no longer available (uploads not saved within a day are removed). Upload it again.');

/**
 * Makes `photos`, in this order, exactly the photos of a thing: new ids must be pending uploads of
 * `ownerId`, ids already attached to this thing keep their files and get the new text and order,
 * and photos of the thing left out are deleted. Returns the object keys to purge after commit.
 */
export async function setPhotos(
	tx: DbOrTx,
	ownerId: string,
	scope: MediaScope,
	scopeId: number,
	photos: PhotoField[],
	options: { max: number; now?: Date }
): Promise<Purge> {
	if (photos.length > options.max) throw new MediaError(400, 'too-many-photos', `Add at most ${options.max} photo${options.max === 1 ? '' : 's'}.`);
	const now = options.now ?? new Date();
	const current = await tx
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.for('update');
	const currentIds = new Set(current.map((r) => r.id));
	const newIds = photos.map((p) => p.id).filter((id) => !currentIds.has(id));
	if (newIds.length) {
		const fresh = await tx
			.select({ id: media.id })
			.from(media)
			.where(and(inArray(media.id, newIds), eq(media.ownerId, ownerId), isNull(media.scope)))
			.for('update');
		if (fresh.length !== new Set(newIds).size) throw unavailable();
	}
	for (const [position, p] of photos.entries()) {
		await tx
			.update(media)
			.set({ scope, scopeId, position, altText: p.alt, caption: p.caption, ...(currentIds.has(p.id) ? {} : { attachedAt: now }) })
			.where(eq(media.id, p.id));
	}
	const keep = new Set(photos.map((p) => p.id));
	const dropped = current.filter((r) => !keep.has(r.id));
	if (dropped.length)
		await tx.delete(media).where(
			inArray(
				media.id,
				dropped.map((r) => r.id)
			)
		);
	return dropped.flatMap((r) => objectKeys(r.storageKey));
}

/** Sets a new order for a thing's photos; ids not attached to it are ignored. */
export async function reorder(tx: DbOrTx, scope: MediaScope, scopeId: number, orderedIds: number[]): Promise<void> {
	for (const [position, id] of orderedIds.entries()) {
		await tx
			.update(media)
			.set({ position })
			.where(and(eq(media.id, id), eq(media.scope, scope), eq(media.scopeId, scopeId)));
	}
}

/** Changes the description (alt text) and caption of one photo of a thing. */
export async function updateText(tx: DbOrTx, scope: MediaScope, scopeId: number, id: number, text: { alt: string; caption: string }): Promise<boolean> {
	const [result] = await tx
		.update(media)
		.set({ altText: text.alt, caption: text.caption })
		.where(and(eq(media.id, id), eq(media.scope, scope), eq(media.scopeId, scopeId)));
	return result.affectedRows > 0;
}

/** Removes some photos of a thing; returns the object keys to purge after commit. */
export async function detach(tx: DbOrTx, scope: MediaScope, scopeId: number, ids: number[]): Promise<Purge> {
	if (ids.length === 0) return [];
	const rows = await tx
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId), inArray(media.id, ids)))
		.for('update');
	if (rows.length)
		await tx.delete(media).where(
			inArray(
				media.id,
				rows.map((r) => r.id)
			)
		);
	return rows.flatMap((r) => objectKeys(r.storageKey));
}

/** Removes every photo of a thing that is being deleted; returns the object keys to purge after commit. */
export async function deleteFor(tx: DbOrTx, scope: MediaScope, scopeId: number): Promise<Purge> {
	const rows = await tx
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.for('update');
	if (rows.length)
		await tx.delete(media).where(
			inArray(
				media.id,
				rows.map((r) => r.id)
			)
		);
	return rows.flatMap((r) => objectKeys(r.storageKey));
}

/** Discards one of the owner's own pending uploads at once (the uploader's remove button). */
export async function discardPending(ownerId: string, id: number, deps: { db?: Database; store?: ObjectStore } = {}): Promise<boolean> {
	const database = deps.db ?? appDb;
	const keys = await database.transaction(async (tx) => {
		const [row] = await tx
			.select()
			.from(media)
			.where(and(eq(media.id, id), eq(media.ownerId, ownerId), isNull(media.scope)))
			.for('update');
		if (!row) return null;
		await tx.delete(media).where(eq(media.id, id));
		return objectKeys(row.storageKey);
	});
	if (!keys) return false;
	await purge(keys, deps);
	return true;
}

/**
 * Deletes pending uploads older than the time-to-live, objects first, so a row is only gone once
 * its objects are; a failure leaves the row for the next round.
 */
export async function sweepPending(options: { now?: Date; batch?: number } & Deps = {}): Promise<number> {
	const database = options.db ?? appDb;
	const bucket = options.store ?? defaultStore();
	const cutoff = new Date((options.now ?? new Date()).getTime() - PENDING_TTL_MS);
	const rows = await database
		.select({ id: media.id, storageKey: media.storageKey })
		.from(media)
		.where(and(isNull(media.scope), lt(media.createdAt, cutoff)))
		.limit(options.batch ?? 200);
	let removed = 0;
	for (const row of rows) {
		try {
			await bucket.remove(objectKeys(row.storageKey));
			await database.delete(media).where(and(eq(media.id, row.id), isNull(media.scope)));
			removed++;
		} catch (error) {
			log.error({ mediaId: row.id, reason: reason(error) }, 'sweeping a pending upload failed');
		}
	}
	return removed;
}

/** One rendition of one photo, ready to serve: an entity tag for it and a way to read its bytes. */
export interface RenditionHandle {
	etag: string;
	open(): ReturnType<ObjectStore['get']>;
}

/** A rendition of a photo known by its row, served at /media/<id>/<size>. */
export function renditionOfRow(row: Pick<MediaRow, 'id' | 'storageKey'>, size: RenditionSize, deps: Deps = {}): RenditionHandle {
	return { etag: `"${row.id}-${size}"`, open: () => (deps.store ?? defaultStore()).get(objectKey(row.storageKey, size)) };
}

/**
 * A rendition of the photo at `index` (0-based, in display order) of a thing, for a feature that
 * serves a thing's photos under addresses of its own rather than /media/<id> (blind judging). Its
 * entity tag is a digest of the file's key, so it names neither the photo's id nor its owner.
 */
export async function renditionAt(scope: MediaScope, scopeId: number, index: number, size: RenditionSize, deps: Deps = {}): Promise<RenditionHandle | null> {
	if (!Number.isInteger(index) || index < 0) return null;
	const [row] = await (deps.db ?? appDb)
		.select({ storageKey: media.storageKey })
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.orderBy(asc(media.position), asc(media.id))
		.limit(1)
		.offset(index);
	if (!row) return null;
	const digest = createHash('sha256').update(objectKey(row.storageKey, size)).digest('base64url').slice(0, 32);
	return { etag: `"${digest}"`, open: () => (deps.store ?? defaultStore()).get(objectKey(row.storageKey, size)) };
}

export async function getRow(id: number, tx: DbOrTx = appDb): Promise<MediaRow | undefined> {
	const [row] = await tx.select().from(media).where(eq(media.id, id)).limit(1);
	return row;
}

/**
 * The photos a form named, as the uploader shows them again after the form came back with
 * errors: the member's own pending uploads, and those already attached to what is being edited.
 * The alt text and caption are the ones the member typed, not the stored ones.
 */
export async function photosAgain(
	ownerId: string,
	fields: PhotoField[],
	attachedTo: { scope: MediaScope; id: number } | null,
	context: Context = {}
): Promise<UploaderPhoto[]> {
	const { db: tx } = resolve(context);
	const ids = fields.map((f) => f.id);
	const known = new Map(
		[...(await pendingOf(ownerId, ids, tx)), ...(attachedTo ? await listFor(attachedTo.scope, attachedTo.id, tx) : [])].map((p) => [p.id, p])
	);
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}
