// The media pipeline: uploads, the photos attached to things, and their removal. Features that
// own photos (tanks, journal entries, swap listings, contest entries) call these functions inside
// their own transactions (`{ db: tx }`) and register who may see their photos (./access.ts).
import { createHash, randomUUID } from 'node:crypto';
import { and, asc, count, eq, inArray, isNull, lt } from 'drizzle-orm';
import { mediaUrls, RENDITION_SIZES, type RenditionSize } from '../../media/urls';
import { readPhotoFields, type PhotoField, type UploaderPhoto } from '../../media/form';
import { DomainError } from '../../errors';
import { resolve, type Context } from '../context';
import { media, type MediaRow, type StoredRendition } from './schema';
import { prepareImage } from './process';
import { store as defaultStore, type ObjectStore } from './storage';
import { requireScope, type MediaScope } from './access';
import { component, reason } from '../ops/log';
import { uploadSeconds } from '../ops/metrics';

const log = component('media');

export { registerScope, type MediaScope, type MediaAudience, type ScopeAccess } from './access';

/** The context of media work: the database and the clock, and the bucket (tests pass a failing one). */
export interface MediaContext extends Context {
	store?: ObjectStore;
}

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

/**
 * Checks, converts and stores one uploaded file as a pending photo of `ownerId`. Nothing is left
 * behind when it fails: objects already written are deleted again if a later write or the
 * insert fails.
 */
export async function upload(ownerId: string, bytes: Uint8Array, context: MediaContext = {}): Promise<UploadResult> {
	const started = performance.now();
	let outcome = 'error';
	try {
		const result = await storeUpload(ownerId, bytes, context);
		outcome = 'ok';
		return result;
	} catch (error) {
		if (error instanceof DomainError) outcome = 'rejected';
		throw error;
	} finally {
		uploadSeconds.observe({ outcome }, (performance.now() - started) / 1000);
	}
}

