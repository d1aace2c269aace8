// Members report a listing or a message to the admins. While a report about a message is open,
// admins may read that conversation (read only). An admin resolves a report, dismisses it, or
// withdraws the listing with a reason; each is recorded in the audit log.
import { and, asc, count, desc, eq, inArray } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import { nameOf } from '../../club/names';
import { conflict, invalid, notFound } from '../../errors';
import { listings, swapMessages, swapReports, swapThreads, type ReportRow } from './schema';
import { canView } from './listings';
import * as moderation from './moderation';

const REASON_MAX = 1000;
const REPORTS_PAGE_SIZE = 20;
const REPORT_NOT_FOUND = 'We could not find that report.';

function cleanReason(reason: string): string {
	const text = reason.trim();
	if (text.length < 5) throw invalid({ reason: 'Say in a few words what is wrong, so the admins can act on it.' }, undefined, 'reason');
	if (text.length > REASON_MAX) throw invalid({ reason: `Keep it to ${REASON_MAX} characters.` }, undefined, 'reason');
	return text;
}

const excerptOf = (text: string) => (text.length > 2000 ? text.slice(0, 1999) + '…' : text);

export async function reportListing(viewer: Viewer, listingId: number, reason: string, context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const text = cleanReason(reason);
	const [listing] = await db.select().from(listings).where(eq(listings.id, listingId));
	if (!listing || !canView(viewer, listing)) throw notFound('We could not find that listing.');
	if (listing.ownerId === viewer.id) throw invalid({}, 'You cannot report your own listing; withdraw it instead.', 'own');
	const excerpt = excerptOf([listing.title, listing.speciesName, listing.conditionNote, listing.description ?? ''].filter(Boolean).join('\n\n'));
	const [result] = await db.insert(swapReports).values({ reporterId: viewer.id, listingId, reason: text, excerpt });
	return result.insertId;
}

/** Only a member of the conversation may report one of its messages, and not their own. */
export async function reportMessage(viewer: Viewer, messageId: number, reason: string, context: Context = {}): Promise<number> {
	const { db } = resolve(context);
	const text = cleanReason(reason);
	const [row] = await db
		.select({ message: swapMessages, thread: swapThreads })
		.from(swapMessages)
		.innerJoin(swapThreads, eq(swapThreads.id, swapMessages.threadId))
		.where(eq(swapMessages.id, messageId));
	if (!row || (viewer.id !== row.thread.ownerId && viewer.id !== row.thread.requesterId)) throw notFound('We could not find that message.');
	if (row.message.senderId === viewer.id) throw invalid({}, 'You cannot report your own message.', 'own');
	const [result] = await db.insert(swapReports).values({
		reporterId: viewer.id,
		listingId: row.thread.listingId,
		messageId,
		threadId: row.thread.id,
		reason: text,
		excerpt: excerptOf(row.message.body || '(a pickup proposal)')
	});
	return result.insertId;
}

export interface ReportView extends ReportRow {
	reporterName: string;
	listingTitle: string;
	listingState: string;
	listingOwnerId: string;
	listingOwnerName: string;
	resolvedByName: string | null;
}

