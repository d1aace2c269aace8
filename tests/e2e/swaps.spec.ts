import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import { makePerson } from '../helpers/people';
import { waitForMail } from '../helpers/mail';
import { placePerson, token } from '../helpers/swaps';
import { contextFor } from './fixtures';

test('a swap from posting to handover: photo, radius filter, request, acceptance, pickup, both confirmations and the mails', async ({ browser }) => {
	test.setTimeout(90_000);
	// Two members about 3.3 km apart over the open sea (0.03° of latitude).
	const owner = await makePerson({ displayName: 'Willa Offerton' });
	const asker = await makePerson({ displayName: 'Tobin Askwith' });
	await placePerson(owner, { lat: -47.3, lng: -35.4 }, 'immediately');
	await placePerson(asker, { lat: -47.33, lng: -35.4 }, 'immediately');
	const title = `Rotala tops ${token('e2e')}`;

	// The owner posts an offer with a photo and a catalogue plant.
	const ownerContext = await contextFor(browser, owner);
	const ownerPage = await ownerContext.newPage();
	await ownerPage.goto('/swaps/new');
	await ownerPage.getByLabel('Title').fill(title);
	const picker = ownerPage.getByRole('combobox', { name: 'Plant (optional)' });
	await picker.fill('roundleaf');
	await expect(ownerPage.getByRole('option', { name: /Rotala rotundifolia/ })).toBeVisible();
	await picker.press('ArrowDown');
	await picker.press('Enter');
	await expect(picker).toHaveValue('Rotala rotundifolia');
	await ownerPage.getByLabel('How many').fill('12');
	const photo = await sharp({ create: { width: 1000, height: 750, channels: 3, background: '#4f9470' } })
		.jpeg()
		.toBuffer();
	await ownerPage.locator('input[type=file]').setInputFiles({ name: 'tops.jpg', mimeType: 'image/jpeg', buffer: photo });
	await ownerPage.getByTestId('photo-item').getByLabel('Description for people who cannot see the photo').fill('A bunch of green stems');
	await expect(ownerPage.locator('input[type=hidden][name="photos[0][id]"]')).toHaveCount(1, { timeout: 15_000 });
	await expect(ownerPage.getByTestId('form-cautions')).toContainText('Never release plants');
	await ownerPage.getByRole('button', { name: 'Post the listing' }).click();
	await expect(ownerPage).toHaveURL(/\/swaps\/\d+$/);
	const listingPath = new URL(ownerPage.url()).pathname;
	await expect(ownerPage.getByRole('heading', { name: title, level: 1 })).toBeVisible();
	await expect(ownerPage.getByRole('img', { name: 'A bunch of green stems' })).toBeVisible();
	await expect(ownerPage.getByTestId('listing-cautions')).toContainText('Rinse new plants');

	// The second member finds it with the radius filter (the board fetches as filters change).
	const askerContext = await contextFor(browser, asker);
	const askerPage = await askerContext.newPage();
	await askerPage.goto('/swaps');
	await askerPage.getByLabel('Search').fill(title);
	await askerPage.getByLabel('Distance').selectOption('2');
	await expect(askerPage).toHaveURL(/radius=2/);
	await expect(askerPage.getByTestId('board-empty')).toBeVisible();
	await askerPage.getByLabel('Distance').selectOption('5');
	await expect(askerPage).toHaveURL(/radius=5/);
	const card = askerPage.getByTestId('listing-card').filter({ hasText: title });
	await expect(card).toBeVisible();
	await expect(card.getByTestId('listing-distance')).toHaveText('about 3 km');
	await card.getByRole('link', { name: title }).click();
	await expect(askerPage).toHaveURL(new RegExp(`${listingPath}$`));

	// …and asks for it.
	await askerPage.getByLabel('Your message to Willa Offerton').fill('Could I have them on Saturday?');
	await askerPage.getByRole('button', { name: 'Send the request' }).click();
	await expect(askerPage).toHaveURL(/\/swaps\/threads\/\d+$/);
	const threadPath = new URL(askerPage.url()).pathname;
	await expect(askerPage.getByTestId('messages')).toContainText('Could I have them on Saturday?');
	await waitForMail(owner.email, { subject: new RegExp(`New message about “${title}”`) });

	// The owner sees the request and accepts it.
	await ownerPage.goto(listingPath);
	await ownerPage.getByTestId('request-list').getByRole('link', { name: 'Tobin Askwith' }).click();
	await expect(ownerPage).toHaveURL(new RegExp(`${threadPath}$`));
	await ownerPage.getByRole('button', { name: 'Accept Tobin Askwith’s request' }).click();
	await expect(ownerPage.getByTestId('conversation-status')).toHaveText('Accepted: agree a pickup');
	await waitForMail(asker.email, { subject: /was accepted/ });

	// The owner's open page picks up a new message by polling.
	await askerPage.reload();
	await askerPage.getByLabel('Write to Willa Offerton').fill('Great, thank you!');
	await askerPage.getByRole('button', { name: 'Send', exact: true }).click();
	await expect(ownerPage.getByTestId('messages')).toContainText('Great, thank you!', { timeout: 15_000 });

	// The asker proposes a pickup; the owner confirms it.
	const day = new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10);
	await askerPage.getByLabel('Day').fill(day);
	await askerPage.getByLabel('From').fill('10:00');
	await askerPage.getByLabel('Until').fill('11:00');
	await askerPage.getByLabel('Meeting point').fill('the library entrance');
	await askerPage.getByRole('button', { name: 'Send the proposal' }).click();
	await expect(askerPage.getByTestId('messages')).toContainText('Pickup proposed:');
	await ownerPage.reload();
	await ownerPage.getByRole('button', { name: 'Confirm this pickup' }).click();
	await expect(ownerPage.getByTestId('agreed-pickup')).toContainText('10:00–11:00 local time (UTC), at the library entrance');

	// After the handover both confirm.
	await ownerPage.getByRole('button', { name: 'Confirm the handover' }).click();
	await expect(ownerPage.getByTestId('handover-state')).toContainText('You: confirmed');
	await waitForMail(asker.email, { subject: /confirmed the handover/ });
	await askerPage.reload();
	await expect(askerPage.getByTestId('agreed-pickup')).toContainText('at the library entrance');
	await askerPage.getByRole('button', { name: 'Confirm the handover' }).click();
	await expect(askerPage.getByTestId('handed-over')).toBeVisible();
	await waitForMail(owner.email, { subject: /handed over/ });

	// The listing shows handed over, and both profiles count the swap.
	await askerPage.goto(listingPath);
	await expect(askerPage.getByTestId('listing-state')).toHaveText('Handed over');
	await askerPage.goto(`/members/${owner.id}`);
	await expect(askerPage.getByTestId('completed-swaps')).toContainText('1 completed swap');
	await ownerContext.close();
	await askerContext.close();
});
