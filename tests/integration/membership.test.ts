// Membership: the three join policies end to end (on an instance with a database of its own, so
// changing the policy touches no other test), the pending applicant kept to public pages, and
// suspension (on the stack's app).
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { and, count, eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { sessions, users } from '../../src/lib/server/club/schema';
import { auditLog } from '../../src/lib/server/audit/schema';
import * as settings from '../../src/lib/server/club/settings';
import * as membership from '../../src/lib/server/club/membership';
import * as suspension from '../../src/lib/server/club/suspension';
import * as listingDetail from '../../src/lib/server/swaps/listing-detail';
import * as nearby from '../../src/lib/server/swaps/nearby';
import { toViewer } from '../../src/lib/server/club/users';
import type { JoinPolicy } from '../../src/lib/club/membership';
import type { Viewer } from '../../src/lib/club/viewer';
import { parseBoardQuery } from '../../src/lib/swaps/board-filter';
import { request } from '../helpers/http';
import { linksIn, waitForMail } from '../helpers/mail';
import { makePerson, SESSION_COOKIE, uniqueEmail } from '../helpers/people';
import { createListing, placePerson, token, viewerOf } from '../helpers/swaps';
import { appUrl } from '../helpers/env';
import { scratchDatabase } from '../helpers/scratch-db';
import { startInstance, type AppInstance } from '../helpers/instance';

/** Signs a new address in through the sign-in link, as a browser would; returns its session cookie. */
async function signInAs(email: string, base?: string): Promise<string> {
	expect((await request('/signin', { form: { email, redirectTo: '/' }, base })).status).toBe(302);
	const mail = await waitForMail(email, { subject: /Sign in/ });
	const link = linksIn(mail).find((l) => l.includes('/auth/callback/'))!;
	const response = await request(link.replace(/^https?:\/\/[^/]+/, ''), { base });
	const cookie = /authjs\.session-token=([^;]+)/.exec(response.headers.get('set-cookie') ?? '')?.[1];
	expect(cookie, `signed in (${response.headers.get('location')})`).toBeTruthy();
	return `${SESSION_COOKIE}=${cookie}`;
}

const auditRows = async (action: string, subjectId: string, context = db) =>
	(
		await context
			.select({ n: count() })
			.from(auditLog)
			.where(and(eq(auditLog.action, action), eq(auditLog.subjectId, subjectId)))
	)[0]!.n;

describe('join policies, end to end', () => {
	let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
	let app: AppInstance;
	let admin: Viewer;
	let adminCookie: string;
	const at = (path: string, options: Parameters<typeof request>[1] = {}) => request(path, { ...options, base: app.url });

	const setPolicy = (joinPolicy: JoinPolicy) =>
		settings.save(admin, { name: 'Test club', description: '', contactEmail: 'committee@tests.riparia.test', joinPolicy }, { db: scratch.db });

	beforeAll(async () => {
		scratch = await scratchDatabase();
		// Same ORIGIN as the stack's app, so the test's requests pass the origin check and links are the stack's.
		app = await startInstance({ databaseUrl: scratch.url, logName: 'membership-instance', env: { ORIGIN: appUrl(), OUTBOX_POLL_MS: '200' } });
		const id = crypto.randomUUID();
		await scratch.db.insert(users).values({ id, email: uniqueEmail('policy-admin'), role: 'admin', displayName: 'Policy Admin' });
		admin = toViewer((await scratch.db.select().from(users).where(eq(users.id, id)))[0]!);
		const sessionToken = crypto.randomUUID();
		await scratch.db.insert(sessions).values({ sessionToken, userId: id, expires: new Date(Date.now() + 86_400_000) });
		adminCookie = `${SESSION_COOKIE}=${sessionToken}`;
	}, 90_000);

	afterAll(async () => {
		await app?.stop();
		await scratch?.drop();
	});

	test('open: whoever signs in is a member at once', async () => {
		await setPolicy('open');
		const cookie = await signInAs(uniqueEmail('open'), app.url);
		// A member is asked for a display name first (askForDisplayName), as every newcomer is.
		expect((await at('/journals', { cookie })).headers.get('location')).toMatch(/^\/welcome/);
		expect((await at('/welcome', { cookie, form: { displayName: 'Open Newcomer' } })).status).toBe(303);
		expect((await at('/journals', { cookie })).status).toBe(200);
		expect((await at('/swaps', { cookie })).status).toBe(200);
	});

	test('by approval: the applicant sees only public pages and their request until an admin approves; they are mailed', async () => {
		await setPolicy('approval');
		const email = uniqueEmail('applicant');
		const cookie = await signInAs(email, app.url);

		// Members-only pages send them to their membership page; API routes refuse; public pages stay open.
		for (const path of ['/journals', '/swaps', '/swaps/new', '/account']) {
			const response = await at(path, { cookie });
			expect(response.status, path).toBe(303);
			expect(response.headers.get('location'), path).toBe('/membership');
		}
		expect((await at('/api/swaps/listings', { cookie, accept: 'application/json' })).status).toBe(403);
		expect((await at('/admin', { cookie })).status).toBe(303);
		expect((await at('/judging', { cookie })).status).toBe(303);
		expect((await at('/journals/showcase', { cookie })).status).toBe(200);
		// The home page sends them on to where their membership stands.
		expect((await at('/', { cookie })).headers.get('location')).toBe('/membership');

		const page = await at('/membership', { cookie });
		expect(page.status).toBe(200);
		expect(await page.text()).toContain('Send my request');
		const sent = await at('/membership?/request', { cookie, form: { displayName: 'Reed Applicant', note: 'I keep a 40-litre crypt tank.' } });
		expect(sent.status).toBe(200);
		const waiting = await (await at('/membership', { cookie })).text();
		expect(waiting).toContain('is waiting for an admin');
		expect(waiting).toContain('I keep a 40-litre crypt tank.');

		const [request] = (await membership.pendingRequests(admin, { db: scratch.db })).filter((r) => r.email === email);
		expect(request).toMatchObject({ name: 'Reed Applicant', note: 'I keep a 40-litre crypt tank.' });
		const decided = await at('/admin/members?/decide', {
			cookie: adminCookie,
			form: { requestId: String(request!.id), decision: 'approve', message: 'Welcome aboard.' }
		});
		expect(decided.status).toBe(200);
		expect(await auditRows('membership.approve', request!.userId, scratch.db)).toBe(1);

		const mail = await waitForMail(email, { subject: /now a member/ });
		expect(mail.text).toContain('Welcome aboard.');
		// The same session now opens members' pages.
		expect((await at('/journals', { cookie })).status).toBe(200);
		// Answered once only.
		const again = await at('/admin/members?/decide', { cookie: adminCookie, form: { requestId: String(request!.id), decision: 'decline', message: '' } });
		expect(again.status).toBe(409);
	});

	test('by approval: a declined applicant is mailed the message and stays outside', async () => {
		await setPolicy('approval');
		const email = uniqueEmail('declined');
		const cookie = await signInAs(email, app.url);
		await at('/membership?/request', { cookie, form: { displayName: 'Fen Declined', note: '' } });
		const [request] = (await membership.pendingRequests(admin, { db: scratch.db })).filter((r) => r.email === email);
		await membership.decide(admin, request!.id, 'decline', 'We only take members from the valley.', { db: scratch.db });
		expect(await auditRows('membership.decline', request!.userId, scratch.db)).toBe(1);
		const mail = await waitForMail(email, { subject: /request to join/ });
		expect(mail.text).toContain('We only take members from the valley.');
		const page = await (await at('/membership', { cookie })).text();
		expect(page).toContain('We only take members from the valley.');
		expect((await at('/swaps', { cookie })).headers.get('location')).toBe('/membership');
	});

	test('by invitation: anyone else who signs in is told so and sees only public pages', async () => {
		await setPolicy('invitation');
		const cookie = await signInAs(uniqueEmail('uninvited'), app.url);
		const page = await (await at('/membership', { cookie })).text();
		expect(page).toContain('by invitation only');
		expect(page).not.toContain('Send my request');
		expect((await at('/membership?/request', { cookie, form: { displayName: 'Pushy Person', note: 'let me in' } })).status).toBe(409);
		expect((await at('/journals', { cookie })).headers.get('location')).toBe('/membership');
		expect((await at('/swaps', { cookie })).headers.get('location')).toBe('/membership');
		expect((await at('/journals/showcase', { cookie })).status).toBe(200);
	});

	test('the settings change itself is audited once, with before and after', async () => {
		await setPolicy('open');
		const before = await auditRows('club.settings', '1', scratch.db);
		await setPolicy('approval');
		const rows = await scratch.db.select().from(auditLog).where(eq(auditLog.action, 'club.settings'));
		expect(rows).toHaveLength(before + 1);
		expect(rows.at(-1)).toMatchObject({ actorId: admin.id, before: { joinPolicy: 'open' }, after: { joinPolicy: 'approval' } });
	});
});

describe('suspension', () => {
	test('signs the member out everywhere at once, blocks sign-in, hides their listings and keeps their data; reinstating restores it', async () => {
		const admin = await makePerson({ role: 'admin' });
		const member = await makePerson({ label: 'suspendee' });
		const other = await makePerson({ label: 'onlooker' });
		const second = await makePerson({ label: 'unused' }); // a second session of the member's
		await db.update(sessions).set({ userId: member.id }).where(eq(sessions.sessionToken, second.token));
		await placePerson(member, { lat: -41.5, lng: -21.5 });
		const tag = token('suspended');
		const listingId = await createListing(member, { title: `Stems ${tag}` });
		const onBoard = async () => (await nearby.search(viewerOf(other), parseBoardQuery(new URLSearchParams({ q: tag })))).rows.map((r) => r.id);
		expect(await onBoard()).toEqual([listingId]);
		expect((await request('/account', { cookie: member.cookie })).status).toBe(200);

		const refused = await request('/admin/members?/suspend', { cookie: admin.cookie, form: { userId: member.id, reason: '' } });
		expect(refused.status).toBe(400);
		const done = await request('/admin/members?/suspend', { cookie: admin.cookie, form: { userId: member.id, reason: 'Repeated rude messages' } });
		expect(done.status).toBe(200);

		// The very next request with either existing session is a signed-out visitor's.
		for (const cookie of [member.cookie, `${SESSION_COOKIE}=${second.token}`]) {
			const response = await request('/account', { cookie });
			expect(response.status).toBe(303);
			expect(response.headers.get('location')).toMatch(/^\/signin\?redirectTo=/);
		}
		expect((await db.select({ n: count() }).from(sessions).where(eq(sessions.userId, member.id)))[0]!.n).toBe(0);
		expect(await onBoard()).toEqual([]);
		expect(await listingDetail.get(viewerOf(other), listingId)).toBeNull();
		expect(await listingDetail.get(viewerOf(admin), listingId)).not.toBeNull();
		expect(await auditRows('member.suspend', member.id)).toBe(1);

		// A sign-in link is still sent (the form tells nobody who is suspended) but refused when used.
		expect((await request('/signin', { form: { email: member.email, redirectTo: '/' } })).status).toBe(302);
		const mail = await waitForMail(member.email, { subject: /Sign in/ });
		const link = linksIn(mail).find((l) => l.includes('/auth/callback/'))!;
		const used = await request(link.replace(/^https?:\/\/[^/]+/, ''));
		expect(used.headers.get('location')).toContain('error=AccessDenied');
		expect(used.headers.get('set-cookie') ?? '').not.toMatch(/authjs\.session-token=[^;]/);

		await suspension.reinstate(viewerOf(admin), member.id);
		expect(await auditRows('member.reinstate', member.id)).toBe(1);
		expect(await onBoard()).toEqual([listingId]);
		const [row] = await db.select().from(users).where(eq(users.id, member.id));
		expect(row).toMatchObject({ state: 'active', stateReason: null });
	});

	test('an admin cannot be suspended, nor can the one suspending', async () => {
		const admin = await makePerson({ role: 'admin' });
		const other = await makePerson({ role: 'admin' });
		await expect(suspension.suspend(viewerOf(admin), other.id, 'no reason')).rejects.toMatchObject({ status: 409, code: 'admin' });
		const judge = await makePerson({ role: 'judge' });
		await expect(suspension.suspend(viewerOf(judge), admin.id, 'coup')).rejects.toMatchObject({ status: 403 });
	});
});

describe('the audit log is append-only', () => {
	test("the application's database user can neither change nor remove a row", async () => {
		const admin = await makePerson({ role: 'admin' });
		const member = await makePerson();
		await request('/admin/members?/role', { cookie: admin.cookie, form: { userId: member.id, role: 'judge' } });
		const [row] = await db
			.select()
			.from(auditLog)
			.where(and(eq(auditLog.action, 'role.change'), eq(auditLog.subjectId, member.id)));
		expect(row).toMatchObject({ actorId: admin.id, before: { role: 'member' }, after: { role: 'judge' } });
		const refusal = (attempt: Promise<unknown>) =>
			attempt.then(
				() => 'done',
				(e: Error & { cause?: Error }) => e.cause?.message ?? e.message
			);
		expect(await refusal(db.update(auditLog).set({ action: 'role.forged' }).where(eq(auditLog.id, row!.id)))).toMatch(/append-only/);
		expect(await refusal(db.delete(auditLog).where(eq(auditLog.id, row!.id)))).toMatch(/append-only/);
		const [still] = await db.select().from(auditLog).where(eq(auditLog.id, row!.id));
		expect(still!.action).toBe('role.change');
	});

	test("removing a member's row keeps their audit rows with the bare id", async () => {
		const admin = await makePerson({ role: 'admin' });
		const member = await makePerson();
		await suspension.suspend(viewerOf(admin), member.id, 'test');
		await db.delete(users).where(eq(users.id, admin.id));
		const rows = await db.select().from(auditLog).where(eq(auditLog.subjectId, member.id));
		expect(rows.map((r) => r.actorId)).toEqual([admin.id]);
	});
});
