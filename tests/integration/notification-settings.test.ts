// The notification settings: every category's choice is honoured when mail is queued, mail about
// the member's own account always goes, and every mail's footer links the settings page and its
// own category's one-click unsubscribe, all on the configured ORIGIN whatever the request said.
import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { outbox } from '../../src/lib/server/mail/schema';
import { enqueue } from '../../src/lib/server/mail/outbox';
import { renderMail } from '../../src/lib/server/mail/templates';
import * as preferences from '../../src/lib/server/mail/preferences';
import { unsubscribeToken } from '../../src/lib/server/mail/unsubscribe';
import * as threads from '../../src/lib/server/swaps/threads';
import { CHOICES, OPTIONAL_CATEGORIES, type MailCategory, type OptionalCategory } from '../../src/lib/mail/categories';
import { appUrl } from '../helpers/env';
import { request } from '../helpers/http';
import { linksIn, waitForMail } from '../helpers/mail';
import { makePerson, type TestPerson } from '../helpers/people';
import { createListing, memberAt, viewerOf } from '../helpers/swaps';

const queuedTo = async (address: string) => db.select().from(outbox).where(eq(outbox.toAddress, address));

function mailFor(person: TestPerson, category: MailCategory) {
	const rendered = renderMail({ heading: `A ${category} mail`, paragraphs: ['Words.'], to: { memberId: person.id, category } });
	return { to: person.email, subject: `A ${category} mail`, ...rendered };
}

