// The periodic job `expire-swap-listings`: records the expiry of open listings whose date has
// passed. Reads never wait for it (they go through effectiveState); it makes the history true.
import { and, eq, lte } from 'drizzle-orm';
import { resolve, within, type Context } from '../context';
import { transition } from '../../swaps/listing-state';
import { listings } from './schema';
import { lockedRowOf, saveTransition, toPure } from './listings';

/** Records due expiries, up to 500 a run, each in its own transaction. Returns how many. */
export async function expireDue(context: Context = {}): Promise<number> {
	const { db, now } = resolve(context);
	const due = await db
		.select({ id: listings.id })
		.from(listings)
		.where(and(eq(listings.state, 'open'), lte(listings.availableUntil, now)))
		.limit(500);
	let expired = 0;
	for (const { id } of due) {
		await db.transaction(async (tx) => {
			const inTx = within({ ...context, now }, tx);
			const row = await lockedRowOf(id, inTx);
			if (!row) return;
			const result = transition(toPure(row), { type: 'expire' }, { kind: 'system' }, now);
			// Extended or reserved meanwhile: nothing to record.
			if (!result.ok) return;
			await saveTransition(result, '', inTx);
			expired++;
		});
	}
	return expired;
}
