// Conversations about a listing: a request (or an answer to a wanted post) opens one between the
// listing's owner and the other member. Only those two may read it, and an admin while a report
// about one of its messages is open; to everyone else it does not exist (404).
import { and, asc, count, desc, eq, gt, inArray, isNull, type SQL, countDistinct } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import { nameOf } from '../../club/names';
import { conflict, DomainError, invalid, notFound } from '../../errors';
import { effectiveState, type Listing, type ListingState } from '../../swaps/listing-state';
import { canArrangePickup, canWrite, conversationStatus, SITE_SENDER, type ConversationStatus } from '../../swaps/conversation';
import { checkPickup, type PickupProposal } from '../../swaps/pickup';
import { refusalMessage, type Assessment } from '../../swaps/restrictions';
import { CATEGORY_CAUTIONS, type ListingCategory, type ListingKind } from '../../swaps/listing';
import { listings, swapMessages, swapReports, swapThreads, type MessageKind, type MessageRow, type ThreadRow } from './schema';
import { canView, toPure } from './listings';
import * as blocks from './blocks';
import * as restricted from './restricted';
import { afterPost } from './notifications';

const MESSAGE_MAX = 2000;
const NOT_FOUND = 'We could not find that conversation.';
const CLOSED = 'This listing is not taking requests now.';
const NOT_RESERVED = 'A pickup is arranged once the request has been accepted.';

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

async function threadRow(id: number, context: Context, lock = false): Promise<ThreadRow | undefined> {
	const { db } = resolve(context);
	const query = db.select().from(swapThreads).where(eq(swapThreads.id, id));
	const [row] = lock ? await query.for('update') : await query;
	return row;
}

/** Whether an admin may read this thread: an open report about one of its messages. */
async function reportedOpen(threadId: number, context: Context): Promise<boolean> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ n: count() })
		.from(swapReports)
		.where(and(eq(swapReports.threadId, threadId), eq(swapReports.state, 'open')));
	return (row?.n ?? 0) > 0;
}

/** The viewer's part in a thread, or null when it does not exist for them. */
async function roleIn(viewer: Viewer | null, thread: ThreadRow | undefined, context: Context): Promise<ThreadView['role'] | null> {
	if (!viewer || !thread) return null;
	if (viewer.id === thread.ownerId) return 'owner';
	if (viewer.id === thread.requesterId) return 'requester';
	if (viewer.role === 'admin' && (await reportedOpen(thread.id, context))) return 'admin';
	return null;
}

