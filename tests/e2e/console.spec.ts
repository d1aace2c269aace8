import { expect, test, type Page } from '@playwright/test';
import { personByEmail } from '../helpers/people';
import { contextFor, crawl } from './fixtures';

// The strict CSP (no 'unsafe-eval', no inline script) must never have to refuse anything our
// own pages try: a refusal is a console error, and usually a feature quietly not working.
// Each role walks the pages it can reach from the main sections, following our own links.

const START = ['/', '/journals', '/journals/showcase', '/journals/dose', '/swaps', '/swaps/mine', '/swaps/new', '/contests', '/judging', '/admin', '/account'];
const SKIP = /^\/(auth|signout|media)\b|\/export\b|\.xml$/;

async function walk(page: Page, limit: number): Promise<{ visited: string[]; problems: string[] }> {
	const problems: string[] = [];
	page.on('console', (message) => {
		// Pages this role may not open answer 403/404 during the walk; that is not a script problem.
		if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(`${page.url()}: ${message.text()}`);
	});
	page.on('pageerror', (error) => problems.push(`${page.url()}: ${error.message}`));
	await page.addInitScript(() => {
		document.addEventListener('securitypolicyviolation', (e) =>
			console.error(`CSP refused ${e.violatedDirective}: ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}`)
		);
	});
	const visited = await crawl(page, { start: START, skip: SKIP, limit, visit: async () => true });
	return { visited, problems };
}

for (const who of ['mara.quillfeather@kettlewater.test', 'sefa.lindqvoss@kettlewater.test', 'oriel.vantwist@kettlewater.test', null]) {
	test(`no page asks the browser for anything our CSP refuses (${who ?? 'signed out'})`, async ({ browser }) => {
		// A crawl of every page a role reaches; the limit only catches a hang.
		test.setTimeout(600_000);
		const context = who ? await contextFor(browser, await personByEmail(who)) : await browser.newContext();
		const page = await context.newPage();
		const { visited, problems } = await walk(page, 45);
		expect(visited.length).toBeGreaterThan(who ? 15 : 5);
		expect(problems).toEqual([]);
		await context.close();
	});
}
