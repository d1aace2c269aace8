// `npm start` (and `npm test -- --serve`) stopped with Ctrl-C or SIGTERM to its process group at
// each step — installing, initialising and starting MariaDB, building, migrating, seeding,
// starting the app, serving — leaves nothing behind: the process group is empty, no process it
// started is left (each carries a marker in its environment), nothing listens on its ports,
// MariaDB shut down cleanly, and the next start gets past that step. Runs on a copy of this
// checkout (its own build and .data/) with ports of its own, so the test stack is not touched.
//
// The install step runs a stand-in for `npm ci` that waits until it is stopped: the real one would
// reach the network and replace node_modules, which the copy shares with this checkout (each
// package is a link to this checkout's). Everything after it is the real thing.
import { execFileSync, spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { chmodSync, copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { checkoutRoot, poll } from '../helpers/instance';

// Made in beforeAll, so a run that filters this file out leaves nothing in the temporary folder.
let folder = '';
const copy = () => join(folder, 'riparia');
const probe = randomUUID();

// Ports of their own, apart from every engineer's test stack (TEST_PORT_OFFSET is small and unique).
const own = Number(process.env.TEST_PORT_OFFSET ?? 0);
const base = 20_000 + own * 10;
const startPorts = { PORT: base, DB_PORT: base + 1, SMTP_PORT: base + 2, MAIL_UI_PORT: base + 3, S3_PORT: base + 4, METRICS_PORT: base + 5 };
// `npm test -- --serve` in the copy: its ports are the test ports moved by this offset.
const testOffset = 21_000 + own * 10;
const testPorts = [3100, 3317, 2535, 8035, 4579, 9474].map((p) => p + testOffset);
const allPorts = [...Object.values(startPorts), ...testPorts];

const realNpm = execFileSync('sh', ['-c', 'command -v npm'], { encoding: 'utf8' }).trim();
const cleanPath = (process.env.PATH ?? '')
	.split(':')
	.filter((dir) => dir && !dir.includes('node_modules'))
	.join(':');
const env = (): NodeJS.ProcessEnv => ({
	PATH: `${join(folder, 'bin')}:${cleanPath}`,
	HOME: process.env.HOME,
	LANG: 'C.UTF-8',
	NO_COLOR: '1',
	RIPARIA_INTERRUPT_PROBE: probe,
	HOLD_INSTALL: join(folder, 'hold-install'),
	REAL_NPM: realNpm,
	...Object.fromEntries(Object.entries(startPorts).map(([k, v]) => [k, String(v)]))
});

/** Ports in LISTEN state on this machine (any address), from the kernel's tables. */
function listening(): Set<number> {
	const ports = new Set<number>();
	for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
		if (!existsSync(table)) continue;
		for (const line of readFileSync(table, 'utf8').split('\n').slice(1)) {
			const fields = line.trim().split(/\s+/);
			if (fields[3] === '0A') ports.add(parseInt(fields[1]!.split(':')[1]!, 16));
		}
	}
	return ports;
}

/** Every process that carries this test's marker in its environment, i.e. that a run started. */
function leftovers(): { pid: number; command: string }[] {
	const found: { pid: number; command: string }[] = [];
	for (const entry of readdirSync('/proc')) {
		if (!/^\d+$/.test(entry)) continue;
		try {
			if (!readFileSync(`/proc/${entry}/environ`, 'latin1').includes(`RIPARIA_INTERRUPT_PROBE=${probe}\0`)) continue;
			found.push({ pid: Number(entry), command: readFileSync(`/proc/${entry}/cmdline`, 'latin1').replaceAll('\0', ' ').trim() });
		} catch {
			// Gone meanwhile, or not ours to read.
		}
	}
	return found;
}

function groupAlive(pgid: number): boolean {
	try {
		process.kill(-pgid, 0);
		return true;
	} catch {
		return false;
	}
}

const mariaDbLog = (mode: 'start' | 'test') => join(copy(), '.data', mode, 'mariadb', 'mariadb.err');
const occurrences = (text: string, needle: string) => text.split(needle).length - 1;

interface Run {
	args: string[];
	/** Output that marks the step to interrupt (null: run to its end). */
	at: string | null;
	signal: NodeJS.Signals;
	/** Output of the step after it: its absence shows the interruption came during the step. */
	next?: string;
	extraEnv?: NodeJS.ProcessEnv;
	/** Checked while it runs, just before the signal. */
	whileUp?: () => Promise<void>;
}

/**
 * Starts `npm <args>` in the copy as its own process group, sends `signal` to the whole group as
 * soon as `at` appears in its output (as Ctrl-C in a terminal does), and waits for the group to end.
 */
async function interrupt(run: Run): Promise<string> {
	const child = spawn(realNpm, run.args, { cwd: copy(), env: { ...env(), ...run.extraEnv }, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
	const pgid = child.pid!;
	let output = '';
	let signalled = false;
	const exited = new Promise<void>((resolve) => child.once('close', () => resolve()));
	const watch = (chunk: Buffer) => {
		output += chunk.toString();
		if (!signalled && run.at !== null && output.includes(run.at)) {
			signalled = true;
			void (run.whileUp ?? (async () => {}))()
				.catch((error: unknown) => (output += `\n[test] check while up failed: ${String(error)}\n`))
				.finally(() => process.kill(-pgid, run.signal));
		}
	};
	child.stdout.on('data', watch);
	child.stderr.on('data', watch);
	await exited;
	await poll(async () => !groupAlive(pgid), 'the process group of the interrupted start to be empty', 120_000);
	const context = `\n--- output of npm ${run.args.join(' ')} ---\n${output.split('\n').slice(-60).join('\n')}`;
	if (run.at !== null) expect(signalled, `never reached “${run.at}”${context}`).toBe(true);
	expect(output, context).not.toContain('already in use');
	if (run.next) expect(output, `the step after “${run.at}” began before the signal arrived${context}`).not.toContain(run.next);
	expect(leftovers(), `processes left running after ${run.signal} at “${run.at}”${context}`).toEqual([]);
	const open = allPorts.filter((port) => listening().has(port));
	expect(open, `ports still listening after ${run.signal} at “${run.at}”${context}`).toEqual([]);
	return output;
}

/** MariaDB shut down cleanly every time it started: as many completed shutdowns as starts, no crash recovery. */
function expectCleanMariaDb(mode: 'start' | 'test') {
	const file = mariaDbLog(mode);
	if (!existsSync(file)) return;
	const log = readFileSync(file, 'utf8');
	expect(log, file).not.toMatch(/crash recovery/i);
	expect(occurrences(log, ': Shutdown complete'), `${file}:\n${log.split('\n').slice(-30).join('\n')}`).toBe(occurrences(log, ': ready for connections'));
}

beforeAll(() => {
	const busy = allPorts.filter((port) => listening().has(port));
	if (busy.length) throw new Error(`Ports ${busy.join(', ')} are in use; this test needs them free (they follow TEST_PORT_OFFSET).`);

	folder = mkdtempSync(join(tmpdir(), 'riparia-interrupt-'));
	const fakeBin = join(folder, 'bin');
	// The working tree as it is (tracked and new files, nothing ignored), so uncommitted work is tested.
	const files = execFileSync('git', ['ls-files', '-z', '--cached', '--others', '--exclude-standard'], { cwd: checkoutRoot, encoding: 'utf8' })
		.split('\0')
		.filter(Boolean);
	for (const file of files) {
		const from = join(checkoutRoot, file);
		if (!existsSync(from)) continue;
		mkdirSync(dirname(join(copy(), file)), { recursive: true });
		copyFileSync(from, join(copy(), file));
	}
	// node_modules of links to this checkout's packages, without the marker of a finished install.
	const modules = join(checkoutRoot, 'node_modules');
	mkdirSync(join(copy(), 'node_modules'));
	for (const entry of readdirSync(modules)) {
		if (entry.startsWith('.') && entry !== '.bin') continue;
		symlinkSync(join(modules, entry), join(copy(), 'node_modules', entry));
	}

	mkdirSync(fakeBin);
	writeFileSync(
		join(fakeBin, 'npm'),
		`#!/bin/sh
# Stand-in for \`npm ci\` (see the top of interrupted-start.test.ts); every other npm command is the real one.
if [ "$1" = ci ]; then
	echo "(stand-in for npm ci)"
	if [ -e "$HOLD_INSTALL" ]; then exec sleep 600; fi
	exit 0
fi
exec "$REAL_NPM" "$@"
`
	);
	chmodSync(join(fakeBin, 'npm'), 0o755);
});

afterAll(() => {
	if (!folder) return;
	// Only if a check failed: stop what this test's runs left (found by the marker), then remove the copy.
	for (const { pid } of leftovers()) {
		try {
			process.kill(pid, 'SIGKILL');
		} catch {
			// Already gone.
		}
	}
	rmSync(folder, { recursive: true, force: true });
});

// Each run is a real start (a full build once, MariaDB, migrations, seeding): minutes, not seconds.
describe.sequential('an interrupted start leaves nothing behind and the next start works', { timeout: 600_000 }, () => {
	test('during the install step', async () => {
		writeFileSync(join(folder, 'hold-install'), '');
		await interrupt({ args: ['start'], at: '» Installing dependencies (npm ci)…', signal: 'SIGINT', next: 'Initialising a MariaDB data folder' });
		rmSync(join(folder, 'hold-install'));
	});

	test('while MariaDB initialises its data folder', async () => {
		await interrupt({ args: ['start'], at: '» Initialising a MariaDB data folder', signal: 'SIGTERM', next: 'Starting MariaDB on' });
	});

	test('while MariaDB starts', async () => {
		await interrupt({ args: ['start'], at: '» Starting MariaDB on', signal: 'SIGINT', next: 'MariaDB is up' });
		expectCleanMariaDb('start');
	});

	test('during the build', async () => {
		await interrupt({ args: ['start'], at: '» Building the app', signal: 'SIGTERM', next: 'Applying database migrations' });
		expectCleanMariaDb('start');
	});

	test('during the migrations', async () => {
		await interrupt({ args: ['start'], at: '» Applying database migrations', signal: 'SIGINT', next: 'Seeding the demo club' });
		expectCleanMariaDb('start');
	});

	test('during seeding (the mail and storage fakes are up)', async () => {
		await interrupt({ args: ['start'], at: '» Seeding the demo club', signal: 'SIGTERM', next: 'Starting the app' });
		expectCleanMariaDb('start');
	});

	test('while the app starts', async () => {
		await interrupt({ args: ['start'], at: '» Starting the app', signal: 'SIGINT', next: 'Riparia is ready' });
		expectCleanMariaDb('start');
	});

	test('once it serves: the app answers, then Ctrl-C stops everything', async () => {
		await interrupt({
			args: ['start'],
			at: '✓ Riparia is ready',
			signal: 'SIGINT',
			whileUp: async () => {
				const ready = await fetch(`http://127.0.0.1:${startPorts.PORT}/readyz`);
				if (ready.status !== 200) throw new Error(`/readyz answered ${ready.status}`);
			}
		}).then((output) => expect(output).not.toContain('check while up failed'));
		expectCleanMariaDb('start');
	});

	test('`npm test -- --serve` during seeding, then serving', async () => {
		const extraEnv = { TEST_PORT_OFFSET: String(testOffset) };
		await interrupt({ args: ['test', '--', '--serve'], at: '» Seeding the demo club', signal: 'SIGTERM', next: 'Starting the app', extraEnv });
		const output = await interrupt({
			args: ['test', '--', '--serve'],
			at: 'Serving the test stack until Ctrl-C',
			signal: 'SIGINT',
			extraEnv,
			whileUp: async () => {
				const ready = await fetch(`http://127.0.0.1:${3100 + testOffset}/readyz`);
				if (ready.status !== 200) throw new Error(`/readyz answered ${ready.status}`);
			}
		});
		expect(output).not.toContain('check while up failed');
		expectCleanMariaDb('test');
	});
});
