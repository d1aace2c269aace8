import { expect, test } from '@playwright/test';
import { linksIn, waitForMail } from '../helpers/mail';
import { makePerson, roleOf, uniqueEmail } from '../helpers/people';
import { contextFor } from './fixtures';

test('a newcomer signs in with the link from the mail, asks to join the club (it admits by approval) and signs out', async ({ page }) => {
	const email = uniqueEmail('e2e-new');
	await page.goto('/signin');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByRole('button', { name: 'Send me a sign-in link' }).click();
	await expect(page.getByTestId('check-email')).toBeVisible();

	const mail = await waitForMail(email, { subject: /Sign in/ });
	const link = linksIn(mail).find((l) => l.includes('/auth/callback/'));
	expect(link).toBeTruthy();
	await page.goto(link!);

	await expect(page).toHaveURL(/\/membership/);
	await page.getByLabel('Your name as members will see it').fill('x');
	await page.getByRole('button', { name: 'Send my request' }).click();
	await expect(page.getByRole('alert')).toContainText('at least 2 characters');
	await page.getByLabel('Your name as members will see it').fill('Quill Tester');
	await page.getByLabel('A short note for the admins').fill('I keep a small rimless tank.');
	await page.getByRole('button', { name: 'Send my request' }).click();
	await expect(page.getByTestId('request-waiting')).toBeVisible();
	// Members' pages stay closed until an admin says yes.
	await page.goto('/journals');
	await expect(page).toHaveURL(/\/membership$/);

	await page.getByRole('banner').getByRole('button', { name: 'Sign out' }).click();
	await expect(page.getByText('You are signed out')).toBeVisible();
	await page.goto('/account');
	await expect(page).toHaveURL(/\/signin\?redirectTo=%2Faccount/);
});

test('a member is refused the admin pages; an admin makes them a judge and it shows on their next request', async ({ browser }) => {
	const member = await makePerson({ role: 'member', displayName: 'Promotable Member' });
	const admin = await makePerson({ role: 'admin' });

	const memberContext = await contextFor(browser, member);
	const memberPage = await memberContext.newPage();
	const refused = await memberPage.goto('/admin');
	expect(refused?.status()).toBe(403);
	await expect(memberPage.getByTestId('error-page')).toContainText('for admins only');
	await expect(memberPage.getByRole('link', { name: 'Judging' })).toHaveCount(0);

	const adminContext = await contextFor(browser, admin);
	const adminPage = await adminContext.newPage();
	await adminPage.goto(`/admin/members?q=${encodeURIComponent(member.email)}`);
	const row = adminPage.locator(`[data-testid="member-row"][data-email="${member.email}"]`);
	await row.getByLabel(/Role for/).selectOption('judge');
	await row.getByRole('button', { name: 'Change' }).click();
	await expect(adminPage.getByRole('status')).toContainText('Role changed to Judge');
	expect(await roleOf(member.id)).toBe('judge');

	await memberPage.goto('/account');
	await expect(memberPage.getByText('Judge ·', { exact: false })).toBeVisible();
	await expect(memberPage.getByRole('banner').getByRole('link', { name: 'Judging' })).toBeVisible();
	await memberContext.close();
	await adminContext.close();
});
