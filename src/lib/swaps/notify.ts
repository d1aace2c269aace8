// When new swap messages are mailed. A member chooses in their notification settings (the
// "swaps" mail category):
//   immediately — a mail soon after a message, but at most one mail per conversation an hour;
//   daily       — one summary of every conversation with news, at most once a day;
//   off         — no mail; the header's unread count is enough.
// Messages read on the site before their mail would go are not mailed at all. The hour is our
// choice (common practice, no source): enough to batch a quick back-and-forth, soon enough for a pickup.
import type { Preferences } from '../mail/categories';

export type NotifySetting = Preferences['swaps'];

export const MAIL_GAP_MS = 60 * 60_000;
export const DIGEST_GAP_MS = 24 * 60 * 60_000;

/** Whether a full gap has passed since the last mail (or there was none). */
export function gapPassed(lastMailAt: Date | null, now: Date, gapMs = MAIL_GAP_MS): boolean {
	return lastMailAt === null || now.getTime() - lastMailAt.getTime() >= gapMs;
}

export type OnPosted = 'mail-now' | 'later' | 'none';

/**
 * Decided when a message is posted: mail the recipient about this conversation now, leave it to
 * the periodic job (the gap has not passed, or the member wants a daily summary), or never.
 */
export function onMessagePosted(setting: NotifySetting, lastThreadMailAt: Date | null, now: Date): OnPosted {
	if (setting === 'off') return 'none';
	if (setting === 'daily') return 'later';
	return gapPassed(lastThreadMailAt, now) ? 'mail-now' : 'later';
}

export interface PendingThread {
	threadId: number;
	/** Unread messages to this recipient that no mail has covered yet, oldest first. */
	messageIds: number[];
	/** When this recipient was last mailed about this conversation. */
	lastMailAt: Date | null;
}

export type PlannedMail =
	{ kind: 'thread'; threadId: number; messageIds: number[] } | { kind: 'summary'; threads: { threadId: number; messageIds: number[] }[] };

/**
 * Decided by the periodic job for one recipient: which mails to send now. Threads still inside
 * their gap wait for a later run; the daily summary waits for a full day since the last one.
 */
export function planMails(setting: NotifySetting, pending: PendingThread[], lastSummaryAt: Date | null, now: Date): PlannedMail[] {
	const waiting = pending.filter((t) => t.messageIds.length > 0);
	if (setting === 'off' || waiting.length === 0) return [];
	if (setting === 'daily') {
		if (!gapPassed(lastSummaryAt, now, DIGEST_GAP_MS)) return [];
		return [{ kind: 'summary', threads: waiting.map((t) => ({ threadId: t.threadId, messageIds: t.messageIds })) }];
	}
	return waiting.filter((t) => gapPassed(t.lastMailAt, now)).map((t) => ({ kind: 'thread', threadId: t.threadId, messageIds: t.messageIds }));
}
