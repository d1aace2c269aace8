import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '../../src/lib/server/club/schema';
import { auditLog } from '../../src/lib/server/audit/schema';
import { changeRole, listMembers, toViewer } from '../../src/lib/server/club/users';
import * as areas from '../../src/lib/server/club/areas';
import { clubAreas } from '../../src/lib/server/club/schema';
import { scratchDatabase } from '../helpers/scratch-db';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
beforeAll(async () => {
	scratch = await scratchDatabase();
});
afterAll(async () => {
	await scratch?.drop();
});

async function admin(email: string, role: 'member' | 'judge' | 'admin' = 'admin') {
	const id = crypto.randomUUID();
	await scratch.db.insert(users).values({ id, email, role, displayName: email });
	const [row] = await scratch.db.select().from(users).where(eq(users.id, id));
	return toViewer(row!);
}

describe('role changes', () => {
	test('the only admin cannot step down', async () => {
		const only = await admin('only-admin@tests.riparia.test');
		await expect(changeRole(only, only.id, 'member', { db: scratch.db })).rejects.toMatchObject({ status: 409, code: 'last-admin' });
		const [row] = await scratch.db.select().from(users).where(eq(users.id, only.id));
		expect(row!.role).toBe('admin');
	});

	test('two admins demoting each other at once leave one admin, and the change is audited', async () => {
		const first = await scratch.db.select().from(users).where(eq(users.role, 'admin'));
		const a = toViewer(first[0]!);
		const b = await admin('second-admin@tests.riparia.test');
		const outcomes = await Promise.allSettled([changeRole(a, b.id, 'member', { db: scratch.db }), changeRole(b, a.id, 'member', { db: scratch.db })]);
		expect(outcomes.filter((o) => o.status === 'fulfilled')).toHaveLength(1);
		const admins = await scratch.db.select().from(users).where(eq(users.role, 'admin'));
		expect(admins).toHaveLength(1);
		const audits = await scratch.db.select().from(auditLog).where(eq(auditLog.action, 'role.change'));
		expect(audits).toHaveLength(1);
		expect(audits[0]!.before).toEqual({ role: 'admin' });
		expect(audits[0]!.after).toEqual({ role: 'member' });
	});
});

describe('commands that need a role check it themselves', () => {
	test('a judge cannot change roles, list members or change areas, whoever calls the function', async () => {
		const judge = await admin('judge-not-admin@tests.riparia.test', 'judge');
		const context = { db: scratch.db };
		const forbidden = { status: 403, code: 'forbidden' };
		await expect(changeRole(judge, judge.id, 'admin', context)).rejects.toMatchObject(forbidden);
		await expect(listMembers(judge, { page: 1 }, context)).rejects.toMatchObject(forbidden);
		await expect(areas.create(judge, { name: 'Judged Hollow', lat: 10, lng: 10 }, context)).rejects.toMatchObject(forbidden);
		const [row] = await scratch.db.select().from(users).where(eq(users.id, judge.id));
		expect(row!.role).toBe('judge');
		expect(await scratch.db.select().from(clubAreas).where(eq(clubAreas.name, 'Judged Hollow'))).toHaveLength(0);
	});

	test('an admin renames and removes an area, refused for a name in use or an area that is gone, and each change is audited', async () => {
		const oriel = await admin('area-admin@tests.riparia.test');
		const context = { db: scratch.db };
		await areas.create(oriel, { name: 'Sedge End', lat: 50.123, lng: 2.987 }, context);
		await areas.create(oriel, { name: 'Rush Green', lat: 50.2, lng: 3 }, context);
		const all = await areas.list(context);
		const sedge = all.find((a) => a.name === 'Sedge End')!;
		expect({ lat: sedge.lat, lng: sedge.lng }).toEqual({ lat: 50.12, lng: 2.99 });
		await expect(areas.rename(oriel, sedge.id, 'rush green', context)).rejects.toMatchObject({
			status: 400,
			fields: { name: 'There is already an area with that name.' }
		});
		await areas.rename(oriel, sedge.id, 'Sedge Ford', context);
		expect(await areas.remove(oriel, sedge.id, context)).toBe('Sedge Ford');
		await expect(areas.remove(oriel, sedge.id, context)).rejects.toMatchObject({ status: 404 });
		const trail = await scratch.db
			.select()
			.from(auditLog)
			.where(eq(auditLog.subjectId, String(sedge.id)));
		expect(trail.filter((t) => t.subjectType === 'club_area').map((t) => t.action)).toEqual(['area.create', 'area.rename', 'area.delete']);
	});
});
