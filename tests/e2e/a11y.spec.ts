import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { personByEmail } from '../helpers/people';
import { contextFor, crawl } from './fixtures';

// axe (WCAG 2.0, 2.1 and 2.2, levels A and AA) on every kind of page the demo club has, signed out
// and as each role: each role walks the pages it reaches from the main sections, one page per
// shape of address (/journals/N, /swaps/threads/N, /judging/N/N…), and every page must be free of
// serious and critical violations. Then a form showing its errors and the photo viewer (a dialog) open.

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const START = [
	'/',
	'/journals',
	'/journals/showcase',
	'/journals/dose',
	'/journals/new',
	'/swaps',
	'/swaps/mine',
	'/swaps/new',
	'/contests',
	'/judging',
	'/admin',
	'/admin/contests',
	'/admin/mail',
	'/admin/members',
	'/account',
	'/sources',
	'/signin'
];
const SKIP = /^\/(auth|signout|media|unsubscribe)\b|\/export\b|\/photos\/|\.xml$|\.csv$/;

/** Serious and critical violations on the page as it is now, one line each with where they are. */
async function violations(page: Page, label: string): Promise<string[]> {
	const results = await new AxeBuilder({ page }).withTags(TAGS).analyze();
	return results.violations
		.filter((v) => v.impact === 'serious' || v.impact === 'critical')
		.map(
			(v) =>
				`${label}: ${v.id} (${v.impact}) ${v.help} — ${v.nodes
					.slice(0, 4)
					.map((n) => n.target.join(' '))
					.join(' | ')}`
		);
}

async function walk(page: Page, limit: number): Promise<{ visited: string[]; problems: string[] }> {
	const problems: string[] = [];
	const visited = await crawl(page, {
		start: START,
		skip: SKIP,
		limit,
		visit: async (path, response) => {
			// Pages this role may not open (403, 404, a sign-in redirect) are the access tests' business.
			if (!response || response.status() >= 400 || new URL(page.url()).pathname !== path.replace(/[?#].*$/, '')) return false;
			problems.push(...(await violations(page, path)));
			return true;
		}
	});
	return { visited, problems };
}

const ROLES = [
	['signed out', null],
	['member', 'mara.quillfeather@kettlewater.test'],
	['judge', 'sefa.lindqvoss@kettlewater.test'],
	['admin', 'oriel.vantwist@kettlewater.test']
] as const;

for (const [role, email] of ROLES) {
	test(`no serious or critical WCAG 2.2 AA violation on any page type (${role})`, async ({ browser }) => {
		// A crawl of every page type a role reaches; the limit only catches a hang.
		test.setTimeout(900_000);
		const context = email ? await contextFor(browser, await personByEmail(email)) : await browser.newContext();
		const page = await context.newPage();
		const { visited, problems } = await walk(page, 70);
		expect(visited.length).toBeGreaterThan(email ? 15 : 5);
		expect(problems).toEqual([]);
		await context.close();
	});
}

test('a form showing its errors, and the photo viewer open, have no serious or critical violation', async ({ browser }) => {
	test.setTimeout(300_000);
	const member = await personByEmail('mara.quillfeather@kettlewater.test');
	const context = await contextFor(browser, member);
	const page = await context.newPage();

	await page.goto('/journals/new');
	await page.getByRole('button', { name: 'Save the tank' }).click();
	await expect(page.getByTestId('form-errors')).toBeVisible();
	expect(await violations(page, 'the new-tank form with errors')).toEqual([]);

	// The first showcased tank with photos: its photo viewer is a modal dialog.
	await page.goto('/journals/showcase');
	const tanks = await page.$$eval('a[href^="/journals/"]', (links) =>
		links.map((a) => a.getAttribute('href')!).filter((href) => /^\/journals\/\d+$/.test(href))
	);
	let photo = null;
	for (const tank of tanks) {
		await page.goto(tank);
		if ((await page.locator('a[data-lightbox]').count()) > 0) {
			photo = page.locator('a[data-lightbox]').first();
			break;
		}
	}
	expect(photo, 'a showcased tank with photos').not.toBeNull();
	await photo!.focus();
	await page.keyboard.press('Enter');
	await expect(page.locator('.pswp')).toBeVisible();
	expect(await violations(page, 'a tank page with the photo viewer open')).toEqual([]);
	await context.close();
});
