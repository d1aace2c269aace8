// Conversations about a listing: a request (or an answer to a wanted post) opens one between the
// listing's owner and the other member. Only those two may read it, and an admin while a report
// about one of its messages is open; to everyone else it does not exist (404).
import { and, asc, count, desc, eq, gt, inArray, isNull, type SQL } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';
import type { Viewer } from '../club/users';
import { effectiveState, type Listing, type ListingState } from '../../swaps/listing-state';
import { canArrangePickup, canWrite, conversationStatus, type ConversationStatus } from '../../swaps/conversation';
import { checkPickup, type PickupProposal } from '../../swaps/pickup';
import { refusalMessage, type Assessment } from '../../swaps/restrictions';
import { CATEGORY_CAUTIONS, type ListingCategory, type ListingKind } from '../../swaps/listing';
import { listings, swapMessages, swapReports, swapThreads, type MessageKind, type MessageRow, type ThreadRow } from './schema';
import { canView, toPure } from './listings';
import * as blocks from './blocks';
import * as restricted from './restricted';
import { afterPost, displayName } from './notifications';
import { notFound, SwapError } from './errors';

export const MESSAGE_MAX = 2000;

interface Options {
	now?: Date;
	database?: DbOrTx;
}

export interface MessageView {
	id: number;
	kind: MessageKind;
	/** null for notes from the site. */
	senderId: string | null;
	senderName: string;
	body: string;
	pickup: PickupProposal | null;
	refersTo: number | null;
	/** For proposals: 'open' (the latest, unanswered), 'confirmed', or 'replaced' by a later one. */
	proposalState: 'open' | 'confirmed' | 'replaced' | null;
	createdAt: Date;
	readAt: Date | null;
	recipientId: string;
}

export interface ThreadView {
	id: number;
	listingId: number;
	listing: {
		title: string;
		kind: ListingKind;
		category: ListingCategory;
		state: ListingState;
		ownerId: string;
		speciesName: string;
		ownerConfirmedAt: Date | null;
		requesterConfirmedAt: Date | null;
	};
	ownerId: string;
	ownerName: string;
	requesterId: string;
	requesterName: string;
	/** How the viewer takes part: one of the two members, or an admin reading a reported thread. */
	role: 'owner' | 'requester' | 'admin';
	otherId: string | null;
	otherName: string | null;
	status: ConversationStatus;
	canWrite: boolean;
	canArrangePickup: boolean;
	/** Why writing is not possible, when it is not. */
	writeBlock: string | null;
	agreedPickup: (PickupProposal & { messageId: number }) | null;
	openProposal: (PickupProposal & { messageId: number; fromViewer: boolean }) | null;
	messages: MessageView[];
	restrictions: Assessment;
	cautions: readonly string[];
	version: string;
	pure: Listing;
}

async function threadRow(id: number, tx: DbOrTx, lock = false): Promise<ThreadRow | undefined> {
	const query = tx.select().from(swapThreads).where(eq(swapThreads.id, id));
	const [row] = lock ? await query.for('update') : await query;
	return row;
}

/** Whether an admin may read this thread: an open report about one of its messages. */
async function reportedOpen(threadId: number, tx: DbOrTx): Promise<boolean> {
	const [row] = await tx
		.select({ n: count() })
		.from(swapReports)
		.where(and(eq(swapReports.threadId, threadId), eq(swapReports.state, 'open')));
	return (row?.n ?? 0) > 0;
}

/** The viewer's part in a thread, or null when it does not exist for them. */
export async function roleIn(viewer: Viewer | null, thread: ThreadRow | undefined, tx: DbOrTx): Promise<ThreadView['role'] | null> {
	if (!viewer || !thread) return null;
	if (viewer.id === thread.ownerId) return 'owner';
	if (viewer.id === thread.requesterId) return 'requester';
	if (viewer.role === 'admin' && (await reportedOpen(thread.id, tx))) return 'admin';
	return null;
}

