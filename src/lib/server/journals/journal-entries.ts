// Journal entries: a dated markdown text with up to twelve photos (media scope 'entry', seen by
// whoever may see the tank, see ./photo-access.ts) and the events it records. Events that add or
// take out plants and animals change the tank's lists in the same transaction. Comments on
// entries live here too. (Contest entries are another thing: ../contests/entries.ts.)
import { and, asc, count, desc, eq, inArray, isNull, max } from 'drizzle-orm';
import type { DbOrTx } from '../db';
import { resolve, within, type Context } from '../context';
import * as media from '../media';
import type { Photo, Purge } from '../media';
import type { PhotoField } from '../../media/form';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import * as catalogue from '../species/catalogue';
import { renderMarkdown, storedHtml } from '../markdown';
import { invalid, notFound } from '../../errors';
import { UNNAMED_MEMBER } from '../../club/names';
import type { EntryInput, EventInput } from '../../journals/journal-entry-form';
import { COMMENT_MAX, ENTRY_PHOTOS_MAX, isListEvent } from '../../journals/journal-vocabulary';
import { doneEventKind } from '../../journals/schedule';
import { threadComments, type Threaded } from '../../journals/comment-thread';
import {
	entryComments,
	journalEntries,
	journalEvents,
	tankFollows,
	tankLivestock,
	tankPlants,
	tanks as tankTable,
	type EntryRow,
	type EventRow,
	type TankRow
} from './schema';
import * as tanks from './tanks';
import * as upkeep from './upkeep';
import * as social from './social';

export type { EventRow };

export interface Entry extends Omit<EntryRow, 'bodyHtml'> {
	html: string;
	photos: Photo[];
	events: EventRow[];
	authorName: string;
	comments: number;
}

export interface Comment {
	id: number;
	entryId: number;
	/** The comment it answers; null for a comment on the entry itself. */
	parentId: number | null;
	authorId: string;
	authorName: string;
	html: string;
	createdAt: Date;
	/** When its author last changed it. */
	editedAt: Date | null;
	/** Whether the viewer may remove it: its author, the tank's keeper, or an admin. */
	removable: boolean;
	/** Whether the viewer may change its text: its author only. */
	editable: boolean;
	/** The markdown source, for its author's edit form only (empty for everyone else). */
	source: string;
}

const entryNotFound = () => notFound('We could not find that entry.');

async function nextPosition(tx: DbOrTx, table: typeof tankPlants | typeof tankLivestock, tankId: number): Promise<number> {
	const [row] = await tx
		.select({ n: max(table.position) })
		.from(table)
		.where(eq(table.tankId, tankId));
	return (row?.n ?? -1) + 1;
}