/** Reports in one state, oldest open first (newest first for closed ones), paged. */
export async function list(
	admin: Viewer,
	state: 'open' | 'closed',
	page = 1,
	context: Context = {}
): Promise<{ rows: ReportView[]; total: number; pages: number }> {
	if (admin.role !== 'admin') throw notFound(REPORT_NOT_FOUND);
	const { db } = resolve(context);
	const where = state === 'open' ? eq(swapReports.state, 'open') : inArray(swapReports.state, ['resolved', 'dismissed']);
	const [{ total }] = (await db.select({ total: count() }).from(swapReports).where(where)) as [{ total: number }];
	const rows = await db
		.select({ report: swapReports, listingTitle: listings.title, listingState: listings.state, listingOwnerId: listings.ownerId })
		.from(swapReports)
		.innerJoin(listings, eq(listings.id, swapReports.listingId))
		.where(where)
		.orderBy(state === 'open' ? asc(swapReports.createdAt) : desc(swapReports.resolvedAt), asc(swapReports.id))
		.limit(REPORTS_PAGE_SIZE)
		.offset((page - 1) * REPORTS_PAGE_SIZE);
	const names = await directory.names(
		rows.flatMap((r) => [r.report.reporterId, r.listingOwnerId, ...(r.report.resolvedById ? [r.report.resolvedById] : [])]),
		{ db }
	);
	return {
		rows: rows.map((r) => ({
			...r.report,
			reporterName: nameOf(names.get(r.report.reporterId)),
			listingTitle: r.listingTitle,
			listingState: r.listingState,
			listingOwnerId: r.listingOwnerId,
			listingOwnerName: nameOf(names.get(r.listingOwnerId)),
			resolvedByName: r.report.resolvedById ? (names.get(r.report.resolvedById) ?? 'An admin') : null
		})),
		total,
		pages: Math.max(1, Math.ceil(total / REPORTS_PAGE_SIZE))
	};
}

/** How many reports wait for an admin, for the reports page's tabs. */
export async function openCount(admin: Viewer, context: Context = {}): Promise<number> {
	if (admin.role !== 'admin') throw notFound(REPORT_NOT_FOUND);
	const { db } = resolve(context);
	const [row] = await db.select({ n: count() }).from(swapReports).where(eq(swapReports.state, 'open'));
	return row?.n ?? 0;
}

async function openReport(id: number, context: Context): Promise<ReportRow> {
	const { db } = resolve(context);
	const [row] = await db.select().from(swapReports).where(eq(swapReports.id, id)).for('update');
	if (!row) throw notFound(REPORT_NOT_FOUND);
	if (row.state !== 'open') throw conflict('closed', 'This report has already been dealt with.');
	return row;
}

async function close(admin: Viewer, report: ReportRow, state: 'resolved' | 'dismissed', resolution: string, action: string, context: Context) {
	const { db, now } = resolve(context);
	await db
		.update(swapReports)
		.set({ state, resolvedById: admin.id, resolvedAt: now, resolution: resolution.trim().slice(0, 500) })
		.where(eq(swapReports.id, report.id));
	await audit.record(
		{ actorId: admin.id, action, subject: { type: 'swap_report', id: report.id }, detail: { listingId: report.listingId, resolution } },
		{ db }
	);
}

export type Decision = { kind: 'resolve'; note: string } | { kind: 'dismiss'; note: string } | { kind: 'withdraw'; reason: string };

/**
 * Deals with a report: resolved (something was done, e.g. the members were spoken to), dismissed
 * (nothing needed doing), or the listing withdrawn with a reason (every open report about the same
 * listing is resolved with it).
 */
export async function decide(admin: Viewer, id: number, decision: Decision, context: Context = {}): Promise<void> {
	if (admin.role !== 'admin') throw notFound(REPORT_NOT_FOUND);
	const { db, now } = resolve(context);
	await db.transaction(async (tx) => {
		const inTx = within({ ...context, now }, tx);
		const report = await openReport(id, inTx);
		if (decision.kind === 'withdraw') {
			const reason = decision.reason.trim();
			if (reason.length < 5) throw invalid({ reason: 'Give the owner a reason (at least a few words).' }, undefined, 'reason');
			await moderation.withdraw(admin, report.listingId, reason.slice(0, 300), inTx);
			const others = await tx
				.select()
				.from(swapReports)
				.where(and(eq(swapReports.listingId, report.listingId), eq(swapReports.state, 'open')))
				.for('update');
			for (const r of others) await close(admin, r, 'resolved', `Listing withdrawn: ${reason}`, 'report.withdraw-listing', inTx);
		} else {
			const resolved = decision.kind === 'resolve';
			await close(admin, report, resolved ? 'resolved' : 'dismissed', decision.note, resolved ? 'report.resolve' : 'report.dismiss', inTx);
		}
	});
}
