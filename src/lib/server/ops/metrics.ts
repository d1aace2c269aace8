// Prometheus metrics (prom-client). Definitions only, so any module can count into them without
// importing the database; the gauges read from the database are filled at scrape time by
// ./scrape.ts. Names and labels are listed in docs/operations.md.
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';

export const registry = new Registry();
// Node's own: process_cpu_seconds_total, process_resident_memory_bytes, nodejs_eventloop_lag_seconds, …
collectDefaultMetrics({ register: registry });

const registers = [registry];
const counter = <L extends string>(name: string, help: string, labelNames: readonly L[] = []) => new Counter<L>({ name, help, labelNames, registers });
const gauge = <L extends string>(name: string, help: string, labelNames: readonly L[] = []) => new Gauge<L>({ name, help, labelNames, registers });
const histogram = <L extends string>(name: string, help: string, labelNames: readonly L[], buckets: number[]) =>
	new Histogram<L>({ name, help, labelNames, buckets, registers });

export const httpRequests = counter('riparia_http_requests_total', 'Requests answered, by route id (never the raw path) and status class.', [
	'method',
	'route',
	'status_class'
]);
export const httpDuration = histogram(
	'riparia_http_request_duration_seconds',
	'Time from receiving a request to its response headers, by route id and status class.',
	['route', 'status_class'],
	[0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10]
);

export const outboxDeliveries = counter(
	'riparia_outbox_deliveries_total',
	'Delivery attempts by this process: sent, retry (failed, tried again later) or failed (given up).',
	['result']
);
export const outboxMessages = gauge('riparia_outbox_messages', 'Messages in the outbox by state (queued, sending, sent, failed), counted at scrape time.', [
	'state'
]);
export const outboxOldestQueuedAge = gauge(
	'riparia_outbox_oldest_queued_age_seconds',
	'Age of the oldest message not yet delivered (queued or sending); 0 when there is none.'
);
export const outboxWorkerLastTickAge = gauge(
	'riparia_outbox_worker_last_tick_age_seconds',
	'Seconds since any instance’s outbox worker last finished a round (from job_run).'
);

export const jobLastRunAge = gauge('riparia_job_last_run_age_seconds', 'Seconds since each periodic job last ran (from job_run).', ['job']);
export const jobLastRunFailed = gauge('riparia_job_last_run_failed', '1 when the last run of the job failed, else 0.', ['job']);

export const readyCheck = gauge('riparia_ready_check', '1 when the readiness check passes, else 0 (the same checks as /readyz).', ['check']);
export const scrapeErrors = counter('riparia_metrics_scrape_errors_total', 'Scrapes whose database gauges could not be read (the gauges are then left out).');

export const uploadSeconds = histogram(
	'riparia_upload_processing_seconds',
	'Time to check, convert and store one uploaded photo, by outcome (ok, rejected, error).',
	['outcome'],
	[0.05, 0.1, 0.25, 0.5, 1, 2, 4, 8, 16, 32]
);
