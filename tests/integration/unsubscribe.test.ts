// Unsubscribe links: signed for one member and one topic, usable without signing in, and the
// one-click POST that mail providers send (RFC 8058) with no Origin header.
import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { unsubscribeHeaders, unsubscribeToken } from '../../src/lib/server/mail/unsubscribe';
import { appUrl } from '../helpers/env';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';

async function subscribedPerson() {
	const person = await makePerson({ label: 'reader' });
	await db.update(users).set({ announcements: true, weeklyDigest: true }).where(eq(users.id, person.id));
	return person;
}

const settingsOf = async (id: string) => (await db.select({ a: users.announcements, d: users.weeklyDigest }).from(users).where(eq(users.id, id)))[0]!;

/** A one-click POST as a mail provider sends it: no Origin, no cookie, the RFC 8058 body. */
function oneClick(path: string, multipart = false, body = 'List-Unsubscribe=One-Click') {
	if (multipart) {
		const form = new FormData();
		form.append('List-Unsubscribe', 'One-Click');
		return fetch(appUrl() + path, { method: 'POST', body: form, redirect: 'manual' });
	}
	return fetch(appUrl() + path, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body, redirect: 'manual' });
}

const pathOf = (memberId: string, topic: 'announcements' | 'digest') => new URL(unsubscribeHeaders(memberId, topic)['List-Unsubscribe']!.slice(1, -1)).pathname;

describe('unsubscribe links', () => {
	test('the headers name the signed link and offer one-click unsubscribe', async () => {
		const person = await subscribedPerson();
		const headers = unsubscribeHeaders(person.id, 'announcements');
		expect(headers['List-Unsubscribe']).toBe(`<${appUrl()}/unsubscribe/${unsubscribeToken(person.id, 'announcements')}>`);
		expect(headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
	});

	test('the page works without signing in and changes its own topic only', async () => {
		const person = await subscribedPerson();
		const path = pathOf(person.id, 'announcements');
		const page = await request(path);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).not.toContain(person.email);
		expect(html).toContain('club announcements');

		expect((await request(path, { form: { subscribed: 'off' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: true });
		expect((await request(path, { form: { subscribed: 'on' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: true });

		expect((await request(pathOf(person.id, 'digest'), { form: { subscribed: 'off' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: false });
	});

	test('a mail provider’s one-click POST works with no Origin header, form-encoded or multipart', async () => {
		const person = await subscribedPerson();
		const encoded = await oneClick(pathOf(person.id, 'announcements'));
		expect(encoded.status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: true });
		const multipart = await oneClick(pathOf(person.id, 'digest'), true);
		expect(multipart.status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: false });
	});

	test('a tampered or foreign token is refused and changes nothing', async () => {
		const person = await subscribedPerson();
		const other = await subscribedPerson();
		const token = unsubscribeToken(person.id, 'announcements');
		const [id64, , sig] = token.split('.') as [string, string, string];
		const flipped = sig.slice(0, -2) + (sig.at(-2) === 'A' ? 'B' : 'A') + sig.at(-1);
		const tampered = [
			`${id64}.announcements.${flipped}`,
			// the same signature for another topic, or for another member
			`${id64}.digest.${sig}`,
			`${Buffer.from(other.id).toString('base64url')}.announcements.${sig}`,
			// the old kind of link, and nonsense
			'0123456789abcdef0123456789abcdef',
			`${id64}.announcements`
		];
		for (const t of tampered) {
			expect((await request(`/unsubscribe/${t}`)).status, t).toBe(404);
			expect((await request(`/unsubscribe/${t}`, { form: { subscribed: 'off' } })).status, t).toBe(404);
			expect((await oneClick(`/unsubscribe/${t}`)).status, t).toBe(404);
		}
		expect(await settingsOf(person.id)).toEqual({ a: true, d: true });
		expect(await settingsOf(other.id)).toEqual({ a: true, d: true });
	});

	test('the exemption from the origin check is for the one-click body on unsubscribe pages only', async () => {
		const person = await subscribedPerson();
		const path = pathOf(person.id, 'announcements');
		// Without our Origin, the page's own form (here: subscribing again) is refused.
		expect((await oneClick(path, false, 'subscribed=on')).status).toBe(403);
		expect((await oneClick(path, false, 'List-Unsubscribe=One-Click&subscribed=on')).status).toBe(403);
		// The one-click body elsewhere is refused as any cross-site post.
		expect((await oneClick('/account?/revokeAll')).status).toBe(403);
		expect((await oneClick('/signout')).status).toBe(403);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: true });
	});
});
