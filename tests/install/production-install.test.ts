// A production install from a clean clone of the committed HEAD: `npm ci` (from the local npm
// cache where it can), `npm run build`, `npm prune --omit=dev`, then `npm run db:migrate` and
// `node build` against a scratch database must work without tsx, vite or any other development
// package, and /readyz must answer 200. Uses the test stack's MariaDB and mail and storage fakes.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { delimiter, join } from 'node:path';
import { count } from 'drizzle-orm';
import { afterAll, expect, test } from 'vitest';
import { users } from '../../src/lib/server/club/schema';
import { species } from '../../src/lib/server/species/schema';
import { SPECIES } from '../../scripts/seed/species-data';
import { checkoutRoot, poll, startInstance, type AppInstance } from '../helpers/instance';
import { scratchDatabase } from '../helpers/scratch-db';

const folder = mkdtempSync(join(tmpdir(), 'riparia-install-'));
const clone = join(folder, 'riparia');
let scratch: Awaited<ReturnType<typeof scratchDatabase>> | null = null;
let app: AppInstance | null = null;

afterAll(async () => {
	await app?.stop();
	await scratch?.drop();
	rmSync(folder, { recursive: true, force: true });
}, 60_000);

/**
 * The environment of a production shell: nothing from this checkout's node_modules/.bin on the
 * PATH, no preloaded loaders (tsx), no NODE_PATH…
 */
function productionEnv(extra: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
	const env: NodeJS.ProcessEnv = { ...process.env, ...extra };
	env.PATH = (process.env.PATH ?? '')
		.split(delimiter)
		.filter((dir) => !dir.includes('node_modules'))
		.join(delimiter);
	// …and the logging defaults of a server (npm test quiets its own in-process code with LOG_LEVEL).
	for (const name of ['NODE_OPTIONS', 'NODE_PATH', 'VITEST', 'VITEST_POOL_ID', 'VITEST_WORKER_ID', 'TEST', 'LOG_LEVEL', 'LOG_FORMAT']) delete env[name];
	env.NODE_ENV = 'production';
	return env;
}

/** Runs a command to its end; fails the test with the end of its output when it fails. */
function run(command: string, args: string[], options: { cwd: string; env?: NodeJS.ProcessEnv }): Promise<string> {
	return new Promise((resolve, reject) => {
		const child = spawn(command, args, { cwd: options.cwd, env: options.env ?? productionEnv(), stdio: ['ignore', 'pipe', 'pipe'] });
		let output = '';
		child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
		child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
		child.once('error', reject);
		child.once('exit', (code) => {
			if (code === 0) resolve(output);
			else reject(new Error(`${command} ${args.join(' ')} exited with ${code}:\n${output.split('\n').slice(-40).join('\n')}`));
		});
	});
}

test('a clean clone installs, builds, prunes to production dependencies, migrates and becomes ready', async () => {
	const head = (await run('git', ['rev-parse', 'HEAD'], { cwd: checkoutRoot })).trim();
	await run('git', ['clone', '--quiet', '--no-checkout', checkoutRoot, clone], { cwd: folder });
	await run('git', ['checkout', '--quiet', '--detach', head], { cwd: clone });

	// Build with everything installed (the development install), then drop what only builds it.
	const devEnv = { ...productionEnv(), NODE_ENV: 'development' };
	await run('npm', ['ci', '--prefer-offline', '--no-audit', '--no-fund'], { cwd: clone, env: devEnv });
	await run('npm', ['run', 'build'], { cwd: clone, env: devEnv });
	await run('npm', ['prune', '--omit=dev', '--no-audit', '--no-fund'], { cwd: clone, env: devEnv });

	const manifest = JSON.parse(readFileSync(join(clone, 'package.json'), 'utf8')) as {
		dependencies: Record<string, string>;
		devDependencies: Record<string, string>;
	};
	for (const tool of ['tsx', 'vite', 'typescript', 'vitest', '@sveltejs/kit', 'drizzle-kit']) {
		expect(existsSync(join(clone, 'node_modules', tool)), `${tool} is left after pruning`).toBe(false);
	}
	for (const name of Object.keys(manifest.dependencies)) {
		expect(existsSync(join(clone, 'node_modules', name)), `${name} is missing after pruning`).toBe(true);
	}

	scratch = await scratchDatabase({ migrated: false });
	const migrateLog = await run('npm', ['run', 'db:migrate'], { cwd: clone, env: productionEnv({ DATABASE_URL: scratch.url, SEED_DEMO: '' }) });
	expect(migrateLog).toContain('"msg":"migrations applied"');
	expect(migrateLog).toContain('"msg":"seeded species"');
	// Reference data only: the species catalogue, not the demo club's people.
	const [catalogue] = await scratch.db.select({ n: count() }).from(species);
	const [people] = await scratch.db.select({ n: count() }).from(users);
	expect(catalogue!.n).toBeGreaterThanOrEqual(SPECIES.length);
	expect(people!.n).toBe(0);

	app = await startInstance({ root: clone, databaseUrl: scratch.url, logName: 'install-app', baseEnv: productionEnv() });
	const ready = await poll(async () => {
		const response = await fetch(`${app!.url}/readyz`);
		return response.status === 200 ? ((await response.json()) as { status: string; checks: Record<string, { ok: boolean }> }) : null;
	}, 'the production install to answer 200 on /readyz');
	expect(ready.status).toBe('ready');
	expect(Object.values(ready.checks).every((c) => c.ok)).toBe(true);
	expect((await fetch(`${app.url}/signin`)).status).toBe(200);
});