function toViews(rows: (MessageRow & { senderName: string | null })[]): MessageView[] {
	const confirmed = new Set(rows.filter((r) => r.kind === 'confirm' && r.refersTo !== null).map((r) => r.refersTo!));
	const lastProposal = rows.filter((r) => r.kind === 'proposal').at(-1)?.id ?? null;
	return rows.map((r) => ({
		id: r.id,
		kind: r.kind,
		senderId: r.senderId,
		senderName: r.senderId ? (r.senderName ?? 'A member') : 'Riparia',
		body: r.body,
		pickup:
			r.kind === 'proposal' || r.kind === 'confirm'
				? { on: r.pickupOn ?? '', from: r.pickupFrom ?? '', to: r.pickupTo ?? '', place: r.pickupPlace ?? '' }
				: null,
		refersTo: r.refersTo,
		proposalState: r.kind !== 'proposal' ? null : confirmed.has(r.id) ? 'confirmed' : r.id === lastProposal ? 'open' : 'replaced',
		createdAt: r.createdAt,
		readAt: r.readAt,
		recipientId: r.recipientId
	}));
}

async function messageRows(threadId: number, tx: DbOrTx, afterId = 0) {
	const rows = await tx
		.select({ message: swapMessages, senderName: users.displayName })
		.from(swapMessages)
		.leftJoin(users, eq(users.id, swapMessages.senderId))
		.where(and(eq(swapMessages.threadId, threadId), gt(swapMessages.id, afterId)))
		.orderBy(asc(swapMessages.id))
		.limit(1000);
	return rows.map((r) => ({ ...r.message, senderName: r.senderName }));
}

async function writeBlockFor(viewerId: string, otherId: string, tx: DbOrTx): Promise<string | null> {
	try {
		await blocks.assertMayWrite(viewerId, otherId, tx);
		return null;
	} catch (error) {
		if (error instanceof SwapError) return error.message;
		throw error;
	}
}

/** A conversation with its messages, or null when it does not exist or the viewer may not read it. */
export async function get(viewer: Viewer | null, id: number, options: Options = {}): Promise<ThreadView | null> {
	const tx = options.database ?? appDb;
	const now = options.now ?? new Date();
	const thread = await threadRow(id, tx);
	const role = await roleIn(viewer, thread, tx);
	if (!thread || !role || !viewer) return null;
	const [listing] = await tx.select().from(listings).where(eq(listings.id, thread.listingId));
	if (!listing) return null;
	const pure = toPure(listing);
	const [names, rows, restrictions] = await Promise.all([
		tx
			.select({ id: users.id, displayName: users.displayName })
			.from(users)
			.where(inArray(users.id, [thread.ownerId, thread.requesterId])),
		messageRows(thread.id, tx),
		restricted.assessOne(listing.speciesId, tx)
	]);
	const name = (uid: string) => displayName(names.find((n) => n.id === uid));
	const status = conversationStatus(pure, String(thread.id), now);
	const otherId = role === 'owner' ? thread.requesterId : role === 'requester' ? thread.ownerId : null;
	const writeBlock =
		role === 'admin'
			? 'Admins read a reported conversation; they do not write in it.'
			: !canWrite(status)
				? 'This conversation is closed.'
				: await writeBlockFor(viewer.id, otherId!, tx);
	const messages = toViews(rows);
	const agreed = [...messages].reverse().find((m) => m.kind === 'proposal' && m.proposalState === 'confirmed');
	const open = messages.find((m) => m.kind === 'proposal' && m.proposalState === 'open');
	return {
		id: thread.id,
		listingId: listing.id,
		listing: {
			title: listing.title,
			kind: listing.kind,
			category: listing.category,
			state: effectiveState(pure, now),
			ownerId: listing.ownerId,
			speciesName: listing.speciesName,
			ownerConfirmedAt: String(listing.reservedThreadId) === String(thread.id) ? listing.ownerConfirmedAt : null,
			requesterConfirmedAt: String(listing.reservedThreadId) === String(thread.id) ? listing.requesterConfirmedAt : null
		},
		ownerId: thread.ownerId,
		ownerName: name(thread.ownerId),
		requesterId: thread.requesterId,
		requesterName: name(thread.requesterId),
		role,
		otherId,
		otherName: otherId ? name(otherId) : null,
		status,
		canWrite: writeBlock === null,
		canArrangePickup: writeBlock === null && canArrangePickup(status),
		writeBlock,
		agreedPickup: agreed?.pickup ? { ...agreed.pickup, messageId: agreed.id } : null,
		openProposal: open?.pickup ? { ...open.pickup, messageId: open.id, fromViewer: open.senderId === viewer.id } : null,
		messages,
		restrictions,
		cautions: CATEGORY_CAUTIONS[listing.category],
		version: versionOf(listing),
		pure
	};
}

