// A standalone background worker: delivers the outbox and runs the periodic jobs, outside the app
// process. Production runs one or more of these beside app instances started with OUTBOX_WORKER=0.
// Workers share nothing but the database: each claims outbox rows with FOR UPDATE SKIP LOCKED and
// each job through job_run, so any number may run at once.
//
//   node --import tsx scripts/worker.ts        (reads the same environment as the app)
import { hostname } from 'node:os';
import { pool } from '../src/lib/server/db';
import { jobs } from '../src/lib/server/jobs';
import { startJobs } from '../src/lib/server/jobs/runner';
import { startWorker } from '../src/lib/server/mail/outbox';
import { defaultTransport } from '../src/lib/server/mail/transport';
import { registerMediaScopes } from '../src/lib/server/media-scopes';

// Jobs read and remove photos of every feature; the features say who owns which first.
registerMediaScopes();

const name = `${hostname()}:${process.pid}`;
const stopOutbox = startWorker({ onError: (e) => console.error('[outbox] delivery round failed:', e instanceof Error ? e.message : e) });
const stopJobs = startJobs(jobs);
console.log(`worker ${name}: delivering the outbox and running periodic jobs`);

let stopping = false;
async function shutdown(signal: string) {
	if (stopping) return;
	stopping = true;
	// Finish the round in hand (a claimed message is sent and recorded), then let go of everything.
	await Promise.all([stopOutbox(), stopJobs()]);
	defaultTransport().close();
	await pool.end();
	console.log(`worker ${name}: stopped (${signal})`);
	process.exit(0);
}
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void shutdown(signal));
