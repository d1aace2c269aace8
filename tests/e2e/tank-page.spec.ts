import { expect, test } from '@playwright/test';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';
import { contextFor } from './fixtures';
import { dayOf } from '../../src/lib/dates';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as water from '../../src/lib/server/journals/water';
import { emptyWaterTestDraft, parseWaterTest } from '../../src/lib/journals/water-tests';

const today = dayOf(new Date());

async function tankWithTest(owner: TestPerson, name: string, readings: { ammonia: string; ph?: string; temperatureC?: string }) {
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name, visibility: 'club', setUpOn: '2026-01-15', co2Method: 'pressurised' }));
	const parsed = parseWaterTest({ ...emptyWaterTestDraft(today), ...readings }, 'metric', { today });
	if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
	await water.create({ id: owner.id }, tankId, parsed.input);
	return tankId;
}

test('ammonia advice follows the un-ionised figure, and says so when only the total is known', async ({ browser }) => {
	const owner = await makePerson({ displayName: 'Ammonia Keeper' });
	// 0.5 mg/L total at pH 7.0 and 24 °C: 0.0026 mg/L NH3 (IFAS FA16, Table 1: 0.0052 of the total).
	const soft = await tankWithTest(owner, 'Soft water', { ammonia: '0.5', ph: '7.0', temperatureC: '24' });
	const noPh = await tankWithTest(owner, 'No pH', { ammonia: '0.5', temperatureC: '24' });
	const context = await contextFor(browser, owner);
	const page = await context.newPage();

	await page.goto(`/journals/${soft}`);
	const warnings = page.getByTestId('water-warnings');
	await expect(warnings).toContainText('0.0026 mg/L of it is un-ionised ammonia');
	await expect(warnings).toContainText('not dangerous now');
	await expect(warnings.locator('.alert')).toHaveCount(0);
	await expect(page.getByTestId('ammonia-estimate')).toContainText('Emerson and colleagues (1975)');
	await expect(page.locator('body')).not.toContainText('harms fish.');
	await expect(page.locator('body')).not.toContainText('from memory');

	await expect(page.getByTestId('latest-test')).toContainText('Where these figures come from');
	await page.goto(`/journals/${noPh}`);
	await expect(page.getByTestId('water-warnings').locator('.alert')).toContainText('No pH was recorded with this test');
	await expect(page.getByTestId('ammonia-total-only')).toContainText('the total alone is used');
	await context.close();
});

test('on a phone the tank page starts with a section index and one folded safety notice', async ({ browser }) => {
	const owner = await makePerson({ displayName: 'Phone Keeper' });
	const tankId = await tankWithTest(owner, 'Long page', { ammonia: '0', ph: '6.8', temperatureC: '24' });
	const context = await contextFor(browser, owner, { viewport: { width: 390, height: 844 } });
	const page = await context.newPage();
	await page.goto(`/journals/${tankId}`);
	const index = page.getByRole('navigation', { name: 'On this page' });
	await expect(index.getByRole('link', { name: 'Plants' })).toBeVisible();
	const safety = page.getByTestId('safety');
	await expect(safety).toContainText('the weight of the filled tank, mains electricity near water and CO2 gas');
	await expect(safety.getByText('licensed electrician')).toBeHidden();
	await safety.locator('summary').click();
	await expect(safety.getByText('licensed electrician')).toBeVisible();
	await expect(safety).toContainText('local safety rules for gas cylinders');
	await index.getByRole('link', { name: 'Water tests' }).click();
	await expect(page).toHaveURL(/#water$/);
	await expect(page.getByRole('heading', { name: 'Water tests' })).toBeInViewport();
	await context.close();
});

test('"Done today" says which task was logged and can be undone', async ({ browser }) => {
	const owner = await makePerson({ displayName: 'Upkeep Keeper' });
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Scheduled', visibility: 'club' }));
	await upkeep.saveSchedule({ id: owner.id }, tankId, [{ kind: 'glass', filterPart: null, label: 'Wipe the front glass', intervalDays: 7 }]);
	const context = await contextFor(browser, owner);
	const page = await context.newPage();
	await page.goto(`/journals/${tankId}`);
	await page.getByRole('button', { name: 'Wipe the front glass: done today' }).click();
	const done = page.getByTestId('upkeep-done');
	await expect(done).toContainText('Wipe the front glass logged for today');
	await expect(page.getByTestId('schedule')).toContainText(/last /);
	await done.getByRole('button', { name: 'Undo' }).click();
	await expect(page.getByText('Taken back')).toBeVisible();
	await expect(page.getByTestId('schedule')).toContainText('not logged yet');
	await context.close();
});

test('a visitor following a link to a club-only or a missing tank is offered sign-in, in the same words', async ({ page }) => {
	const owner = await makePerson({ displayName: 'Club Keeper' });
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Members only', visibility: 'club' }));
	const texts: string[] = [];
	for (const id of [tankId, 999_999_999]) {
		const response = await page.goto(`/journals/${id}`);
		expect(response?.status()).toBe(404);
		await expect(page.getByRole('heading', { name: 'Sign in to see this' })).toBeVisible();
		await expect(page.getByTestId('error-sign-in').getByRole('link', { name: 'Sign in' })).toHaveAttribute(
			'href',
			`/signin?redirectTo=${encodeURIComponent(`/journals/${id}`)}`
		);
		texts.push(await page.getByTestId('error-page').innerText());
	}
	expect(texts[0]!.replace(String(tankId), '')).toBe(texts[1]!.replace('999999999', ''));
	expect(texts[0]).not.toContain('Members only');
});

test('the journal heading keeps its spaces: "newest first · Atom feed"', async ({ page }) => {
	const owner = await makePerson({ displayName: 'Feed Keeper' });
	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Public feed', visibility: 'public' }));
	await page.goto(`/journals/${tankId}`);
	await expect(page.locator('#journal')).toContainText(/newest first\s·\sAtom feed/);
});

test('a member profile shows a tank without a photo as "No photo yet"', async ({ browser }) => {
	const owner = await makePerson({ displayName: 'Photo-less Keeper' });
	await tanks.create({ id: owner.id }, tankInput({ name: 'Bare tank', visibility: 'club' }));
	const viewer = await makePerson({ displayName: 'Profile Visitor' });
	const context = await contextFor(browser, viewer);
	const page = await context.newPage();
	await page.goto(`/members/${owner.id}`);
	const card = page.getByRole('listitem').filter({ hasText: 'Bare tank' });
	await expect(card.getByTestId('no-photo')).toHaveText('No photo yet');
	await context.close();
});

test('the sources note says what the figures rest on, without remarks from the code', async ({ page }) => {
	await page.goto('/sources');
	await expect(page.getByRole('heading', { name: 'Where our figures come from' })).toBeVisible();
	await expect(page.locator('#ammonia')).toContainText('FA16');
	await expect(page.locator('body')).not.toContainText('from memory');
});
