import type { Browser, BrowserContext, Page, Response } from '@playwright/test';
import type { TestPerson } from '../helpers/people';
import { SESSION_COOKIE } from '../helpers/people';
import { registerMediaScopes } from '../../src/lib/server/media-scopes';

// Specs set up their data with domain functions: photo scopes are registered as the app's hooks do.
registerMediaScopes();

/** A browser context signed in as `person` through a real database session. */
export async function contextFor(
	browser: Browser,
	person: TestPerson,
	options: { viewport?: { width: number; height: number } } = {}
): Promise<BrowserContext> {
	const context = await browser.newContext({ viewport: options.viewport });
	const base = process.env.APP_URL ?? 'http://localhost:3100';
	await context.addCookies([{ name: SESSION_COOKIE, value: person.token, url: base, httpOnly: true, sameSite: 'Lax' }]);
	return context;
}

/**
 * Walks the site from `start`, one page per shape of address (/journals/N, /swaps/threads/N…),
 * following our own links, until `limit` pages were visited. `visit` looks at each page once it
 * has loaded and says whether it counts as visited (a page this role may not open may not).
 */
export async function crawl(
	page: Page,
	options: { start: string[]; skip: RegExp; limit: number; visit: (path: string, response: Response | null) => Promise<boolean> }
): Promise<string[]> {
	const seen = new Set<string>();
	const visited: string[] = [];
	const queue = [...options.start];
	while (queue.length && visited.length < options.limit) {
		const path = queue.shift()!;
		const shape = path.replace(/\d+/g, 'N').replace(/[?#].*$/, '');
		if (seen.has(shape) || options.skip.test(path)) continue;
		seen.add(shape);
		const response = await page.goto(path);
		await page.waitForLoadState('networkidle');
		if (!(await options.visit(path, response))) continue;
		visited.push(path);
		for (const href of await page.$$eval('a[href^="/"]', (links) => links.map((a) => a.getAttribute('href')!))) queue.push(href);
	}
	return visited;
}
