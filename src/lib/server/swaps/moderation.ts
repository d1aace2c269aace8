// What the club's admins do to listings: withdraw one after a report, with a reason that goes to
// its owner and into the audit log. Members waiting on it are told.
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as audit from '../audit';
import { conflict, forbidden, notFound } from '../../errors';
import { moderatorWithdraw } from '../../swaps/conversation';
import { lockedRowOf, saveTransition, toPure } from './listings';
import { tell, tellThoseWaiting } from './listing-notices';

const ADMINS = 'The admins';

/** An admin withdraws a listing, with a reason, audited; its owner and anyone waiting are told. Joins the caller's transaction (context.db). */
export async function withdraw(admin: Viewer, id: number, reason: string, context: Context = {}): Promise<void> {
	if (admin.role !== 'admin') throw forbidden('Only the club’s admins withdraw other members’ listings.');
	const { now } = resolve(context);
	const inCall = { ...context, now };
	const row = await lockedRowOf(id, inCall);
	if (!row) throw notFound('We could not find that listing.');
	const before = toPure(row);
	const result = moderatorWithdraw(before, admin.id, now);
	if (!result.ok) throw conflict(result.error.code, result.error.message);
	await saveTransition(result, reason, inCall);
	await audit.record(
		{ actorId: admin.id, action: 'listing.withdraw', subject: { type: 'listing', id }, detail: { reason, from: result.event.from } },
		{ db: inCall.db }
	);
	await tell(row.ownerId, 'withdrawn-by-admin', { threadId: null, listing: row, actorName: ADMINS, reason }, inCall);
	await tellThoseWaiting(
		before,
		row,
		{ senderId: null, text: 'The club’s admins withdrew this listing.', kind: 'withdrawn-by-admin', actorName: ADMINS },
		inCall
	);
}