/** Changes whenever anything that moves the conversation page's buttons changes. */
const versionOf = (l: typeof listings.$inferSelect) =>
	`${l.state}:${l.reservedThreadId ?? ''}:${l.ownerConfirmedAt?.getTime() ?? ''}:${l.requesterConfirmedAt?.getTime() ?? ''}:${l.availableUntil.getTime()}`;

/** Messages after `afterId` for the poller, marking those to the viewer read. Null when not visible. */
export async function poll(viewer: Viewer | null, id: number, afterId: number, options: Options = {}) {
	const tx = options.database ?? appDb;
	const now = options.now ?? new Date();
	const thread = await threadRow(id, tx);
	const role = await roleIn(viewer, thread, tx);
	if (!thread || !role || !viewer) return null;
	const [listing] = await tx.select().from(listings).where(eq(listings.id, thread.listingId));
	if (!listing) return null;
	const rows = await messageRows(id, tx, afterId);
	if (role !== 'admin') await markRead(viewer, id, now, tx);
	const pure = toPure(listing);
	return {
		messages: toViews(rows),
		status: conversationStatus(pure, String(id), now),
		listingState: effectiveState(pure, now),
		version: versionOf(listing)
	};
}

/** Marks every message to the viewer in this thread as read. */
export async function markRead(viewer: Pick<Viewer, 'id'>, threadId: number, now: Date = new Date(), tx: DbOrTx = appDb): Promise<number> {
	const [result] = await tx
		.update(swapMessages)
		.set({ readAt: now })
		.where(and(eq(swapMessages.threadId, threadId), eq(swapMessages.recipientId, viewer.id), isNull(swapMessages.readAt)));
	return result.affectedRows;
}

/** Unread messages to a member, for the header: one COUNT on the (recipient, read) index. */
export async function unreadCount(userId: string, database: DbOrTx = appDb): Promise<number> {
	const [row] = await database
		.select({ n: count() })
		.from(swapMessages)
		.where(and(eq(swapMessages.recipientId, userId), isNull(swapMessages.readAt)));
	return row?.n ?? 0;
}

function cleanBody(body: string): string {
	const text = body.replace(/\r\n?/g, '\n').trim();
	if (text.length === 0) throw new SwapError(400, 'empty', 'Write a message first.', 'body');
	if (text.length > MESSAGE_MAX) throw new SwapError(400, 'too-long', `Keep a message to ${MESSAGE_MAX} characters.`, 'body');
	return text;
}

async function insertMessage(
	tx: DbOrTx,
	thread: ThreadRow,
	values: { senderId: string; recipientId: string; kind: MessageKind; body: string; pickup?: PickupProposal; refersTo?: number },
	now: Date
): Promise<number> {
	const [result] = await tx.insert(swapMessages).values({
		threadId: thread.id,
		senderId: values.senderId,
		recipientId: values.recipientId,
		kind: values.kind,
		body: values.body,
		pickupOn: values.pickup?.on ?? null,
		pickupFrom: values.pickup?.from ?? null,
		pickupTo: values.pickup?.to ?? null,
		pickupPlace: values.pickup?.place.trim() ?? null,
		refersTo: values.refersTo ?? null,
		createdAt: now
	});
	await tx.update(swapThreads).set({ lastMessageAt: now }).where(eq(swapThreads.id, thread.id));
	await afterPost(tx, thread, { id: result.insertId, senderId: values.senderId, recipientId: values.recipientId, body: values.body }, now);
	return result.insertId;
}

/**
 * Asks for an offer (or answers a wanted post) with a first message; this opens the conversation.
 * Asking again writes into the same conversation. Returns the thread id.
 */
