// The mail relay away for a while: swap-request mails and a contest's results mails are queued
// while the mail fake is stopped. The worker records each failed attempt and backs off instead of
// retrying at once, the pages (and the actions that queue mail) keep answering, and once the fake
// is back every queued message arrives exactly once, each with its own Message-ID. Runs an app
// instance on a scratch database with a mail fake of its own, so the stack's are never touched.
import { spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { backoffMs } from '../../src/lib/server/mail/outbox';
import { outbox, outboxAttempts } from '../../src/lib/server/mail/schema';
import type { StoredMessage } from '../../fakes/mail';
import { appUrl } from '../helpers/env';
import { killHard, startFakeProcess } from '../helpers/fake-process';
import { request } from '../helpers/http';
import { checkoutRoot, poll, startInstance, type AppInstance } from '../helpers/instance';
import { freePort } from '../helpers/ports';
import { scratchDatabase } from '../helpers/scratch-db';

interface Fixture {
	contestId: number;
	admin: { cookie: string };
	owner: { email: string; cookie: string };
	listingId: number;
	askers: { id: string; cookie: string }[];
}

const home = join(checkoutRoot, '.data', 'test', 'faults-mail');
const store = join(home, 'messages.jsonl');
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
let app: AppInstance | null = null;
let fake: ChildProcess | null = null;
let ports: { smtp: number; http: number };
let fixture: Fixture;

/** The mail fake as its own process, keeping every message it accepts in `store`. */
async function startFake() {
	fake = await startFakeProcess('mail', ports.smtp, {
		MAIL_FAKE_SMTP_PORT: String(ports.smtp),
		MAIL_FAKE_HTTP_PORT: String(ports.http),
		MAIL_FAKE_STORE: store
	});
}

async function stopFake() {
	await killHard(fake);
	fake = null;
}

/** What the fake accepted, read from its store (each line is written before the fake answers 250). */
const delivered = (): StoredMessage[] =>
	existsSync(store)
		? readFileSync(store, 'utf8')
				.split('\n')
				.filter(Boolean)
				.map((line) => JSON.parse(line) as StoredMessage)
		: [];

const rows = () => scratch.db.select().from(outbox).orderBy(asc(outbox.id));

beforeAll(async () => {
	rmSync(home, { recursive: true, force: true });
	mkdirSync(home, { recursive: true });
	ports = { smtp: await freePort(), http: await freePort() };
	scratch = await scratchDatabase();
	const made = spawnSync(process.execPath, ['--import', 'tsx', join(checkoutRoot, 'tests', 'helpers', 'mail-outage-fixture.ts')], {
		cwd: checkoutRoot,
		env: { ...process.env, DATABASE_URL: scratch.url },
		encoding: 'utf8'
	});
	if (made.status !== 0) throw new Error(`The fixture failed:\n${made.stderr}`);
	fixture = JSON.parse(made.stdout.trim().split('\n').at(-1)!) as Fixture;
	await startFake();
	// The stack's ORIGIN, so requests made as the stack's browser pass the origin check here too.
	app = await startInstance({
		databaseUrl: scratch.url,
		logName: 'faults-mail-app',
		env: { ORIGIN: appUrl(), OUTBOX_POLL_MS: '500', SMTP_URL: `smtp://127.0.0.1:${ports.smtp}` }
	});
}, 240_000);

afterAll(async () => {
	await app?.stop();
	await stopFake();
	await scratch?.drop();
	rmSync(home, { recursive: true, force: true });
}, 60_000);

const base = () => app!.url;

/** A member asks for the listing; the owner wants each message mailed at once. Returns the thread's page. */
async function ask(cookie: string, body: string): Promise<string> {
	const response = await request(`/swaps/${fixture.listingId}?/request`, { base: base(), cookie, form: { body } });
	expect(response.status).toBe(303);
	return response.headers.get('location')!;
}

/** Every page a member or admin opens while mail is away still answers 200 (the thread is the second asker's). */
async function expectPagesAnswer(threadPage: string) {
	const pages: [string, string | undefined][] = [
		['/', undefined],
		['/swaps', fixture.askers[0]!.cookie],
		[`/swaps/${fixture.listingId}`, fixture.askers[0]!.cookie],
		[threadPage, fixture.askers[1]!.cookie],
		[`/contests/${fixture.contestId}`, undefined],
		[`/admin/contests/${fixture.contestId}/announce`, fixture.admin.cookie],
		['/admin/mail', fixture.admin.cookie]
	];
	for (const [path, cookie] of pages) {
		const response = await request(path, { base: base(), cookie });
		expect(response.status, `${path} while the mail fake is stopped`).toBe(200);
	}
}

describe('the mail relay away for a while', () => {
	test('queued mail backs off while it is away and arrives exactly once when it returns', async () => {
		// Mail flows first, so the transport holds pooled connections when the relay goes away.
		await ask(fixture.askers[0]!.cookie, 'Could I have a few stems on Saturday?');
		await poll(async () => delivered().length === 1, 'the first swap mail to arrive', 60_000);

		await stopFake();

		// Queued while it is away: two more requests (mailed to the owner at once)…
		const threadPage = await ask(fixture.askers[1]!.cookie, 'I would love some too, any day this week.');
		await ask(fixture.askers[2]!.cookie, 'Happy to swap some floaters for a few stems.');
		const swapIds = (await rows()).slice(1).map((r) => r.id);
		expect(swapIds).toHaveLength(2);
		// …wait until the worker has tried them and failed.
		await poll(
			async () => (await rows()).filter((r) => swapIds.includes(r.id)).every((r) => r.attempts >= 1 && r.state === 'queued'),
			'the swap mails to fail once'
		);

		// …then the contest's results mails (entrants' own, then the announcement to the club).
		const announce = await request(`/admin/contests/${fixture.contestId}/announce?/send`, {
			base: base(),
			cookie: fixture.admin.cookie,
			form: { confirm: 'yes' }
		});
		expect(announce.status).toBe(303);
		const queued = Number(new URL(announce.headers.get('location')!, base()).searchParams.get('sent'));
		expect(queued).toBeGreaterThanOrEqual(3);
		const contestIds = (await rows()).filter((r) => r.topic?.startsWith('contest')).map((r) => r.id);
		expect(contestIds).toHaveLength(queued);
		await poll(
			async () => (await rows()).filter((r) => contestIds.includes(r.id)).every((r) => r.attempts >= 1 && r.state === 'queued'),
			'the results mails to fail once'
		);

		// The worker went round again after the swap mails failed (it tried the results mails) and
		// left the swap mails alone: each waits its backoff, with the attempt and its error recorded.
		for (const row of (await rows()).filter((r) => swapIds.includes(r.id))) {
			expect(row.attempts, `mail ${row.id}`).toBe(1);
			expect(row.lastError, `mail ${row.id}`).toBeTruthy();
			const attempts = await scratch.db.select().from(outboxAttempts).where(eq(outboxAttempts.outboxId, row.id));
			expect(attempts.map((a) => a.ok)).toEqual([false]);
			const waits = row.nextAttemptAt.getTime() - attempts[0]!.at.getTime();
			expect(waits, `mail ${row.id} is tried again only after its backoff`).toBeGreaterThan(backoffMs(1) / 2);
			expect(waits).toBeLessThanOrEqual(backoffMs(1));
		}
		expect(delivered()).toHaveLength(1);
		await expectPagesAnswer(threadPage);

		// The relay returns: everything queued goes out once the backoff has passed.
		await startFake();
		await poll(async () => (await rows()).every((r) => r.state === 'sent'), 'every queued mail to be delivered', 240_000);

		const all = await rows();
		const received = delivered();
		expect(received).toHaveLength(all.length);
		const ids = received.map((m) => m.messageId);
		expect(new Set(ids).size, 'every Message-ID is unique').toBe(ids.length);
		expect([...ids].sort()).toEqual(all.map((r) => r.messageId).sort());
		for (const row of all) {
			const attempts = await scratch.db.select().from(outboxAttempts).where(eq(outboxAttempts.outboxId, row.id));
			expect(
				attempts.filter((a) => a.ok),
				`mail ${row.id} has one successful attempt`
			).toHaveLength(1);
			const message = received.find((m) => m.messageId === row.messageId)!;
			expect(message.envelopeTo).toEqual([row.toAddress.toLowerCase()]);
		}
		// The three requests reached the owner (who, as a member, also had the results announcement).
		const swapMail = all.filter((r) => r.topic?.startsWith('swap'));
		expect(swapMail.map((r) => r.toAddress.toLowerCase())).toEqual(Array(3).fill(fixture.owner.email.toLowerCase()));
	});
});