/** The messages as the page shows them; `names` holds the two members' names. */
function toViews(rows: MessageRow[], names: Map<string, string>): MessageView[] {
	const confirmed = new Set(rows.filter((r) => r.kind === 'confirm' && r.refersTo !== null).map((r) => r.refersTo!));
	const lastProposal = rows.filter((r) => r.kind === 'proposal').at(-1)?.id ?? null;
	return rows.map((r) => ({
		id: r.id,
		kind: r.kind,
		senderId: r.senderId,
		senderName: r.senderId ? nameOf(names.get(r.senderId)) : SITE_SENDER,
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

async function messageRows(threadId: number, context: Context, afterId = 0): Promise<MessageRow[]> {
	const { db } = resolve(context);
	return db
		.select()
		.from(swapMessages)
		.where(and(eq(swapMessages.threadId, threadId), gt(swapMessages.id, afterId)))
		.orderBy(asc(swapMessages.id))
		.limit(1000);
}

/** The two members' names, by id. */
const namesOf = (thread: ThreadRow, context: Context) => directory.names([thread.ownerId, thread.requesterId], context);

/** The thread and its listing when the viewer may read it, with their part in it. */
async function readable(viewer: Viewer | null, id: number, context: Context) {
	const { db } = resolve(context);
	const thread = await threadRow(id, context);
	const role = await roleIn(viewer, thread, context);
	if (!thread || !role || !viewer) return null;
	const [listing] = await db.select().from(listings).where(eq(listings.id, thread.listingId));
	return listing ? { viewer, thread, role, listing } : null;
}

/** A conversation with its messages, or null when it does not exist or the viewer may not read it. */
export async function get(viewer: Viewer | null, id: number, context: Context = {}): Promise<ThreadView | null> {
	const { db, now } = resolve(context);
	const found = await readable(viewer, id, { db });
	if (!found) return null;
	const { thread, role, listing } = found;
	const pure = toPure(listing);
	const [names, rows, restrictions] = await Promise.all([
		namesOf(thread, { db }),
		messageRows(thread.id, { db }),
		restricted.assessOne(listing.speciesId, { db })
	]);
	const name = (uid: string) => nameOf(names.get(uid));
	const status = conversationStatus(pure, String(thread.id), now);
	const otherId = role === 'owner' ? thread.requesterId : role === 'requester' ? thread.ownerId : null;
	const writeBlock =
		role === 'admin'
			? 'Admins read a reported conversation; they do not write in it.'
			: !canWrite(status)
				? 'This conversation is closed.'
				: await blocks.writeBlock(found.viewer.id, otherId!, { db });
	const messages = toViews(rows, names);
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
		openProposal: open?.pickup ? { ...open.pickup, messageId: open.id, fromViewer: open.senderId === found.viewer.id } : null,
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
export async function poll(viewer: Viewer | null, id: number, afterId: number, context: Context = {}) {
	const { db, now } = resolve(context);
	const found = await readable(viewer, id, { db });
	if (!found) return null;
	const { thread, role, listing } = found;
	const [rows, names] = await Promise.all([messageRows(id, { db }, afterId), namesOf(thread, { db })]);
	if (role !== 'admin' && hasUnread(rows, found.viewer.id)) await markRead(found.viewer, id, { db, now });
	const pure = toPure(listing);
	return {
		messages: toViews(rows, names),
		status: conversationStatus(pure, String(id), now),
		listingState: effectiveState(pure, now),
		version: versionOf(listing)
	};
}

/** Whether any of these messages is to the member and not read yet (reading a conversation writes only then). */
export const hasUnread = (messages: Pick<MessageRow, 'recipientId' | 'readAt'>[], viewerId: string) =>
	messages.some((m) => m.recipientId === viewerId && m.readAt === null);

/** Marks every message to the viewer in this thread as read. */
export async function markRead(viewer: Pick<Viewer, 'id'>, threadId: number, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const [result] = await db
		.update(swapMessages)
		.set({ readAt: now })
		.where(and(eq(swapMessages.threadId, threadId), eq(swapMessages.recipientId, viewer.id), isNull(swapMessages.readAt)));
	return result.affectedRows;
}

/** Unread messages to a member, for the header: one COUNT on the (recipient, read) index. */
export async function unreadCount(userId: string, context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ n: count() })
		.from(swapMessages)
		.where(and(eq(swapMessages.recipientId, userId), isNull(swapMessages.readAt)));
	return row?.n ?? 0;
}

/**
 * Conversations on the member's own listings with messages they have not read (new requests and
 * replies), for the dashboard: one COUNT starting from the (recipient, read) index.
 */
export async function unreadOnOwnListings(userId: string, context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ n: countDistinct(swapMessages.threadId) })
		.from(swapMessages)
		.innerJoin(swapThreads, eq(swapThreads.id, swapMessages.threadId))
		.where(and(eq(swapMessages.recipientId, userId), isNull(swapMessages.readAt), eq(swapThreads.ownerId, userId)));
	return row?.n ?? 0;
}

function cleanBody(body: string): string {
	const text = body.replace(/\r\n?/g, '\n').trim();
	if (text.length === 0) throw invalid({ body: 'Write a message first.' }, undefined, 'empty');
	if (text.length > MESSAGE_MAX) throw invalid({ body: `Keep a message to ${MESSAGE_MAX} characters.` }, undefined, 'too-long');
	return text;
}

/** Stores a member's message in the caller's transaction, and mails or schedules it. */
async function insertMessage(
	thread: ThreadRow,
	values: { senderId: string; recipientId: string; kind: MessageKind; body: string; pickup?: PickupProposal; refersTo?: number },
	context: Context
): Promise<number> {
	const { db: tx, now } = resolve(context);
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
	await afterPost(thread, { id: result.insertId, senderId: values.senderId, recipientId: values.recipientId, body: values.body }, { db: tx, now });
	return result.insertId;
}

/**
 * Asks for an offer (or answers a wanted post) with a first message; this opens the conversation.
 * Asking again writes into the same conversation. Returns the thread id.
 */
export async function request(viewer: Viewer, listingId: number, body: string, context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const text = cleanBody(body);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const [listing] = await tx.select().from(listings).where(eq(listings.id, listingId)).for('update');
		if (!listing || !canView(viewer, listing)) throw notFound('We could not find that listing.');
		if (listing.ownerId === viewer.id) throw invalid({}, 'This is your own listing.', 'own');
		await blocks.assertMayWrite(viewer.id, listing.ownerId, inTx);
		const assessment = await restricted.assessOne(listing.speciesId, inTx);
		if (assessment.banned.length) throw new DomainError(409, 'banned', assessment.banned.map(refusalMessage).join(' '));
		const [existing] = await tx
			.select()
			.from(swapThreads)
			.where(and(eq(swapThreads.listingId, listingId), eq(swapThreads.requesterId, viewer.id)))
			.for('update');
		const pure = toPure(listing);
		if (existing) {
			if (!canWrite(conversationStatus(pure, String(existing.id), now))) throw conflict('closed', CLOSED);
			await insertMessage(existing, { senderId: viewer.id, recipientId: listing.ownerId, kind: 'text', body: text }, inTx);
			return existing.id;
		}
		if (effectiveState(pure, now) !== 'open') throw conflict('closed', CLOSED);
		const [result] = await tx.insert(swapThreads).values({ listingId, ownerId: listing.ownerId, requesterId: viewer.id, createdAt: now, lastMessageAt: now });
		const [thread] = await tx.select().from(swapThreads).where(eq(swapThreads.id, result.insertId)).for('update');
		await insertMessage(thread!, { senderId: viewer.id, recipientId: listing.ownerId, kind: 'text', body: text }, inTx);
		return thread!.id;
	});
}

