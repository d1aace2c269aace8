import { hostname } from 'node:os';
import pLimit from 'p-limit';
import { and, eq, inArray, lte, or, sql } from 'drizzle-orm';
import { config } from '../config';
import { resolve, type Context } from '../context';
import { recordHeartbeat } from '../jobs/runner';
import { component, reason as reasonOf } from '../ops/log';
import { outboxDeliveries } from '../ops/metrics';
import { maskAddress, maskAddresses } from '../../ops/mask';
import { takes, type MailCategory, type OptionalCategory } from '../../mail/categories';
import { OUTBOX_STATES, outbox, outboxAttempts, type OutboxState } from './schema';
import { defaultTransport, type MailTransport } from './transport';
import * as preferences from './preferences';
import { unsubscribeHeaders, unsubscribeUrl } from './unsubscribe';

const log = component('outbox');

/**
 * Every mail names its category. Mail about the member's own account may go to an address alone;
 * mail of any other category names the member, whose settings decide at enqueue whether it goes.
 */
type Recipient = { category: 'account'; memberId?: string } | { category: OptionalCategory; memberId: string };

export type QueuedMail = Recipient & {
	to: string;
	subject: string;
	text: string;
	html: string;
	headers?: Record<string, string>;
	topic?: string;
	/** At most one message with this key is ever queued; a second enqueue is ignored. */
	dedupeKey?: string;
	/** Deliver no earlier than this (batched notifications). */
	notBefore?: Date;
	/** Mail to many members at once (announcements, digests): it waits behind one person's mail. */
	bulk?: boolean;
};

const PRIORITY_PERSONAL = 5;
const PRIORITY_BULK = 9;
/** Messages of one batch in flight at once, over the transport's pooled connections. */
const SEND_CONCURRENCY = 4;

export const MAX_ATTEMPTS = 8;
const LEASE_MS = 5 * 60_000;

/** Wait before the next attempt: 30 s, 1 min, 2 min … capped at one hour. */
export function backoffMs(attemptsSoFar: number): number {
	return Math.min(30_000 * 2 ** Math.max(0, attemptsSoFar - 1), 60 * 60_000);
}

function messageIdFor(domainFrom: string) {
	const domain = /@([^>\s]+)/.exec(domainFrom)?.[1] ?? 'riparia.invalid';
	return `<${crypto.randomUUID()}@${domain}>`;
}

/** Rows per INSERT statement: a club-wide mailing is a few multi-row statements, each well under max_allowed_packet. */
const INSERT_CHUNK = 500;

/**
 * Queues mail inside the caller's transaction (`{ db: tx }`), so the mail exists exactly when the
 * change that caused it commits. A mail in a category its member turned off is dropped here; one
 * the member may turn off must carry its unsubscribe link (renderMail's `to`), and gets the
 * List-Unsubscribe headers. Answers how many were queued (before dedupe keys drop repeats).
 */
export async function enqueue(mails: QueuedMail | QueuedMail[], context: Context = {}): Promise<number> {
	const list = Array.isArray(mails) ? mails : [mails];
	if (list.length === 0) return 0;
	const { db, now } = resolve(context);
	const from = config().MAIL_FROM;
	const optional = list.flatMap((m) => (m.category === 'account' ? [] : [m.memberId]));
	const settings = await preferences.ofMembers(optional, context);
	const kept = list.filter((m) => m.category === 'account' || takes(settings.get(m.memberId)!, m.category));
	if (kept.length === 0) return 0;
	const rows = kept.map((m) => {
		let headers = m.headers ?? null;
		if (m.category !== 'account') {
			// A programming error, not a member's: every mail a member can turn off says how, in its footer.
			if (!m.text.includes(unsubscribeUrl(m.memberId, m.category)))
				throw new Error(`A "${m.category}" mail must be rendered with its recipient (renderMail's "to").`);
			headers = { ...headers, ...unsubscribeHeaders(m.memberId, m.category) };
		}
		return {
			toAddress: m.to,
			subject: m.subject,
			textBody: m.text,
			htmlBody: m.html,
			headers,
			category: m.category as MailCategory,
			topic: m.topic ?? null,
			dedupeKey: m.dedupeKey ?? null,
			priority: m.bulk ? PRIORITY_BULK : PRIORITY_PERSONAL,
			messageId: messageIdFor(from),
			nextAttemptAt: m.notBefore ?? now
		};
	});
	for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
		await db
			.insert(outbox)
			.values(rows.slice(i, i + INSERT_CHUNK))
			// A repeated dedupe key keeps the first message untouched.
			.onDuplicateKeyUpdate({ set: { id: sql`id` } });
	}
	return rows.length;
}

