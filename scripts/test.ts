// `npm test`: the same set-up as `npm start`, on a separate database and ports that start empty
// every run, then every test: vitest (unit tests beside the code, integration tests in tests/
// against the real MariaDB and the running app) and Playwright in Debian's Chromium.
//
//   npm test                      everything
//   npm test -- --only unit       one runner: unit | integration | e2e | install (repeatable)
//   npm test -- --grep outbox     passed on to vitest and Playwright as a name filter
//   npm test -- --file access-matrix   only test files whose path contains this (repeatable)
//   npm test -- --serve           bring the test stack up (seeded, empty otherwise) and keep it
//                                 running until Ctrl-C, e.g. for scripts/shoot.ts
//
// `install` clones the committed HEAD into a temporary folder, installs, builds and prunes it as
// a production server would be, and checks that it migrates and answers /readyz (a few minutes).
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { SetupError, ok, reportFailure, step, warn } from './lib/log';
import { bringUp, dataRoot, portsFor, root, type Stack } from './lib/stack';
import { aptInstall } from './lib/system';

const CHROMIUM = '/usr/bin/chromium';
type Runner = 'unit' | 'integration' | 'e2e' | 'install';
const RUNNERS: Runner[] = ['unit', 'integration', 'e2e', 'install'];

function parseArgs(argv: string[]) {
	const only = new Set<Runner>();
	let grep: string | undefined;
	const files: string[] = [];
	let serve = false;
	for (let i = 0; i < argv.length; i++) {
		const arg = argv[i];
		if (arg === '--only') {
			const value = argv[++i] as Runner;
			if (!RUNNERS.includes(value)) throw new SetupError(`--only ${value} is not a runner.`, `Use --only with one of: ${RUNNERS.join(', ')}.`);
			only.add(value);
		} else if (arg === '--serve') {
			serve = true;
		} else if (arg === '--grep') {
			grep = argv[++i];
		} else if (arg === '--file') {
			// Only test files whose path contains this (repeatable), e.g. --file access-matrix.
			files.push(argv[++i] ?? '');
		} else {
			throw new SetupError(`Unknown argument ${arg}.`, 'See the top of scripts/test.ts for the options.');
		}
	}
	const runners: Runner[] = only.size ? [...only] : RUNNERS;
	return { runners, grep, files, serve };
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
	return new Promise((resolve) => {
		const child = spawn(command, args, { cwd: root, env, stdio: 'inherit' });
		child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
	});
}

let stack: Stack | null = null;
let stopping = false;
const stopAll = async () => {
	if (stopping) return;
	stopping = true;
	await stack?.stop();
};
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
	process.on(signal, () => void stopAll().then(() => process.exit(130)));
}

const started = Date.now();
const results: { runner: string; code: number }[] = [];
try {
	const { runners, grep, files, serve } = parseArgs(process.argv.slice(2));
	const needsStack = serve || runners.some((r) => r !== 'unit');
	if (runners.includes('e2e') && !existsSync(CHROMIUM)) aptInstall(['chromium'], 'The browser tests');

	// Code the tests run in-process logs warnings and errors only (LOG_LEVEL=info shows everything).
	const quiet = { NODE_ENV: 'test', LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn' };
	let env: NodeJS.ProcessEnv = { ...process.env, ...quiet };
	if (needsStack) {
		stack = await bringUp({ mode: 'test', home: join(dataRoot, 'test'), ports: portsFor('test'), database: 'riparia_test', fresh: true });
		step('Starting the app for the tests…');
		await stack.serve();
		ok(`Test stack is up at ${stack.urls.app}`);
		env = { ...stack.env, ...quiet };
		if (serve) {
			console.log(`\n  Serving the test stack until Ctrl-C: app ${stack.urls.app}, mail ${stack.urls.mail}\n`);
			await new Promise(() => {});
		}
	}

	const vitestProjects = runners.filter((r) => r === 'unit' || r === 'integration');
	if (vitestProjects.length) {
		step(`Running vitest (${vitestProjects.join(' + ')})…`);
		const args = ['vitest', 'run', ...vitestProjects.flatMap((p) => ['--project', p]), ...(grep ? ['-t', grep] : []), ...files];
		results.push({ runner: `vitest (${vitestProjects.join(' + ')})`, code: await run('npx', args, env) });
	}
	if (runners.includes('e2e')) {
		step('Running Playwright end-to-end tests in Chromium…');
		const args = ['playwright', 'test', ...(grep ? ['--grep', grep] : []), ...files];
		results.push({ runner: 'playwright (e2e)', code: await run('npx', args, env) });
	}
	if (runners.includes('install')) {
		step('Installing a clean clone as in production (npm ci, build, prune, migrate, /readyz)…');
		const args = ['vitest', 'run', '--project', 'install', ...(grep ? ['-t', grep] : [])];
		results.push({ runner: 'vitest (install)', code: await run('npx', args, env) });
	}
} catch (error) {
	reportFailure(error);
	results.push({ runner: 'set-up', code: 1 });
} finally {
	await stopAll().catch((e) => warn(`While stopping: ${String(e)}`));
}

console.log('\nSummary');
for (const r of results) console.log(`  ${r.code === 0 ? '✓ passed' : '✗ FAILED'}  ${r.runner}`);
console.log(`  (${((Date.now() - started) / 1000).toFixed(0)} s in all; the app's log of this run is in .data/test/app.log)`);
process.exit(results.every((r) => r.code === 0) ? 0 : 1);