/** Writes one event; list events change the tank's lists first. */
async function writeEvent(tx: DbOrTx, tankId: number, entryId: number, on: string, position: number, e: EventInput, index: number): Promise<void> {
	const fail = (field: string, message: string) => {
		throw invalid({ [`events.${index}.${field}`]: message });
	};
	const values: typeof journalEvents.$inferInsert = {
		tankId,
		entryId,
		kind: e.kind,
		occurredOn: on,
		position,
		percent: e.percent,
		filterPart: e.filterPart,
		what: e.what,
		amount: e.amount,
		amountUnit: e.amountUnit,
		saltId: e.saltId,
		speciesId: null,
		speciesName: e.speciesName,
		count: e.count,
		algaeKind: e.algaeKind,
		note: e.note
	};
	if (e.kind === 'plant-added' || e.kind === 'livestock-added') {
		const known = e.speciesId ? await catalogue.get(e.speciesId, { db: tx }) : undefined;
		values.speciesId = known?.id ?? null;
		values.speciesName = known?.scientificName ?? e.speciesName;
		if (e.kind === 'plant-added') {
			const [row] = await tx.insert(tankPlants).values({
				tankId,
				position: await nextPosition(tx, tankPlants, tankId),
				speciesId: values.speciesId,
				name: values.speciesName!,
				placement: known?.placement ?? null,
				addedOn: on
			});
			values.tankPlantId = row.insertId;
		} else {
			const [row] = await tx.insert(tankLivestock).values({
				tankId,
				position: await nextPosition(tx, tankLivestock, tankId),
				speciesId: values.speciesId,
				name: values.speciesName!,
				count: e.count ?? 1,
				addedOn: on
			});
			values.tankLivestockId = row.insertId;
		}
	} else if (e.kind === 'plant-removed') {
		const [row] = await tx
			.select()
			.from(tankPlants)
			.where(and(eq(tankPlants.id, e.rowId ?? 0), eq(tankPlants.tankId, tankId), isNull(tankPlants.removedOn)))
			.for('update');
		if (!row) return fail('rowId', 'That plant is not listed in the tank any more.');
		if (row.addedOn && on < row.addedOn) return fail('rowId', 'That is before the plant went in.');
		await tx.update(tankPlants).set({ removedOn: on }).where(eq(tankPlants.id, row.id));
		Object.assign(values, { tankPlantId: row.id, speciesId: row.speciesId, speciesName: row.name });
	} else if (e.kind === 'livestock-removed') {
		const [row] = await tx
			.select()
			.from(tankLivestock)
			.where(and(eq(tankLivestock.id, e.rowId ?? 0), eq(tankLivestock.tankId, tankId), isNull(tankLivestock.removedOn)))
			.for('update');
		if (!row) return fail('rowId', 'Those animals are not listed in the tank any more.');
		if (row.addedOn && on < row.addedOn) return fail('rowId', 'That is before they were added.');
		const taken = e.count ?? row.count;
		if (taken > row.count) return fail('count', `The list has ${row.count}; take out at most that many.`);
		let closed = row.id;
		if (taken === row.count) {
			await tx.update(tankLivestock).set({ removedOn: on }).where(eq(tankLivestock.id, row.id));
		} else {
			// Some of a group leave: the rest stay on the list, those taken out become a closed row.
			await tx
				.update(tankLivestock)
				.set({ count: row.count - taken })
				.where(eq(tankLivestock.id, row.id));
			const [split] = await tx.insert(tankLivestock).values({
				tankId,
				position: await nextPosition(tx, tankLivestock, tankId),
				speciesId: row.speciesId,
				name: row.name,
				count: taken,
				addedOn: row.addedOn,
				removedOn: on
			});
			closed = split.insertId;
		}
		Object.assign(values, { tankLivestockId: closed, speciesId: row.speciesId, speciesName: row.name, count: taken });
	}
	await tx.insert(journalEvents).values(values);
}

/** Writes an entry's row (its HTML rendered once, here) and attaches its author's photos. */
async function insertEntry(
	tx: DbOrTx,
	authorId: string,
	tankId: number,
	input: { entryOn: string; title: string; body: string },
	photos: PhotoField[],
	context: Context
): Promise<number> {
	const { now } = resolve(context);
	const [result] = await tx.insert(journalEntries).values({
		tankId,
		authorId,
		entryOn: input.entryOn,
		title: input.title,
		body: input.body,
		bodyHtml: renderMarkdown(input.body),
		updatedAt: now,
		createdAt: now
	});
	await media.setPhotos(authorId, 'entry', result.insertId, photos, { max: ENTRY_PHOTOS_MAX }, context);
	return result.insertId;
}

/** Creates an entry on the viewer's tank; mails followers (at most once a day each). */
export async function create(viewer: Pick<Viewer, 'id'>, tankId: number, input: EntryInput, photos: PhotoField[], context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const tank = await tanks.lockOwn(viewer, tankId, inTx);
		const entryId = await insertEntry(tx, viewer.id, tankId, input, photos, inTx);
		for (const [position, e] of input.events.entries()) await writeEvent(tx, tankId, entryId, input.entryOn, position, e, position);
		await upkeep.recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
		await social.notifyFollowers(tank, { id: entryId, title: input.title, entryOn: input.entryOn }, inTx);
		return entryId;
	});
}