describe('notification settings at enqueue', () => {
	test('each category: "off" queues nothing, any other choice queues the mail with its category and one-click headers', async () => {
		for (const category of OPTIONAL_CATEGORIES) {
			for (const choice of CHOICES[category]) {
				const person = await makePerson({ label: `pref-${category}-${choice}` });
				await preferences.save(person.id, { [category]: choice });
				const queued = await enqueue({ ...mailFor(person, category), category: category as OptionalCategory, memberId: person.id });
				const rows = await queuedTo(person.email);
				if (choice === 'off') {
					expect(queued, `${category}=${choice}`).toBe(0);
					expect(rows, `${category}=${choice}`).toHaveLength(0);
				} else {
					expect(queued, `${category}=${choice}`).toBe(1);
					expect(rows, `${category}=${choice}`).toHaveLength(1);
					expect(rows[0]!.category).toBe(category);
					expect(rows[0]!.headers!['List-Unsubscribe']).toBe(`<${appUrl()}/unsubscribe/${unsubscribeToken(person.id, category)}>`);
					expect(rows[0]!.headers!['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
				}
			}
		}
	});

	test('mail about the member’s own account goes with every category off, and carries no unsubscribe link', async () => {
		const person = await makePerson({ label: 'pref-all-off' });
		await preferences.save(person.id, Object.fromEntries(OPTIONAL_CATEGORIES.map((c) => [c, 'off'])));
		expect(await enqueue({ ...mailFor(person, 'account'), category: 'account', memberId: person.id })).toBe(1);
		const [row] = await queuedTo(person.email);
		expect(row!.category).toBe('account');
		expect(row!.headers).toBeNull();
		expect(row!.textBody).toContain(`Choose which mail you get: ${appUrl()}/account/notifications`);
		expect(row!.textBody).not.toContain('/unsubscribe/');
	});

	test('one batch keeps exactly the members who take its category', async () => {
		const people = await Promise.all([0, 1, 2, 3].map((i) => makePerson({ label: `pref-batch-${i}` })));
		await preferences.save(people[1]!.id, { news: 'off' });
		await preferences.save(people[3]!.id, { news: 'off', results: 'off' });
		const queued = await enqueue(people.map((p) => ({ ...mailFor(p, 'news'), category: 'news' as const, memberId: p.id })));
		expect(queued).toBe(2);
		expect(await Promise.all(people.map(async (p) => (await queuedTo(p.email)).length))).toEqual([1, 0, 1, 0]);
	});

	test('a mail a member can turn off is refused unless its footer says how', async () => {
		const person = await makePerson({ label: 'pref-no-footer' });
		const bare = renderMail({ heading: 'No footer', paragraphs: ['x'] });
		await expect(enqueue({ to: person.email, subject: 'No footer', ...bare, category: 'news', memberId: person.id })).rejects.toThrow(/renderMail/);
		// Another member's footer is no footer either.
		const other = await makePerson({ label: 'pref-other-footer' });
		await expect(enqueue({ ...mailFor(other, 'news'), to: person.email, category: 'news', memberId: person.id })).rejects.toThrow(/renderMail/);
		expect(await queuedTo(person.email)).toHaveLength(0);
	});
});

describe('the notification settings page', () => {
	test('shows a member their categories, saves them, and refuses a choice that does not exist', async () => {
		const member = await makePerson({ label: 'pref-page' });
		const page = await (await request('/account/notifications', { cookie: member.cookie })).text();
		for (const label of ['Swap messages', 'Comments on my entries', 'Tanks I follow', 'Upkeep reminders', 'Club news', 'Contest results'])
			expect(page).toContain(label);
		expect(page).not.toContain('Judging reminders');

		const saved = await request('/account/notifications', {
			cookie: member.cookie,
			form: { swaps: 'daily', comments: 'off', follows: 'off', upkeep: 'weekly', news: 'off', results: 'on', judging: 'off' }
		});
		expect(saved.status).toBe(200);
		// A member has no judging setting to change: the stored default stays.
		expect(await preferences.of(member.id)).toEqual({
			swaps: 'daily',
			comments: 'off',
			follows: 'off',
			upkeep: 'weekly',
			news: 'off',
			results: 'on',
			judging: 'on'
		});

		expect((await request('/account/notifications', { cookie: member.cookie, form: { swaps: 'hourly' } })).status).toBe(400);
		expect((await preferences.of(member.id)).swaps).toBe('daily');

		const judge = await makePerson({ role: 'judge', label: 'pref-judge' });
		expect(await (await request('/account/notifications', { cookie: judge.cookie })).text()).toContain('Judging reminders');
		await request('/account/notifications', { cookie: judge.cookie, form: { judging: 'off' } });
		expect((await preferences.of(judge.id)).judging).toBe('off');
	});
});

describe('mail footers', () => {
	test('a swap message mail links the settings and its unsubscribe on ORIGIN, whatever host the request named', async () => {
		const owner = await memberAt({ lat: -31.2, lng: -6.5 }, 'footer-owner', 'immediately');
		const asker = await memberAt({ lat: -31.21, lng: -6.5 }, 'footer-asker');
		const listing = await createListing(owner, { title: 'Footer stems' });
		const threadId = await threads.request(viewerOf(asker), listing, 'Hello there');
		await waitForMail(owner.email, { subject: /Footer stems/ });
		// A second conversation, opened through the app with forged forwarding headers.
		const other = await createListing(owner, { title: 'Forged host stems' });
		const response = await request(`/swaps/${other}?/request`, {
			cookie: asker.cookie,
			form: { body: 'Via a forged host' },
			headers: { 'x-forwarded-host': 'evil.test', 'x-forwarded-proto': 'http', forwarded: 'host=evil.test' }
		});
		expect(response.status).toBeLessThan(400);
		const mail = await waitForMail(owner.email, { subject: /Forged host stems/ });
		const links = linksIn(mail);
		expect(links.length).toBeGreaterThanOrEqual(3);
		for (const link of links) expect(link.startsWith(`${appUrl()}/`), link).toBe(true);
		expect(mail.text).toContain(`Choose which mail you get: ${appUrl()}/account/notifications`);
		expect(mail.text).toContain(`Unsubscribe from mail about swap messages: ${appUrl()}/unsubscribe/${unsubscribeToken(owner.id, 'swaps')}`);
		expect(mail.headers['list-unsubscribe']).toContain(`<${appUrl()}/unsubscribe/${unsubscribeToken(owner.id, 'swaps')}>`);
		expect(threadId).toBeGreaterThan(0);

		// The one-click link turns swap mail off and nothing else; the next message is not mailed.
		expect(
			(
				await fetch(`${appUrl()}/unsubscribe/${unsubscribeToken(owner.id, 'swaps')}`, {
					method: 'POST',
					body: 'List-Unsubscribe=One-Click',
					headers: { 'content-type': 'application/x-www-form-urlencoded' }
				})
			).status
		).toBe(200);
		expect(await preferences.of(owner.id)).toMatchObject({ swaps: 'off', news: 'on', results: 'on' });
		const third = await createListing(owner, { title: 'Quiet stems' });
		await threads.request(viewerOf(asker), third, 'Anyone?');
		const rows = (await queuedTo(owner.email)).filter((r) => r.subject.includes('Quiet stems'));
		expect(rows).toHaveLength(0);
	});
});
