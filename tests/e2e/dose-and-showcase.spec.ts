import { expect, test } from '@playwright/test';
import { makePerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';
import { contextFor } from './fixtures';
import * as tanks from '../../src/lib/server/journals/tanks';

test('the dose calculator fills the volume from one of my tanks, works out a stock solution and logs the dose to the journal', async ({ browser }) => {
	const owner = await makePerson({ displayName: 'Dosing Keeper' });
	// 100 L of water given outright, so the volume is known exactly.
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Dosed tank', visibility: 'club', waterLitres: 100 }));
	const context = await contextFor(browser, owner);
	const page = await context.newPage();
	await page.goto('/journals/dose');
	await page.getByLabel('Your tank').selectOption({ label: 'Dosed tank' });
	await expect(page.getByLabel(/Water in the tank/)).toHaveValue('100');
	await page.getByLabel('Salt', { exact: true }).selectOption('KNO3');
	await page.getByLabel('Dosing from a stock solution').check();
	await page.getByLabel('Salt (g)').fill('50');
	await page.getByLabel('Made up to (mL)').fill('500');
	await page.getByLabel('A dose (mL)').fill('10');
	await page.getByRole('button', { name: 'Work it out' }).click();
	const result = page.getByTestId('dose-result');
	// 50 g in 500 mL, 10 mL a dose: 1 g of KNO3, 6.13 mg/L NO3⁻ in 100 L (CIAAW 2021 atomic weights, by hand).
	await expect(result.getByRole('heading')).toHaveText('1 g of Potassium nitrate');
	await expect(page.getByTestId('stock-summary')).toContainText('100 g/L (50 doses a batch)');
	await expect(result).toContainText('6.13 mg/L');
	await expect(page.getByText(/Fertiliser salts are chemicals/)).toBeVisible();
	await result.getByRole('button', { name: 'Log this dose in Dosed tank’s journal' }).click();
	await expect(page.getByTestId('upkeep-done')).toContainText('Potassium nitrate logged in the journal of Dosed tank for today.');
	await page.goto(`/journals/${tankId}`);
	await expect(page.locator('#journal')).toContainText('Potassium nitrate');
	await context.close();
});

test('showcase filters apply as they change, like the swap board’s, and keep paging', async ({ page }) => {
	const owner = await makePerson({ displayName: 'Showcase Keeper' });
	await tanks.create({ id: owner.id }, tankInput({ name: 'Public iwagumi', style: 'iwagumi-e2e', visibility: 'public' }));
	await page.goto('/journals/showcase');
	await expect(page.getByRole('button', { name: 'Show' })).toHaveCount(0);
	await page.getByLabel('Style').selectOption('iwagumi-e2e');
	await expect(page).toHaveURL(/style=iwagumi-e2e/);
	await expect(page.getByTestId('showcase')).toContainText('Public iwagumi');
	await expect(page.getByTestId('showcase-count')).toContainText('1 tank match');
	await page.goto('/swaps');
	await expect(page.getByRole('button', { name: 'Show listings' })).toHaveCount(0);
});
