// Which club-wide mail a member takes (announcements, the weekly digest), changed from the link
// at the foot of such mail without signing in: the member's unguessable unsubscribe token is the
// credential. The mail service builds those links (mail/unsubscribe.ts); the settings are ours.
import { eq } from 'drizzle-orm';
import { maskEmail } from '../../format';
import { notFound } from '../../errors';
import { resolve, type Context } from '../context';
import { users } from './schema';

export interface Subscriptions {
	announcements: boolean;
	weeklyDigest: boolean;
}

const TOKEN = /^[0-9a-f]{32}$/;
export const INVALID_LINK = 'That unsubscribe link is not valid any more. You can change your mail settings on your account page.';

async function memberOf(token: string, context: Context) {
	if (!TOKEN.test(token)) return undefined;
	const { db } = resolve(context);
	const [row] = await db
		.select({ id: users.id, email: users.email, announcements: users.announcements, weeklyDigest: users.weeklyDigest })
		.from(users)
		.where(eq(users.unsubscribeToken, token))
		.limit(1);
	return row;
}

/** The settings a token opens, with the address masked (the page is seen without signing in); undefined for an unknown token. */
export async function byToken(token: string, context: Context = {}): Promise<(Subscriptions & { email: string }) | undefined> {
	const row = await memberOf(token, context);
	return row && { email: maskEmail(row.email ?? ''), announcements: row.announcements, weeklyDigest: row.weeklyDigest };
}

export async function update(token: string, settings: Subscriptions, context: Context = {}): Promise<void> {
	const row = await memberOf(token, context);
	if (!row) throw notFound(INVALID_LINK);
	const { db } = resolve(context);
	await db.update(users).set(settings).where(eq(users.id, row.id));
}
