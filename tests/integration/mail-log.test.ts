import { expect, test } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { outbox } from '../../src/lib/server/mail/schema';
import { enqueue } from '../../src/lib/server/mail/outbox';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';

test('an admin reads a queued mail made safe, in words; no one else may', async () => {
	const admin = await makePerson({ role: 'admin', label: 'mail-log-admin' });
	const member = await makePerson({ label: 'mail-log-member' });
	const subject = `Log check ${crypto.randomUUID().slice(0, 8)}`;
	await enqueue({
		category: 'account',
		to: member.email,
		subject,
		text: 'Plain words for the log.',
		html: `<html><head><style>body{background:url(https://tracker.test/x.png)}</style></head><body><h1>Hello</h1><p style="color:#1e5b47;background:url(https://tracker.test/y.png)">Formatted words</p><a href="https://kettlewater.test/unsubscribe/secret-token">Unsubscribe</a><script>alert(1)</script><img src="https://tracker.test/z.png"></body></html>`,
		topic: 'swap-listing:13'
	});
	const [row] = await db.select({ id: outbox.id }).from(outbox).where(eq(outbox.subject, subject)).orderBy(desc(outbox.id));

	const page = await (await request(`/admin/mail/${row!.id}`, { cookie: admin.cookie })).text();
	expect(page).toContain(subject);
	expect(page).toContain('Formatted words');
	expect(page).toContain('Plain words for the log.');
	expect(page).toContain('Swap listing changes');
	// No script, style sheet, picture, remote style or followable link of the recipient's.
	expect(page).not.toContain('alert(1)');
	expect(page).not.toContain('tracker.test');
	expect(page).not.toContain('href="https://kettlewater.test/unsubscribe');
	expect(page).toContain('Unsubscribe');

	expect((await request(`/admin/mail/${row!.id}`, { cookie: member.cookie })).status).toBe(403);
	expect((await request(`/admin/mail/999999999`, { cookie: admin.cookie })).status).toBe(404);

	// The log names kinds in words and filters by them; the address is never split inside a word.
	const log = await (await request(`/admin/mail?topic=swap-listing%3A&address=${encodeURIComponent(member.email)}`, { cookie: admin.cookie })).text();
	expect(log).toContain(subject);
	expect(log).toContain('Swap listing changes');
	expect(log).not.toContain('swap-listing:13');
	expect(log).not.toContain('break-all');
	expect(log).toContain(`href="/admin/mail/${row!.id}"`);
});
