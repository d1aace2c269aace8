// Members' time zones: the browser's zone is kept once and never over a chosen one; "today" for
// upkeep is the member's own day.
import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';
import { viewerOf } from '../helpers/swaps';
import { tankInput } from '../helpers/tanks';

const zoneOfMember = async (id: string) => (await db.select({ timeZone: users.timeZone }).from(users).where(eq(users.id, id)))[0]?.timeZone;

describe('a member’s time zone', () => {
	test('the browser’s zone is kept while the member has none, and not after; unknown names are refused', async () => {
		const member = await makePerson({ label: 'zone-new' });
		const send = (timeZone: string) => request('/api/me/time-zone', { cookie: member.cookie, json: { timeZone }, accept: 'application/json' });
		const bad = await send('Mars/Olympus_Mons');
		expect(bad.status).toBe(400);
		expect(await zoneOfMember(member.id)).toBeNull();
		const first = await send('Pacific/Auckland');
		expect(first.status).toBe(200);
		expect(await first.json()).toEqual({ kept: true });
		expect(await zoneOfMember(member.id)).toBe('Pacific/Auckland');
		expect(await (await send('Europe/Lisbon')).json()).toEqual({ kept: false });
		expect(await zoneOfMember(member.id)).toBe('Pacific/Auckland');
	});

	test('“done today” and the schedule count the member’s day, not UTC’s', async () => {
		const member = await makePerson({ label: 'zone-upkeep' });
		// 20:00 UTC on 3 Dec is already 09:00 on 4 Dec in Auckland (UTC+13 in December).
		const now = new Date('2026-12-03T20:00:00Z');
		const viewer = { ...viewerOf(member), timeZone: 'Pacific/Auckland' };
		const tankId = await tanks.create(viewer, tankInput({ setUpOn: '2026-01-15', visibility: 'private' }));
		await upkeep.saveSchedule(viewer, tankId, [{ kind: 'glass', filterPart: null, label: 'Wipe the glass', intervalDays: 7 }], { now });
		const [task] = await upkeep.scheduleOfTank(tankId, 'Pacific/Auckland', { now });
		await upkeep.markDone(viewer, Number(task!.task.taskId), { now });
		const [after] = await upkeep.scheduleOfTank(tankId, 'Pacific/Auckland', { now });
		expect(after!.task.lastDoneOn).toBe('2026-12-04');
		expect(after!.statusLabel).toBe('due in 7 days');
		// Counted from UTC's day (still 3 Dec), the same task is due a day later.
		const [inUtc] = await upkeep.scheduleOfTank(tankId, 'UTC', { now });
		expect(inUtc!.statusLabel).toBe('due in 8 days');
	});
});
