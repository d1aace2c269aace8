import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import { makePerson } from '../helpers/people';
import { contextFor } from './fixtures';
import { dayOf } from '../../src/lib/dates';

const daysAgo = (n: number) => dayOf(new Date(Date.now() - n * 86_400_000));
const photo = (colour: string) =>
	sharp({ create: { width: 1200, height: 800, channels: 3, background: colour } })
		.jpeg()
		.toBuffer();

test('a member keeps a journal that shows in the showcase; another admires it and comments', async ({ browser }) => {
	const keeper = await makePerson({ displayName: 'Journal Keeper' });
	const context = await contextFor(browser, keeper);
	const page = await context.newPage();
	const name = `Showcase tank ${Date.now()}`;

	// A new public tank.
	await page.goto('/journals/new');
	await page.getByLabel('Name').fill(name);
	await page.getByLabel('Set up on').fill(daysAgo(30));
	await page.getByLabel('Anyone, signed in or not').check();
	await page.getByLabel('Length (cm)').fill('60');
	await page.getByLabel('Width (cm)').fill('30');
	await page.getByLabel('Height (cm)').fill('36');
	await page.getByLabel('Glass thickness (mm, optional)').fill('6');
	await page.getByRole('button', { name: 'Save the tank' }).click();
	await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
	const tankUrl = page.url();

	// An entry with two photos and a water change.
	await page.getByRole('link', { name: 'Write an entry' }).click();
	await page.getByLabel('Title (optional)').fill('Planted at last');
	await page.getByLabel('What happened', { exact: true }).fill('The **stems** went in today.');
	await page.locator('input[type=file]').setInputFiles([
		{ name: 'front.jpg', mimeType: 'image/jpeg', buffer: await photo('#2f7a58') },
		{ name: 'side.jpg', mimeType: 'image/jpeg', buffer: await photo('#1d6f8c') }
	]);
	const items = page.getByTestId('photo-item');
	await expect(items).toHaveCount(2);
	await items.nth(0).getByLabel('Description for people who cannot see the photo').fill('The tank from the front');
	await items.nth(1).getByLabel('Description for people who cannot see the photo').fill('The tank from the side');
	await expect(page.locator('input[type=hidden][name="photos[1][id]"]')).toHaveCount(1, { timeout: 15_000 });
	await page.getByRole('group', { name: 'Add an event' }).getByRole('button', { name: 'Water change' }).click();
	await page.getByLabel('Share of the water changed (%)').fill('40');
	await page.getByRole('button', { name: 'Save the entry' }).click();
	await expect(page.getByRole('heading', { name: 'Planted at last', level: 1 })).toBeVisible();
	await expect(page.getByTestId('entry-body').locator('strong')).toHaveText('stems');
	await expect(page.getByRole('img', { name: 'The tank from the front' })).toBeVisible();
	await expect(page.getByRole('img', { name: 'The tank from the side' })).toBeVisible();
	await expect(page.getByTestId('entry-events')).toContainText('Water change — 40 % of the water');

	// A water test; the tank page shows the figures, the estimates and a chart drawn from the API.
	await page.goto(tankUrl);
	await page.getByRole('link', { name: 'Log a water test' }).first().click();
	await page.getByLabel('pH', { exact: true }).fill('6.8');
	await page.getByLabel('Carbonate hardness (KH) (°dKH)').fill('4');
	await page.getByLabel('Nitrate (NO₃) (mg/L)').fill('30');
	await page.getByLabel('Temperature (°C)').fill('25');
	await page.getByRole('button', { name: 'Save the test' }).click();
	await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
	await expect(page.getByTestId('tank-volume')).toContainText('L of water, estimated');
	await expect(page.getByTestId('tank-weight')).toContainText('kg filled');
	await expect(page.getByTestId('co2-estimate')).toContainText('mg/L');
	await expect(page.getByTestId('water-warnings')).toContainText('Nitrate (NO₃) read 30 mg/L, above the usual 5–25 mg/L.');
	// The chart of the reading off target is shown first; the others are a click away.
	// The charts load as their section comes near the screen.
	await page.getByTestId('water-section').scrollIntoViewIfNeeded();
	const chart = page.locator('[data-testid=water-chart][data-parameter=NO3]');
	await expect(chart).toBeVisible();
	await page.getByRole('group', { name: 'Choose what to chart' }).getByRole('button', { name: 'pH' }).click();
	await expect(page.locator('[data-testid=water-chart][data-parameter=pH]')).toBeVisible();
	await page.getByRole('group', { name: 'Choose what to chart' }).getByRole('button', { name: 'NO₃' }).click();
	await expect(chart).toBeVisible();
	await expect(chart.getByRole('group', { name: `Nitrate (NO₃) in ${name}` })).toBeVisible();
	await chart.getByTestId('chart-point').first().focus();
	await expect(chart.getByTestId('chart-readout')).toHaveText(/: 30 mg\/L, above target$/);
	await chart.getByRole('button', { name: 'Show the numbers' }).click();
	await expect(chart.getByRole('table')).toContainText('Above target');
	await expect(page.getByTestId('timeline')).toContainText('Planted at last');

	// The tank is in the showcase.
	await page.goto('/journals/showcase?sort=newest');
	await expect(page.getByTestId('showcase').getByRole('link', { name: new RegExp(name) })).toBeVisible();
	await context.close();

	// Another member admires it and comments on the entry.
	const admirer = await makePerson({ displayName: 'Warm Admirer' });
	const other = await contextFor(browser, admirer);
	const visit = await other.newPage();
	await visit.goto(tankUrl);
	await expect(visit.getByTestId('admire-count')).toHaveText('0 admirers');
	await visit.getByRole('button', { name: '♡ Admire' }).click();
	await expect(visit.getByRole('button', { name: '♥ Admired' })).toHaveAttribute('aria-pressed', 'true');
	await expect(visit.getByTestId('admire-count')).toHaveText('1 admirer');
	await visit.getByRole('link', { name: 'Planted at last' }).click();
	await visit.getByLabel('Add a comment', { exact: true }).fill('What a *lovely* start.');
	await visit.getByRole('button', { name: 'Post the comment' }).click();
	const comments = visit.getByTestId('comments');
	await expect(comments).toContainText('Warm Admirer');
	await expect(comments.locator('em')).toHaveText('lovely');
	await expect(visit.getByLabel('Add a comment', { exact: true })).toHaveValue('');
	await other.close();
});
