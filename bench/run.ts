// `npm run bench`: the measuring instrument for speed and scale. Brings up its own stack (ports
// 500 above the test ports, database riparia_bench, data in .data/bench), seeds a large invented
// club once per schema and seed version, starts the production build with BENCH=1 and measures:
// requests per second and latency of the club's heaviest pages under load against a page with no
// SQL (the baseline, same server, same run); SQL statements per request on the demo club and on
// the large one; the JS and CSS a browser downloads per page; the tank page's largest contentful
// paint; the photo pipeline on a 24-megapixel photo; a 100-entry contest's results; queueing a
// mail to 2,000 members; queueing a news post to 2,000 members; and the same pages through the cluster (nginx, two instances). Prints
// one table with targets beside the figures (never asserted) and writes it as JSON to
// bench/results/<date>-<commit>.json.
//
//   npm run bench                        everything: about 4 minutes with the seed reused; the first
//                                        run seeds first (about 10 minutes on 2 cores from a fresh clone)
//   npm run bench -- --seconds 5         shorter load runs (default 8, after a 2 s warm-up)
//   npm run bench -- --no-cluster        skip the cluster comparison
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { cpus, loadavg } from 'node:os';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import mysql from 'mysql2/promise';
import sharp from 'sharp';
import { SetupError, note, ok, reportFailure, step, warn } from '../scripts/lib/log';
import { bringUp, dataRoot, hashTree, portsFor, root, type Stack } from '../scripts/lib/stack';
import { spawnManaged, waitForPort, type ManagedProcess } from '../scripts/lib/system';
import { stopEverything } from '../scripts/lib/children';
import { startCluster, type Cluster } from '../scripts/lib/cluster';
import { drawAquarium } from '../scripts/seed/lib/images';
import { BENCH_SEED_MARKER, SIZES } from './seed/sizes';
import { findTargets, type PageKey, type Target } from './lib/targets';
import { load, queriesFor, type LoadResult } from './lib/load';
import { largestContentfulPaint, launch, weigh, type PageWeight } from './lib/browser';
import { syntheticContest, timeResults } from './contests';

/** Runs one of the project's scripts (TypeScript, through tsx) and stops the bench if it fails. */
function runNodeScript(script: string, env: NodeJS.ProcessEnv, what: string, args: string[] = []) {
	const result = spawnSync(process.execPath, ['--import', 'tsx', join(root, script), ...args], { cwd: root, env, stdio: 'inherit' });
	if (result.status !== 0) throw new SetupError(`${what} failed (see above).`, 'Fix the error shown above and run the command again.');
}

/** Raise when the large seed changes in a way its source files do not show. */
const BENCH_SEED_VERSION = 1;
const HOME = join(dataRoot, 'bench');
const DEMO_DATABASE = 'riparia_bench_demo';

const TARGETS = {
	share: 0.4,
	p99Ms: 50,
	viewerQueries: 1,
	jsKb: 60,
	lcpMs: 1000,
	photoMs: 1500,
	photoRssMb: 350,
	mailMs: 1000
};

function parseArgs(argv: string[]) {
	let seconds = 8;
	let cluster = true;
	for (let i = 0; i < argv.length; i++) {
		const arg = argv[i];
		if (arg === '--seconds') seconds = Number(argv[++i]);
		else if (arg === '--no-cluster') cluster = false;
		else throw new SetupError(`Unknown argument ${arg}.`, 'See the top of bench/run.ts for the options.');
	}
	if (!Number.isFinite(seconds) || seconds < 1 || seconds > 120) throw new SetupError('--seconds takes a number from 1 to 120.', 'For example: --seconds 5');
	return { seconds, cluster };
}

/** The schema (migrations) and everything that writes seed data: a change to any of them seeds afresh. */
function seedFingerprint(): string {
	const hash = createHash('sha256').update(`bench-seed-v${BENCH_SEED_VERSION}`);
	for (const item of ['drizzle', 'bench/seed', 'scripts/seed', 'scripts/seed.ts']) hashTree(hash, join(root, item));
	return hash.digest('hex');
}