export async function request(viewer: Viewer, listingId: number, body: string, options: Options = {}): Promise<number> {
	const now = options.now ?? new Date();
	const text = cleanBody(body);
	return (options.database ?? appDb).transaction(async (tx) => {
		const [listing] = await tx.select().from(listings).where(eq(listings.id, listingId)).for('update');
		if (!listing || !canView(viewer, listing)) throw notFound();
		if (listing.ownerId === viewer.id) throw new SwapError(400, 'own', 'This is your own listing.');
		await blocks.assertMayWrite(viewer.id, listing.ownerId, tx);
		const assessment = await restricted.assessOne(listing.speciesId, tx);
		if (assessment.banned.length) throw new SwapError(409, 'banned', assessment.banned.map(refusalMessage).join(' '));
		const [existing] = await tx
			.select()
			.from(swapThreads)
			.where(and(eq(swapThreads.listingId, listingId), eq(swapThreads.requesterId, viewer.id)))
			.for('update');
		const pure = toPure(listing);
		if (existing) {
			if (!canWrite(conversationStatus(pure, String(existing.id), now))) throw new SwapError(409, 'closed', 'This listing is not taking requests now.');
			await insertMessage(tx, existing, { senderId: viewer.id, recipientId: listing.ownerId, kind: 'text', body: text }, now);
			return existing.id;
		}
		if (effectiveState(pure, now) !== 'open') throw new SwapError(409, 'closed', 'This listing is not taking requests now.');
		const [result] = await tx.insert(swapThreads).values({ listingId, ownerId: listing.ownerId, requesterId: viewer.id, createdAt: now, lastMessageAt: now });
		const [thread] = await tx.select().from(swapThreads).where(eq(swapThreads.id, result.insertId)).for('update');
		await insertMessage(tx, thread!, { senderId: viewer.id, recipientId: listing.ownerId, kind: 'text', body: text }, now);
		return thread!.id;
	});
}

/** Locks the thread and its listing for a member's write, checking that writing is allowed. */
async function forWriting(tx: DbOrTx, viewer: Viewer, threadId: number, now: Date) {
	const thread = await threadRow(threadId, tx, true);
	if (!thread || (viewer.id !== thread.ownerId && viewer.id !== thread.requesterId)) throw notFound('conversation');
	const [listing] = await tx.select().from(listings).where(eq(listings.id, thread.listingId)).for('update');
	if (!listing) throw notFound('conversation');
	const otherId = viewer.id === thread.ownerId ? thread.requesterId : thread.ownerId;
	await blocks.assertMayWrite(viewer.id, otherId, tx);
	const status = conversationStatus(toPure(listing), String(thread.id), now);
	if (!canWrite(status)) throw new SwapError(409, 'closed', 'This conversation is closed.');
	return { thread, listing, otherId, status };
}

export async function post(viewer: Viewer, threadId: number, body: string, options: Options = {}): Promise<number> {
	const now = options.now ?? new Date();
	const text = cleanBody(body);
	return (options.database ?? appDb).transaction(async (tx) => {
		const { thread, otherId } = await forWriting(tx, viewer, threadId, now);
		return insertMessage(tx, thread, { senderId: viewer.id, recipientId: otherId, kind: 'text', body: text }, now);
	});
}

export class PickupInvalid extends Error {
	constructor(readonly errors: Partial<Record<keyof PickupProposal, string>>) {
		super('Check the pickup proposal.');
	}
}

/** Proposes (or counter-proposes) a pickup day, time window and meeting point. */
export async function propose(viewer: Viewer, threadId: number, pickup: PickupProposal, note: string, options: Options = {}): Promise<number> {
	const now = options.now ?? new Date();
	const errors = checkPickup(pickup, now);
	if (Object.keys(errors).length) throw new PickupInvalid(errors);
	const extra = note.trim().slice(0, 500);
	return (options.database ?? appDb).transaction(async (tx) => {
		const { thread, otherId, status } = await forWriting(tx, viewer, threadId, now);
		if (!canArrangePickup(status)) throw new SwapError(409, 'not-reserved', 'A pickup is arranged once the request has been accepted.');
		return insertMessage(tx, thread, { senderId: viewer.id, recipientId: otherId, kind: 'proposal', body: extra, pickup }, now);
	});
}

