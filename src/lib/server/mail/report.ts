import { and, count, desc, eq, like, type SQL } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { outbox, type OutboxState } from './schema';

export { OUTBOX_STATES, type OutboxState } from './schema';

export const OUTBOX_PAGE_SIZE = 25;

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => '\\' + c);

/** The outbox as admins see it: what was queued, for whom, and how delivery went. */
export async function listOutbox(filter: { state?: OutboxState; topic?: string; address?: string; page: number }, context: Context = {}) {
	const { db } = resolve(context);
	const conditions: SQL[] = [];
	if (filter.state) conditions.push(eq(outbox.state, filter.state));
	if (filter.topic) conditions.push(like(outbox.topic, `${escapeLike(filter.topic)}%`));
	if (filter.address) conditions.push(like(outbox.toAddress, `%${escapeLike(filter.address)}%`));
	const where = conditions.length ? and(...conditions) : undefined;
	const [totals] = await db.select({ total: count() }).from(outbox).where(where);
	const total = totals?.total ?? 0;
	const rows = await db
		.select({
			id: outbox.id,
			toAddress: outbox.toAddress,
			subject: outbox.subject,
			topic: outbox.topic,
			state: outbox.state,
			attempts: outbox.attempts,
			lastError: outbox.lastError,
			createdAt: outbox.createdAt,
			sentAt: outbox.sentAt,
			nextAttemptAt: outbox.nextAttemptAt
		})
		.from(outbox)
		.where(where)
		.orderBy(desc(outbox.id))
		.limit(OUTBOX_PAGE_SIZE)
		.offset((filter.page - 1) * OUTBOX_PAGE_SIZE);
	return { rows, total, pages: Math.max(1, Math.ceil(total / OUTBOX_PAGE_SIZE)) };
}

/** Per-recipient delivery state for everything queued under a topic prefix (e.g. "contest:7:"). */
export async function deliverySummary(topicPrefix: string, context: Context = {}) {
	const { db } = resolve(context);
	const rows = await db
		.select({ state: outbox.state, n: count() })
		.from(outbox)
		.where(like(outbox.topic, `${escapeLike(topicPrefix)}%`))
		.groupBy(outbox.state);
	const summary: Record<OutboxState, number> = { queued: 0, sending: 0, sent: 0, failed: 0 };
	for (const row of rows) summary[row.state] = row.n;
	return summary;
}
