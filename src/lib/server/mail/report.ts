import { and, asc, count, desc, eq, like, type SQL } from 'drizzle-orm';
import sanitizeHtml from 'sanitize-html';
import { resolve, type Context } from '../context';
import { assertRole, type Role } from '../../club/roles';
import { outbox, outboxAttempts, type OutboxState } from './schema';

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

// A queued mail's HTML shown to an admin inside our page: only layout and text survive (no
// <style>, scripts or pictures), inline styles keep only plain properties without url(), and links
// become text, so reading a mail never follows a member's own link (an unsubscribe link acts as them).
const SAFE_STYLE_VALUE = [/^[#a-z0-9.,%\s'"-]+$/i];
const mailViewOptions: sanitizeHtml.IOptions = {
	allowedTags: ['table', 'tbody', 'tr', 'td', 'th', 'h1', 'h2', 'h3', 'p', 'br', 'hr', 'strong', 'em', 'ul', 'ol', 'li', 'blockquote', 'span', 'a'],
	allowedAttributes: { '*': ['style'], td: ['align', 'style'], table: ['role', 'width', 'style'] },
	allowedStyles: {
		'*': Object.fromEntries(
			[
				'color',
				'background',
				'background-color',
				'padding',
				'margin',
				'font-family',
				'font-size',
				'font-weight',
				'line-height',
				'border',
				'border-top',
				'border-bottom',
				'border-radius',
				'max-width',
				'text-align',
				'text-decoration'
			].map((p) => [p, SAFE_STYLE_VALUE])
		)
	},
	allowedSchemes: [],
	transformTags: { a: (_tag, attribs) => ({ tagName: 'span', attribs: { style: attribs.style ?? '' } }), h1: 'h3', h2: 'h3' },
	nonTextTags: [
		'script',
		'style',
		'textarea',
		'option',
		'noscript',
		'xmp',
		'iframe',
		'noembed',
		'noframes',
		'template',
		'svg',
		'math',
		'title',
		'select',
		'object',
		'head'
	]
};

/** One mail as queued, with its delivery attempts and its HTML made safe to show; admins only. Null when there is none. */
export async function readMail(viewer: { role: Role }, id: number, context: Context = {}) {
	assertRole(viewer, 'admin');
	const { db } = resolve(context);
	const [row] = await db.select().from(outbox).where(eq(outbox.id, id));
	if (!row) return null;
	const attempts = await db
		.select({ id: outboxAttempts.id, ok: outboxAttempts.ok, error: outboxAttempts.error, at: outboxAttempts.at })
		.from(outboxAttempts)
		.where(eq(outboxAttempts.outboxId, id))
		.orderBy(asc(outboxAttempts.at));
	return {
		id: row.id,
		toAddress: row.toAddress,
		subject: row.subject,
		topic: row.topic,
		state: row.state,
		attempts,
		lastError: row.lastError,
		createdAt: row.createdAt,
		sentAt: row.sentAt,
		textBody: row.textBody,
		safeHtml: sanitizeHtml(row.htmlBody, mailViewOptions)
	};
}
