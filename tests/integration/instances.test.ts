// Several app instances and workers on one database, as production runs them behind nginx: a
// second instance of the built app (its in-process outbox worker off) and standalone workers
// (scripts/worker.ts), started here beside the stack's own app. Nothing one instance keeps in
// memory may be needed by another.
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { eq, like } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { enqueue, type QueuedMail } from '../../src/lib/server/mail/outbox';
import { outbox, outboxAttempts } from '../../src/lib/server/mail/schema';
import { startMailFake } from '../../fakes/mail';
import { request } from '../helpers/http';
import { linksIn, mailsTo, waitForMail } from '../helpers/mail';
import { makePerson, uniqueEmail } from '../helpers/people';
import { uploadFile } from '../helpers/media';
import { freePort } from '../helpers/ports';
import { scratchDatabase } from '../helpers/scratch-db';
import { waitForPort } from '../../scripts/lib/system';

const root = join(import.meta.dirname, '..', '..');
const children: ChildProcess[] = [];

function startProcess(args: string[], env: NodeJS.ProcessEnv): { child: ChildProcess; output: () => string } {
	const child = spawn(process.execPath, args, { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
	let output = '';
	child.stdout!.on('data', (d: Buffer) => (output += d.toString()));
	child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
	children.push(child);
	return { child, output: () => output };
}

const startWorker = (env: NodeJS.ProcessEnv) => startProcess(['--import', 'tsx', join(root, 'scripts', 'worker.ts')], { ...env, OUTBOX_POLL_MS: '200' });

async function waitFor(check: () => boolean | Promise<boolean>, what: string, timeoutMs = 30_000) {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		if (await check()) return;
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`Timed out waiting for ${what}.`);
}

async function stop(child: ChildProcess) {
	if (child.exitCode !== null || child.signalCode !== null) return;
	const exited = new Promise((resolve) => child.once('exit', resolve));
	child.kill('SIGTERM');
	await exited;
}

let second: string;

beforeAll(async () => {
	const port = await freePort();
	// The same environment as the stack's app (database, storage, mail, secret, ORIGIN), another port.
	const app = startProcess([join(root, 'build', 'index.js')], { ...process.env, NODE_ENV: 'production', PORT: String(port), OUTBOX_WORKER: '0' });
	if (!(await waitForPort(port, 30_000))) throw new Error(`The second instance did not start:\n${app.output()}`);
	second = `http://127.0.0.1:${port}`;
}, 60_000);

afterAll(async () => {
	await Promise.all(children.map(stop));
});

describe('two app instances on one database', () => {
	test('a session made by signing in through one instance works on the other', async () => {
		const email = uniqueEmail('two-instances');
		expect((await request('/signin', { form: { email, redirectTo: '/' } })).status).toBe(302);
		const link = linksIn(await waitForMail(email, { subject: /Sign in/ })).find((l) => l.includes('/auth/callback/'))!;
		const signedIn = await request(link.replace(/^https?:\/\/[^/]+/, ''));
		const cookie = /(authjs\.session-token=[^;]+)/.exec(signedIn.headers.get('set-cookie') ?? '')?.[1];
		expect(cookie).toBeTruthy();

		const [user] = await db.select().from(users).where(eq(users.email, email));
		const me = await request('/api/me', { base: second, cookie, accept: 'application/json' });
		expect(me.status).toBe(200);
		expect(((await me.json()) as { id: string }).id).toBe(user!.id);
		// Signed out on the second instance, the same request is refused.
		expect((await request('/api/me', { base: second, accept: 'application/json' })).status).toBe(401);
	});

	test('a photo uploaded through one instance is served by the other', async () => {
		const person = await makePerson();
		const bytes = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#2f7a58' } })
			.jpeg()
			.toBuffer();
		const uploaded = await uploadFile(person, bytes);
		expect(uploaded.status).toBe(201);
		const { urls } = (await uploaded.json()) as { urls: { thumb: string } };
		const fromSecond = await request(urls.thumb, { base: second, cookie: person.cookie, accept: 'image/webp' });
		expect(fromSecond.status).toBe(200);
		expect(fromSecond.headers.get('content-type')).toBe('image/webp');
		const fromFirst = await request(urls.thumb, { cookie: person.cookie, accept: 'image/webp' });
		expect(Buffer.from(await fromSecond.arrayBuffer()).equals(Buffer.from(await fromFirst.arrayBuffer()))).toBe(true);
		// And the other way round: uploaded through the second, served by the first.
		const back = await uploadFile(person, bytes, 'photo.jpg', 'image/jpeg', second);
		expect(back.status).toBe(201);
		const { urls: again } = (await back.json()) as { urls: { thumb: string } };
		expect((await request(again.thumb, { cookie: person.cookie, accept: 'image/webp' })).status).toBe(200);
	});

	test('the sign-in limit per address counts requests to both instances', async () => {
		const email = uniqueEmail('limit-across');
		for (let i = 0; i < 5; i++) {
			const response = await request('/signin', { form: { email, redirectTo: '/' }, base: i % 2 === 0 ? undefined : second });
			expect(response.status).toBe(302);
		}
		expect((await request('/signin', { form: { email, redirectTo: '/' }, base: second })).status).toBe(429);
		expect((await request('/signin', { form: { email, redirectTo: '/' } })).status).toBe(429);
		await waitFor(async () => (await mailsTo(email)).length === 5, 'five sign-in mails');
	});
});

describe('workers beside the app', () => {
	const mail = (to: string): QueuedMail => ({ category: 'account', to, subject: `Queued for ${to}`, text: 'plain part', html: '<p>html part</p>' });

	test("a standalone worker and the app's own worker deliver the stack's outbox once each", async () => {
		startWorker(process.env);
		const addresses = Array.from({ length: 30 }, () => uniqueEmail('beside-app'));
		await db.transaction((tx) => enqueue(addresses.map(mail), { db: tx }));
		for (const address of addresses) await waitForMail(address, { timeoutMs: 30_000 });
		// A little longer, so a second copy would have arrived.
		await new Promise((r) => setTimeout(r, 1000));
		for (const address of addresses) expect(await mailsTo(address)).toHaveLength(1);
	}, 90_000);

	test('500 queued mails are delivered exactly once between two standalone workers', async () => {
		const scratch = await scratchDatabase();
		const fake = await startMailFake({ smtpPort: await freePort(), httpPort: await freePort() });
		try {
			const env = { ...process.env, DATABASE_URL: scratch.url, SMTP_URL: `smtp://127.0.0.1:${fake.smtpPort}` };
			const workers = [startWorker(env), startWorker(env)];
			await waitFor(() => workers.every((w) => w.output().includes('delivering the outbox')), 'both workers to start');

			const addresses = Array.from({ length: 500 }, (_, i) => `many-${i}@tests.riparia.test`);
			await scratch.db.transaction((tx) => enqueue(addresses.map(mail), { db: tx }));
			await waitFor(() => fake.messages.length >= addresses.length, 'all 500 mails', 60_000);
			await new Promise((r) => setTimeout(r, 1500));

			expect(fake.messages).toHaveLength(addresses.length);
			expect(fake.messages.flatMap((m) => m.envelopeTo).sort()).toEqual([...addresses].sort());
			const rows = await scratch.db.select().from(outbox).where(like(outbox.toAddress, 'many-%'));
			expect(rows.every((r) => r.state === 'sent' && r.attempts === 1)).toBe(true);
			const received = fake.messages.map((m) => m.messageId);
			expect(new Set(received).size).toBe(addresses.length);
			expect([...received].sort()).toEqual(rows.map((r) => r.messageId).sort());
			const attempts = await scratch.db
				.select({ worker: outboxAttempts.worker })
				.from(outboxAttempts)
				.innerJoin(outbox, eq(outbox.id, outboxAttempts.outboxId))
				.where(like(outbox.toAddress, 'many-%'));
			expect(attempts).toHaveLength(addresses.length);
			const byWorker = new Map<string, number>();
			for (const a of attempts) byWorker.set(a.worker, (byWorker.get(a.worker) ?? 0) + 1);
			console.log(`500 mails delivered by ${[...byWorker].map(([w, n]) => `${w}: ${n}`).join(', ')}`);
			await Promise.all(workers.map((w) => stop(w.child)));
		} finally {
			await fake.close();
			await scratch.drop();
		}
	}, 120_000);
});
