// The XSS corpus in Chromium: every vector is put into comments, display names, messages, pickup
// places, report reasons and listing titles, gathered on a few pages (plantGathered in
// tests/fixtures/hostile/xss-setup.ts), which are opened as the member and the admin who read them. No dialog opens, no script error happens, no
// Content-Security-Policy violation is reported and nothing is fetched from the vectors' host.
// (tests/integration/hostile-xss.test.ts checks the HTML of every page showing a vector, in every
// field, and the mails.)
import { expect, test, type Page } from '@playwright/test';
import { plantGathered, type Planted } from '../fixtures/hostile/xss-setup';
import { contextFor } from './fixtures';

// One set of vectors for the three viewers: the tests share it, in one worker.
test.describe.configure({ mode: 'serial' });

let planted: Planted;

test.beforeAll(async () => {
	test.setTimeout(300_000);
	planted = await plantGathered();
});

/** Everything on a page that means script ran or was attempted. */
async function watch(page: Page, seen: string[]) {
	page.on('dialog', (dialog) => {
		seen.push(`dialog: ${dialog.message()}`);
		void dialog.dismiss();
	});
	page.on('pageerror', (error) => seen.push(`page error: ${error.message}`));
	page.on('request', (request) => {
		if (/xss\.invalid/.test(request.url())) seen.push(`request to ${request.url()}`);
	});
	await page.exposeBinding('reportCspViolation', (_source, text: string) => void seen.push(`CSP: ${text}`));
	await page.addInitScript(() => {
		document.addEventListener('securitypolicyviolation', (event) => {
			void (window as unknown as { reportCspViolation: (text: string) => Promise<void> }).reportCspViolation(
				`${event.violatedDirective} blocked ${event.blockedURI} at ${event.sourceFile}:${event.lineNumber}`
			);
		});
	});
}

for (const who of ['reader', 'admin'] as const) {
	test(`no vector runs on the pages the ${who} reads`, async ({ browser }) => {
		test.setTimeout(300_000);
		const context = await contextFor(browser, planted[who]);
		const page = await context.newPage();
		const seen: string[] = [];
		await watch(page, seen);
		for (const path of planted.pages[who]) {
			const response = await page.goto(path, { waitUntil: 'load' });
			expect(response?.status(), path).toBe(200);
			// Hover over everything once: handlers such as onmouseover would fire now.
			await page.mouse.move(200, 300);
			await page.mouse.move(600, 500);
			if (seen.length) seen.push(`(on ${path})`);
		}
		expect(seen).toEqual([]);
		await context.close();
	});
}

test('the watch sees a dialog, a script error and a blocked script', async ({ page }) => {
	const seen: string[] = [];
	await watch(page, seen);
	// A page of our own making, served in place of a made-up address so the watch is installed first.
	await page.route('https://watch.test/', (route) =>
		route.fulfill({
			contentType: 'text/html',
			body: `<meta http-equiv="Content-Security-Policy" content="script-src 'unsafe-inline'"><img src=x onerror="alert('ran')"><script>undefinedFunction()</script><script src="https://blocked.test/x.js"></script>`
		})
	);
	await page.goto('https://watch.test/');
	await expect.poll(() => seen.length).toBeGreaterThanOrEqual(3);
	expect(seen).toEqual(
		expect.arrayContaining([expect.stringMatching(/^dialog: ran/), expect.stringMatching(/^page error:/), expect.stringMatching(/^CSP: script-src/)])
	);
});
