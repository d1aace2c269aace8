// Mail about swap conversations, batched as $lib/swaps/notify decides: at most one mail per
// conversation an hour for "immediately", one summary a day for "daily", none for "off" (the
// member's "swaps" mail setting, mail/preferences.ts). A message
// is mailed at once when its conversation's hour is free; otherwise the periodic job below sends
// what is still unread once the hour has passed. Everything is queued through the outbox inside
// the transaction that causes it, for delivery straight away (`now` only decides the batching).
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import * as users from '../club/users';
import * as directory from '../club/directory';
import { enqueue, type QueuedMail } from '../mail/outbox';
import * as preferences from '../mail/preferences';
import { nameOf } from '../../club/names';
import { SITE_SENDER } from '../../swaps/conversation';
import { onMessagePosted, planMails, type NotifySetting, type PendingThread } from '../../swaps/notify';
import { listings, swapMailState, swapMessages, swapThreads, type ThreadRow } from './schema';
import { summaryMail, threadMail } from './mail';

const sideOf = (thread: Pick<ThreadRow, 'ownerId'>, userId: string) => (thread.ownerId === userId ? 'ownerMailedAt' : 'requesterMailedAt');

/**
 * After a member's message is stored (the thread row locked by the caller): mail the recipient
 * now, leave it for the job, or settle that no mail will go.
 */
export async function afterPost(
	thread: ThreadRow,
	message: { id: number; senderId: string; recipientId: string; body: string },
	context: Context = {}
): Promise<void> {
	const { db: tx, now } = resolve(context);
	const recipient = await users.getById(message.recipientId, { db: tx });
	if (!recipient?.email) return;
	const side = sideOf(thread, message.recipientId);
	const decision = onMessagePosted((await preferences.of(message.recipientId, { db: tx })).swaps, thread[side], now);
	if (decision === 'later') return;
	if (decision === 'mail-now') {
		const [listing] = await tx.select({ title: listings.title }).from(listings).where(eq(listings.id, thread.listingId));
		const sender = nameOf((await directory.names([message.senderId], { db: tx })).get(message.senderId));
		await enqueue(
			threadMail(recipient.email, {
				threadId: thread.id,
				recipientId: message.recipientId,
				title: listing?.title ?? 'your swap',
				otherName: sender,
				messages: [{ senderName: sender, body: message.body }]
			}),
			{ db: tx }
		);
		await tx
			.update(swapThreads)
			.set({ [side]: now })
			.where(eq(swapThreads.id, thread.id));
	}
	await tx.update(swapMessages).set({ notifiedAt: now }).where(eq(swapMessages.id, message.id));
}

/** A change the member hears about at once (accepted, withdrawn…), unless they turned swap mail off (the outbox drops it then). */
export async function queueNotice(userId: string, build: (email: string) => QueuedMail, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const recipient = await users.getById(userId, { db });
	if (!recipient?.email) return;
	await enqueue(build(recipient.email), { db });
}

/**
 * The periodic job: mails what is due of the messages still unread and unmailed. Returns how
 * many mails it queued.
 */
