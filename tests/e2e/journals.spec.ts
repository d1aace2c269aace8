import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import { makePerson } from '../helpers/people';
import { contextFor } from './fixtures';

test('a member adds a tank with a cover photo, a catalogue plant and a previewed description', async ({ browser }) => {
	const member = await makePerson({ displayName: 'Tank Maker' });
	const context = await contextFor(browser, member);
	const page = await context.newPage();
	await page.goto('/journals');
	await expect(page.getByTestId('tanks-empty')).toBeVisible();
	await page.getByRole('link', { name: 'Add your first tank' }).click();

	await page.getByLabel('Name').fill('Browser tank');
	await page.getByLabel('Length (cm)').fill('60');
	await page.getByLabel('Width (cm)').fill('30');
	await page.getByLabel('Height (cm)').fill('36');
	await page.getByLabel('Glass thickness (mm, optional)').fill('6');

	const photo = await sharp({ create: { width: 1200, height: 800, channels: 3, background: '#2f7a58' } })
		.jpeg()
		.toBuffer();
	await page.locator('input[type=file]').setInputFiles({ name: 'front.jpg', mimeType: 'image/jpeg', buffer: photo });
	const item = page.getByTestId('photo-item');
	await expect(item).toHaveCount(1);
	await item.getByLabel('Description for people who cannot see the photo').fill('Green water column');
	await expect(page.locator('input[type=hidden][name="cover[0][id]"]')).toHaveCount(1, { timeout: 15_000 });
	await expect(page.locator('input[type=hidden][name="cover[0][alt]"]')).toHaveValue('Green water column');

	await page.getByRole('button', { name: 'Add a plant' }).click();
	const picker = page.getByRole('combobox', { name: 'Plant 1' });
	await picker.fill('roundleaf');
	await expect(page.getByRole('option', { name: /Rotala rotundifolia/ })).toBeVisible();
	await picker.press('ArrowDown');
	await picker.press('Enter');
	await expect(picker).toHaveValue('Rotala rotundifolia');
	await expect(page.getByTestId('plant-row').getByLabel('Where')).toHaveValue('background');

	await page.getByLabel('About this tank (optional)', { exact: true }).fill('# Week one\n\n**Planted** today. <script>alert(1)</script>');
	await page.getByRole('tab', { name: 'Preview' }).click();
	const preview = page.getByTestId('markdown-preview');
	await expect(preview.getByRole('heading', { name: 'Week one' })).toBeVisible();
	await expect(preview.locator('strong')).toHaveText('Planted');
	await expect(preview.locator('script')).toHaveCount(0);
	await page.getByRole('tab', { name: 'Write' }).click();

	await page.getByRole('button', { name: 'Save the tank' }).click();
	await expect(page).toHaveURL(/\/journals\/\d+$/);
	await expect(page.getByRole('heading', { name: 'Browser tank', level: 1 })).toBeVisible();
	await expect(page.getByRole('img', { name: 'Green water column' })).toBeVisible();
	await expect(page.getByTestId('plant-list')).toContainText('Rotala rotundifolia');
	await expect(page.getByTestId('tank-volume')).toContainText('L of water, estimated');
	await expect(page.getByTestId('tank-weight')).toContainText('kg filled');
	await context.close();
});

test('the form keeps what was typed when a field is wrong', async ({ browser }) => {
	const member = await makePerson({ displayName: 'Careless Typist' });
	const context = await contextFor(browser, member);
	const page = await context.newPage();
	await page.goto('/journals/new');
	await page.getByLabel('Name').fill('Half-filled');
	await page.getByLabel('Length (cm)').fill('sixty');
	await page.getByRole('button', { name: 'Save the tank' }).click();
	await expect(page.getByTestId('form-errors')).toBeVisible();
	await expect(page.getByLabel('Length (cm)')).toHaveAttribute('aria-invalid', 'true');
	await expect(page.getByLabel('Name')).toHaveValue('Half-filled');
	await expect(page.getByLabel('Length (cm)')).toHaveValue('sixty');
	await context.close();
});