function gitCommit(): { id: string; dirty: boolean } {
	const rev = spawnSync('git', ['rev-parse', '--short=10', 'HEAD'], { cwd: root, encoding: 'utf8' });
	const status = spawnSync('git', ['status', '--porcelain', '--untracked-files=no'], { cwd: root, encoding: 'utf8' });
	return { id: rev.status === 0 ? rev.stdout.trim() : 'unknown', dirty: status.status === 0 && status.stdout.trim() !== '' };
}

/** Runs a bench script in its own process and reads the JSON it prints last. */
function jsonChild<T>(script: string, env: NodeJS.ProcessEnv, args: string[] = []): T {
	const result = spawnSync(process.execPath, ['--import', 'tsx', join(root, script), ...args], {
		cwd: root,
		env,
		encoding: 'utf8',
		stdio: ['ignore', 'pipe', 'inherit'],
		maxBuffer: 16 * 1024 * 1024
	});
	const last = result.stdout.trim().split('\n').pop() ?? '';
	if (result.status !== 0 || !last.startsWith('{'))
		throw new SetupError(`${script} failed (exit ${result.status}).`, result.stdout.slice(-2000) || 'See the errors above.');
	return JSON.parse(last) as T;
}

/** A generated 24-megapixel JPEG of a tank (drawn, with grain like a camera's), kept between runs. */
async function largePhoto(): Promise<string> {
	const file = join(HOME, 'photo-24mp.jpg');
	if (existsSync(file)) return file;
	const [width, height] = [6000, 4000];
	const drawn = await drawAquarium(24, { width, height, format: 'png' });
	const grain = await sharp({ create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 0, sigma: 14 } } })
		.png()
		.toBuffer();
	const jpeg = await sharp(drawn)
		.composite([{ input: grain, blend: 'add' }])
		.jpeg({ quality: 90 })
		.toBuffer();
	writeFileSync(file, jpeg);
	return file;
}

const managed: ManagedProcess[] = [];
let stack: Stack | null = null;
let cluster: Cluster | null = null;
let stopping = false;
async function stopAll() {
	if (stopping) return;
	stopping = true;
	await cluster?.stop();
	for (const proc of managed.reverse()) await proc.stop();
	await stack?.stop();
	// Whatever a step had still running (every spawned process is tracked).
	await stopEverything();
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, () => void stopAll().then(() => process.exit(130)));

async function startInstance(name: string, env: NodeJS.ProcessEnv, port: number) {
	const log = join(HOME, `${name.replaceAll(' ', '-')}.log`);
	const proc = spawnManaged(name, process.execPath, [join(root, 'build', 'index.js')], {
		cwd: root,
		env: { ...env, PORT: String(port) },
		logFile: openSync(log, 'w')
	});
	managed.push(proc);
	if (!(await waitForPort(port, 30_000))) throw new SetupError(`The ${name} did not start on port ${port}.`, `See ${log}.`);
	return {
		url: `http://127.0.0.1:${port}`,
		async stop() {
			await proc.stop();
			managed.splice(managed.indexOf(proc), 1);
		}
	};
}

interface PageResult {
	key: PageKey;
	label: string;
	path: string;
	queries: { demo: number | null; large: number };
	one?: LoadResult;
	cluster?: LoadResult;
	weight?: PageWeight;
}

const kb = (bytes: number) => bytes / 1024;
const mark = (ok: boolean) => (ok ? '✓' : '✗');
const fixed = (n: number | undefined | null, digits = 0) => (n === undefined || n === null || Number.isNaN(n) ? '—' : n.toFixed(digits));

