// The links and headers that let a member stop club-wide mail. The token and what it changes
// belong to the club (club/subscriptions.ts); mail only puts them in messages.
import { absoluteUrl } from '../config';

export type MailKind = 'announcements' | 'digest';

/** The link at the foot of announcement-style mail; it needs no sign-in. */
export function unsubscribeUrl(token: string, kind: MailKind): string {
	return absoluteUrl(`/unsubscribe/${token}?kind=${kind}`);
}

/** RFC 2369 header so mail programs can offer their own "unsubscribe" button. */
export function unsubscribeHeaders(token: string, kind: MailKind): Record<string, string> {
	return { 'List-Unsubscribe': `<${unsubscribeUrl(token, kind)}>` };
}