/** Locks the thread and its listing for a member's write, checking that writing is allowed. */
/**
 * Runs `write` in a transaction with the thread and its listing locked, for one of its two members,
 * once it is checked that writing is allowed.
 */
async function whileWriting<T>(
	viewer: Viewer,
	threadId: number,
	context: Context,
	write: (found: { thread: ThreadRow; otherId: string; status: ConversationStatus }, inTx: Context) => Promise<T>
): Promise<T> {
	const { db, now } = resolve(context);
	return db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const thread = await threadRow(threadId, inTx, true);
		if (!thread || (viewer.id !== thread.ownerId && viewer.id !== thread.requesterId)) throw notFound(NOT_FOUND);
		const [listing] = await tx.select().from(listings).where(eq(listings.id, thread.listingId)).for('update');
		if (!listing) throw notFound(NOT_FOUND);
		const otherId = viewer.id === thread.ownerId ? thread.requesterId : thread.ownerId;
		await blocks.assertMayWrite(viewer.id, otherId, inTx);
		const status = conversationStatus(toPure(listing), String(thread.id), now);
		if (!canWrite(status)) throw conflict('closed', 'This conversation is closed.');
		return write({ thread, otherId, status }, inTx);
	});
}

export async function post(viewer: Viewer, threadId: number, body: string, context: Context = {}): Promise<number> {
	const text = cleanBody(body);
	return whileWriting(viewer, threadId, context, ({ thread, otherId }, inTx) =>
		insertMessage(thread, { senderId: viewer.id, recipientId: otherId, kind: 'text', body: text }, inTx)
	);
}

