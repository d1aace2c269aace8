import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { startMailFake } from '../../fakes/mail';
import { deliverDue, enqueue, type QueuedMail } from '../../src/lib/server/mail/outbox';
import { outbox, outboxAttempts } from '../../src/lib/server/mail/schema';
import { smtpTransport } from '../../src/lib/server/mail/transport';
import { freePort } from '../helpers/ports';
import { scratchDatabase } from '../helpers/scratch-db';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;

beforeAll(async () => {
	scratch = await scratchDatabase();
});
afterAll(async () => {
	await scratch?.drop();
});

const mail = (to: string, extra: Partial<Omit<QueuedMail, 'category' | 'memberId'>> = {}): QueuedMail => ({
	category: 'account',
	to,
	subject: `Test message to ${to}`,
	text: 'plain part',
	html: '<p>html part</p>',
	...extra
});

async function drain(worker: string, transport: ReturnType<typeof smtpTransport>) {
	let total = 0;
	for (;;) {
		const { sent, failed } = await deliverDue({ transport, worker, batchSize: 4 }, { db: scratch.db });
		if (sent + failed === 0) return total;
		total += sent;
	}
}

describe('outbox delivery', () => {
	test('two workers running at the same time deliver every queued message exactly once', async () => {
		const fake = await startMailFake({ smtpPort: await freePort(), httpPort: await freePort() });
		const addresses = Array.from({ length: 24 }, (_, i) => `parallel-${i}@tests.riparia.test`);
		await scratch.db.transaction((tx) =>
			enqueue(
				addresses.map((a) => mail(a)),
				{ db: tx }
			)
		);

		const transportA = smtpTransport(`smtp://127.0.0.1:${fake.smtpPort}`);
		const transportB = smtpTransport(`smtp://127.0.0.1:${fake.smtpPort}`);
		const [a, b] = await Promise.all([drain('worker-a', transportA), drain('worker-b', transportB)]);
		transportA.close();
		transportB.close();

		expect(a + b).toBe(addresses.length);
		const received = fake.messages.flatMap((m) => m.envelopeTo);
		expect(received.sort()).toEqual([...addresses].sort());
		const rows = await scratch.db.select().from(outbox).where(inArray(outbox.toAddress, addresses));
		expect(rows.every((r) => r.state === 'sent' && r.attempts === 1)).toBe(true);
		const attempts = await scratch.db
			.select()
			.from(outboxAttempts)
			.where(
				inArray(
					outboxAttempts.outboxId,
					rows.map((r) => r.id)
				)
			);
		expect(attempts).toHaveLength(addresses.length);
		await fake.close();
	});

	test('a message whose delivery fails is retried later and delivered once the mail server is back', async () => {
		const port = await freePort(); // nothing listens here yet
		const address = 'retry@tests.riparia.test';
		await enqueue(mail(address), { db: scratch.db });
		const transport = smtpTransport(`smtp://127.0.0.1:${port}`);
		const now = new Date();

		expect(await deliverDue({ transport, worker: 'w' }, { db: scratch.db, now })).toEqual({ sent: 0, failed: 1 });
		const [afterFailure] = await scratch.db.select().from(outbox).where(eq(outbox.toAddress, address));
		expect(afterFailure!.state).toBe('queued');
		expect(afterFailure!.attempts).toBe(1);
		expect(afterFailure!.lastError).toBeTruthy();
		expect(afterFailure!.nextAttemptAt.getTime()).toBeGreaterThan(now.getTime());

		// Not due again until the backoff has passed.
		expect(await deliverDue({ transport, worker: 'w' }, { db: scratch.db, now })).toEqual({ sent: 0, failed: 0 });

		const fake = await startMailFake({ smtpPort: port, httpPort: await freePort() });
		const later = new Date(afterFailure!.nextAttemptAt.getTime() + 1000);
		expect(await deliverDue({ transport, worker: 'w' }, { db: scratch.db, now: later })).toEqual({ sent: 1, failed: 0 });
		expect(await deliverDue({ transport, worker: 'w' }, { db: scratch.db, now: new Date(later.getTime() + 3_600_000) })).toEqual({ sent: 0, failed: 0 });
		expect(fake.messages.filter((m) => m.envelopeTo.includes(address))).toHaveLength(1);

		const attempts = await scratch.db.select().from(outboxAttempts).where(eq(outboxAttempts.outboxId, afterFailure!.id));
		expect(attempts.map((a) => a.ok)).toEqual([false, true]);
		transport.close();
		await fake.close();
	});

	test('a message left "sending" by a worker that died is picked up again after its lease', async () => {
		const fake = await startMailFake({ smtpPort: await freePort(), httpPort: await freePort() });
		const address = 'orphan@tests.riparia.test';
		await enqueue(mail(address), { db: scratch.db });
		const past = new Date(Date.now() - 60_000);
		await scratch.db.update(outbox).set({ state: 'sending', leaseUntil: past, attempts: 1 }).where(eq(outbox.toAddress, address));
		const transport = smtpTransport(`smtp://127.0.0.1:${fake.smtpPort}`);
		expect((await deliverDue({ transport, worker: 'w2' }, { db: scratch.db })).sent).toBe(1);
		expect(fake.messages.filter((m) => m.envelopeTo.includes(address))).toHaveLength(1);
		transport.close();
		await fake.close();
	});

	test("one person's mail queued after a club-wide announcement goes out first", async () => {
		const fake = await startMailFake({ smtpPort: await freePort(), httpPort: await freePort() });
		const bulk = Array.from({ length: 6 }, (_, i) => mail(`bulk-${i}@tests.riparia.test`, { bulk: true }));
		await enqueue(bulk, { db: scratch.db });
		await enqueue(mail('personal@tests.riparia.test'), { db: scratch.db });
		const transport = smtpTransport(`smtp://127.0.0.1:${fake.smtpPort}`);
		expect((await deliverDue({ transport, worker: 'w3', batchSize: 1 }, { db: scratch.db })).sent).toBe(1);
		expect(fake.messages.map((m) => m.envelopeTo[0])).toEqual(['personal@tests.riparia.test']);
		while ((await deliverDue({ transport, worker: 'w3' }, { db: scratch.db })).sent > 0) {
			/* drain the rest */
		}
		expect(fake.messages).toHaveLength(7);
		transport.close();
		await fake.close();
	});

	test('a dedupe key queues a message at most once', async () => {
		await enqueue(mail('dedupe@tests.riparia.test', { dedupeKey: 'test:once' }), { db: scratch.db });
		await enqueue(mail('dedupe@tests.riparia.test', { dedupeKey: 'test:once', subject: 'second' }), { db: scratch.db });
		const rows = await scratch.db.select().from(outbox).where(eq(outbox.dedupeKey, 'test:once'));
		expect(rows).toHaveLength(1);
		expect(rows[0]!.subject).toBe('Test message to dedupe@tests.riparia.test');
	});

	test('nothing is queued when the transaction that queued it rolls back', async () => {
		await expect(
			scratch.db.transaction(async (tx) => {
				await enqueue(mail('rollback@tests.riparia.test'), { db: tx });
				throw new Error('the action failed');
			})
		).rejects.toThrow('the action failed');
		expect(await scratch.db.select().from(outbox).where(eq(outbox.toAddress, 'rollback@tests.riparia.test'))).toHaveLength(0);
	});
});
