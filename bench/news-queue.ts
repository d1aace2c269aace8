// Publishes a club news post to all members (2,000 or more in the large club) as an admin does:
// the recipients are chosen, each one's settings read, and one outbox row per recipient queued in
// the publishing transaction. Each run is rolled back at the end, so nothing is sent and the post
// is not kept; the time is taken just before the rollback. Prints one line of JSON.
//   node --import tsx bench/news-queue.ts        (with the bench stack's DATABASE_URL)
import { eq } from 'drizzle-orm';
import { connect } from '../src/lib/server/db';
import { users } from '../src/lib/server/club/schema';
import * as posts from '../src/lib/server/news/posts';
import { postForm } from '../src/lib/news/post';

const { db, close } = connect();
/** Thrown to roll a run back once it is timed. */
class Done extends Error {}
try {
	const [admin] = await db.select().from(users).where(eq(users.role, 'admin')).limit(1);
	if (!admin?.email) throw new Error('The large club has no admin to post as; it has not been seeded.');
	const viewer = { id: admin.id, email: admin.email, displayName: admin.displayName, role: 'admin' as const, units: admin.units };
	const input = postForm.parse({
		title: 'Autumn plant auction',
		body: 'The autumn auction is on the **first Saturday** of next month.\n\n- bring cuttings in bags\n- label them',
		visibility: 'members',
		audienceKind: 'all'
	});
	const samples: number[] = [];
	let recipients = 0;
	for (let i = 0; i < 3; i++) {
		await db
			.transaction(async (tx) => {
				const id = await posts.create(viewer, input, { db: tx });
				const started = performance.now();
				recipients = (await posts.publish(viewer, id, { db: tx })).queued;
				samples.push(performance.now() - started);
				throw new Done();
			})
			.catch((error: unknown) => {
				if (!(error instanceof Done)) throw error;
			});
	}
	samples.sort((a, b) => a - b);
	console.log(JSON.stringify({ recipients, msMedian: samples[1], samples }));
} finally {
	await close();
}
