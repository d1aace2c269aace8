// Screenshots of pages at desktop and phone width, signed in as someone, for looking at what we build.
//
//   node --import tsx scripts/shoot.ts [--stack test|start] [--as <email>] [--out screenshots] [--widths 1280,390] <path>...
//
// --stack test (default) talks to a stack from `npm test -- --serve` (honours TEST_PORT_OFFSET);
// --stack start to one from `npm start`. --as signs in through a database session made for that
// address (the person must exist, e.g. a demo member) and removed afterwards.
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { chromium } from '@playwright/test';
import { portsFor, dataRoot, root } from './lib/stack';

const args = process.argv.slice(2);
if (args.includes('--help') || args.length === 0) {
	console.log(
		readFileSync(new URL(import.meta.url), 'utf8')
			.split('\n')
			.slice(0, 8)
			.join('\n')
	);
	process.exit(0);
}
const option = (name: string, fallback: string) => {
	const i = args.indexOf(name);
	if (i === -1) return fallback;
	const value = args[i + 1]!;
	args.splice(i, 2);
	return value;
};
const stack = option('--stack', 'test') as 'test' | 'start';
const as = option('--as', '');
const out = option('--out', join(root, 'screenshots'));
const widths = option('--widths', '1280,390').split(',').map(Number);
const paths = args;

const ports = portsFor(stack);
const base = `http://localhost:${ports.app}`;
const secrets = JSON.parse(readFileSync(join(dataRoot, 'secrets.json'), 'utf8')) as { dbPassword: string };
const database = stack === 'test' ? 'riparia_test' : 'riparia';
const db = await mysql.createConnection({ host: '127.0.0.1', port: ports.db, user: 'riparia', password: secrets.dbPassword, database });

let token: string | null = null;
if (as) {
	const [rows] = (await db.query('SELECT id FROM user WHERE email = ?', [as.toLowerCase()])) as unknown as [{ id: string }[]];
	if (!rows[0]) throw new Error(`No user with e-mail ${as} in ${database}.`);
	token = crypto.randomUUID();
	await db.query('INSERT INTO session (sessionToken, userId, expires) VALUES (?, ?, ?)', [token, rows[0].id, new Date(Date.now() + 3_600_000)]);
}

mkdirSync(out, { recursive: true });
const browser = await chromium.launch({
	executablePath: '/usr/bin/chromium',
	args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run']
});
try {
	for (const width of widths) {
		const context = await browser.newContext({ viewport: { width, height: width < 600 ? 844 : 900 }, deviceScaleFactor: 1 });
		if (token) await context.addCookies([{ name: 'authjs.session-token', value: token, url: base }]);
		const page = await context.newPage();
		for (const path of paths) {
			const response = await page.goto(base + path, { waitUntil: 'networkidle' });
			// Scroll through once so lazily loaded pictures are in the full-page shot.
			await page.evaluate(async () => {
				for (let y = 0; y < document.body.scrollHeight; y += window.innerHeight / 2) {
					window.scrollTo(0, y);
					await new Promise((r) => setTimeout(r, 60));
				}
				window.scrollTo(0, 0);
			});
			await page.waitForLoadState('networkidle');
			const file = join(out, `${path.replace(/[^a-z0-9]+/gi, '_').replace(/^_|_$/g, '') || 'home'}${as ? '-' + as.split('@')[0] : ''}-${width}.png`);
			await page.screenshot({ path: file, fullPage: true });
			console.log(`${response?.status()} ${path} → ${file}`);
		}
		await context.close();
	}
} finally {
	await browser.close();
	if (token) await db.query('DELETE FROM session WHERE sessionToken = ?', [token]);
	await db.end();
}