export async function sendDue(context: Context = {}): Promise<number> {
	const { db: database, now } = resolve(context);
	const pending = await database
		.select({ id: swapMessages.id, threadId: swapMessages.threadId, recipientId: swapMessages.recipientId })
		.from(swapMessages)
		.where(and(isNull(swapMessages.notifiedAt), isNull(swapMessages.readAt)))
		.orderBy(asc(swapMessages.id))
		.limit(2000);
	const byRecipient = new Map<string, Map<number, number[]>>();
	for (const m of pending) {
		const threads = byRecipient.get(m.recipientId) ?? new Map<number, number[]>();
		threads.set(m.threadId, [...(threads.get(m.threadId) ?? []), m.id]);
		byRecipient.set(m.recipientId, threads);
	}
	let queued = 0;
	for (const [recipientId, threadMessages] of byRecipient) {
		queued += await database.transaction(async (tx) => {
			const recipient = await users.getById(recipientId, { db: tx });
			if (!recipient) return 0;
			const threadIds = [...threadMessages.keys()];
			// Locked, so a message posted meanwhile sees this run's mail times.
			const threads = await tx.select().from(swapThreads).where(inArray(swapThreads.id, threadIds)).for('update');
			const byId = new Map(threads.map((t) => [t.id, t]));
			const setting: NotifySetting = (await preferences.of(recipientId, { db: tx })).swaps;
			const allIds = [...threadMessages.values()].flat();
			if (setting === 'off' || !recipient.email) {
				await tx.update(swapMessages).set({ notifiedAt: now }).where(inArray(swapMessages.id, allIds));
				return 0;
			}
			const [state] = await tx.select().from(swapMailState).where(eq(swapMailState.userId, recipientId)).for('update');
			const plan = planMails(
				setting,
				threadIds.flatMap((id): PendingThread[] => {
					const t = byId.get(id);
					return t ? [{ threadId: id, messageIds: threadMessages.get(id)!, lastMailAt: t[sideOf(t, recipientId)] }] : [];
				}),
				state?.summaryMailedAt ?? null,
				now
			);
			if (plan.length === 0) return 0;
			const planned = plan.flatMap((p) => (p.kind === 'thread' ? [{ threadId: p.threadId, messageIds: p.messageIds }] : p.threads));
			// Still unread now? A member reading the thread meanwhile needs no mail about it.
			const rows = await tx
				.select({ id: swapMessages.id, threadId: swapMessages.threadId, body: swapMessages.body, senderId: swapMessages.senderId })
				.from(swapMessages)
				.where(
					and(
						inArray(
							swapMessages.id,
							planned.flatMap((p) => p.messageIds)
						),
						isNull(swapMessages.readAt),
						isNull(swapMessages.notifiedAt)
					)
				)
				.orderBy(asc(swapMessages.id));
			if (rows.length === 0) return 0;
			const titles = new Map(
				(
					await tx
						.select({ id: listings.id, title: listings.title })
						.from(listings)
						.where(
							inArray(
								listings.id,
								threads.map((t) => t.listingId)
							)
						)
				).map((l) => [l.id, l.title])
			);
			const partyIds = [...new Set(threads.flatMap((t) => [t.ownerId, t.requesterId]))];
			const senders = await directory.names(partyIds, { db: tx });
			const otherOf = (t: ThreadRow) => senders.get(t.ownerId === recipientId ? t.requesterId : t.ownerId) ?? 'The other member';
			let mails = 0;
			for (const p of plan) {
				const ids = p.kind === 'thread' ? [p.threadId] : p.threads.map((t) => t.threadId);
				const included = rows.filter((r) => ids.includes(r.threadId));
				if (included.length === 0) continue;
				if (p.kind === 'thread') {
					const t = byId.get(p.threadId)!;
					await enqueue(
						threadMail(recipient.email!, {
							threadId: t.id,
							recipientId,
							title: titles.get(t.listingId) ?? 'your swap',
							otherName: otherOf(t),
							messages: included.map((r) => ({ senderName: r.senderId ? nameOf(senders.get(r.senderId)) : SITE_SENDER, body: r.body }))
						}),
						{ db: tx }
					);
					await tx
						.update(swapThreads)
						.set({ [sideOf(t, recipientId)]: now })
						.where(eq(swapThreads.id, t.id));
				} else {
					const summary = ids.flatMap((id) => {
						const t = byId.get(id)!;
						const count = included.filter((r) => r.threadId === id).length;
						return count ? [{ threadId: id, title: titles.get(t.listingId) ?? 'your swap', otherName: otherOf(t), count }] : [];
					});
					await enqueue(summaryMail(recipient.email!, { recipientId, threads: summary }), { db: tx });
					await tx
						.insert(swapMailState)
						.values({ userId: recipientId, summaryMailedAt: now })
						.onDuplicateKeyUpdate({ set: { summaryMailedAt: now } });
					for (const id of ids)
						await tx
							.update(swapThreads)
							.set({ [sideOf(byId.get(id)!, recipientId)]: now })
							.where(eq(swapThreads.id, id));
				}
				await tx
					.update(swapMessages)
					.set({ notifiedAt: now })
					.where(
						inArray(
							swapMessages.id,
							included.map((r) => r.id)
						)
					);
				mails++;
			}
			return mails;
		});
	}
	return queued;
}
