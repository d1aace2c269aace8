// Members report a listing or a message to the admins. While a report about a message is open,
// admins may read that conversation (read only). An admin resolves a report, dismisses it, or
// withdraws the listing with a reason; each is recorded in the audit log.
import { and, asc, count, desc, eq, inArray } from 'drizzle-orm';
import { db as appDb, type DbOrTx } from '../db';
import { users } from '../club/schema';
import { auditLog } from '../audit/schema';
import type { Viewer } from '../club/users';
import { listings, swapMessages, swapReports, swapThreads, type ReportRow } from './schema';
import * as listingsDomain from './listings';
import { notFound, SwapError } from './errors';

export const REASON_MAX = 1000;
export const REPORTS_PAGE_SIZE = 20;

function cleanReason(reason: string): string {
	const text = reason.trim();
	if (text.length < 5) throw new SwapError(400, 'reason', 'Say in a few words what is wrong, so the admins can act on it.', 'reason');
	if (text.length > REASON_MAX) throw new SwapError(400, 'reason', `Keep it to ${REASON_MAX} characters.`, 'reason');
	return text;
}

const excerptOf = (text: string) => (text.length > 2000 ? text.slice(0, 1999) + '…' : text);

export async function reportListing(viewer: Viewer, listingId: number, reason: string, database: DbOrTx = appDb): Promise<number> {
	const text = cleanReason(reason);
	const [listing] = await database.select().from(listings).where(eq(listings.id, listingId));
	if (!listing || !listingsDomain.canView(viewer, listing)) throw notFound();
	if (listing.ownerId === viewer.id) throw new SwapError(400, 'own', 'You cannot report your own listing; withdraw it instead.');
	const excerpt = excerptOf([listing.title, listing.speciesName, listing.conditionNote, listing.description ?? ''].filter(Boolean).join('\n\n'));
	const [result] = await database.insert(swapReports).values({ reporterId: viewer.id, listingId, reason: text, excerpt });
	return result.insertId;
}

/** Only a member of the conversation may report one of its messages, and not their own. */
export async function reportMessage(viewer: Viewer, messageId: number, reason: string, database: DbOrTx = appDb): Promise<number> {
	const text = cleanReason(reason);
	const [row] = await database
		.select({ message: swapMessages, thread: swapThreads })
		.from(swapMessages)
		.innerJoin(swapThreads, eq(swapThreads.id, swapMessages.threadId))
		.where(eq(swapMessages.id, messageId));
	if (!row || (viewer.id !== row.thread.ownerId && viewer.id !== row.thread.requesterId)) throw notFound('message');
	if (row.message.senderId === viewer.id) throw new SwapError(400, 'own', 'You cannot report your own message.');
	const [result] = await database.insert(swapReports).values({
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
	database: DbOrTx = appDb
): Promise<{ rows: ReportView[]; total: number; pages: number }> {
	if (admin.role !== 'admin') throw notFound('report');
	const where = state === 'open' ? eq(swapReports.state, 'open') : inArray(swapReports.state, ['resolved', 'dismissed']);
	const [{ total }] = (await database.select({ total: count() }).from(swapReports).where(where)) as [{ total: number }];
	const rows = await database
		.select({ report: swapReports, listingTitle: listings.title, listingState: listings.state, listingOwnerId: listings.ownerId })
		.from(swapReports)
		.innerJoin(listings, eq(listings.id, swapReports.listingId))
		.where(where)
		.orderBy(state === 'open' ? asc(swapReports.createdAt) : desc(swapReports.resolvedAt), asc(swapReports.id))
		.limit(REPORTS_PAGE_SIZE)
		.offset((page - 1) * REPORTS_PAGE_SIZE);
	const ids = [...new Set(rows.flatMap((r) => [r.report.reporterId, r.listingOwnerId, ...(r.report.resolvedById ? [r.report.resolvedById] : [])]))];
	const names = new Map(
		ids.length
			? (await database.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, ids))).map((u) => [
					u.id,
					u.displayName ?? 'A member'
				])
			: []
	);
	return {
		rows: rows.map((r) => ({
			...r.report,
			reporterName: names.get(r.report.reporterId) ?? 'A member',
			listingTitle: r.listingTitle,
			listingState: r.listingState,
			listingOwnerId: r.listingOwnerId,
			listingOwnerName: names.get(r.listingOwnerId) ?? 'A member',
			resolvedByName: r.report.resolvedById ? (names.get(r.report.resolvedById) ?? 'An admin') : null
		})),
		total,
		pages: Math.max(1, Math.ceil(total / REPORTS_PAGE_SIZE))
	};
}

async function openReport(tx: DbOrTx, id: number): Promise<ReportRow> {
	const [row] = await tx.select().from(swapReports).where(eq(swapReports.id, id)).for('update');
	if (!row) throw notFound('report');
	if (row.state !== 'open') throw new SwapError(409, 'closed', 'This report has already been dealt with.');
	return row;
}

async function close(tx: DbOrTx, admin: Viewer, report: ReportRow, state: 'resolved' | 'dismissed', resolution: string, action: string, now: Date) {
	await tx
		.update(swapReports)
		.set({ state, resolvedById: admin.id, resolvedAt: now, resolution: resolution.trim().slice(0, 500) })
		.where(eq(swapReports.id, report.id));
	await tx
		.insert(auditLog)
		.values({ actorId: admin.id, action, subjectType: 'swap_report', subjectId: String(report.id), detail: { listingId: report.listingId, resolution } });
}

export type Decision = { kind: 'resolve'; note: string } | { kind: 'dismiss'; note: string } | { kind: 'withdraw'; reason: string };

/**
 * Deals with a report: resolved (something was done, e.g. the members were spoken to), dismissed
 * (nothing needed doing), or the listing withdrawn with a reason (every open report about the same
 * listing is resolved with it).
 */
export async function decide(admin: Viewer, id: number, decision: Decision, options: { now?: Date; database?: DbOrTx } = {}): Promise<void> {
	if (admin.role !== 'admin') throw notFound('report');
	const now = options.now ?? new Date();
	await (options.database ?? appDb).transaction(async (tx) => {
		const report = await openReport(tx, id);
		if (decision.kind === 'withdraw') {
			const reason = decision.reason.trim();
			if (reason.length < 5) throw new SwapError(400, 'reason', 'Give the owner a reason (at least a few words).', 'reason');
			await listingsDomain.moderatorWithdraw(admin, report.listingId, reason.slice(0, 300), tx, now);
			const others = await tx
				.select()
				.from(swapReports)
				.where(and(eq(swapReports.listingId, report.listingId), eq(swapReports.state, 'open')))
				.for('update');
			for (const r of others) await close(tx, admin, r, 'resolved', `Listing withdrawn: ${reason}`, 'report.withdraw-listing', now);
		} else {
			await close(
				tx,
				admin,
				report,
				decision.kind === 'resolve' ? 'resolved' : 'dismissed',
				decision.note,
				decision.kind === 'resolve' ? 'report.resolve' : 'report.dismiss',
				now
			);
		}
	});
}

export async function openCount(database: DbOrTx = appDb): Promise<number> {
	const [row] = await database.select({ n: count() }).from(swapReports).where(eq(swapReports.state, 'open'));
	return row?.n ?? 0;
}
