// Deleting an account: on a database of its own, every table is counted before and after, and the
// bucket under each person's prefix, so the deletion is shown to remove exactly what it should —
// the member's private rows and photos — and to keep the rest: the other side of conversations,
// published results (under "Former member"), other members' tanks, and an opaque id in the audit log.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import * as deletion from '../../src/lib/server/club/account-deletion';
import * as directory from '../../src/lib/server/club/directory';
import { sessions, users } from '../../src/lib/server/club/schema';
import * as media from '../../src/lib/server/media';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as social from '../../src/lib/server/journals/social';
import * as water from '../../src/lib/server/journals/water';
import * as threads from '../../src/lib/server/swaps/threads';
import * as transitions from '../../src/lib/server/swaps/listing-transitions';
import * as blocks from '../../src/lib/server/swaps/blocks';
import * as reports from '../../src/lib/server/swaps/reports';
import { listings, swapMessages } from '../../src/lib/server/swaps/schema';
import * as contests from '../../src/lib/server/contests/contests';
import * as contestEntries from '../../src/lib/server/contests/contest-entries';
import * as judging from '../../src/lib/server/contests/judging';
import * as panel from '../../src/lib/server/contests/panel';
import { publicResults, transition } from '../../src/lib/server/contests/review';
import { contestEntries as entryTable } from '../../src/lib/server/contests/schema';
import { enqueue } from '../../src/lib/server/mail/outbox';
import * as preferences from '../../src/lib/server/mail/preferences';
import { FORMER_MEMBER } from '../../src/lib/club/names';
import type { Viewer } from '../../src/lib/club/viewer';
import type { Role } from '../../src/lib/club/roles';
import { scratchDatabase } from '../helpers/scratch-db';
import { ownerKeys } from '../helpers/media';
import { tankInput } from '../helpers/tanks';
import { contestInput, fields } from '../helpers/contests';
import { createListing } from '../helpers/swaps';
import { makePerson, uniqueEmail, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';

let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
const ctx = () => ({ db: scratch.db });

async function person(label: string, role: Role = 'member'): Promise<Viewer> {
	const id = crypto.randomUUID();
	const email = uniqueEmail(label);
	const displayName = `${label} ${id.slice(0, 4)}`;
	await scratch.db.insert(users).values({ id, email, role, displayName, emailVerified: new Date(), homeLat: 54.1, homeLng: -12.3 });
	await scratch.db.insert(sessions).values({ sessionToken: crypto.randomUUID(), userId: id, expires: new Date(Date.now() + 86_400_000) });
	return { id, email, displayName, role, units: 'metric' };
}

async function photo(owner: Viewer, colour: string) {
	const jpeg = await sharp({ create: { width: 240, height: 160, channels: 3, background: colour } })
		.jpeg()
		.toBuffer();
	return (await media.upload(owner.id, jpeg, ctx())).id;
}

async function countAll(): Promise<Map<string, number>> {
	const [tables] = (await scratch.db.execute(sql`SHOW TABLES`)) as unknown as [Record<string, string>[]];
	const counts = new Map<string, number>();
	for (const row of tables) {
		const name = Object.values(row)[0]!;
		if (name === '__drizzle_migrations') continue;
		const [[{ n }]] = (await scratch.db.execute(sql`SELECT COUNT(*) AS n FROM ${sql.identifier(name)}`)) as unknown as [[{ n: number }]];
		counts.set(name, Number(n));
	}
	return counts;
}

async function countWhere(table: string, column: string, values: (string | number)[]): Promise<number> {
	if (values.length === 0) return 0;
	const [[{ n }]] = (await scratch.db.execute(
		sql`SELECT COUNT(*) AS n FROM ${sql.identifier(table)} WHERE ${sql.identifier(column)} IN (${sql.join(
			values.map((v) => sql`${v}`),
			sql`, `
		)})`
	)) as unknown as [[{ n: number }]];
	return Number(n);
}

beforeAll(async () => {
	scratch = await scratchDatabase();
});

afterAll(async () => {
	await scratch.drop();
});

describe('deleting an account', () => {
	test('removes exactly the member’s private rows and photos and keeps everyone else’s', async () => {
		const leaver = await person('Leaver');
		const other = await person('Other');
		const bystander = await person('Bystander');
		const admin = await person('Admin', 'admin');
		const judges = [await person('Judge A', 'judge'), await person('Judge B', 'judge')];

		// Journals: a tank each with an entry; comments, admires and follows both ways.
		const leaverTank = await tanks.create(
			leaver,
			tankInput({ name: 'Leaver’s tank', setUpOn: '2026-01-15' }),
			[{ id: await photo(leaver, '#2f7a58'), alt: 'Front', caption: '' }],
			ctx()
		);
		const otherTank = await tanks.create(
			other,
			tankInput({ name: 'Other’s tank', setUpOn: '2026-01-15' }),
			[{ id: await photo(other, '#7a2f58'), alt: 'Front', caption: '' }],
			ctx()
		);
		const noEvents = { events: [] };
		const leaverEntry = await entries.create(
			leaver,
			leaverTank,
			{ entryOn: '2026-02-01', title: 'Trim', body: 'Trimmed.', ...noEvents },
			[{ id: await photo(leaver, '#58702f'), alt: 'After', caption: '' }],
			ctx()
		);
		const otherEntry = await entries.create(other, otherTank, { entryOn: '2026-02-01', title: 'Rescape', body: 'New stones.', ...noEvents }, [], ctx());
		await water.create(
			leaver,
			leaverTank,
			{
				testedOn: '2026-02-01',
				ph: 6.8,
				kh: 4,
				gh: 8,
				no3: 15,
				po4: 1,
				k: null,
				fe: null,
				ammonia: 0,
				ammoniaBasis: 'NH3',
				no2: 0,
				temperatureC: 25,
				tds: null,
				note: ''
			},
			ctx()
		);
		await entries.addComment(other, leaverTank, leaverEntry, 'Lovely trim.', ctx());
		await entries.addComment(leaver, otherTank, otherEntry, 'Nice stones.', ctx());
		await entries.addComment(bystander, otherTank, otherEntry, 'Agreed.', ctx());
		await social.toggleAdmire(leaver, otherTank, true, ctx());
		await social.toggleAdmire(other, leaverTank, true, ctx());
		await social.toggleFollow(leaver, otherTank, true, ctx());
		await social.toggleFollow(other, leaverTank, true, ctx());

		// Swaps: one listing nobody asked about, one the other member asked about, and the other
		// member's listing reserved for the leaver; a report and a block.
		const asTest = (v: Viewer): TestPerson => ({ ...v, displayName: v.displayName ?? '', token: '', cookie: '' });
		const unasked = await createListing(asTest(leaver), { title: 'Unasked stems', description: 'Cut this week.' }, ctx());
		const asked = await createListing(asTest(leaver), { title: 'Asked moss', description: 'Private detail of the leaver.' }, ctx());
		await media.setPhotos(leaver.id, 'listing', asked, [{ id: await photo(leaver, '#2f587a'), alt: 'Moss', caption: '' }], { max: 4 }, ctx());
		const otherListing = await createListing(asTest(other), { title: 'Other’s ferns' }, ctx());
		const askedThread = await threads.request(other, asked, 'May I have some moss?', ctx());
		await threads.post(leaver, askedThread, 'Yes, come on Saturday.', ctx());
		await threads.post(other, askedThread, 'Thank you!', ctx());
		const reservedThread = await threads.request(leaver, otherListing, 'I would love the ferns.', ctx());
		await transitions.accept(other, reservedThread, ctx());
		await reports.reportListing(leaver, otherListing, 'Testing the report', ctx());
		await blocks.block(bystander, leaver.id, ctx());

		// Contests: a published one with entries of both (kept), an open one (the leaver's entry goes).
		const published = await contests.create(admin, contestInput(), ctx());
		for (const j of judges) await panel.assign(admin, published, j.id, ctx());
		await transition(admin, published, 'open-entries', {}, ctx());
		const openCategory = (await contests.load(published, ctx()))!.categories.find((c) => c.name === 'Open')!.id;
		const criteria = (await contests.load(published, ctx()))!.criteria.map((c) => String(c.id));
		for (const [who, tank] of [
			[leaver, leaverTank],
			[other, otherTank]
		] as const) {
			await contestEntries.create(
				who,
				published,
				{ categoryId: openCategory, tankId: tank, statement: 'Stems at the back.', photos: [{ id: await photo(who, '#446688'), alt: 'Whole', caption: '' }] },
				ctx()
			);
		}
		await transition(admin, published, 'start-judging', {}, ctx());
		const numbers = await scratch.db.select({ number: entryTable.number }).from(entryTable).where(eq(entryTable.contestId, published));
		for (const judge of judges)
			for (const { number } of numbers) {
				const saved = await judging.saveCard(
					judge,
					published,
					number!,
					{ baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(criteria, [8, 4]) },
					ctx()
				);
				await judging.submitCard(judge, published, number!, saved.version, ctx());
			}
		await transition(admin, published, 'publish', {}, ctx());
		const running = await contests.create(admin, contestInput(), ctx());
		await transition(admin, running, 'open-entries', {}, ctx());
		const runningCategory = (await contests.load(running, ctx()))!.categories.find((c) => c.name === 'Open')!.id;
		await contestEntries.create(
			leaver,
			running,
			{ categoryId: runningCategory, tankId: leaverTank, statement: 'Again.', photos: [{ id: await photo(leaver, '#886644'), alt: 'Whole', caption: '' }] },
			ctx()
		);

		// A pending upload, and mail to the leaver waiting in the outbox.
		await photo(leaver, '#000000');
		await enqueue({ category: 'account', to: leaver.email, subject: 'Waiting mail', text: 'x', html: '<p>x</p>' }, ctx());
		// Their notification settings.
		await preferences.save(leaver.id, { news: 'off' }, ctx());

		// What the deletion must remove, counted before it by the tables' own columns.
		const tankChildren = ['tank_light', 'tank_filter', 'tank_fertiliser', 'tank_plant', 'tank_livestock', 'maintenance_task', 'water_test', 'journal_event'];
		const childCounts = Object.fromEntries(await Promise.all(tankChildren.map(async (t) => [t, await countWhere(t, 'tank_id', [leaverTank])] as const)));
		expect(childCounts.water_test).toBe(1);
		const leaverMessages = await countWhere('swap_message', 'sender_id', [leaver.id]);
		expect(leaverMessages).toBe(2);
		const otherMessages = await countWhere('swap_message', 'sender_id', [other.id]);
		const unaskedEvents = await countWhere('listing_event', 'listing_id', [unasked]);
		const leaverMail = await countWhere('outbox', 'to_address', [leaver.email]);
		expect(leaverMail).toBeGreaterThanOrEqual(1);
		const leaverPhotos = await countWhere('media', 'owner_id', [leaver.id]);
		expect(leaverPhotos).toBe(6);
		const leaverObjects = (await ownerKeys(leaver.id)).length;
		expect(leaverObjects).toBeGreaterThanOrEqual(6);
		const othersObjects = await Promise.all([other, bystander, admin].map(async (p) => (await ownerKeys(p.id)).length));

		const before = await countAll();
		await deletion.deleteOwn(leaver, ` ${leaver.displayName!.toUpperCase()} `, ctx());
		const after = await countAll();

		const removed: Record<string, number> = {
			session: 1,
			tank: 1,
			...childCounts,
			journal_entry: 1,
			entry_comment: 2,
			tank_admire: 2,
			tank_follow: 2,
			media: 6,
			listing: 1,
			// the unasked listing's events go with it; the asked one is withdrawn and the reserved one released (one event each)
			listing_event: unaskedEvents - 2,
			swap_message: leaverMessages,
			swap_report: 1,
			member_block: 1,
			contest_entry: 1,
			contest_card: 0,
			// every mail to the address goes; one goodbye is queued
			outbox: leaverMail - 1,
			mail_preference: 1,
			audit_log: -1
		};
		for (const [table, n] of before) {
			expect(after.get(table), `rows in ${table}`).toBe(n - (removed[table] ?? 0));
		}

		// The bucket: nothing of the leaver's, everything of the others'.
		expect(await ownerKeys(leaver.id)).toEqual([]);
		expect(await Promise.all([other, bystander, admin].map(async (p) => (await ownerKeys(p.id)).length))).toEqual(othersObjects);

		// The member row is a tombstone: the id stays, nothing personal does.
		const [tomb] = await scratch.db.select().from(users).where(eq(users.id, leaver.id));
		expect(tomb).toMatchObject({ email: null, displayName: null, name: null, homeLat: null, homeLng: null, role: 'member' });
		expect(tomb!.deletedAt).toBeInstanceOf(Date);
		expect((await directory.names([leaver.id], ctx())).get(leaver.id)).toBe(FORMER_MEMBER);

		// Published results keep the entry, under "Former member"; the other entrant keeps their name.
		const results = (await publicResults(published, ctx()))!;
		const shown = results.categories.flatMap((c) => c.entries);
		expect(shown.map((e) => e.entrantName).sort()).toEqual([FORMER_MEMBER, other.displayName].sort());
		expect(shown.find((e) => e.entrantName === FORMER_MEMBER)!.photos).toEqual([]);
		expect(shown.find((e) => e.entrantName === FORMER_MEMBER)!.cardCount).toBe(2);

		// The conversation keeps the other side's messages; the listing stays withdrawn and blank.
		expect(await countWhere('swap_message', 'sender_id', [other.id])).toBe(otherMessages);
		const kept = await scratch.db.select().from(swapMessages).where(eq(swapMessages.threadId, askedThread));
		expect(kept.some((m) => m.senderId === leaver.id)).toBe(false);
		expect(kept.map((m) => m.body)).toContain('Thank you!');
		const [askedRow] = await scratch.db.select().from(listings).where(eq(listings.id, asked));
		expect(askedRow).toMatchObject({ state: 'withdrawn', description: null });
		const [otherRow] = await scratch.db.select().from(listings).where(eq(listings.id, otherListing));
		expect(otherRow).toMatchObject({ state: 'open', reservedRequesterId: null });

		// The audit row names the tombstone's id and nothing else about the member.
		const [[auditRow]] = (await scratch.db.execute(sql`SELECT actor_id, subject_id, detail FROM audit_log WHERE action = 'member.delete-own'`)) as unknown as [
			[{ actor_id: string; subject_id: string; detail: unknown }]
		];
		expect(auditRow).toMatchObject({ actor_id: leaver.id, subject_id: leaver.id });
		expect(JSON.stringify(auditRow!.detail)).not.toContain(leaver.email);

		// A second deletion finds nobody.
		await expect(deletion.deleteOwn(leaver, '', ctx())).rejects.toMatchObject({ status: 400 });
		await expect(deletion.removeMember(admin, leaver.id, 'again', ctx())).rejects.toMatchObject({ status: 404 });
	});

	test('the last admin cannot delete their account, and a wrong confirmation deletes nothing', async () => {
		const admin = await person('Only admin', 'admin');
		const before = await countAll();
		await expect(deletion.deleteOwn(admin, 'someone else', ctx())).rejects.toMatchObject({ status: 400, fields: { confirm: expect.any(String) } });
		expect(await countAll()).toEqual(before);
		// Alone as admin (the other test's admins made members for this), the admin may not leave.
		await scratch.db
			.update(users)
			.set({ role: 'member' })
			.where(sql`${users.role} = 'admin' AND ${users.id} <> ${admin.id}`);
		await expect(deletion.deleteOwn(admin, admin.displayName!, ctx())).rejects.toMatchObject({ code: 'last-admin' });
		expect(await countAll()).toEqual(before);
	});

	test('an admin removes a member with a reason; members and judges may not', async () => {
		const admin = await person('Remover', 'admin');
		await person('Second admin', 'admin');
		const judge = await person('Not an admin', 'judge');
		const member = await person('Removed');
		await expect(deletion.removeMember(judge, member.id, 'no', ctx())).rejects.toMatchObject({ status: 403 });
		await expect(deletion.removeMember(admin, member.id, '  ', ctx())).rejects.toMatchObject({ status: 400 });
		await deletion.removeMember(admin, member.id, 'Asked us to by letter', ctx());
		const [[row]] = (await scratch.db.execute(
			sql`SELECT actor_id, detail FROM audit_log WHERE action = 'member.remove' AND subject_id = ${member.id}`
		)) as unknown as [[{ actor_id: string; detail: { reason: string } }]];
		expect(row).toMatchObject({ actor_id: admin.id, detail: { reason: 'Asked us to by letter' } });
	});
});

describe('the account data page', () => {
	test('a member deletes their account by typing their name, and is signed out', async () => {
		const member = await makePerson({ label: 'leaving' });
		const wrong = await request('/account/data?/delete', { cookie: member.cookie, form: { confirm: 'Someone Else' } });
		expect(wrong.status).toBe(400);
		expect(await request('/account', { cookie: member.cookie })).toHaveProperty('status', 200);

		const done = await request('/account/data?/delete', { cookie: member.cookie, form: { confirm: member.displayName } });
		expect(done.status).toBe(303);
		expect(done.headers.get('location')).toBe('/?accountDeleted=1');
		const account = await request('/account', { cookie: member.cookie });
		expect(account.status).toBe(303);
		expect(account.headers.get('location')).toMatch(/^\/signin/);
	});
});
