import { eq } from 'drizzle-orm';
import { absoluteUrl } from '../config';
import { db } from '../db';
import { users } from '../club/schema';

export type MailKind = 'announcements' | 'digest';

/** The link at the foot of announcement-style mail; it needs no sign-in. */
export function unsubscribeUrl(token: string, kind: MailKind): string {
	return absoluteUrl(`/unsubscribe/${token}?kind=${kind}`);
}

/** RFC 2369 header so mail programs can offer their own "unsubscribe" button. */
export function unsubscribeHeaders(token: string, kind: MailKind): Record<string, string> {
	return { 'List-Unsubscribe': `<${unsubscribeUrl(token, kind)}>` };
}

export async function findByToken(token: string) {
	if (!/^[0-9a-f]{32}$/.test(token)) return undefined;
	const [row] = await db
		.select({ id: users.id, email: users.email, announcements: users.announcements, weeklyDigest: users.weeklyDigest })
		.from(users)
		.where(eq(users.unsubscribeToken, token))
		.limit(1);
	return row;
}

export async function setSubscriptions(token: string, settings: { announcements: boolean; weeklyDigest: boolean }): Promise<boolean> {
	const row = await findByToken(token);
	if (!row) return false;
	await db.update(users).set(settings).where(eq(users.id, row.id));
	return true;
}

/** "m…a@kettlewater.test": enough to recognise one's own address, not to harvest it. */
export function maskEmail(email: string): string {
	const [local = '', domain = ''] = email.split('@');
	if (local.length <= 2) return `${local[0] ?? ''}…@${domain}`;
	return `${local[0]}…${local.at(-1)}@${domain}`;
}
