import { expect, test } from '@playwright/test';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as water from '../../src/lib/server/journals/water';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import { dayOf } from '../../src/lib/dates';
import { formatDate, zoneName } from '../../src/lib/format';
import { makePerson, SESSION_COOKIE } from '../helpers/people';
import { createListing, placePerson, token, viewerOf } from '../helpers/swaps';
import { tankInput } from '../helpers/tanks';
import { contextFor } from './fixtures';

/** A metric figure anywhere in a text: a number followed by cm, mm, L, kg, °C or km (but not mg/L). */
const METRIC_FIGURE = /\d(?:[.,]\d+)? ?(?:cm|mm|L|kg|°C|km)(?![\w/²])/;

test('a member using US units sees °F, US gallons, inches, pounds and miles on a tank page and the board', async ({ browser }) => {
	const member = await makePerson({ displayName: 'Unity Gallonway' });
	await db.update(users).set({ units: 'us' }).where(eq(users.id, member.id));
	const tankId = await tanks.create(
		viewerOf(member),
		tankInput({ name: 'Inch tank', glassMm: 10, heaterSetC: 24, hardscapeLitres: 3.785411784, substrateDepthCm: 7.62, visibility: 'private' })
	);
	await water.create(viewerOf(member), tankId, {
		testedOn: new Date().toISOString().slice(0, 10),
		ph: 6.8,
		kh: 4,
		gh: 8,
		no3: 15,
		po4: 1,
		k: null,
		fe: null,
		ammonia: 0,
		ammoniaBasis: 'NH3',
		no2: 0,
		temperatureC: 25,
		tds: null,
		note: ''
	});
	const context = await contextFor(browser, member);
	const page = await context.newPage();
	await page.goto(`/journals/${tankId}`);
	await expect(page.getByRole('heading', { name: 'Inch tank', level: 1 })).toBeVisible();
	const specs = page.getByTestId('specs');
	// 60 × 30 × 36 cm = 23.6 × 11.8 × 14.2 in; 10 mm glass ≈ 3/8 in; 24 °C = 75.2 °F; 3.785 L = 1 US gal.
	await expect(specs).toContainText('23.6 × 11.8 × 14.2 in');
	await expect(specs).toContainText('glass 3/8 in');
	await expect(specs).toContainText('set to 75.2 °F');
	await expect(specs).toContainText('about 1 US gal');
	await expect(specs).toContainText('3 in deep');
	await expect(specs).toContainText(/\d lb filled/);
	await expect(page.getByText('77 °F').first()).toBeVisible();
	expect(await page.locator('main').innerText()).not.toMatch(METRIC_FIGURE);

	// The board: distances and the radius filter in miles. 0.05° of latitude is about 5.6 km, 3.5 mi.
	await placePerson(member, { lat: -48.3, lng: -36.4 });
	const owner = await makePerson({ displayName: 'Mila Offset' });
	await placePerson(owner, { lat: -48.35, lng: -36.4 });
	const title = `Ludwigia tops ${token('miles')}`;
	await createListing(owner, { title });
	await page.goto(`/swaps?q=${encodeURIComponent(title)}`);
	const card = page.getByTestId('listing-card').filter({ hasText: title });
	await expect(card.getByTestId('listing-distance')).toHaveText('about 3 mi');
	const radius = page.getByLabel('Distance');
	await expect(radius.locator('option')).toContainText([
		'Any distance',
		'Within 2 miles',
		'Within 5 miles',
		'Within 10 miles',
		'Within 25 miles',
		'Within 50 miles'
	]);
	await radius.selectOption('2');
	await expect(page).toHaveURL(/radius=2/);
	await expect(page.getByText('Nothing matches these filters within that distance.')).toBeVisible();
	await radius.selectOption('5');
	await expect(card.getByTestId('listing-distance')).toHaveText('about 3 mi');
	expect(await page.locator('main').innerText()).not.toMatch(METRIC_FIGURE);
	await context.close();
});

