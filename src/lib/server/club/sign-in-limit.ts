// How many sign-in links may be asked for: a few an hour per address and per client.
import { createHash } from 'node:crypto';
import { and, count, eq, gte, lt, sql } from 'drizzle-orm';
import { DomainError } from '../../errors';
import { config } from '../config';
import { resolve, type Context } from '../context';
import { signInRequests } from './schema';

export const SIGN_IN_WINDOW_MS = 60 * 60_000;
/** How long a request waits for the ones before it with the same address or client. */
const LOCK_WAIT_SECONDS = 10;

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

	// Requests for the same address or from the same client are counted one at a time: without it
	// a burst sent at once is counted before any of it is recorded, and all of it passes. Each
	// request takes a named lock per address and per client (in one order, so two requests never
	// wait on each other); the counts are locking reads, which also wait for a row the previous
	// holder inserted and has not committed yet. The table has no row to lock before the first
	// request, hence named locks rather than a row lock.
	return db.transaction(
		async (tx) => {
			const names = [`signin:a:${emailHash.slice(0, 48)}`, `signin:c:${clientHash.slice(0, 48)}`].sort();
			for (const name of names) {
				const [rows] = (await tx.execute(sql`SELECT GET_LOCK(${name}, ${LOCK_WAIT_SECONDS}) AS got`)) as unknown as [{ got: number | null }[]];
				if (rows[0]?.got !== 1) throw new DomainError(503, 'busy', 'Too many sign-in requests at once. Try again in a moment.');
			}
			try {
				const [byAddress] = await tx
					.select({ n: count() })
					.from(signInRequests)
					.where(and(eq(signInRequests.emailHash, emailHash), gte(signInRequests.createdAt, since)))
					.for('update');
				if ((byAddress?.n ?? 0) >= perAddress) return { allowed: false, reason: 'address', retryAfterMinutes: 60 } as const;
				const [byClient] = await tx
					.select({ n: count() })
					.from(signInRequests)
					.where(and(eq(signInRequests.clientHash, clientHash), gte(signInRequests.createdAt, since)))
					.for('update');
				if ((byClient?.n ?? 0) >= perClient) return { allowed: false, reason: 'client', retryAfterMinutes: 60 } as const;
				await tx.insert(signInRequests).values({ emailHash, clientHash, createdAt: now });
				return { allowed: true } as const;
			} finally {
				for (const name of names) await tx.execute(sql`SELECT RELEASE_LOCK(${name})`);
			}
		},
		// No gap locks: requests for other addresses never wait on this one.
		{ isolationLevel: 'read committed' }
	);
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
