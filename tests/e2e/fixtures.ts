import type { Browser, BrowserContext } from '@playwright/test';
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
