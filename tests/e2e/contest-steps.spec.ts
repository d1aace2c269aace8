import { expect, test, type Page } from '@playwright/test';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { contestEntries } from '../../src/lib/server/contests/schema';
import * as contests from '../../src/lib/server/contests/contests';
import * as panel from '../../src/lib/server/contests/panel';
import { makePerson } from '../helpers/people';
import { contestFixture, contestInput, scoreAll, viewerOf } from '../helpers/contests';
import { contextFor } from './fixtures';

// An admin's steps through a contest's life: each step asks for its own confirmation (nothing
// carried over from the step before) and ends with one whole sentence about the new state.

async function expectFreshStep(page: Page, label: string) {
	// The next step shows only its button; its confirmation opens closed and unticked.
	await expect(page.getByTestId('confirm-step')).toHaveCount(0);
	await page.getByRole('button', { name: `${label}…` }).click();
	const confirm = page.getByTestId('confirm-step');
	await expect(confirm.getByRole('checkbox')).not.toBeChecked();
	return confirm;
}

async function takeStep(page: Page, label: string) {
	const confirm = await expectFreshStep(page, label);
	await confirm.getByRole('checkbox').check();
	await confirm.getByRole('button', { name: `Yes, ${label.toLowerCase()}` }).click();
}

test('each step of a contest needs its own confirmation and reports in whole sentences', async ({ browser }) => {
	test.setTimeout(120_000);
	// From preparation to open, on a contest made as an admin would.
	const admin = await makePerson({ role: 'admin', label: 'steps-admin' });
	const judge = await makePerson({ role: 'judge', label: 'steps-judge' });
	const draftId = await contests.create(viewerOf(admin), contestInput());
	await panel.assign(viewerOf(admin), draftId, judge.id);
	const page = await (await contextFor(browser, admin, { viewport: { width: 1280, height: 900 } })).newPage();
	await page.goto(`/admin/contests/${draftId}`);
	await takeStep(page, 'Open for entries');
	await expect(page.getByTestId('step-done')).toHaveText('The contest is open for entries. Members can enter their tanks until the entry window closes.');
	// Without entries the next step cannot be taken, and nothing of the last one is left open.
	await expect(page.getByTestId('confirm-step')).toHaveCount(0);
	await expect(page.getByRole('button', { name: 'Close entries and start judging…' })).toBeDisabled();
	await page.close();

	// Open to judging, judging to published, published to archived on a contest with entries.
	const f = await contestFixture({ judges: 2, entrantNames: ['Step Entrant A', 'Step Entrant B'], state: 'open' });
	const adminPage = await (await contextFor(browser, f.admin, { viewport: { width: 390, height: 800 } })).newPage();
	await adminPage.goto(`/admin/contests/${f.contestId}`);
	await takeStep(adminPage, 'Close entries and start judging');
	await expect(adminPage.getByTestId('step-done')).toHaveText(
		'Entries are closed and judging has started. Judges score the entries by number; nobody else sees the scores.'
	);
	// The judges score every entry, then the admin publishes from the overview.
	const rows = await db.select({ id: contestEntries.id, number: contestEntries.number }).from(contestEntries).where(eq(contestEntries.contestId, f.contestId));
	for (const e of f.entries) e.number = rows.find((r) => r.id === e.entryId)!.number;
	await scoreAll(f, () => [8, 4]);
	await adminPage.reload();
	await takeStep(adminPage, 'Publish the results');
	await expect(adminPage.getByTestId('step-done')).toHaveText('The results are published. Send the announcement from the Announcement tab when you are ready.');
	await expectFreshStep(adminPage, 'Archive');
	await adminPage.getByTestId('confirm-step').getByRole('checkbox').check();
	await adminPage.getByTestId('confirm-step').getByRole('button', { name: 'Yes, archive' }).click();
	await expect(adminPage.getByTestId('step-done')).toHaveText('The contest is archived. Its results stay public and nothing changes any more.');
	await expect(adminPage.getByTestId('confirm-step')).toHaveCount(0);
});