const started = Date.now();
let exitCode = 0;
try {
	const options = parseArgs(process.argv.slice(2));
	mkdirSync(HOME, { recursive: true });
	const fingerprint = seedFingerprint();
	const fingerprintFile = join(HOME, 'seed-fingerprint');
	const reuse = existsSync(fingerprintFile) && readFileSync(fingerprintFile, 'utf8').trim() === fingerprint;
	if (!reuse) {
		note(
			existsSync(fingerprintFile) ? 'The schema or the seed changed since the last bench run: seeding afresh.' : 'First bench run here: seeding the large club.'
		);
		rmSync(fingerprintFile, { force: true });
	}

	const benchPorts = portsFor('bench');
	const seedStarted = Date.now();
	stack = await bringUp({ mode: 'bench', home: HOME, ports: benchPorts, database: 'riparia_bench', fresh: !reuse });
	const env = stack.env;
	const db = stack.db!;

	// The demo club on its own, for the statements per request at demo size.
	const demoUrl = env.DATABASE_URL!.replace(/\/riparia_bench$/, `/${DEMO_DATABASE}`);
	const demoEnv = { ...env, DATABASE_URL: demoUrl };
	await db.admin([
		...(reuse ? [] : [`DROP DATABASE IF EXISTS \`${DEMO_DATABASE}\``]),
		`CREATE DATABASE IF NOT EXISTS \`${DEMO_DATABASE}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`
	]);
	step('Preparing the demo-sized database…');
	runNodeScript('scripts/migrate.ts', demoEnv, 'Migrating the demo-sized database');
	runNodeScript('scripts/seed.ts', demoEnv, 'Seeding the demo-sized database');

	const conn = await mysql.createConnection({ uri: env.DATABASE_URL! });
	const [marker] = (await conn.query('SELECT name FROM seed_run WHERE name = ?', [`${BENCH_SEED_MARKER}:${fingerprint.slice(0, 40)}`])) as unknown as [
		unknown[]
	];
	await conn.end();
	let seed: { reused: boolean; totalMs: number; steps: { what: string; rows: number; ms: number }[] };
	if (marker.length > 0) {
		seed = { reused: true, totalMs: 0, steps: [] };
		ok('The large club from an earlier run is current; reusing it.');
	} else {
		if (reuse) throw new SetupError('The bench database lost its large club.', `Delete ${HOME} and run the bench again.`);
		step(
			`Seeding the large club (${SIZES.members} members, ${SIZES.tanks} tanks, ${SIZES.entries} entries, ${SIZES.waterTests} water tests, ${SIZES.listings} listings, ${SIZES.contests} contests, ${SIZES.photos} photos)…`
		);
		const out = jsonChild<{ totalMs: number; steps: { what: string; rows: number; ms: number }[] }>('bench/seed/large.ts', env, [fingerprint]);
		seed = { reused: false, ...out };
		for (const s of out.steps) note(`${s.what}: ${(s.ms / 1000).toFixed(1)} s`);
		ok(`Seeded the large club in ${(out.totalMs / 1000).toFixed(1)} s.`);
		writeFileSync(fingerprintFile, fingerprint + '\n');
	}
	const setupSeconds = (Date.now() - seedStarted) / 1000;

	// --- One instance on the large club, one on the demo club --------------------------------
	step('Starting the production build (node build) on the large and the demo-sized club…');
	const single = await startInstance('large instance', env, benchPorts.app);
	const demo = await startInstance('demo instance', demoEnv, benchPorts.app + 1);
	const [largeTargets, demoTargets] = await Promise.all([findTargets(env.DATABASE_URL!), findTargets(demoUrl)]);

	step('Counting SQL statements per request…');
	const results: PageResult[] = [];
	for (const target of largeTargets) {
		const large = await queriesFor(single.url + target.path, target.cookie);
		if (large.status !== 200) throw new SetupError(`${target.path} answered ${large.status} on the large club.`, `See ${join(HOME, 'large-instance.log')}.`);
		const demoTarget = demoTargets.find((t) => t.key === target.key)!;
		const small = await queriesFor(demo.url + demoTarget.path, demoTarget.cookie);
		if (small.status !== 200) warn(`${demoTarget.path} answered ${small.status} on the demo club.`);
		results.push({
			key: target.key,
			label: target.label,
			path: target.path,
			queries: { demo: small.status === 200 ? small.queries.at(-1)! : null, large: large.queries.at(-1)! }
		});
	}
	await demo.stop();

	// The cluster runs beside the single instance (idle while the other is measured), so each page's
	// two figures are taken one after the other, under the same load from the rest of the machine.
	let clusterNote = 'skipped (--no-cluster)';
	if (options.cluster) {
		step('Starting the cluster (nginx, two instances, two workers)…');
		cluster = await startCluster({
			env,
			home: join(HOME, 'cluster'),
			publicPort: benchPorts.app + 2,
			appPorts: [benchPorts.app + 3, benchPorts.app + 4],
			workers: 2,
			origin: env.ORIGIN,
			portEnvName: 'TEST_PORT_OFFSET',
			quiet: true
		});
		clusterNote = `nginx → 2 instances, 2 workers, on ${cpus().length} cores; each page measured right after the single instance`;
	}

	const loadOptions = { connections: 10, warmupSeconds: 2, seconds: options.seconds };
	const loadBefore = loadavg()[0]!;
	const measured = largeTargets.filter((t) => t.key !== 'viewer');
	step(
		`Load: ${loadOptions.connections} connections, ${loadOptions.warmupSeconds} s warm-up then ${loadOptions.seconds} s per page, one instance${cluster ? ', then the cluster' : ''}…`
	);
	for (const target of measured) {
		const result = results.find((p) => p.key === target.key)!;
		result.one = await load(single.url + target.path, target.cookie, loadOptions);
		if (cluster) result.cluster = await load(cluster.url + target.path, target.cookie, loadOptions);
		note(
			`${target.label}: ${result.one.requestsPerSecond.toFixed(0)} req/s, p99 ${result.one.p99} ms${result.cluster ? `; cluster ${result.cluster.requestsPerSecond.toFixed(0)} req/s` : ''}`
		);
	}
	if (cluster) {
		await cluster.stop();
		cluster = null;
	}

	step('Weighing each page in Chromium, and the tank page’s largest contentful paint…');
	const browser = await launch();
	let lcp: number[] = [];
	try {
		// The browser is sent to localhost, as people are, so the session cookie's origin matches.
		const origin = `http://localhost:${benchPorts.app}`;
		for (const target of measured.filter((t: Target) => t.page)) {
			results.find((p) => p.key === target.key)!.weight = await weigh(browser, origin, target.path, target.cookie);
		}
		const tank = largeTargets.find((t) => t.key === 'tank')!;
		lcp = await largestContentfulPaint(browser, origin, tank.path, tank.cookie);
	} finally {
		await browser.close();
	}
	await single.stop();

	// --- Off the HTTP path ---------------------------------------------------------------------
	const loadAfter = loadavg()[0]!;
	step('Photo pipeline on a 24-megapixel JPEG (own process)…');
	const photo = jsonChild<{ width: number; height: number; uploadBytes: number; renditions: number; msMedian: number; peakRssMb: number; rssBeforeMb: number }>(
		'bench/photo.ts',
		env,
		[await largePhoto()]
	);
	step('Results of a 100-entry, 6-judge, 6-criteria category…');
	const contestInput = syntheticContest(100, 6, 6);
	const contestMs = timeResults(contestInput, 10);
	step('Queueing a mail to 2,000 members in one transaction…');
	const mail = jsonChild<{ recipients: number; msMedian: number }>('bench/mail-queue.ts', env);
	step('Queueing a news post to 2,000 members…');
	const news = jsonChild<{ recipients: number; msMedian: number }>('bench/news-queue.ts', env);

	// --- The table --------------------------------------------------------------------------------
	const baseline = results.find((r) => r.key === 'baseline')!;
	const baseRps = baseline.one?.requestsPerSecond ?? NaN;
	const lcpMedian = [...lcp].sort((a, b) => a - b)[Math.floor(lcp.length / 2)] ?? NaN;
	const commit = gitCommit();
	const date = new Date().toISOString().slice(0, 10);
	const machineLoad = { before: loadBefore, after: loadAfter };
	const lines: string[] = [];
	const row = (cells: string[], widths: number[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');
	const widths = [44, 7, 7, 7, 6, 6, 11, 7, 7, 8, 6];
	lines.push(
		`Riparia bench ${date}, commit ${commit.id}${commit.dirty ? ' (with uncommitted changes)' : ''}, Node ${process.version}, ${cpus().length} cores, loopback, ${loadOptions.connections} connections`
	);
	lines.push(
		`Machine load average (1 min) ${machineLoad.before.toFixed(1)} when the load runs began, ${machineLoad.after.toFixed(1)} at the end: other work on this machine shares its cores`
	);
	lines.push(
		`Large club: ${SIZES.members} members, ${SIZES.tanks} tanks, ${SIZES.entries} entries, ${SIZES.waterTests} water tests, ${SIZES.comments} comments, ${SIZES.listings} listings, ${SIZES.conversations} conversations, ${SIZES.contests}×${SIZES.entriesPerContest} contest entries, ${SIZES.photos} photos`
	);
	lines.push(
		seed.reused
			? `Seed: reused from an earlier run (fingerprint ${fingerprint.slice(0, 12)}); stack ready in ${setupSeconds.toFixed(1)} s`
			: `Seed: large club written in ${(seed.totalMs / 1000).toFixed(1)} s (fingerprint ${fingerprint.slice(0, 12)}); stack ready in ${setupSeconds.toFixed(1)} s`
	);
	lines.push('');
	lines.push(row(['', 'req/s', 'p50 ms', 'p99 ms', 'non2xx', '×base', 'SQL demo→', 'JS kB', 'CSS kB', 'cluster', '×one'], widths));
	lines.push(row(['', '', '', '', '', '', 'large', 'gzip', 'gzip', 'req/s', ''], widths));
	for (const r of results) {
		const one = r.one;
		lines.push(
			row(
				[
					r.label,
					fixed(one?.requestsPerSecond),
					fixed(one?.p50, 1),
					fixed(one?.p99, 1),
					one ? String(one.non2xx + one.errors) : '—',
					one ? (one.requestsPerSecond / baseRps).toFixed(2) : '—',
					`${r.queries.demo ?? '?'} → ${r.queries.large}`,
					r.weight ? kb(r.weight.jsGzipBytes).toFixed(1) : '—',
					r.weight ? kb(r.weight.cssGzipBytes).toFixed(1) : '—',
					fixed(r.cluster?.requestsPerSecond),
					r.cluster && one ? (r.cluster.requestsPerSecond / one.requestsPerSecond).toFixed(2) : '—'
				],
				widths
			)
		);
	}
	lines.push('');
	lines.push(`Tank page LCP (Chromium, empty cache, loopback): median ${lcpMedian.toFixed(0)} ms of ${lcp.map((x) => x.toFixed(0)).join(', ')}`);
	lines.push(
		`Photo pipeline, ${photo.width}×${photo.height} JPEG of ${(photo.uploadBytes / 1048576).toFixed(1)} MB → ${photo.renditions} renditions: ${photo.msMedian.toFixed(0)} ms, peak RSS ${photo.peakRssMb.toFixed(0)} MB (${photo.rssBeforeMb.toFixed(0)} MB before the photo)`
	);
	lines.push(`Results of one category, 100 entries × 6 judges × 6 criteria (${contestInput.cards.length} cards): ${contestMs.toFixed(1)} ms`);
	lines.push(`Queueing a mail to ${mail.recipients} members in one transaction: ${mail.msMedian.toFixed(0)} ms`);
	lines.push(`Queueing a news post to ${news.recipients} members (audience, settings, one row each): ${news.msMedian.toFixed(0)} ms`);
	lines.push(`Cluster: ${clusterNote}`);

	const targets: { what: string; figure: string; ok: boolean }[] = [];
	for (const r of results) {
		if (!r.one || r.key === 'baseline') continue;
		const share = r.one.requestsPerSecond / baseRps;
		targets.push({
			what: `${r.label}: ≥ ${TARGETS.share * 100} % of the baseline's req/s`,
			figure: `${(share * 100).toFixed(0)} %`,
			ok: share >= TARGETS.share
		});
		targets.push({ what: `${r.label}: p99 ≤ ${TARGETS.p99Ms} ms`, figure: `${r.one.p99} ms`, ok: r.one.p99 <= TARGETS.p99Ms });
	}
	for (const r of results) {
		if (r.key === 'baseline' || r.key === 'viewer') continue;
		targets.push({
			what: `${r.label}: same SQL statements on the demo and the large club`,
			figure: `${r.queries.demo ?? '?'} → ${r.queries.large}`,
			ok: r.queries.demo !== null && r.queries.demo === r.queries.large
		});
	}
	const viewer = results.find((r) => r.key === 'viewer')!;
	targets.push({
		what: `resolving a signed-in viewer: ≤ ${TARGETS.viewerQueries} statement`,
		figure: String(viewer.queries.large),
		ok: viewer.queries.large <= TARGETS.viewerQueries
	});
	for (const r of results) {
		if (!r.weight) continue;
		targets.push({
			what: `${r.label}: ≤ ${TARGETS.jsKb} kB JS (gzip)`,
			figure: `${kb(r.weight.jsGzipBytes).toFixed(1)} kB`,
			ok: kb(r.weight.jsGzipBytes) <= TARGETS.jsKb
		});
	}
	targets.push({ what: `tank page LCP ≤ ${TARGETS.lcpMs} ms`, figure: `${lcpMedian.toFixed(0)} ms`, ok: lcpMedian <= TARGETS.lcpMs });
	targets.push({ what: `24 MP photo renditions ≤ ${TARGETS.photoMs} ms`, figure: `${photo.msMedian.toFixed(0)} ms`, ok: photo.msMedian <= TARGETS.photoMs });
	targets.push({
		what: `24 MP photo peak RSS ≤ ${TARGETS.photoRssMb} MB`,
		figure: `${photo.peakRssMb.toFixed(0)} MB`,
		ok: photo.peakRssMb <= TARGETS.photoRssMb
	});
	targets.push({ what: `mail to 2,000 members queued ≤ ${TARGETS.mailMs} ms`, figure: `${mail.msMedian.toFixed(0)} ms`, ok: mail.msMedian <= TARGETS.mailMs });
	lines.push('');
	lines.push(`Targets (${targets.filter((t) => t.ok).length} of ${targets.length} met; printed, never asserted)`);
	for (const t of targets) lines.push(`  ${mark(t.ok)} ${t.what.padEnd(84)} ${t.figure}`);

	console.log('\n' + lines.join('\n') + '\n');

	const resultsDir = join(root, 'bench', 'results');
	mkdirSync(resultsDir, { recursive: true });
	const file = join(resultsDir, `${date}-${commit.id}${commit.dirty ? '-dirty' : ''}.json`);
	writeFileSync(
		file,
		JSON.stringify(
			{
				date: new Date().toISOString(),
				commit: commit.id,
				dirty: commit.dirty,
				node: process.version,
				cpus: cpus().length,
				machineLoad,
				load: loadOptions,
				sizes: SIZES,
				seed: { ...seed, fingerprint },
				setupSeconds,
				pages: results,
				lcpMs: lcp,
				photo,
				contest: { entries: 100, judges: 6, criteria: 6, cards: contestInput.cards.length, ms: contestMs },
				mail,
				news,
				cluster: clusterNote,
				targets,
				table: lines
			},
			null,
			2
		) + '\n'
	);
	ok(`Written to ${relative(root, file)}; the bench took ${((Date.now() - started) / 1000).toFixed(0)} s in all.`);
} catch (error) {
	reportFailure(error);
	exitCode = 1;
} finally {
	await stopAll().catch((e) => warn(`While stopping: ${String(e)}`));
}
process.exit(exitCode);