/**
 * Deletes every message to an address, sent or waiting, with its attempts (an account deletion:
 * the rows hold the address and what was said). A message being sent right now may still go out.
 */
export async function forgetAddress(address: string, context: Context = {}): Promise<number> {
	if (!address) return 0;
	const { db } = resolve(context);
	const [result] = await db.delete(outbox).where(eq(outbox.toAddress, address));
	return result.affectedRows;
}

export interface DeliveryOptions {
	transport?: MailTransport;
	worker?: string;
	batchSize?: number;
}

/**
 * Claims due messages (rows another worker holds are skipped, not waited for), marks them
 * `sending` with a lease, then delivers them outside the transaction. A claimed row is never
 * claimed again unless its lease runs out, which the SMTP timeouts keep from happening.
 */
export async function deliverDue(options: DeliveryOptions = {}, context: Context = {}): Promise<{ sent: number; failed: number }> {
	const { db, now } = resolve(context);
	const transport = options.transport ?? defaultTransport();
	const worker = options.worker ?? `${hostname()}:${process.pid}`;
	const batchSize = options.batchSize ?? 20;

	const claimed = await db.transaction(async (tx) => {
		const due = await tx
			.select()
			.from(outbox)
			.where(or(and(eq(outbox.state, 'queued'), lte(outbox.nextAttemptAt, now)), and(eq(outbox.state, 'sending'), lte(outbox.leaseUntil, now))))
			.orderBy(outbox.priority, outbox.id)
			.limit(batchSize)
			.for('update', { skipLocked: true });
		if (due.length === 0) return [];
		await tx
			.update(outbox)
			.set({ state: 'sending', leaseUntil: new Date(now.getTime() + LEASE_MS), attempts: sql`${outbox.attempts} + 1` })
			.where(
				inArray(
					outbox.id,
					due.map((d) => d.id)
				)
			);
		return due;
	});

	let sent = 0;
	let failed = 0;
	/** What went out, by the topic's kind ("swap-thread:42" counts as swap-thread), for the log. */
	const topics: Record<string, number> = {};
	const deliverOne = async (message: (typeof claimed)[number]) => {
		const attempt = message.attempts + 1;
		try {
			await transport.send({
				to: message.toAddress,
				subject: message.subject,
				text: message.textBody,
				html: message.htmlBody,
				headers: message.headers ?? undefined,
				messageId: message.messageId
			});
			await db.transaction(async (tx) => {
				await tx.update(outbox).set({ state: 'sent', sentAt: new Date(), leaseUntil: null, lastError: null }).where(eq(outbox.id, message.id));
				await tx.insert(outboxAttempts).values({ outboxId: message.id, worker, ok: true, at: new Date() });
			});
			sent++;
			const kind = message.topic?.split(':')[0] ?? 'other';
			topics[kind] = (topics[kind] ?? 0) + 1;
			outboxDeliveries.inc({ result: 'sent' });
			log.debug({ mailId: message.id, topic: message.topic, to: maskAddress(message.toAddress), attempt }, 'mail sent');
		} catch (error) {
			const reason = reasonOf(error);
			const giveUp = attempt >= MAX_ATTEMPTS;
			await db.transaction(async (tx) => {
				await tx
					.update(outbox)
					.set({
						state: giveUp ? 'failed' : 'queued',
						leaseUntil: null,
						lastError: reason.slice(0, 2000),
						nextAttemptAt: new Date(now.getTime() + backoffMs(attempt))
					})
					.where(eq(outbox.id, message.id));
				await tx.insert(outboxAttempts).values({ outboxId: message.id, worker, ok: false, error: reason.slice(0, 2000), at: new Date() });
			});
			failed++;
			outboxDeliveries.inc({ result: giveUp ? 'failed' : 'retry' });
			// The server's reply can quote the address: mask it like the recipient.
			const fields = { mailId: message.id, topic: message.topic, to: maskAddress(message.toAddress), attempt, reason: maskAddresses(reason) };
			if (giveUp) log.error(fields, `mail given up after ${attempt} attempts`);
			else log.warn({ ...fields, retryInSeconds: backoffMs(attempt) / 1000 }, 'mail not delivered; will retry');
		}
	};
	const limit = pLimit(SEND_CONCURRENCY);
	await Promise.all(claimed.map((message) => limit(() => deliverOne(message))));
	if (claimed.length > 0) log.info({ worker, sent, failed, topics }, 'outbox batch delivered');
	return { sent, failed };
}