async function storeUpload(ownerId: string, bytes: Uint8Array, context: MediaContext): Promise<UploadResult> {
	const { db } = resolve(context);
	const bucket = context.store ?? defaultStore();
	const [pending] = await db
		.select({ n: count() })
		.from(media)
		.where(and(eq(media.ownerId, ownerId), isNull(media.scope)));
	if ((pending?.n ?? 0) >= MAX_PENDING_PER_OWNER) {
		throw new DomainError(
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
		if (failed) throw storeUnavailable(failed.reason);
		const renditions = Object.fromEntries(prepared.renditions.map((r) => [r.size, { width: r.width, height: r.height, bytes: r.data.byteLength }])) as Record<
			RenditionSize,
			StoredRendition
		>;
		const [result] = await db.insert(media).values({
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

/**
 * The bucket did not take a write (it is down, unreachable or refusing). The member is told so in
 * plain words, with a 503 they may retry, rather than an unexpected error or the database's outage
 * page (a refused connection looks alike to both); the cause goes to the log.
 */
function storeUnavailable(cause: unknown): DomainError {
	log.warn({ reason: reason(cause) }, 'the photo store did not take an upload');
	return new DomainError(
		503,
		'storage-unavailable',
		'We could not store your photo just now: the photo store is not answering. Nothing was saved; please try the same photo again in a minute.'
	);
}

/** Object keys to delete once the transaction that removed their rows has committed. */
export type Purge = string[];

/** Deletes the objects of removed photos; call it after the transaction has committed. */
export async function purge(keys: Purge, context: MediaContext = {}): Promise<void> {
	if (keys.length === 0) return;
	await (context.store ?? defaultStore()).remove(keys);
}

/**
 * purge() after a member's change has committed: a failure is logged with what it was about
 * (e.g. `{ tankId: 4, what: 'replaced photos' }`) and does not undo or fail the change.
 */
export async function purgeAfterCommit(keys: Purge, about: Record<string, string | number>): Promise<void> {
	await purge(keys).catch((error: unknown) => log.error({ ...about, objects: keys.length, reason: reason(error) }, 'removing photos from the bucket failed'));
}

/** The photos of one thing, in order. */
export async function listFor(scope: MediaScope, scopeId: number, context: Context = {}): Promise<Photo[]> {
	const { db } = resolve(context);
	const rows = await db
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.orderBy(asc(media.position), asc(media.id));
	return rows.map(toPhoto);
}

/** The photos of many things at once (for lists showing a cover each), keyed by scope id. */
export async function listForMany(scope: MediaScope, scopeIds: number[], context: Context = {}): Promise<Map<number, Photo[]>> {
	const map = new Map<number, Photo[]>();
	if (scopeIds.length === 0) return map;
	const { db } = resolve(context);
	const rows = await db
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
export async function pendingOf(ownerId: string, ids: number[], context: Context = {}): Promise<Photo[]> {
	if (ids.length === 0) return [];
	const { db } = resolve(context);
	const rows = await db
		.select()
		.from(media)
		.where(and(eq(media.ownerId, ownerId), isNull(media.scope), inArray(media.id, ids)));
	return rows.map(toPhoto);
}

/** How many photos a thing may have, and the form field a refusal is shown at. */
export interface PhotoRules {
	max: number;
	/** The name of the form's photo field; 'photos' unless the form calls it otherwise (a tank's 'cover'). */
	field?: string;
}

const refusal = (rules: PhotoRules, code: string, message: string) => new DomainError(400, code, message, { [rules.field ?? 'photos']: message });

/**
 * Makes `photos`, in this order, exactly the photos of a thing: new ids must be pending uploads of
 * `ownerId`, ids already attached to this thing keep their files and get the new text and order,
 * and photos of the thing left out are deleted. Returns the object keys to purge after commit.
 * Call it in the transaction that saves the thing.
 */
export async function setPhotos(
	ownerId: string,
	scope: MediaScope,
	scopeId: number,
	photos: PhotoField[],
	rules: PhotoRules,
	context: Context = {}
): Promise<Purge> {
	requireScope(scope);
	if (photos.length > rules.max) throw refusal(rules, 'too-many-photos', `Add at most ${rules.max} photo${rules.max === 1 ? '' : 's'}.`);
	const { db, now } = resolve(context);
	const ofScope = and(eq(media.scope, scope), eq(media.scopeId, scopeId));
	// A locking read on the (scope, scope_id) index takes a gap lock where no row matches: two members
	// creating an entry (or tank, listing) at once then both hold the gap their photos' UPDATEs must
	// enter, and InnoDB kills one as a deadlock. A scope with no photos yet (always so when it was just
	// created) is therefore only read; one with photos is locked as before, so edits of it queue.
	const seen = await db.select({ id: media.id }).from(media).where(ofScope);
	const current = seen.length ? await db.select().from(media).where(ofScope).for('update') : [];
	const currentIds = new Set(current.map((r) => r.id));
	const newIds = photos.map((p) => p.id).filter((id) => !currentIds.has(id));
	if (newIds.length) {
		const fresh = await db
			.select({ id: media.id })
			.from(media)
			.where(and(inArray(media.id, newIds), eq(media.ownerId, ownerId), isNull(media.scope)))
			.for('update');
		if (fresh.length !== new Set(newIds).size) {
			throw refusal(rules, 'photo-unavailable', 'One of the photos is no longer available (uploads not saved within a day are removed). Upload it again.');
		}
	}
	for (const [position, p] of photos.entries()) {
		await db
			.update(media)
			.set({ scope, scopeId, position, altText: p.alt, caption: p.caption, ...(currentIds.has(p.id) ? {} : { attachedAt: now }) })
			.where(eq(media.id, p.id));
	}
	const keep = new Set(photos.map((p) => p.id));
	const dropped = current.filter((r) => !keep.has(r.id));
	if (dropped.length)
		await db.delete(media).where(
			inArray(
				media.id,
				dropped.map((r) => r.id)
			)
		);
	return dropped.flatMap((r) => objectKeys(r.storageKey));
}

/** Removes every photo of a thing that is being deleted; returns the object keys to purge after commit. */
export async function deleteFor(scope: MediaScope, scopeId: number, context: Context = {}): Promise<Purge> {
	const { db } = resolve(context);
	const rows = await db
		.select()
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.for('update');
	if (rows.length)
		await db.delete(media).where(
			inArray(
				media.id,
				rows.map((r) => r.id)
			)
		);
	return rows.flatMap((r) => objectKeys(r.storageKey));
}

/**
 * Deletes the rows of every photo a member uploaded, attached or pending (an account deletion),
 * and returns the object keys to purge once the caller's transaction has committed.
 */
export async function deleteOwnedBy(ownerId: string, context: Context = {}): Promise<Purge> {
	const { db } = resolve(context);
	const rows = await db.select({ id: media.id, storageKey: media.storageKey }).from(media).where(eq(media.ownerId, ownerId)).for('update');
	if (rows.length) await db.delete(media).where(eq(media.ownerId, ownerId));
	return rows.flatMap((r) => objectKeys(r.storageKey));
}

/** Discards one of the owner's own pending uploads at once (the uploader's remove button). */
export async function discardPending(ownerId: string, id: number, context: MediaContext = {}): Promise<boolean> {
	const { db } = resolve(context);
	const keys = await db.transaction(async (tx) => {
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
	await purge(keys, context);
	return true;
}

/**
 * Deletes pending uploads older than the time-to-live, objects first, so a row is only gone once
 * its objects are; a failure leaves the row for the next round.
 */
export async function sweepPending(options: { batch?: number } = {}, context: MediaContext = {}): Promise<number> {
	const { db, now } = resolve(context);
	const bucket = context.store ?? defaultStore();
	const cutoff = new Date(now.getTime() - PENDING_TTL_MS);
	const rows = await db
		.select({ id: media.id, storageKey: media.storageKey })
		.from(media)
		.where(and(isNull(media.scope), lt(media.createdAt, cutoff)))
		.limit(options.batch ?? 200);
	let removed = 0;
	for (const row of rows) {
		try {
			await bucket.remove(objectKeys(row.storageKey));
			await db.delete(media).where(and(eq(media.id, row.id), isNull(media.scope)));
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
export function renditionOfRow(row: Pick<MediaRow, 'id' | 'storageKey'>, size: RenditionSize, context: MediaContext = {}): RenditionHandle {
	return { etag: `"${row.id}-${size}"`, open: () => (context.store ?? defaultStore()).get(objectKey(row.storageKey, size)) };
}

/**
 * A rendition of the photo at `index` (0-based, in display order) of a thing, for a feature that
 * serves a thing's photos under addresses of its own rather than /media/<id> (blind judging). Its
 * entity tag is a digest of the file's key, so it names neither the photo's id nor its owner.
 */
export async function renditionAt(
	scope: MediaScope,
	scopeId: number,
	index: number,
	size: RenditionSize,
	context: MediaContext = {}
): Promise<RenditionHandle | null> {
	if (!Number.isInteger(index) || index < 0) return null;
	const { db } = resolve(context);
	const [row] = await db
		.select({ storageKey: media.storageKey })
		.from(media)
		.where(and(eq(media.scope, scope), eq(media.scopeId, scopeId)))
		.orderBy(asc(media.position), asc(media.id))
		.limit(1)
		.offset(index);
	if (!row) return null;
	const digest = createHash('sha256').update(objectKey(row.storageKey, size)).digest('base64url').slice(0, 32);
	return { etag: `"${digest}"`, open: () => (context.store ?? defaultStore()).get(objectKey(row.storageKey, size)) };
}

export async function getRow(id: number, context: Context = {}): Promise<MediaRow | undefined> {
	const { db } = resolve(context);
	const [row] = await db.select().from(media).where(eq(media.id, id)).limit(1);
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
	const ids = fields.map((f) => f.id);
	const known = new Map(
		[...(await pendingOf(ownerId, ids, context)), ...(attachedTo ? await listFor(attachedTo.scope, attachedTo.id, context) : [])].map((p) => [p.id, p])
	);
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}

/** The photos a sent form's uploader field `name` named, as photosAgain shows them after a refusal. */
export async function photosAgainFrom(
	form: FormData,
	name: string,
	max: number,
	ownerId: string,
	attachedTo: { scope: MediaScope; id: number } | null,
	context: Context = {}
): Promise<UploaderPhoto[]> {
	const fields = readPhotoFields(form, name, max);
	return photosAgain(ownerId, fields.ok ? fields.photos : [], attachedTo, context);
}
