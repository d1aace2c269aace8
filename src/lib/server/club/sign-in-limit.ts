import { createHash } from 'node:crypto';
import { and, count, eq, gte } from 'drizzle-orm';
import { config } from '../config';
import { db, type DbOrTx } from '../db';
import { signInRequests } from './schema';

export const SIGN_IN_WINDOW_MS = 60 * 60_000;

// Addresses and client addresses are stored only as salted hashes.
const hashOf = (value: string) =>
	createHash('sha256')
		.update(`${config().AUTH_SECRET ?? 'riparia'}:${value.toLowerCase()}`)
		.digest('hex');

export type SignInVerdict = { allowed: true } | { allowed: false; reason: 'address' | 'client'; retryAfterMinutes: number };

/**
 * Counts sign-in links requested in the last hour for this address and for this client, and
 * records the request when it is allowed.
 */
export async function checkAndRecord(
	email: string,
	client: string,
	options: { now?: Date; perAddress?: number; perClient?: number; tx?: DbOrTx } = {}
): Promise<SignInVerdict> {
	const now = options.now ?? new Date();
	const tx = options.tx ?? db;
	const perAddress = options.perAddress ?? config().SIGNIN_LIMIT_PER_ADDRESS;
	const perClient = options.perClient ?? config().SIGNIN_LIMIT_PER_CLIENT;
	const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
	const emailHash = hashOf(email);
	const clientHash = hashOf(client);

	const [byAddress] = await tx
		.select({ n: count() })
		.from(signInRequests)
		.where(and(eq(signInRequests.emailHash, emailHash), gte(signInRequests.createdAt, since)));
	if ((byAddress?.n ?? 0) >= perAddress) return { allowed: false, reason: 'address', retryAfterMinutes: 60 };
	const [byClient] = await tx
		.select({ n: count() })
		.from(signInRequests)
		.where(and(eq(signInRequests.clientHash, clientHash), gte(signInRequests.createdAt, since)));
	if ((byClient?.n ?? 0) >= perClient) return { allowed: false, reason: 'client', retryAfterMinutes: 60 };

	await tx.insert(signInRequests).values({ emailHash, clientHash, createdAt: now });
	return { allowed: true };
}
