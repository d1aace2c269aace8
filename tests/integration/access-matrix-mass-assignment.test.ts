// Fields no form or body takes from the client (who owns or wrote something, roles, states, ids),
// sent along with requests that succeed: the thing is made or changed as the form says, and none
// of those fields took. (access-matrix.test.ts sends the same fields with every request of its
// table and checks the same at its end.)
import { beforeAll, describe, expect, test } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { entryComments, journalEntries, tanks as tankTable } from '../../src/lib/server/journals/schema';
import { listings, swapMessages } from '../../src/lib/server/swaps/schema';
import { contestCards, contestEntries } from '../../src/lib/server/contests/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as threads from '../../src/lib/server/swaps/threads';
import { makePerson, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';
import { tankInput } from '../helpers/tanks';
import { createListing, placePerson, viewerOf } from '../helpers/swaps';
import { contestFixture, openTank, photoOf } from '../helpers/contests';

let member: TestPerson;
let other: TestPerson;
let otherTank: number;
/** Titles of this run's things, so a rerun on the same database finds its own. */
const run = crypto.randomUUID().slice(0, 8);

/** What an attacker adds to a form: someone else's ids, a role, a state. */
const extrasFor = () => ({
	id: String(otherTank),
	userId: other.id,
	ownerId: other.id,
	authorId: other.id,
	senderId: other.id,
	recipientId: other.id,
	entrantId: other.id,
	judgeId: other.id,
	role: 'admin',
	state: 'reserved',
	status: 'submitted',
	number: '1',
	version: '99',
	email: 'taken-over@tests.riparia.test',
	emailVerified: '2020-01-01',
	createdAt: '2020-01-01'
});

beforeAll(async () => {
	member = await makePerson({ label: 'mass-member' });
	other = await makePerson({ label: 'mass-other' });
	otherTank = await tanks.create(viewerOf(other), tankInput({ name: 'Someone else’s tank' }));
});

const post = (path: string, form: Record<string, string>, who: TestPerson = member) =>
	request(path, { method: 'POST', cookie: who.cookie, form: { ...extrasFor(), ...form } });

describe('extra fields in forms are dropped', () => {
	test('the profile form changes the name only: not the role, the address or the verification', async () => {
		const [before] = await db.select().from(users).where(eq(users.id, member.id));
		const response = await post('/account?/profile', {
			displayName: 'Renamed Member',
			units: 'metric',
			locationMode: 'none',
			notifyMessages: 'hourly',
			homeLat: '',
			homeLng: ''
		});
		expect(response.status).toBe(200);
		const [after] = await db.select().from(users).where(eq(users.id, member.id));
		const fixed = ({ id, email, emailVerified, role, createdAt, unsubscribeToken }: typeof before & object) => ({
			id,
			email,
			emailVerified,
			role,
			createdAt,
			unsubscribeToken
		});
		expect(after!.displayName).toBe('Renamed Member');
		expect(fixed(after!)).toEqual(fixed(before!));
		expect((await post('/welcome', { displayName: 'Welcomed Member' })).status).toBe(303);
		const [welcomed] = await db.select({ role: users.role, email: users.email }).from(users).where(eq(users.id, member.id));
		expect(welcomed).toEqual({ role: 'member', email: member.email });
	});

	test('a new tank is the poster’s, with a new id; the tank whose id was sent is untouched', async () => {
		const [before] = await db.select().from(tankTable).where(eq(tankTable.id, otherTank));
		const response = await post('/journals/new', {
			name: 'Mass tank',
			style: 'jungle',
			setUpOn: '2026-01-10',
			visibility: 'club',
			length: '60',
			width: '30',
			height: '36',
			glass: '6',
			substrateKind: 'sand',
			substrateDepth: '5',
			waterVolume: '',
			co2Method: 'none'
		});
		expect(response.status).toBe(303);
		const id = Number(response.headers.get('location')!.split('/').pop());
		expect(id).not.toBe(otherTank);
		const [made] = await db.select().from(tankTable).where(eq(tankTable.id, id));
		expect(made).toMatchObject({ ownerId: member.id, name: 'Mass tank', visibility: 'club' });
		expect(await db.select().from(tankTable).where(eq(tankTable.id, otherTank))).toEqual([before]);
	});

	test('an entry goes to the tank of its address, by its poster; a comment is by the one who sends it', async () => {
		const mine = await tanks.create(viewerOf(member), tankInput({ name: 'Mass entry tank' }));
		const response = await post(`/journals/${mine}/entries/new`, {
			tankId: String(otherTank),
			entryOn: '2026-02-01',
			title: `Mass entry ${run}`,
			body: 'Mine.'
		});
		expect(response.status).toBe(303);
		const [entry] = await db
			.select()
			.from(journalEntries)
			.where(eq(journalEntries.title, `Mass entry ${run}`));
		expect(entry).toMatchObject({ tankId: mine });
		expect(await db.select().from(journalEntries).where(eq(journalEntries.tankId, otherTank))).toEqual([]);

		const theirEntry = await entries.create(viewerOf(other), otherTank, { entryOn: '2026-02-01', title: 'Theirs', body: 'Theirs.', events: [] }, []);
		expect((await post(`/journals/${otherTank}/entries/${theirEntry}?/comment`, { comment: 'Nice stems.', entryId: String(entry!.id) })).status).toBe(200);
		const comments = await db.select().from(entryComments).where(eq(entryComments.entryId, theirEntry));
		expect(comments.map((c) => ({ authorId: c.authorId, body: c.body }))).toEqual([{ authorId: member.id, body: 'Nice stems.' }]);
	});

	test('a new listing is the poster’s, open, at the poster’s point', async () => {
		await placePerson(member, { lat: -52.25, lng: -33.75 });
		const response = await post('/swaps/new', {
			kind: 'offer',
			category: 'plants',
			title: `Mass stems ${run}`,
			speciesId: '',
			speciesName: '',
			amount: '5',
			unit: 'stems',
			terms: 'free',
			termsNote: '',
			pickupAreaId: '',
			availableUntil: new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10),
			condition: '',
			description: '',
			tankId: '',
			lat: '10',
			lng: '10'
		});
		expect(response.status).toBe(303);
		const [made] = await db
			.select()
			.from(listings)
			.where(eq(listings.title, `Mass stems ${run}`));
		expect(made).toMatchObject({ ownerId: member.id, state: 'open' });
		expect([Number(made!.lat), Number(made!.lng)]).toEqual([-52.25, -33.75]);
	});

	test('a message is the sender’s, in the conversation of its address, to the other member', async () => {
		await placePerson(other, { lat: -52.25, lng: -33.75 });
		const listing = await createListing(other, { title: 'Mass talk' });
		const thread = await threads.request(viewerOf(member), listing, 'First question');
		expect((await post(`/swaps/threads/${thread}?/send`, { body: 'Second question', threadId: '1' })).status).toBe(303);
		const [last] = await db.select().from(swapMessages).where(eq(swapMessages.threadId, thread)).orderBy(desc(swapMessages.id)).limit(1);
		expect(last).toMatchObject({ body: 'Second question', senderId: member.id, recipientId: other.id });
	});

	test('a contest entry is the entrant’s, without a number, in the state a new entry has', async () => {
		const f = await contestFixture({ judges: 1, state: 'open', entrantNames: ['Mass Entrant'] });
		const tank = await openTank(member, 'Mass contest tank');
		const photo = await photoOf(member);
		const response = await post(`/contests/${f.contestId}/enter`, {
			categoryId: String(f.categories[1]),
			tankId: String(tank),
			statement: 'Mine.',
			'photos[0][id]': String(photo.id),
			'photos[0][alt]': 'Front',
			'photos[0][caption]': ''
		});
		expect(response.status).toBe(303);
		const [entry] = await db.select().from(contestEntries).where(eq(contestEntries.tankId, tank));
		expect(entry).toMatchObject({ entrantId: member.id, number: null, contestId: f.contestId });
	});
});

