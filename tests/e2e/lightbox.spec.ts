import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import * as media from '../../src/lib/server/media';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import { makePerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';
import { contextFor } from './fixtures';

// The photo viewer on a journal entry's photos: opens on the photo clicked, moves on with the
// arrow keys, zooms, and Escape closes it with focus back on the photo's link. At phone width.
test('the photo viewer opens, moves to the next photo, zooms and gives focus back on Escape', async ({ browser }) => {
	const owner = await makePerson({ label: 'lightbox-owner' });
	const photo = async (colour: string) =>
		media.upload(
			owner.id,
			await sharp({ create: { width: 1600, height: 1000, channels: 3, background: colour } })
				.jpeg()
				.toBuffer()
		);
	const [first, second] = [await photo('#2f7a58'), await photo('#7a4a2f')];
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Viewer tank' }));
	await entries.create({ id: owner.id }, tankId, { entryOn: '2026-02-01', title: 'Two views', body: 'Front and side.', events: [] }, [
		{ id: first.id, alt: 'The front of the tank', caption: '' },
		{ id: second.id, alt: 'The left side of the tank', caption: '' }
	]);

	const context = await contextFor(browser, owner, { viewport: { width: 390, height: 800 } });
	const page = await context.newPage();
	await page.goto(`/journals/${tankId}`);
	const link = page.locator('a[data-lightbox]').filter({ has: page.getByAltText('The front of the tank') });
	await link.focus();
	await page.keyboard.press('Enter');

	const viewer = page.locator('.pswp');
	await expect(viewer).toBeVisible();
	await expect(viewer.locator('.pswp__counter')).toHaveText('1 of 2');
	await expect(viewer.getByAltText('The front of the tank')).toBeVisible();
	await page.keyboard.press('ArrowRight');
	await expect(viewer.locator('.pswp__counter')).toHaveText('2 of 2');
	await expect(viewer.getByAltText('The left side of the tank')).toBeVisible();

	await viewer.getByRole('button', { name: /Zoom in or out/ }).click();
	await expect(viewer).toHaveClass(/pswp--zoomed-in/);

	await page.keyboard.press('Escape');
	await expect(viewer).toHaveCount(0);
	await expect(link).toBeFocused();
	await context.close();
});
