// @ts-check
// `npm start`, `npm test`, `npm run cluster` and `npm run bench` land here. This file runs on
// plain Node before any dependency is installed: it checks Node, installs dependencies when they
// are missing or stale (npm ci), then hands over to the TypeScript orchestrator through tsx
// (scripts/start.ts, scripts/test.ts, scripts/cluster.ts or bench/run.ts).
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const entries = { start: 'scripts/start.ts', test: 'scripts/test.ts', cluster: 'scripts/cluster.ts', bench: 'bench/run.ts' };
const command = process.argv[2];
if (!command || !Object.hasOwn(entries, command)) {
	console.error(`usage: node scripts/bootstrap.mjs ${Object.keys(entries).join('|')} [args]`);
	process.exit(2);
}

const [major = 0, minor = 0] = process.versions.node.split('.').map(Number);
// The build tool (vite 8) needs 20.19 or newer; package.json's engines says the same.
if (major < 20 || (major === 20 && minor < 19)) {
	console.error(`Riparia needs Node.js 20.19 or newer; this is ${process.version}.`);
	process.exit(1);
}

// Each command runs as our one child at a time; Ctrl-C or SIGTERM (to us or to the process group)
// is passed on to it and we end once it has, so no install or orchestrator is left running.
/** @type {import('node:child_process').ChildProcess | null} */
let current = null;
/** @type {NodeJS.Signals | null} */
let interrupted = null;
for (const signal of /** @type {const} */ (['SIGINT', 'SIGTERM', 'SIGHUP'])) {
	process.on(signal, () => {
		interrupted ??= signal;
		if (current && current.exitCode === null && current.signalCode === null) current.kill(signal);
		else process.exit(130);
	});
}

/**
 * @param {string} command
 * @param {string[]} args
 * @returns {Promise<number>} its exit code (1 when a signal ended it)
 */
function run(command, args) {
	return new Promise((resolve) => {
		const child = spawn(command, args, { cwd: root, stdio: 'inherit' });
		current = child;
		child.once('error', (error) => {
			console.error(`\n✗ Could not run ${command}: ${error.message}`);
			resolve(1);
		});
		child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
	}).then((code) => {
		current = null;
		return /** @type {number} */ (code);
	});
}

const lockFile = join(root, 'package-lock.json');
const marker = join(root, 'node_modules', '.riparia-lock-hash');
const lockHash = createHash('sha256').update(readFileSync(lockFile)).digest('hex');
const installed = existsSync(marker) && readFileSync(marker, 'utf8').trim() === lockHash;
if (!installed) {
	console.log('» Installing dependencies (npm ci)…');
	const code = await run('npm', ['ci', '--no-audit', '--no-fund']);
	if (interrupted) process.exit(130);
	if (code !== 0) {
		console.error('\n✗ npm ci failed (see above). Check the network connection to the npm registry and free disk space, then run the command again.');
		process.exit(1);
	}
	writeFileSync(marker, lockHash + '\n');
}

// Scripts run with tsx resolve `$lib` through the tsconfig SvelteKit generates; a fresh clone has none yet.
if (!existsSync(join(root, '.svelte-kit', 'tsconfig.json'))) {
	const code = await run('npx', ['svelte-kit', 'sync']);
	if (interrupted) process.exit(130);
	if (code !== 0) {
		console.error('\n✗ `svelte-kit sync` failed (see above); the project configuration may be broken.');
		process.exit(1);
	}
}

// One process (node --import tsx) so signals reach the orchestrator directly; it stops everything it
// started and then ends, and so do we, with its exit code.
const entry = entries[/** @type {keyof typeof entries} */ (command)];
const code = await run(process.execPath, ['--import', 'tsx', join(root, entry), ...process.argv.slice(3)]);
process.exit(code);
