import { expect, test, type Browser, type Page } from '@playwright/test';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import { contestEntries } from '../../src/lib/server/contests/schema';
import { makePerson, type TestPerson } from '../helpers/people';
import { waitForMail } from '../helpers/mail';
import * as judging from '../../src/lib/server/contests/judging';
import { contestFixture, openTank, viewerOf } from '../helpers/contests';
import { contextFor } from './fixtures';

test.describe.configure({ mode: 'serial' });

async function pageFor(browser: Browser, person: TestPerson, width = 1280): Promise<Page> {
	const context = await contextFor(browser, person, { viewport: { width, height: 900 } });
	return context.newPage();
}

async function confirmStep(page: Page, label: string) {
	await page.getByRole('button', { name: `${label}…` }).click();
	const confirm = page.getByTestId('confirm-step');
	await confirm.getByRole('checkbox').check();
	await confirm.getByRole('button', { name: `Yes, ${label.toLowerCase()}` }).click();
}

test('a contest from set-up to announced results: rubric, panel, entries, blind scoring, publication, mail', async ({ browser }) => {
	test.setTimeout(240_000);
	const suffix = crypto.randomUUID().slice(0, 6);
	const admin = await makePerson({ role: 'admin', displayName: `Contest Admin ${suffix}` });
	const judges = [
		await makePerson({ role: 'judge', displayName: `First Judge ${suffix}` }),
		await makePerson({ role: 'judge', displayName: `Second Judge ${suffix}` })
	];
	const members = [await makePerson({ displayName: `Ada Entrant ${suffix}` }), await makePerson({ displayName: `Bo Entrant ${suffix}` })];
	for (const m of members) await openTank(m, `${m.displayName}'s tank`);
	const title = `Browser scapes ${suffix}`;

	// The admin writes the contest with a two-criterion rubric and one category.
	const adminPage = await pageFor(browser, admin);
	await adminPage.goto('/admin/contests/new');
	await adminPage.getByLabel('Title').fill(title);
	await adminPage.getByLabel('Rules', { exact: true }).fill('Photos of the tank as it is now.');
	await adminPage.getByRole('button', { name: 'Add a criterion' }).click();
	await adminPage.getByRole('button', { name: 'Add a criterion' }).click();
	await adminPage.getByLabel('Criterion 1', { exact: true }).fill('Layered depth');
	await adminPage.locator('[data-testid=criterion-row]').nth(0).getByLabel('Weight').fill('2');
	await adminPage.getByLabel('Criterion 2', { exact: true }).fill('Neat finish');
	await adminPage.locator('[data-testid=criterion-row]').nth(1).getByLabel('Points').fill('5');
	// Compare the finish first when entries are level.
	await adminPage.getByRole('button', { name: 'Compare Neat finish earlier' }).click();
	await expect(adminPage.getByTestId('tie-break').locator('li').first()).toContainText('Neat finish');
	await adminPage.getByRole('button', { name: 'Add a category' }).click();
	await adminPage.getByLabel('Category 1', { exact: true }).fill('Any size');
	await adminPage.getByRole('button', { name: 'Create the contest' }).click();
	await expect(adminPage).toHaveURL(/\/admin\/contests\/\d+\?created=1$/);
	const contestId = Number(/contests\/(\d+)/.exec(adminPage.url())![1]);

	await adminPage.getByRole('link', { name: 'Judges and progress' }).click();
	for (const judge of judges) {
		await adminPage.getByLabel('Add a judge').selectOption({ label: judge.displayName });
		await adminPage.getByRole('button', { name: 'Add to the panel' }).click();
		await expect(adminPage.getByTestId('panel')).toContainText(judge.displayName);
	}
	await adminPage.getByRole('link', { name: 'Overview' }).click();
	await confirmStep(adminPage, 'Open for entries');
	await expect(adminPage.getByTestId('step-done')).toBeVisible();

	// Two members enter their tanks.
	const photo = await sharp({ create: { width: 1200, height: 800, channels: 3, background: '#2f7a58' } })
		.jpeg()
		.toBuffer();
	for (const member of members) {
		const page = await pageFor(browser, member);
		await page.goto(`/contests/${contestId}`);
		await page.getByRole('link', { name: 'Enter a tank' }).click();
		await page.getByLabel(new RegExp(`${member.displayName}'s tank`)).check();
		await expect(page.getByLabel(/Any size/)).toBeChecked();
		await page.locator('input[type=file]').setInputFiles({ name: 'front.jpg', mimeType: 'image/jpeg', buffer: photo });
		await expect(page.getByTestId('first-photo-label')).toHaveText('Whole tank, from the front');
		await expect(page.locator('input[type=hidden][name="photos[0][id]"]')).toHaveCount(1, { timeout: 15_000 });
		await page.getByLabel('Statement for the judges', { exact: true }).fill('Stems behind a low lawn.');
		await page.getByRole('button', { name: 'Enter this tank' }).click();
		// One notice says both what happened and what may still be done.
		await expect(page.getByTestId('entry-status')).toHaveText(/^Your tank is entered\. You can change or withdraw it until /);
		await expect(page.locator('.notice')).toHaveCount(1);
		await page.context().close();
	}

	await adminPage.goto(`/admin/contests/${contestId}`);
	await confirmStep(adminPage, 'Close entries and start judging');
	await expect(adminPage.getByTestId('step-done')).toBeVisible();

	// The judges score by number only. Ada's entry: 80 % and 72 %; Bo's: 60 % and 88 %.
	const rows = await db.select().from(contestEntries).where(eq(contestEntries.contestId, contestId));
	const numberOf = (m: TestPerson) => rows.find((r) => r.entrantId === m.id)!.number!;
	const scores: Record<number, [number, number][]> = {
		[numberOf(members[0]!)]: [
			[8, 4],
			[7, 4]
		],
		[numberOf(members[1]!)]: [
			[6, 3],
			[9, 4]
		]
	};
	for (const [j, judge] of judges.entries()) {
		const page = await pageFor(browser, judge, j === 1 ? 390 : 1280);
		await page.goto('/judging');
		await page.getByRole('link', { name: title }).first().click();
		await expect(page.getByTestId('entry-link')).toHaveCount(2);
		for (const number of Object.keys(scores).map(Number)) {
			await page.goto(`/judging/${contestId}/${number}`);
			const card = page.getByTestId('scorecard');
			await expect(card).toBeVisible();
			const html = await page.content();
			for (const m of members) {
				expect(html).not.toContain(m.displayName);
				expect(html).not.toContain(m.email);
			}
			const [depth, finish] = scores[number]![j]!;
			await card.getByLabel('Layered depth', { exact: true }).fill(String(depth));
			await card.getByRole('button', { name: 'Half a point more for Neat finish' }).click();
			await card.getByLabel('Neat finish', { exact: true }).fill(String(finish));
			await card.getByLabel('Comment for the entrant').fill(`Judge ${j + 1} on entry ${number}`);
			await card.getByLabel('Note for the other judges').fill(`Private ${j + 1}`);
			await expect(page.getByTestId('save-state')).toHaveText('✓ Saved', { timeout: 10_000 });
			await card.getByRole('button', { name: 'Submit the card' }).click();
			await expect(page.getByTestId('save-state')).toContainText('Submitted');
		}
		await page.goto('/judging');
		await expect(page.getByTestId('judge-progress').first()).toContainText('2 of 2 cards submitted');
		await page.context().close();
	}

	// The admin publishes; the results rank Ada (76.00 %) above Bo (74.00 %).
	await adminPage.goto(`/admin/contests/${contestId}/results`);
	await expect(adminPage.getByTestId('readiness')).toContainText('4 of 4 cards submitted');
	await confirmStep(adminPage, 'Publish the results');
	await expect(adminPage.getByTestId('published')).toBeVisible();

	const publicPage = await browser.newPage();
	await publicPage.goto(`/contests/${contestId}`);
	await publicPage.getByRole('link', { name: 'Full results for Any size →' }).click();
	const ranked = publicPage.getByTestId('result-entry');
	await expect(ranked).toHaveCount(2);
	await expect(ranked.nth(0).getByTestId('entrant')).toHaveText(members[0]!.displayName);
	await expect(ranked.nth(0).getByTestId('place')).toHaveText('1st');
	await expect(ranked.nth(0).getByTestId('score')).toHaveText('76.00 %');
	await expect(ranked.nth(1).getByTestId('entrant')).toHaveText(members[1]!.displayName);
	await expect(ranked.nth(1).getByTestId('score')).toHaveText('74.00 %');
	await expect(ranked.nth(0)).toContainText(`Judge 2 on entry ${numberOf(members[0]!)}`);
	await expect(publicPage.getByText('Private 1')).toHaveCount(0);
	await publicPage.close();

	// The announcement goes out through the outbox; each entrant gets their place.
	await adminPage.getByRole('link', { name: 'Announcement' }).click();
	await expect(adminPage.getByTestId('announce-preview')).toContainText(title);
	await adminPage.getByRole('checkbox').check();
	await adminPage.getByRole('button', { name: 'Send the announcement' }).click();
	await expect(adminPage.getByTestId('announce-sent')).toBeVisible();
	// The page follows delivery by itself while mail waits: no reload here.
	await expect(adminPage.getByTestId('delivery-summary')).toHaveText(/^\d+ delivered · 0 waiting · 0 gave up$/, { timeout: 60_000 });
	const first = await waitForMail(members[0]!.email, { subject: /Your result/, timeoutMs: 60_000 });
	expect(first.text).toContain('placed 1st of 2 with 76.00 %');
	const second = await waitForMail(members[1]!.email, { subject: /Your result/, timeoutMs: 60_000 });
	expect(second.text).toContain('placed 2nd of 2 with 74.00 %');
	const announcement = await waitForMail(judges[0]!.email, { subject: new RegExp(`^Results: ${title}`), timeoutMs: 120_000 });
	expect(announcement.text).toContain(`1st ${members[0]!.displayName} (76.00 %)`);
	expect(announcement.headers['list-unsubscribe']).toContain('/unsubscribe/');
	await adminPage.getByLabel('Recipient').fill(members[0]!.email);
	await adminPage.getByRole('button', { name: 'Find' }).click();
	const rowsFor = adminPage.getByTestId('delivery').locator('tbody tr');
	await expect(rowsFor).toHaveCount(2);
	await expect(rowsFor.filter({ hasText: 'Personal result' })).toContainText('Delivered');
	await adminPage.context().close();
});

