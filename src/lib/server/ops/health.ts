// /healthz and /readyz. Readiness asks MariaDB, compares the applied migrations with the ones this
// build was made with, asks the bucket (HeadBucket) and looks at the outbox worker's last round.
// The answer is kept for a moment so probes from several balancers cannot hammer the database.
//
// The worker check: an instance that runs a worker (OUTBOX_WORKER, the default) judges its own,
// in process; an instance that does not reads the heartbeat every worker writes to job_run
// (`outbox-worker`), so it reports whether any instance is delivering mail.
import { sql } from 'drizzle-orm';
import journal from '../../../../drizzle/meta/_journal.json';
import { config } from '../config';
import { db } from '../db';
import { lastRuns } from '../jobs/runner';
import { WORKER_HEARTBEAT, workerStatus } from '../mail/outbox';
import { checkBucket } from '../media/storage';
import { migrationCheck, summarise, workerCheck, type CheckResult, type JournalEntry, type Readiness } from '../../ops/readiness';
import { component, reason } from './log';

const log = component('health');

/** How long one answer is reused. */
const CACHE_MS = 1_500;
/** A check that has not answered by then counts as failed. */
const CHECK_TIMEOUT_MS = 2_000;

/** How long the outbox worker may go without finishing a round before the instance is not ready. */
const workerStaleAfterMs = () => Math.max(120_000, 10 * config().OUTBOX_POLL_MS);

const migrations: JournalEntry[] = journal.entries;

async function timed(run: (signal: AbortSignal) => Promise<CheckResult>, failure: string, name: string): Promise<CheckResult> {
	const controller = new AbortController();
	let timer: ReturnType<typeof setTimeout> | undefined;
	const timeout = new Promise<CheckResult>((resolve) => {
		timer = setTimeout(() => {
			controller.abort();
			resolve({ ok: false, detail: `${failure} (no answer in ${CHECK_TIMEOUT_MS / 1000} s)` });
		}, CHECK_TIMEOUT_MS);
	});
	try {
		return await Promise.race([run(controller.signal), timeout]);
	} catch (error) {
		// The reason (which can name hosts) goes to the log only; the public answer stays short.
		log.warn({ check: name, reason: reason(error) }, 'readiness check failed');
		return { ok: false, detail: failure };
	} finally {
		clearTimeout(timer);
	}
}

async function checkDatabase(): Promise<{ database: CheckResult; migrations: CheckResult }> {
	const database = await timed(
		async () => {
			await db.execute(sql`SELECT 1`);
			return { ok: true };
		},
		'not reachable',
		'database'
	);
	if (!database.ok) return { database, migrations: { ok: false, detail: 'unknown while the database is not reachable' } };
	const applied = await timed(
		async () => {
			const [rows] = (await db.execute(sql`SELECT MAX(created_at) AS latest FROM __drizzle_migrations`)) as unknown as [{ latest: string | number | null }[]];
			const latest = rows[0]?.latest;
			return migrationCheck(migrations, latest === null || latest === undefined ? null : Number(latest));
		},
		'applied migrations could not be read',
		'migrations'
	);
	return { database, migrations: applied };
}

async function checkWorker(): Promise<CheckResult> {
	const own = workerStatus();
	const now = Date.now();
	if (own.runsHere) {
		return workerCheck({ runsHere: true, startedAt: own.startedAt, lastTickAt: own.lastRoundAt, now, staleAfterMs: workerStaleAfterMs() });
	}
	return timed(
		async () => {
			const heartbeat = (await lastRuns()).find((r) => r.name === WORKER_HEARTBEAT);
			return workerCheck({ runsHere: false, startedAt: null, lastTickAt: heartbeat?.lastRunAt?.getTime() ?? null, now, staleAfterMs: workerStaleAfterMs() });
		},
		'heartbeat could not be read',
		'outbox-worker'
	);
}

async function check(): Promise<Readiness> {
	const [{ database, migrations: applied }, storage, worker] = await Promise.all([
		checkDatabase(),
		timed(
			async (signal) => {
				await checkBucket(signal);
				return { ok: true };
			},
			'bucket not reachable',
			'storage'
		),
		checkWorker()
	]);
	return summarise({ database, migrations: applied, storage, outboxWorker: worker });
}

let cached: { at: number; result: Promise<Readiness> } | null = null;
let lastStatus: Readiness['status'] | null = null;

/** The readiness of this instance, computed at most once per CACHE_MS however many ask. */
export function readiness(now = Date.now()): Promise<Readiness> {
	if (cached && now - cached.at < CACHE_MS) return cached.result;
	const result = check()
		.catch((error: unknown): Readiness => {
			log.error({ reason: reason(error) }, 'readiness could not be computed');
			return summarise({ readiness: { ok: false, detail: 'could not be computed' } });
		})
		.then((r) => {
			if (r.status !== lastStatus) {
				const failing = Object.entries(r.checks)
					.filter(([, c]) => !c.ok)
					.map(([name, c]) => `${name}: ${c.detail}`);
				if (r.status === 'ready') log.info({ checks: r.checks }, 'ready');
				else log.warn({ failing }, 'not ready');
				lastStatus = r.status;
			}
			return r;
		});
	cached = { at: now, result };
	return result;
}

const json = (body: unknown, status: number) =>
	new Response(JSON.stringify(body), {
		status,
		headers: { 'content-type': 'application/json', 'cache-control': 'no-store', 'x-content-type-options': 'nosniff' }
	});

/** The process is up and answering; it asks nothing else. */
export const liveResponse = () => json({ status: 'up', uptimeSeconds: Math.round(process.uptime()) }, 200);

export async function readyResponse(): Promise<Response> {
	const result = await readiness();
	return json(result, result.status === 'ready' ? 200 : 503);
}