/**
 * An entry written on someone else's tank by a member the keeper asked to look in while away (the
 * caller, away care, has checked that they may). Ticked schedule tasks are logged as done by this
 * visit, so the schedule resets them; the photos are the sitter's own uploads.
 */
export async function createVisit(
	sitter: Pick<Viewer, 'id'>,
	tankId: number,
	input: { entryOn: string; title: string; body: string; taskIds: number[] },
	photos: PhotoField[],
	context: Context = {}
): Promise<number> {
	const { db, now } = resolve(context);
	const write = async (tx: DbOrTx) => {
		const inTx = within({ ...context, now }, tx);
		const tasks = (await upkeep.listForTank(tankId, inTx)).filter((t) => input.taskIds.includes(t.id));
		const entryId = await insertEntry(tx, sitter.id, tankId, input, photos, inTx);
		for (const [position, task] of tasks.entries()) {
			const kind = doneEventKind(task.kind);
			await tx.insert(journalEvents).values({
				tankId,
				entryId,
				kind,
				occurredOn: input.entryOn,
				position,
				filterPart: kind === 'filter-clean' ? task.filterPart : null,
				what: kind === 'upkeep' ? task.label : '',
				taskId: task.id
			});
		}
		await upkeep.recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
		return entryId;
	};
	return db.transaction(write);
}

/**
 * Saves the owner's changes. Events of the entry named by id are updated (list events keep what
 * they did and only their note changes), new ones are written, and events left out are removed;
 * removing a list event leaves the tank's list as it is (change it on the tank's form).
 */
export async function update(
	viewer: Pick<Viewer, 'id'>,
	tankId: number,
	entryId: number,
	input: EntryInput,
	photos: PhotoField[],
	context: Context = {}
): Promise<void> {
	const { db, now } = resolve(context);
	const purge: Purge = await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [entry] = await tx
			.select()
			.from(journalEntries)
			.where(and(eq(journalEntries.id, entryId), eq(journalEntries.tankId, tankId)))
			.for('update');
		if (!entry) throw entryNotFound();
		await tx
			.update(journalEntries)
			.set({ entryOn: input.entryOn, title: input.title, body: input.body, bodyHtml: renderMarkdown(input.body), updatedAt: now })
			.where(eq(journalEntries.id, entryId));
		const keys = await media.setPhotos(viewer.id, 'entry', entryId, photos, { max: ENTRY_PHOTOS_MAX }, inTx);
		const existing = new Map((await tx.select().from(journalEvents).where(eq(journalEvents.entryId, entryId))).map((e) => [e.id, e]));
		const kept = new Set<number>();
		for (const [position, e] of input.events.entries()) {
			const old = e.id !== undefined ? existing.get(e.id) : undefined;
			if (old && isListEvent(old.kind)) {
				await tx.update(journalEvents).set({ position, note: e.note, occurredOn: input.entryOn }).where(eq(journalEvents.id, old.id));
				kept.add(old.id);
			} else if (old && !isListEvent(e.kind)) {
				await tx
					.update(journalEvents)
					.set({
						kind: e.kind,
						occurredOn: input.entryOn,
						position,
						percent: e.percent,
						filterPart: e.filterPart,
						what: e.what,
						amount: e.amount,
						amountUnit: e.amountUnit,
						saltId: e.saltId,
						count: e.count,
						algaeKind: e.algaeKind,
						note: e.note
					})
					.where(eq(journalEvents.id, old.id));
				kept.add(old.id);
			} else {
				await writeEvent(tx, tankId, entryId, input.entryOn, position, { ...e, id: undefined }, position);
			}
		}
		const dropped = [...existing.keys()].filter((id) => !kept.has(id));
		if (dropped.length) await tx.delete(journalEvents).where(inArray(journalEvents.id, dropped));
		await upkeep.recompute(tankId, inTx);
		await tanks.touch(tankId, inTx);
		return keys;
	});
	await media.purgeAfterCommit(purge, { entryId, what: 'dropped photos' });
}

