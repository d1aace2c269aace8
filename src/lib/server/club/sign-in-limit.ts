// How many sign-in links may be asked for: a few an hour per address and per client.
import { createHash } from 'node:crypto';
import { and, count, eq, gte, lt } from 'drizzle-orm';
import { DomainError } from '../../errors';
import { config } from '../config';
import { resolve, type Context } from '../context';
import { signInRequests } from './schema';

export const SIGN_IN_WINDOW_MS = 60 * 60_000;

// Addresses and client addresses are stored only as salted hashes.
const hashOf = (value: string) =>
	createHash('sha256')
		.update(`${config().AUTH_SECRET ?? 'riparia'}:${value.toLowerCase()}`)
		.digest('hex');

export type SignInVerdict = { allowed: true } | { allowed: false; reason: 'address' | 'client'; retryAfterMinutes: number };

export interface SignInLimits {
	perAddress?: number;
	perClient?: number;
}

/**
 * Counts sign-in links requested in the last hour for this address and for this client, and
 * records the request when it is allowed.
 */
export async function checkAndRecord(email: string, client: string, limits: SignInLimits = {}, context: Context = {}): Promise<SignInVerdict> {
	const { db, now } = resolve(context);
	const perAddress = limits.perAddress ?? config().SIGNIN_LIMIT_PER_ADDRESS;
	const perClient = limits.perClient ?? config().SIGNIN_LIMIT_PER_CLIENT;
	const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
	const emailHash = hashOf(email);
	const clientHash = hashOf(client);

	const [byAddress] = await db
		.select({ n: count() })
		.from(signInRequests)
		.where(and(eq(signInRequests.emailHash, emailHash), gte(signInRequests.createdAt, since)));
	if ((byAddress?.n ?? 0) >= perAddress) return { allowed: false, reason: 'address', retryAfterMinutes: 60 };
	const [byClient] = await db
		.select({ n: count() })
		.from(signInRequests)
		.where(and(eq(signInRequests.clientHash, clientHash), gte(signInRequests.createdAt, since)));
	if ((byClient?.n ?? 0) >= perClient) return { allowed: false, reason: 'client', retryAfterMinutes: 60 };

	await db.insert(signInRequests).values({ emailHash, clientHash, createdAt: now });
	return { allowed: true };
}

/** Records a request for a link, or refuses it (429, at the address field) when too many were asked for. */
export async function admit(email: string, client: string, context: Context = {}): Promise<void> {
	const verdict = await checkAndRecord(email, client, {}, context);
	if (verdict.allowed) return;
	const why =
		verdict.reason === 'address'
			? 'We have sent several links to this address in the last hour.'
			: 'Several sign-in links were asked for from this device in the last hour.';
	const message = `${why} Use the newest one, or try again in ${verdict.retryAfterMinutes} minutes.`;
	throw new DomainError(429, 'too-many-links', message, { email: message });
}

/** Forgets requests older than the counting window (with an hour's margin): a periodic job. */
export async function prune(context: Context = {}): Promise<void> {
	const { db, now } = resolve(context);
	await db.delete(signInRequests).where(lt(signInRequests.createdAt, new Date(now.getTime() - 2 * SIGN_IN_WINDOW_MS)));
}
