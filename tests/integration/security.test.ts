// Findings of a security review of the running app, each checked here so it cannot come back:
// links built from request headers, cross-site requests without a form body, cookies on
// cacheable responses, caching of private content, superseded sign-in links, Auth.js's own
// paths without our headers, and unreadable bodies answered with a 500.
import http from 'node:http';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, test } from 'vitest';
import { and, eq, isNotNull } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { sessions } from '../../src/lib/server/club/schema';
import { outbox } from '../../src/lib/server/mail/schema';
import { tanks } from '../../src/lib/server/journals/schema';
import { media } from '../../src/lib/server/media/schema';
import { appUrl, mailApiUrl } from '../helpers/env';
import { request } from '../helpers/http';
import { waitForMail, type FakeMail } from '../helpers/mail';
import { makePerson, uniqueEmail, SESSION_COOKIE } from '../helpers/people';

const origin = () => new URL(appUrl()).origin;

/** A request with exactly the headers given (fetch would set Host itself). */
function raw(path: string, options: { method?: string; headers?: Record<string, string>; body?: string | Buffer } = {}) {
	const url = new URL(appUrl() + path);
	return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }>((resolve, reject) => {
		const req = http.request(
			{ host: url.hostname, port: url.port, path: url.pathname + url.search, method: options.method ?? 'GET', headers: options.headers },
			(res) => {
				let body = '';
				res.setEncoding('utf8');
				res.on('data', (c) => (body += c));
				res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
			}
		);
		req.on('error', reject);
		if (options.body) req.write(options.body);
		req.end();
	});
}

