import { expect, test } from '@playwright/test';
import { eq } from 'drizzle-orm';
import { joinRequests, sessions, users } from '../../src/lib/server/club/schema';
import { linksIn, waitForMail } from '../helpers/mail';
import { SESSION_COOKIE, uniqueEmail } from '../helpers/people';
import { scratchDatabase } from '../helpers/scratch-db';
import { startInstance, type AppInstance } from '../helpers/instance';

// The club's policy is club-wide, so this runs on an app instance with a database of its own:
// switching the stack's club to invitations would change what other specs' newcomers see.
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
let app: AppInstance;
let adminToken: string;
let applicantToken: string;
const applicantEmail = uniqueEmail('e2e-applicant');

test.describe.configure({ mode: 'serial', timeout: 120_000 });

test.beforeAll(async () => {
	test.setTimeout(180_000);
	scratch = await scratchDatabase();
	app = await startInstance({ databaseUrl: scratch.url, logName: 'membership-e2e', env: { OUTBOX_POLL_MS: '200' } });
	const session = async (userId: string) => {
		const sessionToken = crypto.randomUUID();
		await scratch.db.insert(sessions).values({ sessionToken, userId, expires: new Date(Date.now() + 86_400_000) });
		return sessionToken;
	};
	const adminId = crypto.randomUUID();
	await scratch.db.insert(users).values({ id: adminId, email: uniqueEmail('e2e-club-admin'), role: 'admin', displayName: 'Club Admin' });
	adminToken = await session(adminId);
	const applicantId = crypto.randomUUID();
	await scratch.db.insert(users).values({ id: applicantId, email: applicantEmail, displayName: 'Waiting Wren', state: 'pending' });
	await scratch.db.insert(joinRequests).values({ userId: applicantId, note: 'I keep a 60-litre crypt tank.' });
	applicantToken = await session(applicantId);
});

test.afterAll(async () => {
	await app?.stop();
	await scratch?.drop();
});

const signedIn = async (browser: import('@playwright/test').Browser, token: string) => {
	const context = await browser.newContext({ baseURL: app.url });
	if (token) await context.addCookies([{ name: SESSION_COOKIE, value: token, url: app.url, httpOnly: true, sameSite: 'Lax' }]);
	return context;
};

test('an admin switches the club to invitation only and invites two people; one accepts and appears in the directory', async ({ browser }) => {
	const adminPage = await (await signedIn(browser, adminToken)).newPage();
	await adminPage.goto('/admin/settings');
	await adminPage.getByLabel('Club name').fill('Reedside Planted Tank Circle');
	await adminPage.getByLabel('Contact address').fill('committee@reedside.test');
	await adminPage.getByLabel(/By invitation only/).check();
	await adminPage.getByRole('button', { name: 'Save settings' }).click();
	await expect(adminPage.getByRole('status')).toHaveText('Saved.');

	const [first, second] = [uniqueEmail('e2e-invitee'), uniqueEmail('e2e-invitee')];
	await adminPage.goto('/admin/invitations');
	await adminPage.getByLabel('E-mail addresses to invite').fill(`${first}\n${second}, not-an-address`);
	await adminPage.getByRole('button', { name: 'Send invitations' }).click();
	await expect(adminPage.getByTestId('invite-outcome')).toContainText('Sent 2 invitations.');
	await expect(adminPage.getByTestId('invite-outcome')).toContainText('not-an-address');
	await expect(adminPage.getByTestId('invitation-row')).toHaveCount(2);

	const mail = await waitForMail(first, { subject: /Invitation to join Reedside Planted Tank Circle/ });
	const link = linksIn(mail).find((l) => l.includes('/join/'))!;
	const invitee = await (await signedIn(browser, '')).newPage();
	await invitee.goto(link);
	await invitee.getByRole('button', { name: 'Accept and sign in' }).click();
	await expect(invitee).toHaveURL(/\/welcome/);
	await invitee.getByLabel('Display name').fill('Invited Ida');
	await invitee.getByRole('button', { name: 'Save and continue' }).click();
	await invitee.goto('/members');
	await invitee.getByRole('button', { name: 'Show me in the directory' }).click();
	await expect(invitee.getByTestId('directory-card').filter({ hasText: 'Invited Ida' })).toBeVisible();

	// The link worked once.
	const again = await invitee.goto(link);
	expect(again?.status()).toBe(404);
	await adminPage.goto('/admin/invitations?state=accepted');
	await expect(adminPage.getByTestId('invitation-row')).toHaveAttribute('data-email', first);
});

test('the admin approves a pending applicant, who is mailed and becomes a member', async ({ browser }) => {
	const applicant = await (await signedIn(browser, applicantToken)).newPage();
	await applicant.goto('/journals');
	await expect(applicant).toHaveURL(/\/membership$/);
	await expect(applicant.getByTestId('request-waiting')).toBeVisible();

	const adminPage = await (await signedIn(browser, adminToken)).newPage();
	await adminPage.goto('/admin/members');
	const request = adminPage.getByTestId('join-request').filter({ hasText: 'Waiting Wren' });
	await expect(request).toContainText('I keep a 60-litre crypt tank.');
	await request.getByLabel(/Message to Waiting Wren/).fill('Welcome, see you at the plant sale.');
	await request.getByRole('button', { name: 'Approve' }).click();
	await expect(adminPage.getByRole('status')).toContainText('Request approved');
	await expect(adminPage.getByTestId('no-requests')).toBeVisible();

	const mail = await waitForMail(applicantEmail, { subject: /now a member/ });
	expect(mail.text).toContain('Welcome, see you at the plant sale.');
	await applicant.goto('/journals');
	await expect(applicant).toHaveURL(/\/journals$/);
	const [row] = await scratch.db.select().from(users).where(eq(users.email, applicantEmail));
	expect(row!.state).toBe('active');
});
