// Which club-wide mail a member takes (announcements, the weekly digest), changed from the link
// at the foot of such mail without signing in. The link's signed token (mail/unsubscribe.ts) is
// the credential, and it opens one member's one topic: nothing else can be read or changed with it.
import { and, eq, isNull } from 'drizzle-orm';
import { maskEmail } from '../../format';
import { notFound } from '../../errors';
import { resolve, type Context } from '../context';
import { verifyUnsubscribeToken, type UnsubscribeTopic } from '../mail/unsubscribe';
import { users } from './schema';

export const INVALID_LINK = 'That unsubscribe link is not valid. You can change your mail settings on your account page.';

export interface Subscription {
	topic: UnsubscribeTopic;
	/** The member's address, masked (the page is seen without signing in). */
	email: string;
	subscribed: boolean;
}

const column = { announcements: users.announcements, digest: users.weeklyDigest } as const;

async function open(token: string, context: Context) {
	const signed = verifyUnsubscribeToken(token);
	if (!signed) return undefined;
	const { db } = resolve(context);
	const [row] = await db
		.select({ id: users.id, email: users.email, subscribed: column[signed.topic] })
		.from(users)
		.where(and(eq(users.id, signed.memberId), isNull(users.deletedAt)))
		.limit(1);
	return row && { ...row, topic: signed.topic };
}

/** What a token opens; undefined for a token we did not sign, or a member no longer here. */
export async function byToken(token: string, context: Context = {}): Promise<Subscription | undefined> {
	const row = await open(token, context);
	return row && { topic: row.topic, email: maskEmail(row.email ?? ''), subscribed: row.subscribed };
}

/** Turns the token's one topic on or off for its one member. */
export async function set(token: string, subscribed: boolean, context: Context = {}): Promise<Subscription> {
	const row = await open(token, context);
	if (!row) throw notFound(INVALID_LINK);
	const { db } = resolve(context);
	await db
		.update(users)
		.set({ [row.topic === 'digest' ? 'weeklyDigest' : 'announcements']: subscribed })
		.where(eq(users.id, row.id));
	return { topic: row.topic, email: maskEmail(row.email ?? ''), subscribed };
}