/** Deletes an entry with its events, comments and photos (objects after the commit). */
export async function remove(viewer: Pick<Viewer, 'id'>, tankId: number, entryId: number, context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	const purge = await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		await tanks.lockOwn(viewer, tankId, inTx);
		const [entry] = await tx
			.select()
			.from(journalEntries)
			.where(and(eq(journalEntries.id, entryId), eq(journalEntries.tankId, tankId)))
			.for('update');
		if (!entry) throw entryNotFound();
		const keys = await media.deleteFor('entry', entryId, inTx);
		await tx.delete(journalEntries).where(eq(journalEntries.id, entryId));
		await upkeep.recompute(tankId, inTx);
		return keys;
	});
	await media.purge(purge);
}

async function hydrate(rows: EntryRow[], context: Context): Promise<Entry[]> {
	if (!rows.length) return [];
	const { db } = resolve(context);
	const ids = rows.map((r) => r.id);
	const [photos, events, names, comments] = await Promise.all([
		media.listForMany('entry', ids, context),
		db.select().from(journalEvents).where(inArray(journalEvents.entryId, ids)).orderBy(asc(journalEvents.position), asc(journalEvents.id)),
		directory.names(
			rows.map((r) => r.authorId),
			context
		),
		db.select({ entryId: entryComments.entryId, n: count() }).from(entryComments).where(inArray(entryComments.entryId, ids)).groupBy(entryComments.entryId)
	]);
	const counts = new Map(comments.map((c) => [c.entryId, c.n]));
	return rows.map(({ bodyHtml, ...r }) => ({
		...r,
		html: storedHtml(bodyHtml, r.body),
		photos: photos.get(r.id) ?? [],
		events: events.filter((e) => e.entryId === r.id),
		authorName: names.get(r.authorId) ?? UNNAMED_MEMBER,
		comments: counts.get(r.id) ?? 0
	}));
}

/** An entry as a page shows it: the rendered HTML without the markdown source. */
export type ShownEntry = Omit<Entry, 'body'>;
export function shown(entry: Entry): ShownEntry {
	const { body, ...rest } = entry;
	void body;
	return rest;
}

/** One entry of a tank the viewer may see, or null. */
export async function get(
	viewer: Pick<Viewer, 'id'> | null,
	tankId: number,
	entryId: number,
	context: Context = {}
): Promise<{ tank: TankRow; entry: Entry } | null> {
	const tank = await tanks.findVisible(viewer, tankId, context);
	if (!tank) return null;
	const [row] = await resolve(context)
		.db.select()
		.from(journalEntries)
		.where(and(eq(journalEntries.id, entryId), eq(journalEntries.tankId, tankId)));
	if (!row) return null;
	const [entry] = await hydrate([row], context);
	return { tank, entry: entry! };
}

/** Entries by id, with photos and events (the caller has checked the tank's visibility). */
export async function many(ids: number[], context: Context = {}): Promise<Entry[]> {
	if (!ids.length) return [];
	const rows = await resolve(context).db.select().from(journalEntries).where(inArray(journalEntries.id, ids));
	return hydrate(rows, context);
}

/** The newest entries of a tank (for its feed). */
export async function latestOf(tankId: number, limit: number, context: Context = {}): Promise<Entry[]> {
	const rows = await resolve(context)
		.db.select()
		.from(journalEntries)
		.where(eq(journalEntries.tankId, tankId))
		.orderBy(desc(journalEntries.entryOn), desc(journalEntries.createdAt), desc(journalEntries.id))
		.limit(limit);
	return hydrate(rows, context);
}

// ——— Comments ———

