import { createHash } from 'node:crypto';
import { and, desc, eq, gt } from 'drizzle-orm';
import { db } from '../db';
import { sessions } from './schema';

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

export async function listActive(userId: string, currentToken: string | undefined, now = new Date()): Promise<ActiveSession[]> {
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

export async function revoke(userId: string, handle: string): Promise<boolean> {
	const rows = await db.select({ token: sessions.sessionToken }).from(sessions).where(eq(sessions.userId, userId));
	const match = rows.find((r) => sessionHandle(r.token) === handle);
	if (!match) return false;
	await db.delete(sessions).where(and(eq(sessions.userId, userId), eq(sessions.sessionToken, match.token)));
	return true;
}

export async function revokeAll(userId: string): Promise<void> {
	await db.delete(sessions).where(eq(sessions.userId, userId));
}

/** Records the device and time of use, at most every few minutes per session. */
export async function touch(token: string, previous: Date | null, userAgent: string | null, now = new Date()): Promise<void> {
	if (previous && now.getTime() - previous.getTime() < 5 * 60_000) return;
	await db
		.update(sessions)
		.set({ lastSeenAt: now, userAgent: userAgent?.slice(0, 255) ?? null })
		.where(eq(sessions.sessionToken, token));
}

export async function getByToken(token: string) {
	const [row] = await db.select().from(sessions).where(eq(sessions.sessionToken, token)).limit(1);
	return row;
}
