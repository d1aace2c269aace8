import { z } from 'zod';

// Server configuration comes from the environment (adapter-node passes it through process.env),
// read through this one module so scripts, workers and tests see the same values as the app.
// Defaults match what `npm start` sets up locally; see .env.example.

const bool = z.enum(['1', '0', 'true', 'false', 'yes', 'no', 'on', 'off']).transform((v) => ['1', 'true', 'yes', 'on'].includes(v));

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
	BENCH: bool.default(false)
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

/** Absolute URL for links that leave the site (e-mail, feeds). */
export function absoluteUrl(path: string): string {
	return new URL(path, config().ORIGIN).toString();
}
