// Resolving a signed-in viewer costs one statement (the session joined to its member); the time
// of use is written in one more statement, and only every few minutes or at a renewal.
import { afterAll, describe, expect, test } from 'vitest';
import { drizzle } from 'drizzle-orm/mysql2';
import { eq } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import * as schema from '../../src/lib/server/db/schema';
import { countStatements, measure } from '../../src/lib/server/db/query-count';
import * as sessions from '../../src/lib/server/club/sessions';
import { sessions as sessionTable, users } from '../../src/lib/server/club/schema';
import { databaseUrl } from '../helpers/env';
import { makePerson } from '../helpers/people';

const pool = mysql.createPool({ uri: databaseUrl(), connectionLimit: 2, timezone: 'Z' });
countStatements(pool);
const db = drizzle(pool, { schema, mode: 'default', casing: 'snake_case' });
afterAll(() => pool.end());

async function use(token: string, now: Date) {
	return measure(async () => {
		const session = (await sessions.find(token, { db, now }))!;
		const renew = sessions.renewalDue(session, { now });
		const recorded = sessions.recordUse(token, session, 'Test browser', renew, { db, now });
		await recorded.written;
		return { renewed: recorded.expires };
	});
}

describe('resolving a signed-in viewer', () => {
	test('one statement to read; the time of use written in one statement, at most every few minutes', async () => {
		const person = await makePerson();
		const start = new Date();
		// First use: nothing recorded yet, so one read and one write (session and member together).
		const first = await use(person.token, start);
		expect(first.queries).toBe(2);
		expect(first.value.renewed).toBeNull();
		const [row] = await db
			.select({ seen: sessionTable.lastSeenAt, agent: sessionTable.userAgent, memberSeen: users.lastSeenAt })
			.from(sessionTable)
			.innerJoin(users, eq(users.id, sessionTable.userId))
			.where(eq(sessionTable.sessionToken, person.token));
		expect(row).toEqual({ seen: start, agent: 'Test browser', memberSeen: start });

		// A minute later: the read alone.
		expect((await use(person.token, new Date(start.getTime() + 60_000))).queries).toBe(1);
		// Ten minutes later: read and one write again.
		expect((await use(person.token, new Date(start.getTime() + 10 * 60_000))).queries).toBe(2);
	});

	test('a renewal moves the end out in the same single write', async () => {
		const person = await makePerson();
		const now = new Date(Date.now() + 2 * 86_400_000);
		const renewed = await use(person.token, now);
		expect(renewed.queries).toBe(2);
		expect(renewed.value.renewed!.getTime()).toBe(now.getTime() + sessions.SESSION_MAX_AGE_MS);
		const [row] = await db.select({ expires: sessionTable.expires }).from(sessionTable).where(eq(sessionTable.sessionToken, person.token));
		// The column keeps whole seconds.
		expect(Math.abs(row!.expires.getTime() - renewed.value.renewed!.getTime())).toBeLessThan(1000);
		expect((await use(person.token, new Date(now.getTime() + 60_000))).queries).toBe(1);
	});
});
