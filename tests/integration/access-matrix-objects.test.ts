// Every id that travels in a URL or a body is checked against the viewer, not only the one the
// route's path is guarded by: another member's ids sent through one's own tank, entry or
// conversation find nothing and change nothing; photos, listings and contest entries take only
// the viewer's own things; judges never reach their own entry; entrants see no score before the
// results are out. (Who may open each route at all is in access-matrix.test.ts.)
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { entryComments, journalEntries, journalEvents, maintenanceTasks, waterTests } from '../../src/lib/server/journals/schema';
import { swapReports } from '../../src/lib/server/swaps/schema';
import { media as mediaTable } from '../../src/lib/server/media/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as water from '../../src/lib/server/journals/water';
import * as threads from '../../src/lib/server/swaps/threads';
import * as listingEdits from '../../src/lib/server/swaps/listing-edits';
import * as contestEntries from '../../src/lib/server/contests/contest-entries';
import * as judging from '../../src/lib/server/contests/judging';
import * as panel from '../../src/lib/server/contests/panel';
import { contestCards, contestEntries as contestEntriesTable } from '../../src/lib/server/contests/schema';
import { transition } from '../../src/lib/server/contests/review';
import { makePerson, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';
import { tankInput } from '../helpers/tanks';
import { createListing, listingInput, placePerson, viewerOf } from '../helpers/swaps';
import { contestFixture, fields, photoOf } from '../helpers/contests';

let owner: TestPerson;
let intruder: TestPerson;
let ownerTank: number;
let ownerPrivateTank: number;
let ownerEntry: number;
let ownerTask: number;
let ownerEvent: number;
let ownerTest: number;
let neighbourComment: number;
let intruderTank: number;
let intruderEntry: number;

const waterTest = {
	testedOn: '2026-02-02',
	note: '',
	ph: 6.8,
	kh: 4,
	gh: null,
	no3: null,
	po4: null,
	k: null,
	fe: null,
	ammonia: null,
	ammoniaBasis: 'NH3' as const,
	no2: null,
	temperatureC: null,
	tds: null
};

beforeAll(async () => {
	owner = await makePerson({ label: 'objects-owner' });
	intruder = await makePerson({ label: 'objects-intruder' });
	const keeper = viewerOf(owner);
	ownerTank = await tanks.create(keeper, tankInput({ name: 'Owner’s club tank', visibility: 'club' }));
	ownerPrivateTank = await tanks.create(keeper, tankInput({ name: 'Owner’s private tank', visibility: 'private' }));
	ownerEntry = await entries.create(keeper, ownerTank, { entryOn: '2026-02-01', title: 'Owner’s entry', body: 'As it was.', events: [] }, []);
	await upkeep.saveSchedule(keeper, ownerTank, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
	ownerTask = (await upkeep.listForTank(ownerTank))[0]!.id;
	await upkeep.markDone(keeper, ownerTask);
	ownerEvent = (await db.select({ id: journalEvents.id }).from(journalEvents).where(eq(journalEvents.tankId, ownerTank)))[0]!.id;
	ownerTest = await water.create(keeper, ownerTank, waterTest);
	const neighbour = await makePerson({ label: 'objects-neighbour' });
	neighbourComment = await entries.addComment(viewerOf(neighbour), ownerTank, ownerEntry, 'A neighbour’s kind words.');
	intruderTank = await tanks.create(viewerOf(intruder), tankInput({ name: 'Intruder’s tank' }));
	intruderEntry = await entries.create(viewerOf(intruder), intruderTank, { entryOn: '2026-02-01', title: 'Mine', body: 'Mine.', events: [] }, []);
});

const post = (path: string, form: Record<string, string>, who: TestPerson = intruder) => request(path, { method: 'POST', cookie: who.cookie, form });
const exists = async (table: typeof waterTests | typeof journalEvents | typeof entryComments | typeof journalEntries, id: number) =>
	(await db.select({ id: table.id }).from(table).where(eq(table.id, id))).length === 1;

describe("another member's journal ids, sent through one's own tank and entry", () => {
	test('a water test, an upkeep task and a logged event of theirs are not found, and stay', async () => {
		const tankPath = `/journals/${intruderTank}`;
		const taskBefore = await db.select().from(maintenanceTasks).where(eq(maintenanceTasks.id, ownerTask));
		expect((await post(`${tankPath}?/deleteTest`, { testId: String(ownerTest) })).status).toBe(404);
		expect((await post(`${tankPath}?/done`, { taskId: String(ownerTask) })).status).toBe(404);
		expect((await post('/?/done', { taskId: String(ownerTask) })).status).toBe(404);
		expect((await post(`${tankPath}?/undoEvent`, { eventId: String(ownerEvent) })).status).toBe(404);
		expect(await exists(waterTests, ownerTest)).toBe(true);
		expect(await exists(journalEvents, ownerEvent)).toBe(true);
		expect(await db.select().from(maintenanceTasks).where(eq(maintenanceTasks.id, ownerTask))).toEqual(taskBefore);
		expect(await db.select({ id: journalEvents.id }).from(journalEvents).where(eq(journalEvents.tankId, ownerTank))).toHaveLength(1);
	});

	test('their entry under one’s own tank’s address is not found: not shown, edited, commented on or deleted', async () => {
		const path = `/journals/${intruderTank}/entries/${ownerEntry}`;
		expect((await request(path, { cookie: intruder.cookie })).status).toBe(404);
		expect((await request(`${path}/edit`, { cookie: intruder.cookie })).status).toBe(404);
		expect((await post(`${path}/edit`, { entryOn: '2026-02-01', title: 'Taken', body: 'Taken over' })).status).toBe(404);
		expect((await post(`${path}?/comment`, { comment: 'Slipped in.' })).status).toBe(404);
		expect((await post(`${path}?/delete`, {})).status).toBe(404);
		const [entry] = await db.select().from(journalEntries).where(eq(journalEntries.id, ownerEntry));
		expect(entry).toMatchObject({ tankId: ownerTank, title: 'Owner’s entry', body: 'As it was.' });
		expect(await db.select().from(entryComments).where(eq(entryComments.entryId, ownerEntry))).toHaveLength(1);
	});

	test('a keeper removes comments on their own entries only: a comment on another tank’s entry is not found', async () => {
		const response = await post(`/journals/${intruderTank}/entries/${intruderEntry}?/removeComment`, { commentId: String(neighbourComment) });
		expect(response.status).toBe(404);
		expect(await exists(entryComments, neighbourComment)).toBe(true);
	});

	test('a private tank’s entries, water tests and photos answer 404 to another member, by every address', async () => {
		const photo = await photoOf(owner);
		const privateEntry = await entries.create(viewerOf(owner), ownerPrivateTank, { entryOn: '2026-02-03', title: 'Quiet', body: 'Quiet.', events: [] }, [
			{ id: photo.id, alt: 'Tank', caption: '' }
		]);
		await water.create(viewerOf(owner), ownerPrivateTank, waterTest);
		for (const path of [
			`/journals/${ownerPrivateTank}`,
			`/journals/${ownerPrivateTank}/entries/${privateEntry}`,
			`/journals/${ownerPrivateTank}/feed.xml`,
			`/journals/dose?tank=${ownerPrivateTank}`,
			`/api/tanks/${ownerPrivateTank}/water-tests`,
			`/media/${photo.id}/thumb`,
			`/media/${photo.id}/large`
		]) {
			const response = await request(path, { cookie: intruder.cookie });
			if (path.startsWith('/journals/dose')) {
				// The calculator itself is public; the tank is simply not offered.
				expect(response.status).toBe(200);
				expect(await response.text()).not.toContain('Owner’s private tank');
			} else expect(response.status, path).toBe(404);
		}
	});
});

describe('photos are attached only by their uploader', () => {
	test('another member’s upload sent with one’s own journal entry is refused and stays theirs, unattached', async () => {
		const theirs = await photoOf(owner);
		const before = await db.select({ id: journalEntries.id }).from(journalEntries).where(eq(journalEntries.tankId, intruderTank));
		const response = await post(`/journals/${intruderTank}/entries/new`, {
			entryOn: '2026-02-05',
			title: 'With a borrowed photo',
			body: 'Look.',
			'photos[0][id]': String(theirs.id),
			'photos[0][alt]': 'Borrowed',
			'photos[0][caption]': ''
		});
		expect(response.status).toBe(400);
		expect(await db.select({ id: journalEntries.id }).from(journalEntries).where(eq(journalEntries.tankId, intruderTank))).toEqual(before);
		const [row] = await db.select().from(mediaTable).where(eq(mediaTable.id, theirs.id));
		expect(row).toMatchObject({ ownerId: owner.id, scope: null, scopeId: null });
	});

	test('…nor on a listing or a contest entry', async () => {
		const theirs = await photoOf(owner);
		await placePerson(intruder, { lat: -51.5, lng: -31.5 });
		await expect(listingEdits.create(viewerOf(intruder), listingInput(), [{ id: theirs.id, alt: 'Borrowed', caption: '' }])).rejects.toMatchObject({
			status: 400,
			code: 'photo-unavailable'
		});
		const f = await contestFixture({ judges: 1, state: 'open' });
		await expect(
			contestEntries.create(viewerOf(intruder), f.contestId, {
				categoryId: f.categories[1]!,
				tankId: intruderTank,
				statement: 'Mine.',
				photos: [{ id: theirs.id, alt: 'Borrowed', caption: '' }]
			})
		).rejects.toMatchObject({ status: 400, message: expect.stringMatching(/no longer available/) });
		const [row] = await db.select().from(mediaTable).where(eq(mediaTable.id, theirs.id));
		expect(row).toMatchObject({ ownerId: owner.id, scope: null, scopeId: null });
	});
});

describe('listings name their owner’s things only', () => {
	test('a listing cannot name another member’s tank', async () => {
		await placePerson(intruder, { lat: -51.5, lng: -31.5 });
		for (const tankId of [ownerTank, ownerPrivateTank]) {
			await expect(listingEdits.create(viewerOf(intruder), listingInput({ tankId }))).rejects.toMatchObject({ status: 400, code: 'no-tank' });
		}
	});

	test('a withdrawn listing is its owner’s alone', async () => {
		await placePerson(owner, { lat: -51.5, lng: -31.5 });
		const listing = await createListing(owner, { title: 'Soon withdrawn' });
		expect((await post(`/swaps/${listing}?/withdraw`, {}, owner)).status).toBe(303);
		expect((await request(`/swaps/${listing}`, { cookie: intruder.cookie })).status).toBe(404);
		expect((await request(`/swaps/${listing}`, { cookie: owner.cookie })).status).toBe(200);
	});
});

describe('conversations', () => {
	test('a message of a conversation one is not in cannot be reported through one’s own', async () => {
		await placePerson(owner, { lat: -51.5, lng: -31.5 });
		const listing = await createListing(owner, { title: 'Talked about' });
		const stranger = await makePerson({ label: 'objects-stranger' });
		const theirThread = await threads.request(viewerOf(stranger), listing, 'Their private question');
		const [theirMessage] = (await threads.poll(viewerOf(owner), theirThread, 0))!.messages;
		const ownThread = await threads.request(viewerOf(intruder), listing, 'My own question');
		const response = await post(`/swaps/threads/${ownThread}?/report`, { messageId: String(theirMessage!.id), reason: 'Reported from elsewhere' });
		expect(response.status).toBe(404);
		expect(await db.select().from(swapReports).where(eq(swapReports.reporterId, intruder.id))).toEqual([]);
		// Nor is it read, nor answered in, through the API.
		expect((await request(`/api/swaps/threads/${theirThread}/messages`, { cookie: intruder.cookie, accept: 'application/json' })).status).toBe(404);
	});
});

describe('contests', () => {
	test('a judge never reaches their own entry, by any address; the blind list leaves it out', async () => {
		const entrant = await makePerson({ role: 'judge', label: 'judge-entrant' });
		const f = await contestFixture({ judges: 1, entrants: [entrant], state: 'open' });
		const { contestId } = f;
		// On the panel of the contest they entered.
		await panel.assign(viewerOf(f.admin), contestId, entrant.id);
		await transition(viewerOf(f.admin), contestId, 'start-judging');
		const [{ number }] = (await db
			.select({ number: contestEntriesTable.number })
			.from(contestEntriesTable)
			.where(eq(contestEntriesTable.id, f.entries[0]!.entryId))) as [{ number: number }];
		for (const path of [`/judging/${contestId}/${number}`, `/judging/${contestId}/${number}/photos/1/thumb`]) {
			expect((await request(path, { cookie: entrant.cookie })).status, path).toBe(404);
		}
		expect((await request(`/api/judging/${contestId}/${number}/card`, { cookie: entrant.cookie, accept: 'application/json' })).status).toBe(404);
		const put = await request(`/api/judging/${contestId}/${number}/card`, {
			method: 'PUT',
			cookie: entrant.cookie,
			accept: 'application/json',
			json: { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [10, 5]) }
		});
		expect(put.status).toBe(404);
		const list = await judging.blindList(viewerOf(entrant), contestId);
		expect(JSON.stringify(list)).not.toContain(`"number":${number}`);
	});

	test('entrants see no score or comment before the results are out; entry photos are not at /media for judges', async () => {
		const entrant = await makePerson({ label: 'early-reader' });
		const f = await contestFixture({ judges: 1, entrants: [entrant] });
		const judge = f.judges[0]!;
		const number = f.entries[0]!.number!;
		const marker = `Marker ${crypto.randomUUID().slice(0, 8)}`;
		const saved = await judging.saveCard(viewerOf(judge), f.contestId, number, {
			baseVersion: 0,
			saveId: crypto.randomUUID(),
			fields: fields(f.criteria, [9, 4], { entrantComment: marker, panelNote: `${marker} for the panel` })
		});
		await judging.submitCard(viewerOf(judge), f.contestId, number, saved.version);
		for (const path of [`/contests/${f.contestId}/entries/${f.entries[0]!.entryId}`, `/contests/${f.contestId}`]) {
			const response = await request(path, { cookie: entrant.cookie });
			expect(response.status).toBe(200);
			expect(await response.text()).not.toContain(marker);
		}
		for (const category of f.categories) {
			expect((await request(`/contests/${f.contestId}/results/${category}`, { cookie: entrant.cookie })).status).toBe(404);
		}
		const own = await contestEntries.getOwn(viewerOf(entrant), f.entries[0]!.entryId);
		const photoId = own!.entry.photos[0]!.id;
		expect((await request(`/media/${photoId}/thumb`, { cookie: entrant.cookie })).status).toBe(200);
		expect((await request(`/media/${photoId}/thumb`, { cookie: judge.cookie })).status).toBe(404);
	});

	test('a card is corrected only under its own contest’s address', async () => {
		const a = await contestFixture({ judges: 1 });
		const b = await contestFixture({ judges: 1 });
		const saved = await judging.saveCard(viewerOf(a.judges[0]!), a.contestId, a.entries[0]!.number!, {
			baseVersion: 0,
			saveId: crypto.randomUUID(),
			fields: fields(a.criteria, [7, 3])
		});
		const [card] = await db.select({ id: contestCards.id }).from(contestCards).where(eq(contestCards.entryId, a.entries[0]!.entryId));
		expect(saved.version).toBe(1);
		expect((await request(`/admin/contests/${b.contestId}/cards/${card!.id}`, { cookie: b.admin.cookie })).status).toBe(404);
		expect((await request(`/admin/contests/${a.contestId}/cards/${card!.id}`, { cookie: a.admin.cookie })).status).toBe(200);
	});
});
