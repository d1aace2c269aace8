// Members made on the fly for a test, each with a unique address, and sessions for them created
// the way Auth.js creates them (a row in `session` and the session cookie).
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { sessions, users } from '../../src/lib/server/club/schema';
import type { Role } from '../../src/lib/club/roles';

export const SESSION_COOKIE = 'authjs.session-token';

export interface TestPerson {
	id: string;
	email: string;
	displayName: string;
	role: Role;
	token: string;
	/** A Cookie header value that signs requests in as this person. */
	cookie: string;
}

export const uniqueEmail = (label: string) => `${label}-${randomBytes(5).toString('hex')}@tests.riparia.test`;

export async function makePerson(options: { role?: Role; displayName?: string | null; label?: string } = {}): Promise<TestPerson> {
	const role = options.role ?? 'member';
	const email = uniqueEmail(options.label ?? role);
	const displayName = options.displayName === undefined ? `Test ${role} ${randomBytes(2).toString('hex')}` : options.displayName;
	const id = crypto.randomUUID();
	await db.insert(users).values({ id, email, role, displayName, emailVerified: new Date() });
	const token = crypto.randomUUID();
	await db.insert(sessions).values({ sessionToken: token, userId: id, expires: new Date(Date.now() + 30 * 86_400_000) });
	return { id, email, displayName: displayName ?? '', role, token, cookie: `${SESSION_COOKIE}=${token}` };
}

/** A database session for someone who already exists, such as a member of the demo club. */
export async function sessionFor(userId: string): Promise<TestPerson> {
	const [row] = await db.select().from(users).where(eq(users.id, userId));
	if (!row) throw new Error(`No member with the id ${userId}.`);
	const token = crypto.randomUUID();
	await db.insert(sessions).values({ sessionToken: token, userId: row.id, expires: new Date(Date.now() + 30 * 86_400_000) });
	return { id: row.id, email: row.email ?? '', displayName: row.displayName ?? '', role: row.role, token, cookie: `${SESSION_COOKIE}=${token}` };
}

export async function roleOf(id: string): Promise<Role | undefined> {
	const [row] = await db.select({ role: users.role }).from(users).where(eq(users.id, id));
	return row?.role;
}

/** A database session for someone who already exists (a demo member, say). */
export async function personByEmail(email: string): Promise<TestPerson> {
	const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase()));
	if (!row) throw new Error(`No member with the address ${email}.`);
	const token = crypto.randomUUID();
	await db.insert(sessions).values({ sessionToken: token, userId: row.id, expires: new Date(Date.now() + 30 * 86_400_000) });
	return { id: row.id, email: row.email ?? email, displayName: row.displayName ?? '', role: row.role, token, cookie: `${SESSION_COOKIE}=${token}` };
}