/** The comments on an entry of `tank`, each with its replies, oldest first (the caller has checked that the viewer may see the tank). */
export async function comments(
	viewer: Pick<Viewer, 'id' | 'role'> | null,
	tank: Pick<TankRow, 'ownerId'>,
	entryId: number,
	context: Context = {}
): Promise<Threaded<Comment>[]> {
	const rows = await resolve(context)
		.db.select()
		.from(entryComments)
		.where(eq(entryComments.entryId, entryId))
		.orderBy(asc(entryComments.createdAt), asc(entryComments.id));
	const names = await directory.names(
		rows.map((c) => c.authorId),
		context
	);
	return threadComments(
		rows.map((comment) => {
			const isAuthor = !!viewer && viewer.id === comment.authorId;
			return {
				id: comment.id,
				entryId: comment.entryId,
				parentId: comment.parentId,
				authorId: comment.authorId,
				authorName: names.get(comment.authorId) ?? UNNAMED_MEMBER,
				html: storedHtml(comment.bodyHtml, comment.body),
				createdAt: comment.createdAt,
				editedAt: comment.editedAt,
				removable: !!viewer && (isAuthor || viewer.id === tank.ownerId || viewer.role === 'admin'),
				editable: isAuthor,
				source: isAuthor ? comment.body : ''
			};
		})
	);
}

/** A comment's text as it is kept: line ends made plain, trimmed, not empty, not too long. */
function commentText(body: string, field: string): string {
	const text = body.replace(/\r\n/g, '\n').trim();
	if (!text) throw invalid({ [field]: 'Write a comment first.' });
	if (text.length > COMMENT_MAX) throw invalid({ [field]: `Keep the comment to ${COMMENT_MAX.toLocaleString('en-GB')} characters.` });
	return text;
}

const commentNotFound = () => notFound('We could not find that comment.');

/** A member's comment on an entry of a tank they may see. */
export async function addComment(viewer: Pick<Viewer, 'id'>, tankId: number, entryId: number, body: string, context: Context = {}): Promise<number> {
	const text = commentText(body, 'comment');
	return resolve(context).db.transaction(async (tx) => {
		const found = await get(viewer, tankId, entryId, within(context, tx));
		if (!found) throw entryNotFound();
		const [result] = await tx.insert(entryComments).values({ entryId, authorId: viewer.id, body: text, bodyHtml: renderMarkdown(text) });
		return result.insertId;
	});
}

/**
 * A reply to a comment on an entry of a tank the viewer may see (whoever may comment there may
 * reply). Replies go one level deep: answering a reply joins the thread of the comment it answers.
 * Returns the reply's id and the comment it went under, with that comment's author.
 */
export async function reply(
	viewer: Pick<Viewer, 'id'>,
	tankId: number,
	entryId: number,
	parentId: number,
	body: string,
	context: Context = {}
): Promise<{ id: number; parentId: number; parentAuthorId: string }> {
	const text = commentText(body, 'reply');
	return resolve(context).db.transaction(async (tx) => {
		const found = await get(viewer, tankId, entryId, within(context, tx));
		if (!found) throw entryNotFound();
		const [answered] = await tx
			.select({ id: entryComments.id, parentId: entryComments.parentId })
			.from(entryComments)
			.where(and(eq(entryComments.id, parentId), eq(entryComments.entryId, entryId)));
		if (!answered) throw commentNotFound();
		const threadId = answered.parentId ?? answered.id;
		// The thread's first comment, locked so a reply cannot land under a comment being removed (MariaDB has no FOR SHARE).
		const [thread] = await tx
			.select({ id: entryComments.id, authorId: entryComments.authorId })
			.from(entryComments)
			.where(eq(entryComments.id, threadId))
			.for('update');
		if (!thread) throw commentNotFound();
		const [result] = await tx.insert(entryComments).values({ entryId, parentId: thread.id, authorId: viewer.id, body: text, bodyHtml: renderMarkdown(text) });
		return { id: result.insertId, parentId: thread.id, parentAuthorId: thread.authorId };
	});
}

