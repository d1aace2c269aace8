import { expect, test } from '@playwright/test';
import { makePerson } from '../helpers/people';
import { linksIn, waitForMail } from '../helpers/mail';
import { token } from '../helpers/swaps';
import * as preferences from '../../src/lib/server/mail/preferences';
import { contextFor } from './fixtures';

test('an admin posts news to all members; the mail arrives with a working unsubscribe link, and a recipient unsubscribes', async ({ browser }) => {
	test.setTimeout(180_000);
	const admin = await makePerson({ role: 'admin', displayName: 'Odile Newsome' });
	const reader = await makePerson({ displayName: 'Perrin Readwell' });
	const title = `Autumn plant swap ${token('e2e')}`;

	const adminContext = await contextFor(browser, admin);
	const page = await adminContext.newPage();
	await page.goto('/admin/news/new');
	await page.getByLabel('Title').fill(title);
	await page.getByLabel('Post', { exact: true }).fill('Bring **cuttings** and a bag.\n\n- stems\n- mosses');
	await page.getByLabel('Everyone (on the news page and in the feed)').check();
	await page.getByLabel('All members').check();
	await page.getByRole('button', { name: 'Save the draft' }).click();
	await expect(page).toHaveURL(/\/admin\/news\/\d+$/);
	await expect(page.getByTestId('news-preview').locator('strong')).toHaveText('cuttings');

	await page.getByRole('button', { name: 'Send me a test' }).click();
	await expect(page.getByText(`A test copy is on its way to ${admin.email}`)).toBeVisible();
	const testCopy = await waitForMail(admin.email, { subject: /^\[Test\] /, timeoutMs: 30_000 });
	expect(testCopy.subject).toBe(`[Test] ${title}`);

	await page.getByRole('button', { name: 'Publish' }).click();
	await expect(page.getByRole('alert')).toContainText('Tick the box');
	await page.getByLabel(/I have read the post/).check();
	await page.getByRole('button', { name: 'Publish' }).click();
	await expect(page.getByTestId('news-published')).toBeVisible();
	await expect(page.getByTestId('delivery-summary')).toBeVisible();

	// The reader's copy, with the one-click link of club news in its footer.
	const mail = await waitForMail(reader.email, { subject: new RegExp(title), timeoutMs: 120_000 });
	expect(mail.text).toContain('cuttings');
	const unsubscribe = linksIn(mail).find((l) => l.includes('/unsubscribe/'));
	expect(unsubscribe).toMatch(/\/unsubscribe\/[\w-]+\.news\.[\w-]{43}$/);
	expect(mail.headers['list-unsubscribe']).toContain(unsubscribe);
	expect(linksIn(mail)).toContain(new URL('/account/notifications', unsubscribe).toString());

	// Opened in a browser that is not signed in.
	const visitor = await browser.newContext();
	const inbox = await visitor.newPage();
	await inbox.goto(unsubscribe!);
	await expect(inbox.getByText('Stop sending club news to')).toBeVisible();
	await inbox.getByRole('button', { name: 'Unsubscribe' }).click();
	await expect(inbox.getByRole('status')).toContainText('no longer gets club news');
	expect((await preferences.of(reader.id)).news).toBe('off');
	expect((await preferences.of(reader.id)).swaps).toBe('immediately');

	// The post is on the public news page.
	await inbox.goto('/news');
	await expect(inbox.getByRole('heading', { name: title })).toBeVisible();
	await visitor.close();
	await adminContext.close();
});
