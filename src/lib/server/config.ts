import { z } from 'zod';

// Server configuration comes from the environment (adapter-node passes it through process.env),
// read through this one module so scripts, workers and tests see the same values as the app.
// Defaults match what `npm start` sets up locally; see .env.example.

const bool = z.enum(['1', '0', 'true', 'false', 'yes', 'no', 'on', 'off']).transform((v) => ['1', 'true', 'yes', 'on'].includes(v));

/** An empty variable (`NAME=` in a .env file) counts as unset. */
const unsetIfEmpty = <T extends z.ZodType>(inner: T) => z.preprocess((v) => (v === '' ? undefined : v), inner);

const schema = z.object({
	DATABASE_URL: z.string().url().default('mysql://riparia@127.0.0.1:3307/riparia'),
	ORIGIN: z.string().url().default('http://127.0.0.1:5173'),
	AUTH_SECRET: z.string().optional(),
	SMTP_URL: z.string().default('smtp://127.0.0.1:2525'),
	MAIL_FROM: z.string().default('Riparia <hello@riparia.test>'),
	S3_ENDPOINT: z.string().url().optional(),
	S3_REGION: z.string().default('us-east-1'),
	S3_BUCKET: z.string().default('riparia-media'),
	S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
	S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
	S3_FORCE_PATH_STYLE: bool.default(true),
	ADMIN_EMAIL: z
		.string()
		.email()
		.optional()
		.or(z.literal('').transform(() => undefined)),
	SIGNIN_LIMIT_PER_ADDRESS: z.coerce.number().int().positive().default(5),
	SIGNIN_LIMIT_PER_CLIENT: z.coerce.number().int().positive().default(20),
	OUTBOX_WORKER: bool.default(true),
	OUTBOX_POLL_MS: z.coerce.number().int().positive().default(2000),
	CLUB_NAME: z.string().default('Riparia club'),
	/** Set by `npm run bench`: responses carry the number of SQL statements they took. */
	BENCH: bool.default(false),
	/** Prometheus metrics on their own listener, bound to 127.0.0.1 only; unset: no listener. */
	METRICS_PORT: unsetIfEmpty(z.coerce.number().int().min(1).max(65535).optional()),
	/** Bearer token for /metrics on the app's own port; unset: /metrics there answers 404. */
	METRICS_TOKEN: unsetIfEmpty(z.string().min(16, 'use at least 16 characters (e.g. openssl rand -hex 24)').optional())
});

export type Config = z.infer<typeof schema>;

let cached: Config | undefined;

export function config(): Config {
	if (!cached) {
		const parsed = schema.safeParse(process.env);
		if (!parsed.success) {
			const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
			throw new Error(`Invalid environment for Riparia:\n${lines.join('\n')}`);
		}
		cached = parsed.data;
	}
	return cached;
}

const logSchema = z.object({
	LOG_FORMAT: z.enum(['json', 'pretty']).optional(),
	LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
	NODE_ENV: z.string().optional()
});

/**
 * How to log: JSON lines in production (NODE_ENV=production), readable lines otherwise; LOG_FORMAT
 * overrides either way. Read apart from config() and never throws, so an invalid environment can
 * itself be logged.
 */
export function logSettings(env: Record<string, string | undefined> = process.env): { format: 'json' | 'pretty'; level: string } {
	const parsed = logSchema.safeParse(env);
	const values = parsed.success ? parsed.data : { LOG_FORMAT: undefined, LOG_LEVEL: 'info', NODE_ENV: env.NODE_ENV };
	return { format: values.LOG_FORMAT ?? (values.NODE_ENV === 'production' ? 'json' : 'pretty'), level: values.LOG_LEVEL };
}

/** Absolute URL for links that leave the site (e-mail, feeds). */
export function absoluteUrl(path: string): string {
	return new URL(path, config().ORIGIN).toString();
}
