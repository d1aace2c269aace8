// Runs the periodic jobs (jobs/index.ts lists them): each is claimed by one conditional UPDATE
// on job_run, so with several app instances ticking at once exactly one runs it.
import { hostname } from 'node:os';
import { and, eq, isNull, lte, or, sql } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import { jobRuns } from '../db/meta';
import { component, reason } from '../ops/log';

const log = component('jobs');

/** What a job's run is given: the moment of this round, and the database the runner was given (if any). */
export type JobContext = Context & { now: Date };

export interface Job {
	/** Stable name; the row in job_run is keyed by it. */
	name: string;
	/** How often it should run at most. */
	everyMs: number;
	/** How long one run may hold the job before another instance may take it over. */
	leaseMs?: number;
	run(context: JobContext): Promise<unknown>;
}

/**
 * Claims a job for one run if it is due and nobody holds it. The claim is one conditional UPDATE,
 * so of several instances ticking at once exactly one wins.
 */
export async function claim(job: Job, worker: string, context: Context = {}): Promise<boolean> {
	const { db, now } = resolve(context);
	await db
		.insert(jobRuns)
		.values({ name: job.name })
		.onDuplicateKeyUpdate({ set: { name: sql`name` } });
	const dueBefore = new Date(now.getTime() - job.everyMs);
	const [result] = await db
		.update(jobRuns)
		.set({ lockedUntil: new Date(now.getTime() + (job.leaseMs ?? 10 * 60_000)), lockedBy: worker })
		.where(
			and(
				eq(jobRuns.name, job.name),
				or(isNull(jobRuns.lockedUntil), lte(jobRuns.lockedUntil, now)),
				or(isNull(jobRuns.lastRunAt), lte(jobRuns.lastRunAt, dueBefore))
			)
		);
	return result.affectedRows === 1;
}

async function release(job: Job, error: unknown, context: Context) {
	const { db, now } = resolve(context);
	await db
		.update(jobRuns)
		.set({
			lastRunAt: now,
			lockedUntil: null,
			lockedBy: null,
			lastError: error ? String(error instanceof Error ? error.message : error).slice(0, 1000) : null
		})
		.where(eq(jobRuns.name, job.name));
}

/** Runs every due job once; returns the names of the jobs this call ran. */
export async function runDueJobs(jobs: Job[], options: { worker?: string } = {}, context: Context = {}): Promise<string[]> {
	const worker = options.worker ?? `${hostname()}:${process.pid}`;
	// One moment for the whole round: every claim, run and release of it agrees on "now".
	const round: JobContext = { ...context, now: resolve(context).now };
	const ran: string[] = [];
	for (const job of jobs) {
		if (!(await claim(job, worker, round))) continue;
		let failure: unknown = null;
		const started = performance.now();
		try {
			const result = await job.run(round);
			// Jobs return how many things they handled (mails queued, listings expired…).
			log.info({ job: job.name, ms: Math.round(performance.now() - started), ...(typeof result === 'number' ? { handled: result } : {}) }, 'job ran');
		} catch (error) {
			failure = error;
			log.error({ job: job.name, ms: Math.round(performance.now() - started), reason: reason(error) }, 'job failed');
		}
		await release(job, failure, round);
		ran.push(job.name);
	}
	return ran;
}

/** Ticks the runner until stopped; the function it returns resolves once a round in progress has finished. */
export function startJobs(jobs: Job[], intervalMs = 30_000) {
	let stopped = false;
	let timer: ReturnType<typeof setTimeout> | undefined;
	let round: Promise<void> = Promise.resolve();
	const tick = () => (round = runRound());
	const runRound = async () => {
		if (stopped) return;
		try {
			await runDueJobs(jobs);
		} catch (error) {
			log.error({ reason: reason(error) }, 'job round failed');
		}
		if (!stopped) timer = setTimeout(() => void tick(), intervalMs);
	};
	timer = setTimeout(() => void tick(), 1_000);
	return (): Promise<void> => {
		stopped = true;
		if (timer) clearTimeout(timer);
		return round;
	};
}

/**
 * Records that a long-running worker (not a claimed job) finished a round, e.g. `outbox-worker`;
 * its row in job_run is never claimed by the runner, only read by /readyz and the metrics.
 */
export async function recordHeartbeat(name: string, worker: string, context: Context = {}): Promise<void> {
	const { db, now: at } = resolve(context);
	await db
		.insert(jobRuns)
		.values({ name, lastRunAt: at, lockedBy: worker })
		.onDuplicateKeyUpdate({ set: { lastRunAt: at, lockedBy: worker } });
}

/** Every row of job_run: when each job (and each worker's heartbeat) last ran, and whether it failed. */
export async function lastRuns(context: Context = {}): Promise<{ name: string; lastRunAt: Date | null; failed: boolean }[]> {
	const { db } = resolve(context);
	const rows = await db.select({ name: jobRuns.name, lastRunAt: jobRuns.lastRunAt, lastError: jobRuns.lastError }).from(jobRuns);
	return rows.map((r) => ({ name: r.name, lastRunAt: r.lastRunAt, failed: r.lastError !== null }));
}