/** Changes the text of the viewer's own comment or reply, on a tank they may still see, and marks it edited; "not found" for anyone else. */
export async function editComment(viewer: Pick<Viewer, 'id'>, tankId: number, commentId: number, body: string, context: Context = {}): Promise<void> {
	const text = commentText(body, 'body');
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const [row] = await tx
			.select({ authorId: entryComments.authorId, tankId: journalEntries.tankId })
			.from(entryComments)
			.innerJoin(journalEntries, eq(journalEntries.id, entryComments.entryId))
			.where(and(eq(entryComments.id, commentId), eq(journalEntries.tankId, tankId)))
			.for('update');
		if (!row || row.authorId !== viewer.id) throw commentNotFound();
		if (!(await tanks.findVisible(viewer, row.tankId, within(context, tx)))) throw commentNotFound();
		await tx
			.update(entryComments)
			.set({ body: text, bodyHtml: renderMarkdown(text), editedAt: now })
			.where(eq(entryComments.id, commentId));
	});
}

/** Removes a comment (its replies with it): its author, the keeper of the tank, or an admin (audited when it is not the author); anyone else gets "not found". */
export async function removeComment(viewer: Pick<Viewer, 'id' | 'role'>, tankId: number, commentId: number, context: Context = {}): Promise<void> {
	await resolve(context).db.transaction(async (tx) => {
		const [row] = await tx
			.select({ comment: entryComments, tankId: journalEntries.tankId })
			.from(entryComments)
			.innerJoin(journalEntries, eq(journalEntries.id, entryComments.entryId))
			.where(and(eq(entryComments.id, commentId), eq(journalEntries.tankId, tankId)))
			.for('update');
		const tank = row ? await tanks.findVisible(viewer, row.tankId, within(context, tx)) : null;
		if (!row || !tank) throw commentNotFound();
		const isAuthor = row.comment.authorId === viewer.id;
		const isKeeper = tank.ownerId === viewer.id;
		if (!isAuthor && !isKeeper && viewer.role !== 'admin') throw commentNotFound();
		await tx.delete(entryComments).where(eq(entryComments.id, commentId));
		if (!isAuthor) {
			await audit.record(
				{
					actorId: viewer.id,
					action: 'comment.remove',
					subject: { type: 'entry_comment', id: commentId },
					detail: { entryId: row.comment.entryId, authorId: row.comment.authorId, asKeeper: isKeeper }
				},
				within(context, tx)
			);
		}
	});
}

/** The newest entries in tanks the viewer follows and may still see, for the dashboard. */
export async function recentFollowed(viewer: Pick<Viewer, 'id'>, limit = 6, context: Context = {}) {
	const rows = await resolve(context)
		// Only the tank's columns the card and the visibility check need: whole rows (descriptions
		// included) would ride through the sort.
		.db.select({
			id: journalEntries.id,
			title: journalEntries.title,
			entryOn: journalEntries.entryOn,
			createdAt: journalEntries.createdAt,
			tank: { id: tankTable.id, name: tankTable.name, ownerId: tankTable.ownerId, visibility: tankTable.visibility }
		})
		.from(tankFollows)
		.innerJoin(tankTable, eq(tankTable.id, tankFollows.tankId))
		.innerJoin(journalEntries, eq(journalEntries.tankId, tankTable.id))
		.where(eq(tankFollows.userId, viewer.id))
		.orderBy(desc(journalEntries.createdAt), desc(journalEntries.id))
		.limit(limit * 2);
	return rows
		.filter((r) => tanks.canView(viewer, r.tank))
		.slice(0, limit)
		.map((r) => ({ id: r.id, title: r.title, entryOn: r.entryOn, createdAt: r.createdAt, tankId: r.tank.id, tankName: r.tank.name }));
}