/** Every absolute URL in a mail: hrefs and srcs of its HTML, addresses in its text and headers. */
function urlsIn(mail: { html: string; text: string; headers?: Record<string, string> | null }): string[] {
	const found = [
		...[...mail.html.matchAll(/(?:href|src)\s*=\s*"([^"]*)"/gi)].map((m) => m[1]!.replace(/&amp;/g, '&')),
		...[...mail.html.matchAll(/https?:\/\/[^\s"'<>]+/gi)].map((m) => m[0]),
		...[...mail.text.matchAll(/https?:\/\/\S+/gi)].map((m) => m[0]),
		...Object.values(mail.headers ?? {}).flatMap((v) => [...String(v).matchAll(/https?:\/\/[^\s<>,]+/gi)].map((m) => m[0]))
	];
	return found.filter((u) => !u.startsWith('mailto:'));
}

function expectOnOrigin(urls: string[], where: string) {
	for (const url of urls) {
		expect(new URL(url, 'http://not-absolute.invalid').origin, `${where}: ${url}`).toBe(origin());
	}
}

async function askForLink(email: string, headers: Record<string, string>) {
	const body = new URLSearchParams({ email, redirectTo: '/journals' }).toString();
	return raw('/signin', {
		method: 'POST',
		headers: {
			host: new URL(appUrl()).host,
			origin: origin(),
			accept: 'text/html',
			'content-type': 'application/x-www-form-urlencoded',
			'content-length': String(Buffer.byteLength(body)),
			...headers
		},
		body
	});
}

describe('links the app sends are built on ORIGIN', () => {
	const forged: [string, Record<string, string>][] = [
		['Host', { host: 'attacker.example' }],
		['X-Forwarded-Host', { 'x-forwarded-host': 'attacker.example', 'x-forwarded-proto': 'https' }],
		['Forwarded', { forwarded: 'for=198.51.100.7;host=attacker.example;proto=https' }],
		['all of them', { host: 'attacker.example:8443', 'x-forwarded-host': 'evil.example', forwarded: 'host=evil.example', 'x-forwarded-proto': 'https' }]
	];
	test.each(forged)('a sign-in link asked for with a forged %s points at ORIGIN', async (_label, headers) => {
		const email = uniqueEmail('forged');
		const response = await askForLink(email, headers);
		expect(response.status).toBe(302);
		expect(new URL(response.headers.location!, 'http://relative.invalid').origin).toMatch(new RegExp(`^(${origin()}|http://relative.invalid)$`));
		const mail = await waitForMail(email, { subject: /Sign in/ });
		const urls = urlsIn(mail);
		expect(urls.some((u) => u.includes('/auth/callback/'))).toBe(true);
		expectOnOrigin(urls, 'sign-in mail');
		for (const u of urls.filter((u) => u.includes('/auth/callback/'))) {
			expectOnOrigin([new URL(u).searchParams.get('callbackUrl')!], 'callbackUrl');
		}
	});

	test('every mail queued or delivered so far links only to ORIGIN', async () => {
		// The demo seed queues results announcements, entrants' mails and swap notices; other
		// tests add sign-in mails, digests and reminders. Whatever kind a mail is, its links are ours.
		const queued = await db.select({ html: outbox.htmlBody, text: outbox.textBody, headers: outbox.headers, topic: outbox.topic }).from(outbox);
		expect(queued.length).toBeGreaterThan(0);
		for (const row of queued)
			expectOnOrigin(urlsIn({ html: row.html, text: row.text, headers: row.headers as Record<string, string> | null }), `outbox ${row.topic}`);
		const delivered = (await (await fetch(`${mailApiUrl()}/api/messages`)).json()) as FakeMail[];
		for (const mail of delivered) expectOnOrigin(urlsIn(mail), `delivered "${mail.subject}"`);
	});
});

describe('sign-in links', () => {
	test('a newer link retires the earlier unused one', async () => {
		const email = uniqueEmail('superseded');
		expect((await request('/signin', { form: { email } })).status).toBe(302);
		const first = await waitForMail(email, { subject: /Sign in/ });
		expect((await request('/signin', { form: { email } })).status).toBe(302);
		const deadline = Date.now() + 15_000;
		let second: FakeMail | undefined;
		while (!second && Date.now() < deadline) {
			second = ((await (await fetch(`${mailApiUrl()}/api/messages?to=${encodeURIComponent(email)}`)).json()) as FakeMail[]).find((m) => m.id !== first.id);
			if (!second) await new Promise((r) => setTimeout(r, 200));
		}
		const linkOf = (m: FakeMail) =>
			urlsIn(m)
				.find((u) => u.includes('/auth/callback/'))!
				.replace(origin(), '');
		const old = await request(linkOf(first));
		expect(old.headers.get('location')).toContain('/signin/problem');
		const fresh = await request(linkOf(second!));
		expect(fresh.headers.get('set-cookie')).toMatch(/authjs\.session-token=/);
	});
});

/** Every `+server.ts` handler that changes something, found from the route files themselves. */
function stateChangingEndpoints(): { path: string; method: string; json: boolean }[] {
	const routes = join(import.meta.dirname, '../../src/routes');
	const found: { path: string; method: string; json: boolean }[] = [];
	const walk = (dir: string) => {
		for (const name of readdirSync(dir)) {
			const full = join(dir, name);
			if (statSync(full).isDirectory()) walk(full);
			else if (name === '+server.ts') {
				const source = readFileSync(full, 'utf8');
				const path =
					'/' +
					relative(routes, dir)
						.split('/')
						.filter((s) => !/^\(.*\)$/.test(s))
						.map((s) => (s.startsWith('[') ? '1' : s))
						.join('/');
				for (const m of source.matchAll(/export (?:const|async function) (POST|PUT|PATCH|DELETE)\b/g)) {
					found.push({ path, method: m[1]!, json: source.includes('request.json()') });
				}
			}
		}
	};
	walk(routes);
	return found;
}

describe('state-changing endpoints refuse requests from other sites', () => {
	const endpoints = stateChangingEndpoints();
	test('there are endpoints to check', () => {
		expect(endpoints.map((e) => `${e.method} ${e.path}`)).toContain('POST /api/judging/1/1/card/reopen');
	});
	test.each(endpoints)('$method $path', async ({ path, method, json }) => {
		const person = await makePerson({ role: 'admin' });
		const host = new URL(appUrl()).host;
		const attempts: Record<string, string>[] = [
			{ origin: 'https://attacker.example' },
			{ origin: 'null' },
			{ 'sec-fetch-site': 'cross-site' },
			{ 'sec-fetch-site': 'same-site' },
			{}
		];
		for (const headers of attempts) {
			const response = await raw(path, { method, headers: { host, cookie: person.cookie, accept: 'application/json', 'content-length': '0', ...headers } });
			expect(response.status, JSON.stringify(headers)).toBe(403);
		}
		if (json) {
			const body = '{}';
			const response = await raw(path, {
				method,
				headers: { host, cookie: person.cookie, origin: origin(), 'content-type': 'text/plain', 'content-length': String(body.length) },
				body
			});
			expect(response.status).toBe(415);
		}
	});
});

describe('caching and cookies', () => {
	async function sessionDueForRenewal() {
		const person = await makePerson();
		// Made 29 days ago by the clock of its end: a day of use has passed, so the end is due to move.
		await db
			.update(sessions)
			.set({ expires: new Date(Date.now() + 29 * 86_400_000 - 60_000) })
			.where(eq(sessions.sessionToken, person.token));
		return person;
	}

	async function publicPhoto() {
		const [row] = await db
			.select({ id: media.id, tankId: tanks.id })
			.from(media)
			.innerJoin(tanks, and(eq(media.scope, 'tank'), eq(media.scopeId, tanks.id)))
			.where(and(eq(tanks.visibility, 'public'), isNotNull(media.scopeId)))
			.limit(1);
		if (!row) throw new Error('The demo club has no public tank with a photo.');
		return row;
	}

	test('a response marked public never carries a cookie, and the session is renewed at most daily', async () => {
		const person = await sessionDueForRenewal();
		const photo = await publicPhoto();
		for (const path of [`/journals/${photo.tankId}/feed.xml`, `/media/${photo.id}/thumb`]) {
			const response = await request(path, { cookie: person.cookie, accept: '*/*' });
			expect(response.status, path).toBe(200);
			expect(response.headers.get('cache-control'), path).toMatch(/public/);
			expect(response.headers.get('set-cookie'), path).toBeNull();
		}
		const page = await request('/account', { cookie: person.cookie });
		expect(page.status).toBe(200);
		const cookie = page.headers.get('set-cookie') ?? '';
		expect(cookie).toContain(`${SESSION_COOKIE}=${person.token}`);
		const [stored] = await db.select().from(sessions).where(eq(sessions.sessionToken, person.token));
		expect(stored!.expires.getTime()).toBeGreaterThan(Date.now() + 29.5 * 86_400_000);
		// Renewed: the next pages send no cookie.
		const again = await request('/account', { cookie: person.cookie });
		expect(again.headers.get('set-cookie')).toBeNull();
		const other = await request('/journals', { cookie: person.cookie });
		expect(other.headers.get('set-cookie')).toBeNull();
	});

	test('private pages and data are never stored by a cache', async () => {
		const admin = await makePerson({ role: 'admin' });
		for (const path of ['/account', '/admin', '/admin/members', '/swaps/mine', '/journals', '/api/me']) {
			const response = await request(path, { cookie: admin.cookie });
			expect(response.status, path).toBe(200);
			expect(response.headers.get('cache-control'), path).toMatch(/private/);
			expect(response.headers.get('cache-control'), path).toMatch(/no-store/);
		}
	});

	test('a photo that is not public is kept only briefly and asked for again', async () => {
		const [row] = await db
			.select({ id: media.id, ownerId: media.ownerId })
			.from(media)
			.innerJoin(tanks, and(eq(media.scope, 'tank'), eq(media.scopeId, tanks.id)))
			.where(eq(tanks.visibility, 'club'))
			.limit(1);
		const member = await makePerson();
		const response = await request(`/media/${row!.id}/thumb`, { cookie: member.cookie, accept: '*/*' });
		expect(response.status).toBe(200);
		const cache = response.headers.get('cache-control') ?? '';
		expect(cache).toMatch(/private/);
		expect(cache).not.toMatch(/immutable/);
		expect(Number(/max-age=(\d+)/.exec(cache)?.[1] ?? 0)).toBeLessThanOrEqual(300);
		expect(cache).toMatch(/must-revalidate|no-cache/);
		expect(response.headers.get('vary')).toMatch(/cookie/i);
		expect(response.headers.get('set-cookie')).toBeNull();
	});
});

describe("Auth.js's own paths", () => {
	test.each(['/auth/session', '/auth/csrf', '/auth/providers', '/auth/signout', '/auth/error', '/auth/verify-request', '/auth/signin'])(
		'%s answers with our security headers and never with its own page',
		async (path) => {
			const response = await request(path, { accept: 'text/html' });
			expect(response.headers.get('x-content-type-options')).toBe('nosniff');
			expect(response.headers.get('x-frame-options')).toBe('DENY');
			expect(response.headers.get('content-security-policy')).toBeTruthy();
			const type = response.headers.get('content-type') ?? '';
			if (response.status === 200) expect(type).not.toContain('text/html');
		}
	);
});

describe('bodies that cannot be read get a 400, never a 500', () => {
	test('a truncated multipart body to a form action', async () => {
		const member = await makePerson();
		const boundary = '----riparia-test-boundary';
		const body = `--${boundary}\r\nContent-Disposition: form-data; name="name"\r\n\r\nHalf a tank`;
		const response = await raw('/journals/new', {
			method: 'POST',
			headers: {
				host: new URL(appUrl()).host,
				origin: origin(),
				cookie: member.cookie,
				'content-type': `multipart/form-data; boundary=${boundary}`,
				'content-length': String(Buffer.byteLength(body))
			},
			body
		});
		expect(response.status).toBe(400);
		expect(response.body).toMatch(/could not read/i);
	});

	test('invalid JSON to an endpoint that takes JSON', async () => {
		const member = await makePerson();
		const response = await fetch(appUrl() + '/api/markdown/preview', {
			method: 'POST',
			headers: { cookie: member.cookie, origin: origin(), 'content-type': 'application/json' },
			body: '{"markdown": "unterminated'
		});
		expect(response.status).toBe(400);
	});

	test('an oversized text body', async () => {
		const member = await makePerson();
		// On a connection of its own: the app answers without reading the body and resets the
		// connection, which must not be one a later test's fetch is handed from the shared pool.
		const body = new URLSearchParams({ name: 'x'.repeat(700_000) }).toString();
		const response = await raw('/journals/new', {
			method: 'POST',
			headers: {
				host: new URL(appUrl()).host,
				cookie: member.cookie,
				origin: origin(),
				'content-type': 'application/x-www-form-urlencoded',
				'content-length': String(Buffer.byteLength(body))
			},
			body
		});
		expect(response.status).toBe(400);
		expect(response.body).toMatch(/more text than/i);
	});
});

describe('the admin and judging sections are refused before any route runs', () => {
	test('a member asking for an admin page by an encoded path gets the site’s 403 page', async () => {
		const member = await makePerson({ role: 'member' });
		const page = await request('/%61dmin/members', { cookie: member.cookie });
		expect(page.status).toBe(403);
		expect(await page.text()).toContain('data-testid="error-page"');
	});

	test('a member’s form posted with use:enhance gets an error result, and the action never runs', async () => {
		const member = await makePerson({ role: 'member' });
		const name = `Forbidden Fen ${crypto.randomUUID().slice(0, 6)}`;
		const response = await request('/admin/areas?/add', {
			cookie: member.cookie,
			form: { name, lat: '10', lng: '10' },
			accept: 'application/json',
			headers: { 'x-sveltekit-action': 'true' }
		});
		expect(response.status).toBe(403);
		expect(await response.json()).toEqual({ type: 'error', error: { message: 'This part of Riparia is for admins only.' } });
		const admin = await makePerson({ role: 'admin' });
		expect(await (await request('/admin/areas', { cookie: admin.cookie })).text()).not.toContain(name);
	});

	test('client-side navigation into a section gets JSON: a redirect signed out, a 403 for the wrong role', async () => {
		const signedOut = await request('/admin/members/__data.json');
		expect(signedOut.status).toBe(200);
		expect(await signedOut.json()).toMatchObject({ type: 'redirect', location: '/signin?redirectTo=%2Fadmin%2Fmembers' });
		const judge = await makePerson({ role: 'judge' });
		const refused = await request('/admin/members/__data.json', { cookie: judge.cookie });
		expect(refused.status).toBe(403);
		expect(await refused.json()).toMatchObject({ code: 'forbidden', message: 'This part of Riparia is for admins only.' });
		expect((await request('/judging/__data.json', { cookie: judge.cookie })).status).toBe(200);
	});
});
