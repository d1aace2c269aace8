// What a browser downloads for a page — JS and CSS gzipped by us (level 9) from the bodies
// Chromium received, whatever encoding the server chose — and the tank page's largest contentful
// paint, from Debian's Chromium driven by Playwright (never a downloaded browser).
import { gzipSync } from 'node:zlib';
import { chromium, type Browser } from '@playwright/test';

const CHROMIUM = '/usr/bin/chromium';

export interface PageWeight {
	jsGzipBytes: number;
	cssGzipBytes: number;
	htmlGzipBytes: number;
	scripts: number;
	stylesheets: number;
}

export const launch = () =>
	chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--no-first-run'] });

async function contextFor(browser: Browser, origin: string, cookie: string | null) {
	const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
	if (cookie) {
		const [name, value] = cookie.split('=') as [string, string];
		await context.addCookies([{ name, value, url: origin }]);
	}
	return context;
}

const gzipped = (body: Buffer) => gzipSync(body, { level: 9 }).byteLength;

export async function weigh(browser: Browser, origin: string, path: string, cookie: string | null): Promise<PageWeight> {
	const context = await contextFor(browser, origin, cookie);
	const page = await context.newPage();
	const pending: Promise<void>[] = [];
	const weight: PageWeight = { jsGzipBytes: 0, cssGzipBytes: 0, htmlGzipBytes: 0, scripts: 0, stylesheets: 0 };
	page.on('response', (response) => {
		const type = response.request().resourceType();
		if (type !== 'script' && type !== 'stylesheet' && type !== 'document') return;
		pending.push(
			response
				.body()
				.then((body) => {
					if (type === 'script') {
						weight.jsGzipBytes += gzipped(body);
						weight.scripts++;
					} else if (type === 'stylesheet') {
						weight.cssGzipBytes += gzipped(body);
						weight.stylesheets++;
					} else weight.htmlGzipBytes += gzipped(body);
				})
				.catch(() => {})
		);
	});
	const response = await page.goto(origin + path, { waitUntil: 'networkidle' });
	if (!response?.ok()) throw new Error(`${path} answered ${response?.status()} in the browser.`);
	await Promise.all(pending);
	await context.close();
	return weight;
}

/** Largest contentful paint of a page loaded in a fresh context (empty cache), median of `runs`, in ms. */
export async function largestContentfulPaint(browser: Browser, origin: string, path: string, cookie: string | null, runs = 5): Promise<number[]> {
	const samples: number[] = [];
	for (let i = 0; i < runs; i++) {
		const context = await contextFor(browser, origin, cookie);
		const page = await context.newPage();
		await page.goto(origin + path, { waitUntil: 'load' });
		const lcp = await page.evaluate(
			() =>
				new Promise<number>((resolve) => {
					let last = 0;
					new PerformanceObserver((list) => {
						for (const entry of list.getEntries()) last = entry.startTime;
					}).observe({ type: 'largest-contentful-paint', buffered: true });
					setTimeout(() => resolve(last), 1000);
				})
		);
		samples.push(lcp);
		await context.close();
	}
	return samples;
}
