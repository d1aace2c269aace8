// Database sessions (Auth.js writes them; we read, renew and end them) and the account page's
// list of devices a member is signed in on.
import { createHash } from 'node:crypto';
import { and, desc, eq, gt, sql } from 'drizzle-orm';
import { notFound } from '../../errors';
import { resolve, type Context } from '../context';
import { sessions, users } from './schema';
import type { UserRow } from './users';

/** Sessions are addressed by a hash of their token, so the token never reaches a page. */
export const sessionHandle = (token: string) => createHash('sha256').update(token).digest('hex').slice(0, 16);

export interface ActiveSession {
	handle: string;
	createdAt: Date;
	lastSeenAt: Date | null;
	expires: Date;
	userAgent: string | null;
	current: boolean;
}

export async function listActive(userId: string, currentToken: string | null, context: Context = {}): Promise<ActiveSession[]> {
	const { db, now } = resolve(context);
	const rows = await db
		.select()
		.from(sessions)
		.where(and(eq(sessions.userId, userId), gt(sessions.expires, now)))
		.orderBy(desc(sessions.lastSeenAt), desc(sessions.createdAt));
	return rows.map((s) => ({
		handle: sessionHandle(s.sessionToken),
		createdAt: s.createdAt,
		lastSeenAt: s.lastSeenAt,
		expires: s.expires,
		userAgent: s.userAgent,
		current: s.sessionToken === currentToken
	}));
}

/** Ends one of the member's own sessions, named by its handle; one that has already ended is not found. */
export async function revoke(userId: string, handle: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	const rows = await db.select({ token: sessions.sessionToken }).from(sessions).where(eq(sessions.userId, userId));
	const match = rows.find((r) => sessionHandle(r.token) === handle);
	if (!match) throw notFound('That session has already ended.');
	await db.delete(sessions).where(and(eq(sessions.userId, userId), eq(sessions.sessionToken, match.token)));
}

export async function revokeAll(userId: string, context: Context = {}): Promise<void> {
	const { db } = resolve(context);
	await db.delete(sessions).where(eq(sessions.userId, userId));
}

/** How long a session lasts without use, and how often its end is pushed out again (as Auth.js does). */
export const SESSION_MAX_AGE_MS = 30 * 24 * 60 * 60_000;
export const SESSION_UPDATE_AGE_MS = 24 * 60 * 60_000;
/** Last-seen times are written at most this often, so reads stay reads. */
const TOUCH_GAP_MS = 5 * 60_000;

export interface ResolvedSession {
	user: UserRow;
	expires: Date;
	lastSeenAt: Date | null;
}

/** The live session for a cookie's token and its member, in one query; undefined when it is unknown or expired. */
export async function find(token: string, context: Context = {}): Promise<ResolvedSession | undefined> {
	const { db, now } = resolve(context);
	const [row] = await db
		.select({ user: users, expires: sessions.expires, lastSeenAt: sessions.lastSeenAt })
		.from(sessions)
		.innerJoin(users, eq(users.id, sessions.userId))
		.where(and(eq(sessions.sessionToken, token), gt(sessions.expires, now)))
		.limit(1);
	return row;
}

/** Sliding expiry: once a day of use has passed since the end was last set, it moves out again. */
export const renewalDue = (session: Pick<ResolvedSession, 'expires'>, context: Context = {}) =>
	session.expires.getTime() - SESSION_MAX_AGE_MS + SESSION_UPDATE_AGE_MS <= resolve(context).now.getTime();

/**
 * Records the device and time of use (at most every few minutes) and, when `renew` is set, pushes
 * the session's end out; returns the new end, or null when nothing was renewed. The session and
 * its member's last-seen time are written in one statement, and only when something is due, so a
 * signed-in read costs the one query of `find`. The caller need not wait for the write: the new
 * end is returned at once and the write settles in `written`.
 */
export function recordUse(
	token: string,
	session: ResolvedSession,
	userAgent: string | null,
	renew: boolean,
	context: Context = {}
): { expires: Date | null; written: Promise<void> } {
	const { db, now } = resolve(context);
	const expires = renew ? new Date(now.getTime() + SESSION_MAX_AGE_MS) : null;
	const stale = (at: Date | null) => !at || now.getTime() - at.getTime() >= TOUCH_GAP_MS;
	if (!expires && !stale(session.lastSeenAt) && !stale(session.user.lastSeenAt)) return { expires, written: Promise.resolve() };
	// Drizzle has no multi-table UPDATE; the column names are the schema's (Auth.js's own for the session).
	const written = db
		.execute(
			sql`UPDATE ${sessions} INNER JOIN ${users} ON ${users.id} = ${sessions.userId}
				SET ${sessions.lastSeenAt} = ${now}, ${sessions.userAgent} = ${userAgent?.slice(0, 255) ?? null}, ${users.lastSeenAt} = ${now}
				${expires ? sql`, ${sessions.expires} = ${expires}` : sql``}
				WHERE ${sessions.sessionToken} = ${token}`
		)
		.then(() => undefined);
	return { expires, written };
}

/** The session cookie's name as Auth.js sets it: the `__Secure-` form when the club is served over HTTPS. */
export const sessionCookieName = (origin: string) => (origin.startsWith('https:') ? '__Secure-authjs.session-token' : 'authjs.session-token');

/** Starts a database session for a member, as Auth.js does after a sign-in link (an accepted invitation is one). */
export async function start(userId: string, context: Context = {}): Promise<{ token: string; expires: Date }> {
	const { db, now } = resolve(context);
	const token = crypto.randomUUID();
	const expires = new Date(now.getTime() + SESSION_MAX_AGE_MS);
	await db.insert(sessions).values({ sessionToken: token, userId, expires });
	return { token, expires };
}
