import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { verificationTokens } from '../../src/lib/server/club/schema';
import { checkAndRecord } from '../../src/lib/server/club/sign-in-limit';
import { request } from '../helpers/http';
import { linksIn, waitForMail } from '../helpers/mail';
import { uniqueEmail } from '../helpers/people';

async function requestLink(email: string, redirectTo = '/') {
	return request('/signin', { form: { email, redirectTo } });
}

describe('sign-in links', () => {
	test('a link arrives, expires after 10 minutes, signs in once and only once', async () => {
		const email = uniqueEmail('link');
		const asked = Date.now();
		const response = await requestLink(email, '/account');
		expect(response.status).toBe(302);
		const mail = await waitForMail(email, { subject: /Sign in/ });
		const link = linksIn(mail).find((l) => l.includes('/auth/callback/'))!;
		expect(link).toBeTruthy();
		expect(mail.html).toContain('Sign in to Riparia');

		const [token] = await db.select().from(verificationTokens).where(eq(verificationTokens.identifier, email));
		const lifetime = token!.expires.getTime() - asked;
		expect(lifetime).toBeGreaterThan(9 * 60_000);
		expect(lifetime).toBeLessThanOrEqual(10 * 60_000 + 5_000);

		const path = link.replace(/^https?:\/\/[^/]+/, '');
		const first = await request(path);
		expect(first.status).toBe(302);
		expect(first.headers.get('location')).toMatch(/\/account$/);
		expect(first.headers.get('set-cookie')).toMatch(/authjs\.session-token=.+HttpOnly; SameSite=Lax/);

		const second = await request(path);
		expect(second.headers.get('location')).toContain('/signin/problem?error=Verification');
	});

	test('the destination after sign-in is always one of our own paths', async () => {
		for (const hostile of ['https://evil.example/phish', '//evil.example/x', '/\\evil.example', 'javascript:alert(1)']) {
			const email = uniqueEmail('redirect');
			await requestLink(email, hostile);
			const mail = await waitForMail(email);
			const link = new URL(linksIn(mail).find((l) => l.includes('/auth/callback/'))!);
			const callback = new URL(link.searchParams.get('callbackUrl')!);
			expect(callback.origin).toBe(new URL(link).origin);
			expect(callback.pathname).toBe('/');
		}
	});

	test('a malformed address is refused at the field and nothing is sent', async () => {
		const response = await request('/signin', { form: { email: 'not-an-address' }, accept: 'text/html' });
		expect(response.status).toBe(400);
		expect(await response.text()).toContain('Enter an e-mail address');
	});

	test('links are rate-limited per address', async () => {
		const email = uniqueEmail('limited');
		for (let i = 0; i < 5; i++) expect((await requestLink(email)).status).toBe(302);
		const refused = await requestLink(email);
		expect(refused.status).toBe(429);
		expect(await refused.text()).toContain('several links to this address');
	});

	test('links are rate-limited per client', async () => {
		const client = `198.51.100.${Math.floor(Math.random() * 200)}-${Date.now()}`;
		for (let i = 0; i < 3; i++) {
			expect(await checkAndRecord(uniqueEmail('client'), client, { perClient: 3, perAddress: 5 })).toEqual({ allowed: true });
		}
		expect(await checkAndRecord(uniqueEmail('client'), client, { perClient: 3, perAddress: 5 })).toMatchObject({ allowed: false, reason: 'client' });
	});

	test('sign-in links cannot be requested around our form', async () => {
		const response = await request('/auth/signin/nodemailer', { form: { email: uniqueEmail('direct') } });
		expect(response.status).toBe(404);
	});

	test('responses carry the security headers and a nonce-based CSP', async () => {
		const response = await request('/signin');
		const csp = response.headers.get('content-security-policy') ?? '';
		expect(csp).toMatch(/script-src 'self' 'nonce-[^']+'/);
		expect(csp).not.toContain('unsafe-eval');
		expect(response.headers.get('x-content-type-options')).toBe('nosniff');
		expect(response.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
		expect(response.headers.get('permissions-policy')).toContain('camera=()');
	});
});
