import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { unsubscribeHeaders } from '../../src/lib/server/mail/unsubscribe';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';

describe('unsubscribe links', () => {
	test('the link in a mail turns announcements off without signing in', async () => {
		const person = await makePerson();
		const [row] = await db.select({ token: users.unsubscribeToken }).from(users).where(eq(users.id, person.id));
		const header = unsubscribeHeaders(row!.token, 'announcements')['List-Unsubscribe']!;
		const path = new URL(header.slice(1, -1)).pathname;

		const page = await request(path);
		expect(page.status).toBe(200);
		expect(await page.text()).not.toContain(person.email);

		const saved = await request(path, { form: { weeklyDigest: 'on' } });
		expect(saved.status).toBe(200);
		const [after] = await db.select().from(users).where(eq(users.id, person.id));
		expect(after!.announcements).toBe(false);
		expect(after!.weeklyDigest).toBe(true);
	});

	test('a made-up token finds nobody', async () => {
		expect((await request('/unsubscribe/0123456789abcdef0123456789abcdef')).status).toBe(404);
		expect((await request('/unsubscribe/not-a-token')).status).toBe(404);
	});
});
