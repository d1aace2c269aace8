import { defineConfig, devices } from '@playwright/test';

// Run through `npm test` (or `npm test -- --only e2e`), which starts the built app, MariaDB and
// the fakes and sets APP_URL. Debian's Chromium is used; Playwright never downloads a browser.
const baseURL = process.env.APP_URL ?? 'http://localhost:3100';

export default defineConfig({
	testDir: 'tests/e2e',
	outputDir: '.data/test/playwright',
	fullyParallel: true,
	workers: 2,
	retries: 0,
	timeout: 45_000,
	expect: { timeout: 8_000 },
	reporter: [['list']],
	use: {
		baseURL,
		trace: 'retain-on-failure',
		screenshot: 'only-on-failure',
		launchOptions: {
			executablePath: '/usr/bin/chromium',
			args: [
				'--no-sandbox',
				'--disable-gpu',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--no-first-run',
				'--disable-quic'
			]
		}
	},
	projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'] } }]
});
