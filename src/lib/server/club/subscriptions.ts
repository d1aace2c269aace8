// What an unsubscribe link at the foot of a mail opens, without signing in. The link's signed
// token (mail/unsubscribe.ts) is the credential, and it opens one member's one mail category (two
// for an older "announcements" link): nothing else can be read or changed with it. The settings
// themselves are the mail service's (mail/preferences.ts); this adds who the member is.
import { and, eq, isNull } from 'drizzle-orm';
import { maskEmail } from '../../format';
import { notFound } from '../../errors';
import { onValue, type OptionalCategory } from '../../mail/categories';
import { resolve, type Context } from '../context';
import * as preferences from '../mail/preferences';
import { verifyUnsubscribeToken } from '../mail/unsubscribe';
import { users } from './schema';

export const INVALID_LINK = 'That unsubscribe link is not valid. You can change your mail settings on your account page.';

export interface Subscription {
	categories: OptionalCategory[];
	/** The member's address, masked (the page is seen without signing in). */
	email: string;
	subscribed: boolean;
}

async function open(token: string, context: Context) {
	const signed = verifyUnsubscribeToken(token);
	if (!signed) return undefined;
	const { db } = resolve(context);
	const [row] = await db
		.select({ id: users.id, email: users.email })
		.from(users)
		.where(and(eq(users.id, signed.memberId), isNull(users.deletedAt)))
		.limit(1);
	return row && { ...row, categories: signed.categories };
}

/** What a token opens; undefined for a token we did not sign, or a member no longer here. */
export async function byToken(token: string, context: Context = {}): Promise<Subscription | undefined> {
	const row = await open(token, context);
	if (!row) return undefined;
	const settings = await preferences.of(row.id, context);
	return { categories: row.categories, email: maskEmail(row.email ?? ''), subscribed: row.categories.some((c) => settings[c] !== 'off') };
}

/** Turns the token's categories off, or back on (to their usual setting), for its one member. */
export async function set(token: string, subscribed: boolean, context: Context = {}): Promise<Subscription> {
	const row = await open(token, context);
	if (!row) throw notFound(INVALID_LINK);
	for (const category of row.categories) await preferences.setCategory(row.id, category, subscribed ? onValue(category) : 'off', context);
	return { categories: row.categories, email: maskEmail(row.email ?? ''), subscribed };
}
