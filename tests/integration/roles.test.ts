import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '../../src/lib/server/club/schema';
import { auditLog } from '../../src/lib/server/audit/schema';
import { changeRole, LastAdminError, toViewer } from '../../src/lib/server/club/users';
import { scratchDatabase } from '../helpers/scratch-db';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
beforeAll(async () => {
	scratch = await scratchDatabase();
});
afterAll(async () => {
	await scratch?.drop();
});

async function admin(email: string) {
	const id = crypto.randomUUID();
	await scratch.db.insert(users).values({ id, email, role: 'admin', displayName: email });
	const [row] = await scratch.db.select().from(users).where(eq(users.id, id));
	return toViewer(row!);
}

describe('role changes', () => {
	test('the only admin cannot step down', async () => {
		const only = await admin('only-admin@tests.riparia.test');
		await expect(changeRole(only, only.id, 'member', scratch.db)).rejects.toBeInstanceOf(LastAdminError);
		const [row] = await scratch.db.select().from(users).where(eq(users.id, only.id));
		expect(row!.role).toBe('admin');
	});

	test('two admins demoting each other at once leave one admin, and the change is audited', async () => {
		const first = await scratch.db.select().from(users).where(eq(users.role, 'admin'));
		const a = toViewer(first[0]!);
		const b = await admin('second-admin@tests.riparia.test');
		const outcomes = await Promise.allSettled([changeRole(a, b.id, 'member', scratch.db), changeRole(b, a.id, 'member', scratch.db)]);
		expect(outcomes.filter((o) => o.status === 'fulfilled')).toHaveLength(1);
		const admins = await scratch.db.select().from(users).where(eq(users.role, 'admin'));
		expect(admins).toHaveLength(1);
		const audits = await scratch.db.select().from(auditLog).where(eq(auditLog.action, 'role.change'));
		expect(audits).toHaveLength(1);
		expect(audits[0]!.detail).toEqual({ from: 'admin', to: 'member' });
	});
});