/** Proposes (or counter-proposes) a pickup day, time window and meeting point. */
export async function propose(viewer: Viewer, threadId: number, pickup: PickupProposal, note: string, context: Context = {}): Promise<number> {
	const { now } = resolve(context);
	const errors = checkPickup(pickup, now);
	if (Object.keys(errors).length) throw invalid(errors, undefined, 'pickup');
	const extra = note.trim().slice(0, 500);
	return whileWriting(viewer, threadId, { ...context, now }, ({ thread, otherId, status }, inTx) => {
		if (!canArrangePickup(status)) throw conflict('not-reserved', NOT_RESERVED);
		return insertMessage(thread, { senderId: viewer.id, recipientId: otherId, kind: 'proposal', body: extra, pickup }, inTx);
	});
}

/** The other member confirms the latest proposal. */
export async function confirmPickup(viewer: Viewer, threadId: number, proposalId: number, context: Context = {}): Promise<number> {
	return whileWriting(viewer, threadId, context, async ({ thread, otherId, status }, inTx) => {
		const { db: tx } = resolve(inTx);
		if (!canArrangePickup(status)) throw conflict('not-reserved', NOT_RESERVED);
		const [latest] = await tx
			.select()
			.from(swapMessages)
			.where(and(eq(swapMessages.threadId, thread.id), eq(swapMessages.kind, 'proposal')))
			.orderBy(desc(swapMessages.id))
			.limit(1);
		if (!latest || latest.id !== proposalId) throw conflict('stale', 'That proposal has been replaced by a newer one.');
		if (latest.senderId === viewer.id) throw conflict('own-proposal', 'The other member confirms your proposal.');
		const [already] = await tx
			.select({ id: swapMessages.id })
			.from(swapMessages)
			.where(and(eq(swapMessages.threadId, thread.id), eq(swapMessages.kind, 'confirm'), eq(swapMessages.refersTo, latest.id)));
		if (already) throw conflict('confirmed', 'This pickup is already agreed.');
		const pickup = { on: latest.pickupOn ?? '', from: latest.pickupFrom ?? '', to: latest.pickupTo ?? '', place: latest.pickupPlace ?? '' };
		return insertMessage(thread, { senderId: viewer.id, recipientId: otherId, kind: 'confirm', body: '', pickup, refersTo: latest.id }, inTx);
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
export async function listRequests(viewer: Viewer, context: Context = {}): Promise<ThreadSummary[]> {
	return summaries(viewer, eq(swapThreads.requesterId, viewer.id), context);
}

/** Conversations about one of the viewer's listings. */
export async function listForListing(viewer: Viewer, listingId: number, context: Context = {}): Promise<ThreadSummary[]> {
	return summaries(viewer, and(eq(swapThreads.listingId, listingId), eq(swapThreads.ownerId, viewer.id))!, context);
}

async function summaries(viewer: Viewer, where: SQL, context: Context): Promise<ThreadSummary[]> {
	const { db: tx, now } = resolve(context);
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
		directory.names(otherIds, { db: tx }),
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
			otherName: nameOf(names.get(otherId)),
			lastMessageAt: thread.lastMessageAt,
			unread: unreadBy.get(thread.id) ?? 0
		};
	});
}

/** The viewer's own conversation about a listing, if they have one. */
export async function ownThreadFor(viewer: Pick<Viewer, 'id'>, listingId: number, context: Context = {}): Promise<number | null> {
	const { db } = resolve(context);
	const [row] = await db
		.select({ id: swapThreads.id })
		.from(swapThreads)
		.where(and(eq(swapThreads.listingId, listingId), eq(swapThreads.requesterId, viewer.id)));
	return row?.id ?? null;
}