/** This process's worker, for /readyz: when it started and when a round last finished. */
let workerState: { startedAt: number; lastRoundAt: number | null } | null = null;

export function workerStatus(): { runsHere: boolean; startedAt: number | null; lastRoundAt: number | null } {
	return { runsHere: workerState !== null, startedAt: workerState?.startedAt ?? null, lastRoundAt: workerState?.lastRoundAt ?? null };
}

/** The job_run row the workers' heartbeat is written to (never claimed as a job). */
export const WORKER_HEARTBEAT = 'outbox-worker';
/** A heartbeat row written at most this often per process, so idle polling does not write every round. */
const HEARTBEAT_EVERY_MS = 15_000;

/**
 * Polls the outbox until stopped. Several of these may run at once, in one process or many. The
 * function it returns stops polling and resolves once a round in progress has finished.
 */
export function startWorker(options: { intervalMs?: number; onError?: (e: unknown) => void } = {}) {
	const interval = options.intervalMs ?? config().OUTBOX_POLL_MS;
	const worker = `${hostname()}:${process.pid}`;
	const state = { startedAt: Date.now(), lastRoundAt: null as number | null };
	workerState = state;
	let lastHeartbeat = 0;
	let stopped = false;
	let timer: ReturnType<typeof setTimeout> | undefined;
	let round: Promise<void> = Promise.resolve();
	const tick = () => (round = deliverRounds());
	const deliverRounds = async () => {
		if (stopped) return;
		try {
			// A full batch means more may be waiting: keep draining before the pause.
			const batchSize = 20;
			let handled: number;
			do {
				const result = await deliverDue({ batchSize, worker });
				handled = result.sent + result.failed;
				state.lastRoundAt = Date.now();
			} while (!stopped && handled === batchSize);
			if (state.lastRoundAt - lastHeartbeat >= HEARTBEAT_EVERY_MS) {
				await recordHeartbeat(WORKER_HEARTBEAT, worker, { now: new Date(state.lastRoundAt) });
				lastHeartbeat = state.lastRoundAt;
			}
		} catch (error) {
			log.error({ reason: reasonOf(error) }, 'outbox round failed');
			options.onError?.(error);
		}
		if (!stopped) timer = setTimeout(() => void tick(), interval);
	};
	timer = setTimeout(() => void tick(), 500);
	return (): Promise<void> => {
		stopped = true;
		if (timer) clearTimeout(timer);
		if (workerState === state) workerState = null;
		return round;
	};
}

/**
 * The outbox at a glance for the metrics, in one query: messages per state (answered from the
 * (state, next_attempt_at) index) and how long the oldest undelivered one has waited (reads only
 * the few undelivered rows; measured on the database's clock, which also stamped it).
 */
export async function queueStats(context: Context = {}): Promise<{ byState: Record<OutboxState, number>; oldestUndeliveredSeconds: number | null }> {
	const { db } = resolve(context);
	const [rows] = (await db.execute(sql`
		SELECT ${outbox.state} AS state, COUNT(*) AS n, NULL AS waited FROM ${outbox} GROUP BY ${outbox.state}
		UNION ALL
		SELECT 'oldest', 0, TIMESTAMPDIFF(MICROSECOND, MIN(${outbox.createdAt}), UTC_TIMESTAMP(3)) / 1000000
		FROM ${outbox} WHERE ${outbox.state} IN ('queued', 'sending')`)) as unknown as [{ state: string; n: number | string; waited: number | string | null }[]];
	const byState = Object.fromEntries(OUTBOX_STATES.map((s) => [s, 0])) as Record<OutboxState, number>;
	let oldestUndeliveredSeconds: number | null = null;
	for (const row of rows) {
		// COUNT and the division come back as strings (DECIMAL) or numbers depending on the driver's settings.
		if (row.state === 'oldest') oldestUndeliveredSeconds = row.waited === null ? null : Math.max(0, Number(row.waited));
		else if ((OUTBOX_STATES as readonly string[]).includes(row.state)) byState[row.state as OutboxState] = Number(row.n);
	}
	return { byState, oldestUndeliveredSeconds };
}
