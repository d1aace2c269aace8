// Prometheus metrics (prom-client). Definitions only, so any module can count into them without
// importing the database; the gauges read from the database are filled at scrape time by
// ./scrape.ts. Names and labels are listed in docs/operations.md.
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';

export const registry = new Registry();
// Node's own: process_cpu_seconds_total, process_resident_memory_bytes, nodejs_eventloop_lag_seconds, …
collectDefaultMetrics({ register: registry });

const registers = [registry];

export const httpRequests = new Counter({
	name: 'riparia_http_requests_total',
	help: 'Requests answered, by route id (never the raw path) and status class.',
	labelNames: ['method', 'route', 'status_class'] as const,
	registers
});

export const httpDuration = new Histogram({
	name: 'riparia_http_request_duration_seconds',
	help: 'Time from receiving a request to its response headers, by route id and status class.',
	labelNames: ['route', 'status_class'] as const,
	buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
	registers
});

export const outboxDeliveries = new Counter({
	name: 'riparia_outbox_deliveries_total',
	help: 'Delivery attempts by this process: sent, retry (failed, tried again later) or failed (given up).',
	labelNames: ['result'] as const,
	registers
});

export const outboxMessages = new Gauge({
	name: 'riparia_outbox_messages',
	help: 'Messages in the outbox by state (queued, sending, sent, failed), counted at scrape time.',
	labelNames: ['state'] as const,
	registers
});

export const outboxOldestQueuedAge = new Gauge({
	name: 'riparia_outbox_oldest_queued_age_seconds',
	help: 'Age of the oldest message not yet delivered (queued or sending); 0 when there is none.',
	registers
});

export const jobLastRunAge = new Gauge({
	name: 'riparia_job_last_run_age_seconds',
	help: 'Seconds since each periodic job last ran (from job_run).',
	labelNames: ['job'] as const,
	registers
});

export const jobLastRunFailed = new Gauge({
	name: 'riparia_job_last_run_failed',
	help: '1 when the last run of the job failed, else 0.',
	labelNames: ['job'] as const,
	registers
});

export const outboxWorkerLastTickAge = new Gauge({
	name: 'riparia_outbox_worker_last_tick_age_seconds',
	help: 'Seconds since any instance’s outbox worker last finished a round (from job_run).',
	registers
});

export const readyCheck = new Gauge({
	name: 'riparia_ready_check',
	help: '1 when the readiness check passes, else 0 (the same checks as /readyz).',
	labelNames: ['check'] as const,
	registers
});

export const scrapeErrors = new Counter({
	name: 'riparia_metrics_scrape_errors_total',
	help: 'Scrapes whose database gauges could not be read (the gauges are then left out).',
	registers
});

export const uploadSeconds = new Histogram({
	name: 'riparia_upload_processing_seconds',
	help: 'Time to check, convert and store one uploaded photo, by outcome (ok, rejected, error).',
	labelNames: ['outcome'] as const,
	buckets: [0.05, 0.1, 0.25, 0.5, 1, 2, 4, 8, 16, 32],
	registers
});
