// @ts-check
// `npm start`, `npm test`, `npm run cluster` and `npm run bench` land here. This file runs on
// plain Node before any dependency is installed: it checks Node, installs dependencies when they
// are missing or stale (npm ci), then hands over to the TypeScript orchestrator through tsx
// (scripts/start.ts, scripts/test.ts, scripts/cluster.ts or bench/run.ts).
import { spawn, spawnSync } from 'node:child_process';
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

const lockFile = join(root, 'package-lock.json');
const marker = join(root, 'node_modules', '.riparia-lock-hash');
const lockHash = createHash('sha256').update(readFileSync(lockFile)).digest('hex');
const installed = existsSync(marker) && readFileSync(marker, 'utf8').trim() === lockHash;
if (!installed) {
	console.log('» Installing dependencies (npm ci)…');
	const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
	if (result.status !== 0) {
		console.error('\n✗ npm ci failed (see above). Check the network connection to the npm registry and free disk space, then run the command again.');
		process.exit(1);
	}
	writeFileSync(marker, lockHash + '\n');
}

// Scripts run with tsx resolve `$lib` through the tsconfig SvelteKit generates; a fresh clone has none yet.
if (!existsSync(join(root, '.svelte-kit', 'tsconfig.json'))) {
	const sync = spawnSync('npx', ['svelte-kit', 'sync'], { cwd: root, stdio: 'inherit' });
	if (sync.status !== 0) {
		console.error('\n✗ `svelte-kit sync` failed (see above); the project configuration may be broken.');
		process.exit(1);
	}
}

// One process (node --import tsx) so signals reach the orchestrator directly.
const entry = entries[/** @type {keyof typeof entries} */ (command)];
const child = spawn(process.execPath, ['--import', 'tsx', join(root, entry), ...process.argv.slice(3)], { cwd: root, stdio: 'inherit' });
for (const signal of /** @type {const} */ (['SIGINT', 'SIGTERM', 'SIGHUP'])) {
	process.on(signal, () => child.kill(signal));
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