test('the scorecard keeps edits through a dropped connection and brings them back in a new tab', async ({ browser }) => {
	const f = await contestFixture({ judges: 1, entrantNames: ['Offline Entrant'] });
	const judge = f.judges[0]!;
	const number = f.entries[0]!.number!;
	const context = await contextFor(browser, judge, { viewport: { width: 390, height: 844 } });
	const page = await context.newPage();
	await page.goto(`/judging/${f.contestId}/${number}`);
	const card = page.getByTestId('scorecard');
	await card.getByLabel('Depth', { exact: true }).fill('7.5');
	await expect(page.getByTestId('save-state')).toHaveText('✓ Saved', { timeout: 10_000 });

	// The connection drops: the card says so, keeps the edit and retries.
	await context.setOffline(true);
	await card.getByLabel('Finish', { exact: true }).fill('4');
	await expect(page.getByTestId('save-state')).toContainText('Offline: kept on this device', { timeout: 10_000 });
	await context.setOffline(false);
	await expect(page.getByTestId('save-state')).toHaveText('✓ Saved', { timeout: 15_000 });
	const stored = await judging.getCard(viewerOf(judge), f.contestId, number);
	expect(stored.fields.scores).toEqual({ [f.criteria[0]!]: 7.5, [f.criteria[1]!]: 4 });

	// Saves stop getting through from this tab (its connection is gone for good) …
	await page.route('**/card', (route) => route.abort('internetdisconnected'));
	await card.getByLabel('Comment for the entrant').fill('Typed on the train');
	await expect(page.getByTestId('save-state')).toContainText('kept on this device', { timeout: 10_000 });
	expect((await judging.getCard(viewerOf(judge), f.contestId, number)).fields.entrantComment).toBe('');
	// … and the judge carries on in a new tab: the edit is back and saved from there.
	const again = await context.newPage();
	await again.goto(`/judging/${f.contestId}/${number}`);
	await expect(again.getByText('Changes you made earlier on this device')).toBeVisible();
	await expect(again.getByTestId('scorecard').getByLabel('Comment for the entrant')).toHaveValue('Typed on the train');
	await expect(again.getByTestId('save-state')).toHaveText('✓ Saved', { timeout: 10_000 });
	expect((await judging.getCard(viewerOf(judge), f.contestId, number)).fields.entrantComment).toBe('Typed on the train');
	await page.close();
	await context.close();
});
