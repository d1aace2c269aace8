import { expect, test, type Browser } from '@playwright/test';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as threads from '../../src/lib/server/swaps/threads';
import * as reports from '../../src/lib/server/swaps/reports';
import { makePerson, type TestPerson } from '../helpers/people';
import { createListing, memberAt, viewerOf } from '../helpers/swaps';
import { tankInput } from '../helpers/tanks';
import { contextFor } from './fixtures';

// Member text with long unbroken strings and links must wrap on a 390 px phone: no page may
// become wider than the screen (the reports page once grew to 526 px).
const word = 'Rotala'.repeat(24);
const link = `https://kettlewater.test/${'long-path-segment-'.repeat(8)}`;
const long = `${word} ${link} ${word}`;

async function widthOf(browser: Browser, person: TestPerson, path: string) {
	const context = await contextFor(browser, person, { viewport: { width: 390, height: 800 } });
	const page = await context.newPage();
	const response = await page.goto(path);
	expect(response?.status(), path).toBe(200);
	// The text is on the page, and the page is no wider than the phone.
	await expect(page.getByText(word.slice(0, 30)).first()).toBeAttached();
	const width = await page.evaluate(() => document.documentElement.scrollWidth);
	await context.close();
	return width;
}

test('long words and links in member text wrap at 390 px', async ({ browser }) => {
	test.setTimeout(90_000);
	const owner = await memberAt({ lat: -50.5, lng: -30.5 }, 'wrap-owner');
	const asker = await memberAt({ lat: -50.5, lng: -30.4 }, 'wrap-asker');
	const admin = await makePerson({ role: 'admin', label: 'wrap-admin' });

	const listingId = await createListing(owner, { title: `Stems ${word.slice(0, 60)}`, description: long });
	const threadId = await threads.request(viewerOf(asker), listingId, long);
	const thread = await threads.get(viewerOf(asker), threadId);
	await reports.reportMessage(viewerOf(owner), thread!.messages[0]!.id, long);

	const tankId = await tanks.create({ id: owner.id }, tankInput({ name: 'Wrap tank', visibility: 'public', description: long }));
	const entryId = await entries.create({ id: owner.id }, tankId, { entryOn: '2026-02-01', title: `Trim ${word.slice(0, 50)}`, body: long, events: [] }, []);
	await entries.addComment({ id: asker.id }, tankId, entryId, long);

	// The open reports are listed oldest first, twenty a page, and other tests report things too:
	// the page that holds this one is the last, or (if more arrived since) one before it.
	const lastPage = Math.max(1, Math.ceil((await reports.openCount(viewerOf(admin))) / 20));
	let reportsPage = lastPage;
	for (let n = lastPage; n >= 1; n--) {
		const context = await contextFor(browser, admin, { viewport: { width: 390, height: 800 } });
		const page = await context.newPage();
		await page.goto(`/admin/reports?page=${n}`);
		const found = (await page.getByText(word.slice(0, 30)).count()) > 0;
		await context.close();
		if (found) {
			reportsPage = n;
			break;
		}
	}

	const pages: [TestPerson, string][] = [
		[admin, `/admin/reports?page=${reportsPage}`],
		[asker, `/swaps/${listingId}`],
		[asker, `/swaps/threads/${threadId}`],
		[asker, `/journals/${tankId}`]
	];
	for (const [person, path] of pages) expect(await widthOf(browser, person, path), path).toBeLessThanOrEqual(390);
});