/** The other member confirms the latest proposal. */
export async function confirmPickup(viewer: Viewer, threadId: number, proposalId: number, options: Options = {}): Promise<number> {
	const now = options.now ?? new Date();
	return (options.database ?? appDb).transaction(async (tx) => {
		const { thread, otherId, status } = await forWriting(tx, viewer, threadId, now);
		if (!canArrangePickup(status)) throw new SwapError(409, 'not-reserved', 'A pickup is arranged once the request has been accepted.');
		const [latest] = await tx
			.select()
			.from(swapMessages)
			.where(and(eq(swapMessages.threadId, thread.id), eq(swapMessages.kind, 'proposal')))
			.orderBy(desc(swapMessages.id))
			.limit(1);
		if (!latest || latest.id !== proposalId) throw new SwapError(409, 'stale', 'That proposal has been replaced by a newer one.');
		if (latest.senderId === viewer.id) throw new SwapError(409, 'own-proposal', 'The other member confirms your proposal.');
		const [already] = await tx
			.select({ id: swapMessages.id })
			.from(swapMessages)
			.where(and(eq(swapMessages.threadId, thread.id), eq(swapMessages.kind, 'confirm'), eq(swapMessages.refersTo, latest.id)));
		if (already) throw new SwapError(409, 'confirmed', 'This pickup is already agreed.');
		const pickup = { on: latest.pickupOn ?? '', from: latest.pickupFrom ?? '', to: latest.pickupTo ?? '', place: latest.pickupPlace ?? '' };
		return insertMessage(tx, thread, { senderId: viewer.id, recipientId: otherId, kind: 'confirm', body: '', pickup, refersTo: latest.id }, now);
	});
}

export interface ThreadSummary {
	id: number;
	listingId: number;
	title: string;
	listingState: ListingState;
	status: ConversationStatus;
	otherId: string;
	otherName: string;
	lastMessageAt: Date;
	unread: number;
}

/** Conversations the viewer started (their requests and answers), newest activity first. */
export async function listRequests(viewer: Viewer, options: Options = {}): Promise<ThreadSummary[]> {
	return summaries(viewer, eq(swapThreads.requesterId, viewer.id), options);
}

/** Conversations about one of the viewer's listings. */
export async function listForListing(viewer: Viewer, listingId: number, options: Options = {}): Promise<ThreadSummary[]> {
	return summaries(viewer, and(eq(swapThreads.listingId, listingId), eq(swapThreads.ownerId, viewer.id))!, options);
}

async function summaries(viewer: Viewer, where: SQL, options: Options): Promise<ThreadSummary[]> {
	const tx = options.database ?? appDb;
	const now = options.now ?? new Date();
	const rows = await tx
		.select({ thread: swapThreads, listing: listings })
		.from(swapThreads)
		.innerJoin(listings, eq(listings.id, swapThreads.listingId))
		.where(where)
		.orderBy(desc(swapThreads.lastMessageAt))
		.limit(200);
	if (rows.length === 0) return [];
	const ids = rows.map((r) => r.thread.id);
	const otherIds = [...new Set(rows.map((r) => (r.thread.ownerId === viewer.id ? r.thread.requesterId : r.thread.ownerId)))];
	const [names, unread] = await Promise.all([
		tx.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, otherIds)),
		tx
			.select({ threadId: swapMessages.threadId, n: count() })
			.from(swapMessages)
			.where(and(inArray(swapMessages.threadId, ids), eq(swapMessages.recipientId, viewer.id), isNull(swapMessages.readAt)))
			.groupBy(swapMessages.threadId)
	]);
	const unreadBy = new Map(unread.map((u) => [u.threadId, u.n]));
	return rows.map(({ thread, listing }) => {
		const otherId = thread.ownerId === viewer.id ? thread.requesterId : thread.ownerId;
		const pure = toPure(listing);
		return {
			id: thread.id,
			listingId: listing.id,
			title: listing.title,
			listingState: effectiveState(pure, now),
			status: conversationStatus(pure, String(thread.id), now),
			otherId,
			otherName: displayName(names.find((n) => n.id === otherId)),
			lastMessageAt: thread.lastMessageAt,
			unread: unreadBy.get(thread.id) ?? 0
		};
	});
}

/** The viewer's own conversation about a listing, if they have one. */
export async function ownThreadFor(viewer: Pick<Viewer, 'id'>, listingId: number, database: DbOrTx = appDb): Promise<number | null> {
	const [row] = await database
		.select({ id: swapThreads.id })
		.from(swapThreads)
		.where(and(eq(swapThreads.listingId, listingId), eq(swapThreads.requesterId, viewer.id)));
	return row?.id ?? null;
}
