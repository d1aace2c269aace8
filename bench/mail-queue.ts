// Queues one mail to each of 2,000 members through the outbox's enqueue, in one transaction, as
// an announcement to the whole club would, and times it to the commit. The rows are due only in
// a year and are deleted again afterwards, so no worker sends them. Prints one line of JSON.
//   node --import tsx bench/mail-queue.ts        (with the bench stack's DATABASE_URL)
import { asc, eq, isNotNull } from 'drizzle-orm';
import { connect } from '../src/lib/server/db';
import { users } from '../src/lib/server/club/schema';
import { enqueue, type QueuedMail } from '../src/lib/server/mail/outbox';
import { outbox } from '../src/lib/server/mail/schema';

const RECIPIENTS = 2000;
const TOPIC = 'bench:mail-queue';
const { db, close } = connect();
try {
	const people = await db
		.select({ email: users.email, name: users.displayName })
		.from(users)
		.where(isNotNull(users.email))
		.orderBy(asc(users.createdAt))
		.limit(RECIPIENTS);
	if (people.length < RECIPIENTS) throw new Error(`Only ${people.length} members to mail; the large club has not been seeded.`);
	const later = new Date(Date.now() + 365 * 86_400_000);
	const mails: QueuedMail[] = people.map((p) => ({
		category: 'account',
		to: p.email!,
		subject: 'The results of the autumn layout contest are out',
		text: `Hello ${p.name},\n\nThe results are on the club's site. Thank you to every entrant and judge.\n`,
		html: `<p>Hello ${p.name},</p><p>The results are on the club's site. Thank you to every entrant and judge.</p>`,
		topic: TOPIC,
		bulk: true,
		notBefore: later
	}));
	const samples: number[] = [];
	for (let i = 0; i < 3; i++) {
		const started = performance.now();
		await db.transaction((tx) => enqueue(mails, { db: tx }));
		samples.push(performance.now() - started);
		await db.delete(outbox).where(eq(outbox.topic, TOPIC));
	}
	samples.sort((a, b) => a - b);
	console.log(JSON.stringify({ recipients: mails.length, msMedian: samples[1], samples }));
} finally {
	await close();
}