test('a member in a far time zone sees times in their zone, named, and "today" is their day', async ({ browser }) => {
	// A zone whose day differs from UTC's right now: UTC+14 once UTC's day is ten hours old, UTC−11 before.
	const now = new Date();
	const timeZone = now.getUTCHours() >= 10 ? 'Pacific/Kiritimati' : 'Pacific/Pago_Pago';
	const localDay = dayOf(now, timeZone);
	expect(localDay).not.toBe(dayOf(now, 'UTC'));
	const member = await makePerson({ displayName: 'Zoe Farzone' });
	await db.update(users).set({ timeZone }).where(eq(users.id, member.id));
	const tankId = await tanks.create(viewerOf(member), tankInput({ name: 'Dateline tank', setUpOn: '2026-01-15', visibility: 'private' }));
	await upkeep.saveSchedule(viewerOf(member), tankId, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);

	const context = await contextFor(browser, member);
	const page = await context.newPage();
	// "Done today" logs the member's day, and the schedule counts from it: due in 7 days, not 6 or 8.
	await page.goto(`/journals/${tankId}`);
	const schedule = page.getByTestId('schedule');
	await expect(schedule).toContainText('due today · not logged yet');
	await schedule.getByRole('button', { name: 'Water change: done today' }).click();
	await expect(schedule).toContainText(`due in 7 days · last ${formatDate(localDay)}`);
	// A new water test is dated the member's today by default.
	await page.goto(`/journals/${tankId}/water-tests/new`);
	await expect(page.getByLabel('Day of the test')).toHaveValue(localDay);
	// Times carry the member's zone: the sessions on the account page, and the zone chosen there.
	await page.goto('/account');
	await expect(page.getByLabel('Time zone')).toHaveValue(timeZone);
	await expect(page.getByTestId('session-list')).toContainText(zoneName(now, timeZone));
	await context.close();
});

test('a new member’s time zone comes from their browser, once; visitors see UTC, named', async ({ browser }) => {
	const member = await makePerson({ displayName: 'Kiran Newzone' });
	const context = await browser.newContext({ timezoneId: 'Asia/Kolkata' });
	const base = process.env.APP_URL ?? 'http://localhost:3100';
	await context.addCookies([{ name: SESSION_COOKIE, value: member.token, url: base, httpOnly: true, sameSite: 'Lax' }]);
	const page = await context.newPage();
	const sent = page.waitForResponse((r) => r.url().endsWith('/api/me/time-zone') && r.request().method() === 'POST');
	await page.goto('/account');
	expect(await (await sent).json()).toEqual({ kept: true });
	// The page's times switch to that zone at once (India: UTC+5:30 all year), and the next page is rendered in it.
	await expect(page.getByTestId('session-list')).toContainText('GMT+5:30');
	// The zone is kept under the name this browser gives it (Chromium's ICU may call India's zone
	// "Asia/Calcutta", its older name).
	const browserZone = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone);
	expect(['Asia/Kolkata', 'Asia/Calcutta']).toContain(browserZone);
	await page.reload();
	await expect(page.getByLabel('Time zone')).toHaveValue(browserZone);
	await expect(page.getByTestId('session-list')).toContainText('GMT+5:30');
	const [row] = await db.select({ timeZone: users.timeZone }).from(users).where(eq(users.id, member.id));
	expect(row?.timeZone).toBe(browserZone);

	// A zone chosen on the account page is kept over the browser's.
	await page.getByLabel('Time zone').selectOption('Europe/Lisbon');
	await page.getByRole('button', { name: 'Save profile' }).click();
	await expect(page.getByLabel('Time zone')).toHaveValue('Europe/Lisbon');
	const again = await page.request.post('/api/me/time-zone', { data: { timeZone: 'Asia/Kolkata' }, headers: { origin: base } });
	expect(await again.json()).toEqual({ kept: false });
	await context.close();
});
