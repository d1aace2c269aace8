// The links and headers that let a member stop club-wide mail without signing in. A link carries
// a token signed with an HMAC (SHA-256, keyed from AUTH_SECRET) over the member's id and one
// topic, so it works for that member and that topic only, and a changed character anywhere makes
// it worthless. A topic is one optional mail category ($lib/mail/categories); links in mail sent
// before the categories existed name "announcements" (now club news and contest results) or
// "digest" (now the upkeep reminder) and keep working. club/subscriptions.ts opens a link for the
// member; mail only signs, checks and puts the links in messages. Mail programs get RFC 2369's List-Unsubscribe and RFC
// 8058's List-Unsubscribe-Post, whose one-click POST arrives from the provider's servers without
// an Origin header; http/requests.ts lets exactly that request through to the unsubscribe page.
import { createHmac, timingSafeEqual } from 'node:crypto';
import { absoluteUrl, config } from '../config';
import { isOptionalCategory, type OptionalCategory } from '../../mail/categories';

/** What the two topics of older links stand for today. */
const LEGACY_TOPICS: Record<'announcements' | 'digest', OptionalCategory[]> = { announcements: ['news', 'results'], digest: ['upkeep'] };

/** The path of unsubscribe pages; requests.ts exempts one-click POSTs to it from the origin check. */
export const UNSUBSCRIBE_PATH = /^\/unsubscribe\/[A-Za-z0-9_.-]{1,400}$/;

function key(): Buffer {
	const secret = config().AUTH_SECRET;
	if (!secret) throw new Error('AUTH_SECRET must be set to sign unsubscribe links.');
	// A key of its own, derived from the secret, so these signatures are never valid for anything else.
	return createHmac('sha256', secret).update('riparia:unsubscribe-links:v1').digest();
}

const signature = (memberId: string, topic: string) => createHmac('sha256', key()).update(`${memberId}\n${topic}`).digest();

/** `<member id, base64url>.<topic>.<HMAC, base64url>` */
export function unsubscribeToken(memberId: string, topic: OptionalCategory | keyof typeof LEGACY_TOPICS): string {
	return `${Buffer.from(memberId).toString('base64url')}.${topic}.${signature(memberId, topic).toString('base64url')}`;
}

/** The member and the categories a token was signed for; null for anything not signed by us exactly so. */
export function verifyUnsubscribeToken(token: string): { memberId: string; categories: OptionalCategory[] } | null {
	const parts = token.split('.');
	if (parts.length !== 3) return null;
	const [id64, topic, sig64] = parts as [string, string, string];
	if (!(isOptionalCategory(topic) || Object.hasOwn(LEGACY_TOPICS, topic)) || !/^[A-Za-z0-9_-]+$/.test(id64) || !/^[A-Za-z0-9_-]{43}$/.test(sig64)) return null;
	const memberId = Buffer.from(id64, 'base64url').toString();
	// Decoding must give back the very text that was sent (no second spelling of the same id).
	if (Buffer.from(memberId).toString('base64url') !== id64) return null;
	const expected = signature(memberId, topic);
	const given = Buffer.from(sig64, 'base64url');
	if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
	return { memberId, categories: isOptionalCategory(topic) ? [topic] : LEGACY_TOPICS[topic as keyof typeof LEGACY_TOPICS] };
}

/** The link at the foot of club-wide mail; it needs no sign-in. */
export function unsubscribeUrl(memberId: string, topic: OptionalCategory): string {
	return absoluteUrl(`/unsubscribe/${unsubscribeToken(memberId, topic)}`);
}

/** RFC 2369 and RFC 8058 headers, so mail programs can offer their own one-click "unsubscribe". */
export function unsubscribeHeaders(memberId: string, topic: OptionalCategory): Record<string, string> {
	return { 'List-Unsubscribe': `<${unsubscribeUrl(memberId, topic)}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
}

/** The notification settings page, linked from the foot of every mail to a member. */
export const settingsUrl = () => absoluteUrl('/account/notifications');
