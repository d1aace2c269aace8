// The words of the swap board's mail, all in the "swaps" mail category: the footer links the
// member's notification settings and the one-click "no more swap mail".
import { absoluteUrl } from '../config';
import { renderMail } from '../mail/templates';
import type { QueuedMail } from '../mail/outbox';

const FOOTER = 'You get this because of your swap message settings.';
const swapsFor = (memberId: string) => ({ memberId, category: 'swaps' as const });

const clip = (text: string, max = 300) => (text.length > max ? text.slice(0, max - 1).trimEnd() + '…' : text);
const quoted = (title: string) => `“${title}”`;

export interface MailMessage {
	senderName: string;
	body: string;
}

/** New messages in one conversation. */
export function threadMail(to: string, o: { threadId: number; recipientId: string; title: string; otherName: string; messages: MailMessage[] }): QueuedMail {
	const count = o.messages.length;
	const shown = o.messages.slice(-3);
	const { html, text } = renderMail({
		heading: count === 1 ? `${o.otherName} wrote about ${quoted(o.title)}` : `${count} new messages about ${quoted(o.title)}`,
		paragraphs: [
			...shown.map((m) => `${m.senderName}: ${clip(m.body)}`),
			...(count > shown.length ? [`…and ${count - shown.length} earlier message${count - shown.length === 1 ? '' : 's'}.`] : []),
			'Reply on Riparia, not to this mail. Keep your home address to yourself until you are comfortable; a public place is best for a pickup.'
		],
		action: { label: 'Open the conversation', url: absoluteUrl(`/swaps/threads/${o.threadId}`) },
		footer: FOOTER,
		to: swapsFor(o.recipientId)
	});
	return {
		to,
		...swapsFor(o.recipientId),
		subject: count === 1 ? `New message about ${quoted(o.title)}` : `${count} new messages about ${quoted(o.title)}`,
		html,
		text,
		topic: `swap-thread:${o.threadId}:${o.recipientId}`
	};
}

/** The daily summary of every conversation with news. */
export function summaryMail(
	to: string,
	o: { recipientId: string; threads: { threadId: number; title: string; otherName: string; count: number }[] }
): QueuedMail {
	const total = o.threads.reduce((s, t) => s + t.count, 0);
	const { html, text } = renderMail({
		heading: `${total} new swap message${total === 1 ? '' : 's'}`,
		paragraphs: [
			...o.threads.map((t) => `${quoted(t.title)}: ${t.count} from ${t.otherName} — ${absoluteUrl(`/swaps/threads/${t.threadId}`)}`),
			'Reply on Riparia, not to this mail.'
		],
		action: { label: 'Open My swaps', url: absoluteUrl('/swaps/mine') },
		footer: FOOTER,
		to: swapsFor(o.recipientId)
	});
	return {
		to,
		...swapsFor(o.recipientId),
		subject: `${total} new swap message${total === 1 ? '' : 's'} on Riparia`,
		html,
		text,
		topic: `swap-summary:${o.recipientId}`
	};
}

/** Changes of a listing that the other member should hear about at once. */
export type NoticeKind = 'accepted' | 'not-chosen' | 'released' | 'withdrawn' | 'withdrawn-by-admin' | 'confirmed-by-other' | 'handed-over';

export function noticeMail(
	to: string,
	memberId: string,
	o: { kind: NoticeKind; threadId: number | null; listingId: number; title: string; actorName: string; reason?: string }
): QueuedMail {
	const t = quoted(o.title);
	const words: Record<NoticeKind, { subject: string; heading: string; paragraphs: string[] }> = {
		accepted: {
			subject: `Your request for ${t} was accepted`,
			heading: `${o.actorName} accepted your request`,
			paragraphs: [`${o.actorName} accepted your request for ${t}. Agree a day, a time and a public meeting place in the conversation.`]
		},
		'not-chosen': {
			subject: `About your request for ${t}`,
			heading: `${t} has gone to another member`,
			paragraphs: [
				`Thank you for asking about ${t}. ${o.actorName} has accepted another request this time, so this one will not go ahead.`,
				'There is usually more on the board: fast growers need trimming every week or two.'
			]
		},
		released: {
			subject: `The reservation of ${t} was released`,
			heading: `${o.actorName} released the reservation`,
			paragraphs: [`${o.actorName} released your reservation of ${t}; the listing is open for requests again. If this is a surprise, ask in the conversation.`]
		},
		withdrawn: {
			subject: `${t} was withdrawn`,
			heading: `${t} is no longer available`,
			paragraphs: [`${o.actorName} withdrew the listing ${t}, so your request will not go ahead. Thank you for asking.`]
		},
		'withdrawn-by-admin': {
			subject: `${t} was withdrawn by the club's admins`,
			heading: `${t} was withdrawn`,
			paragraphs: [`The club's admins withdrew the listing ${t}.`, ...(o.reason ? [`Their reason: ${o.reason}`] : [])]
		},
		'confirmed-by-other': {
			subject: `${o.actorName} confirmed the handover of ${t}`,
			heading: 'Please confirm the handover too',
			paragraphs: [`${o.actorName} confirmed that ${t} has changed hands. Once you have it too, confirm on Riparia so the swap counts as done.`]
		},
		'handed-over': {
			subject: `${t}: handed over`,
			heading: 'Swap complete',
			paragraphs: [
				`You and ${o.actorName} both confirmed the handover of ${t}. Thank you for swapping!`,
				'Remember: never release plants, animals or tank water into the wild.'
			]
		}
	};
	const w = words[o.kind];
	const url = absoluteUrl(o.threadId ? `/swaps/threads/${o.threadId}` : `/swaps/${o.listingId}`);
	const { html, text } = renderMail({
		heading: w.heading,
		paragraphs: w.paragraphs,
		action: { label: o.threadId ? 'Open the conversation' : 'Open the listing', url },
		footer: FOOTER,
		to: swapsFor(memberId)
	});
	return { to, ...swapsFor(memberId), subject: w.subject, html, text, topic: `swap-listing:${o.listingId}` };
}
