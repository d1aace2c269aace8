// Serves the metrics: fills the gauges that come from the database (one outbox query, one read of
// job_run) and the readiness checks (cached, see ./health), then renders the registry. Reached two
// ways, both kept from the public: a listener on 127.0.0.1:METRICS_PORT, and /metrics on the app's
// port with `Authorization: Bearer <METRICS_TOKEN>`.
import { createHash, timingSafeEqual } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import { config } from '../config';
import { lastRuns } from '../jobs/runner';
import { WORKER_HEARTBEAT, queueStats } from '../mail/outbox';
import { readiness } from './health';
import { component, reason } from './log';
import * as m from './metrics';

const log = component('metrics');

async function fillGauges(now = Date.now()): Promise<void> {
	const [ready] = await Promise.all([
		readiness(),
		(async () => {
			try {
				const [stats, runs] = await Promise.all([queueStats(), lastRuns()]);
				m.outboxMessages.reset();
				for (const [state, n] of Object.entries(stats.byState)) m.outboxMessages.set({ state }, n);
				m.outboxOldestQueuedAge.set(stats.oldestUndeliveredSeconds ?? 0);
				m.jobLastRunAge.reset();
				m.jobLastRunFailed.reset();
				m.outboxWorkerLastTickAge.reset();
				for (const run of runs) {
					if (!run.lastRunAt) continue;
					const age = Math.max(0, (now - run.lastRunAt.getTime()) / 1000);
					if (run.name === WORKER_HEARTBEAT) {
						m.outboxWorkerLastTickAge.set(age);
					} else {
						m.jobLastRunAge.set({ job: run.name }, age);
						m.jobLastRunFailed.set({ job: run.name }, run.failed ? 1 : 0);
					}
				}
			} catch (error) {
				// Without the database these gauges are left out rather than shown stale.
				m.scrapeErrors.inc();
				for (const gauge of [m.outboxMessages, m.outboxOldestQueuedAge, m.jobLastRunAge, m.jobLastRunFailed, m.outboxWorkerLastTickAge]) gauge.reset();
				log.warn({ reason: reason(error) }, 'database gauges could not be read');
			}
		})()
	]);
	m.readyCheck.reset();
	for (const [name, result] of Object.entries(ready.checks)) m.readyCheck.set({ check: name }, result.ok ? 1 : 0);
}

let rendering: Promise<{ body: string; contentType: string }> | null = null;

/** The metrics in Prometheus's text format; scrapes that overlap share one rendering. */
function metricsText(): Promise<{ body: string; contentType: string }> {
	rendering ??= (async () => {
		try {
			await fillGauges();
			return { body: await m.registry.metrics(), contentType: m.registry.contentType };
		} finally {
			rendering = null;
		}
	})();
	return rendering;
}

const digest = (value: string) => createHash('sha256').update(value).digest();

/** Whether an Authorization header carries the configured METRICS_TOKEN (compared in constant time). */
function tokenMatches(header: string | null, token = config().METRICS_TOKEN): boolean {
	if (!token || !header) return false;
	const match = /^Bearer\s+(\S+)$/i.exec(header.trim());
	return match !== null && timingSafeEqual(digest(match[1]!), digest(token));
}

/** `/metrics` on the app's own port: 404 unless METRICS_TOKEN is set, 401 without it. */
export async function metricsResponse(request: Request): Promise<Response> {
	const headers = { 'cache-control': 'no-store', 'x-content-type-options': 'nosniff' };
	if (!config().METRICS_TOKEN) return new Response('Not found', { status: 404, headers });
	if (!tokenMatches(request.headers.get('authorization'))) {
		return new Response('A bearer token is needed for the metrics.', { status: 401, headers: { ...headers, 'www-authenticate': 'Bearer realm="metrics"' } });
	}
	const { body, contentType } = await metricsText();
	return new Response(body, { headers: { ...headers, 'content-type': contentType } });
}

/** The metrics on their own listener, bound to 127.0.0.1 only, for a Prometheus on the same host. */
export function startMetricsServer(port: number): Server {
	const server = createServer((req, res) => {
		if (req.method !== 'GET' || req.url?.split('?')[0] !== '/metrics') {
			res.writeHead(404).end('Not found');
			return;
		}
		metricsText().then(
			({ body, contentType }) => res.writeHead(200, { 'content-type': contentType, 'cache-control': 'no-store' }).end(body),
			(error: unknown) => {
				log.error({ reason: reason(error) }, 'metrics could not be rendered');
				res.writeHead(500).end('Metrics could not be rendered.');
			}
		);
	});
	server.on('error', (error) => log.error({ port, reason: reason(error) }, 'metrics listener failed'));
	server.listen(port, '127.0.0.1', () => log.info({ address: `127.0.0.1:${port}` }, 'metrics listening'));
	return server;
}