describe('extra fields in JSON bodies are dropped', () => {
	test('a card save sets the judge’s own draft: not its judge, status or version, nor a criterion of no rubric', async () => {
		const f = await contestFixture({ judges: 2 });
		const [judge, otherJudge] = f.judges as [TestPerson, TestPerson];
		const number = f.entries[0]!.number!;
		const save = (scores: Record<string, number | null>) =>
			request(`/api/judging/${f.contestId}/${number}/card`, {
				method: 'PUT',
				cookie: judge.cookie,
				accept: 'application/json',
				json: {
					baseVersion: 0,
					saveId: crypto.randomUUID(),
					judgeId: otherJudge.id,
					status: 'submitted',
					version: 99,
					entryId: f.entries[1]!.entryId,
					fields: { scores, comments: { [f.criteria[0]!]: '', [f.criteria[1]!]: '' }, entrantComment: '', panelNote: '', judgeId: otherJudge.id }
				}
			});
		// A criterion of no rubric is refused outright, and nothing is stored.
		const stray = await save({ [f.criteria[0]!]: 6, [f.criteria[1]!]: null, '999999': 10 });
		expect(stray.status).toBe(400);
		expect(await db.select().from(contestCards).where(eq(contestCards.contestId, f.contestId))).toEqual([]);
		const response = await save({ [f.criteria[0]!]: 6, [f.criteria[1]!]: null });
		expect(response.status).toBe(200);
		const cards = await db.select().from(contestCards).where(eq(contestCards.contestId, f.contestId));
		expect(cards).toHaveLength(1);
		expect(cards[0]).toMatchObject({ judgeId: judge.id, entryId: f.entries[0]!.entryId, status: 'draft', version: 1 });
	});
});
