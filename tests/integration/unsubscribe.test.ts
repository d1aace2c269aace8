// Unsubscribe links: signed for one member and one mail category, usable without signing in, and
// the one-click POST that mail providers send (RFC 8058) with no Origin header.
import { describe, expect, test } from 'vitest';
import * as preferences from '../../src/lib/server/mail/preferences';
import { unsubscribeHeaders, unsubscribeToken } from '../../src/lib/server/mail/unsubscribe';
import type { OptionalCategory } from '../../src/lib/mail/categories';
import { appUrl } from '../helpers/env';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';

async function subscribedPerson() {
	const person = await makePerson({ label: 'reader' });
	await preferences.save(person.id, { news: 'on', upkeep: 'weekly' });
	return person;
}

/** Club news (a) and the upkeep reminder (d), as on or off. */
const settingsOf = async (id: string) => {
	const p = await preferences.of(id);
	return { a: p.news !== 'off', d: p.upkeep !== 'off' };
};

/** A one-click POST as a mail provider sends it: no Origin, no cookie, the RFC 8058 body. */
function oneClick(path: string, multipart = false, body = 'List-Unsubscribe=One-Click') {
	if (multipart) {
		const form = new FormData();
		form.append('List-Unsubscribe', 'One-Click');
		return fetch(appUrl() + path, { method: 'POST', body: form, redirect: 'manual' });
	}
	return fetch(appUrl() + path, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body, redirect: 'manual' });
}

const pathOf = (memberId: string, topic: OptionalCategory) => new URL(unsubscribeHeaders(memberId, topic)['List-Unsubscribe']!.slice(1, -1)).pathname;

describe('unsubscribe links', () => {
	test('the headers name the signed link and offer one-click unsubscribe', async () => {
		const person = await subscribedPerson();
		const headers = unsubscribeHeaders(person.id, 'news');
		expect(headers['List-Unsubscribe']).toBe(`<${appUrl()}/unsubscribe/${unsubscribeToken(person.id, 'news')}>`);
		expect(headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
	});

	test('the page works without signing in and changes its own topic only', async () => {
		const person = await subscribedPerson();
		const path = pathOf(person.id, 'news');
		const page = await request(path);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).not.toContain(person.email);
		expect(html).toContain('club news');

		expect((await request(path, { form: { subscribed: 'off' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: true });
		expect((await request(path, { form: { subscribed: 'on' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: true });

		expect((await request(pathOf(person.id, 'upkeep'), { form: { subscribed: 'off' } })).status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: false });
	});

	test('a link from before the categories still works: "announcements" stops club news and contest results, "digest" the upkeep reminder', async () => {
		const person = await subscribedPerson();
		const legacy = (topic: string) => `/unsubscribe/${unsubscribeToken(person.id, topic as 'announcements' | 'digest')}`;
		expect((await oneClick(legacy('announcements'))).status).toBe(200);
		expect(await preferences.of(person.id)).toMatchObject({ news: 'off', results: 'off', upkeep: 'weekly', swaps: 'immediately' });
		expect((await request(legacy('digest'), { form: { subscribed: 'off' } })).status).toBe(200);
		expect(await preferences.of(person.id)).toMatchObject({ news: 'off', results: 'off', upkeep: 'off' });
		expect((await request(legacy('announcements'), { form: { subscribed: 'on' } })).status).toBe(200);
		expect(await preferences.of(person.id)).toMatchObject({ news: 'on', results: 'on', upkeep: 'off' });
	});

	test('a mail provider’s one-click POST works with no Origin header, form-encoded or multipart', async () => {
		const person = await subscribedPerson();
		const encoded = await oneClick(pathOf(person.id, 'news'));
		expect(encoded.status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: true });
		const multipart = await oneClick(pathOf(person.id, 'upkeep'), true);
		expect(multipart.status).toBe(200);
		expect(await settingsOf(person.id)).toEqual({ a: false, d: false });
	});

	test('a tampered or foreign token is refused and changes nothing', async () => {
		const person = await subscribedPerson();
		const other = await subscribedPerson();
		const token = unsubscribeToken(person.id, 'news');
		const [id64, , sig] = token.split('.') as [string, string, string];
		const flipped = sig.slice(0, -2) + (sig.at(-2) === 'A' ? 'B' : 'A') + sig.at(-1);
		const tampered = [
			`${id64}.news.${flipped}`,
			// the same signature for another topic, or for another member
			`${id64}.upkeep.${sig}`,
			`${id64}.announcements.${sig}`,
			`${Buffer.from(other.id).toString('base64url')}.news.${sig}`,
			// mail the member cannot turn off has no link; the old kind of link, and nonsense
			`${id64}.account.${sig}`,
			'0123456789abcdef0123456789abcdef',
			`${id64}.news`
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
		const path = pathOf(person.id, 'news');
		// Without our Origin, the page's own form (here: subscribing again) is refused.
		expect((await oneClick(path, false, 'subscribed=on')).status).toBe(403);
		expect((await oneClick(path, false, 'List-Unsubscribe=One-Click&subscribed=on')).status).toBe(403);
		// The one-click body elsewhere is refused as any cross-site post.
		expect((await oneClick('/account?/revokeAll')).status).toBe(403);
		expect((await oneClick('/signout')).status).toBe(403);
		expect(await settingsOf(person.id)).toEqual({ a: true, d: true });
	});
});
