// Journal entries, water tests, the schedule, the showcase and what other members do, through the
// running app, the real database, the bucket and the mail fake.
import { beforeAll, describe, expect, test } from 'vitest';
import { and, eq, inArray } from 'drizzle-orm';
import sharp from 'sharp';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { outbox } from '../../src/lib/server/mail/schema';
import { unsubscribeToken } from '../../src/lib/server/mail/unsubscribe';
import * as preferences from '../../src/lib/server/mail/preferences';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as water from '../../src/lib/server/journals/water';
import * as social from '../../src/lib/server/journals/social';
import * as digest from '../../src/lib/server/journals/digest';
import { journalDigests, tankFollows } from '../../src/lib/server/journals/schema';
import { media as mediaTable } from '../../src/lib/server/media/schema';
import { isoDay, dayNumber } from '../../src/lib/journals/calc';
import { weekOf } from '../../src/lib/journals/digest-content';
import { today } from '../../src/lib/dates';
import type { Viewer } from '../../src/lib/server/club/users';
import { request } from '../helpers/http';
import { mailsTo, waitForMail } from '../helpers/mail';
import { bucketKeys, uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';

const viewerOf = (p: TestPerson): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units: 'metric' });
const daysAgo = (n: number) => isoDay(dayNumber(new Date()) - n);
const jpeg = (colour = '#2f7a58') =>
	sharp({ create: { width: 480, height: 320, channels: 3, background: colour } })
		.jpeg()
		.toBuffer();

async function upload(person: TestPerson, colour?: string): Promise<number> {
	const response = await uploadFile(person, await jpeg(colour));
	expect(response.status).toBe(201);
	return (await response.json()).id;
}

const noEvents = { events: [] };

let owner: TestPerson;
let member: TestPerson;
let admin: TestPerson;

beforeAll(async () => {
	owner = await makePerson({ label: 'journal-owner' });
	member = await makePerson({ label: 'journal-member' });
	admin = await makePerson({ role: 'admin', label: 'journal-admin' });
});

/** A tank with one entry (with a photo) and one water test. */
async function journalTank(visibility: 'public' | 'club' | 'private') {
	const tankId = await tanks.create(viewerOf(owner), tankInput({ name: `Journal ${visibility}`, visibility, setUpOn: daysAgo(60) }));
	const photoId = await upload(owner);
	const entryId = await entries.create(
		viewerOf(owner),
		tankId,
		{ entryOn: daysAgo(3), title: `Entry of the ${visibility} tank`, body: 'Trimmed the *stems*.', ...noEvents },
		[{ id: photoId, alt: 'Stems after the trim', caption: '' }]
	);
	await water.create(viewerOf(owner), tankId, {
		testedOn: daysAgo(3),
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
	});
	return { tankId, entryId, photoId };
}

describe('who may see a journal', () => {
	test.each([
		['private', { owner: 200, member: 404, admin: 404, anonymous: 404 }, 404],
		['club', { owner: 200, member: 200, admin: 200, anonymous: 404 }, 404],
		['public', { owner: 200, member: 200, admin: 200, anonymous: 200 }, 200]
	] as const)('a %s tank: its page, entries, entry photos and water-test data follow it; its feed is %s', async (visibility, expected, feedStatus) => {
		const { tankId, entryId, photoId } = await journalTank(visibility);
		for (const [who, person] of [
			['owner', owner],
			['member', member],
			['admin', admin],
			['anonymous', null]
		] as const) {
			const cookie = person?.cookie;
			const entryPage = await request(`/journals/${tankId}/entries/${entryId}`, { cookie });
			expect(entryPage.status, `${who}: entry page`).toBe(expected[who]);
			if (expected[who] === 200) expect(await entryPage.text()).toContain(`Entry of the ${visibility} tank`);
			else expect(await entryPage.text()).not.toContain(`Entry of the ${visibility}`);
			expect((await request(`/media/${photoId}/thumb`, { cookie, accept: 'image/webp' })).status, `${who}: entry photo`).toBe(expected[who]);
			const api = await request(`/api/tanks/${tankId}/water-tests`, { cookie, accept: 'application/json' });
			expect(api.status, `${who}: water-test data`).toBe(expected[who]);
			if (expected[who] === 200)
				expect((await api.json()).series.map((s: { parameter: string }) => s.parameter)).toEqual([
					'pH',
					'KH',
					'GH',
					'NO3',
					'PO4',
					'ammonia',
					'NO2',
					'temperature'
				]);
			else expect(await api.json()).toEqual({ code: 'not-found', message: 'We could not find that tank.', fields: {} });
			expect((await request(`/journals/${tankId}/feed.xml`, { cookie, accept: 'application/atom+xml' })).status, `${who}: feed`).toBe(feedStatus);
		}
	});

	test('photos of an entry become private with the tank', async () => {
		const { tankId, photoId } = await journalTank('public');
		const publicPhoto = await request(`/media/${photoId}/medium`, { accept: 'image/webp' });
		expect(publicPhoto.headers.get('cache-control')).toMatch(/^public/);
		const tank = (await tanks.getOwn(viewerOf(owner), tankId))!;
		await tanks.update(viewerOf(owner), tankId, tankInput({ name: tank.name, visibility: 'private', setUpOn: tank.setUpOn }), []);
		expect((await request(`/media/${photoId}/medium`, { accept: 'image/webp' })).status).toBe(404);
		expect((await request(`/media/${photoId}/medium`, { cookie: member.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(`/media/${photoId}/medium`, { cookie: owner.cookie, accept: 'image/webp' })).status).toBe(200);
	});
});

describe('entries through the form', () => {
	test('an entry with two photos and a water change; its text is sanitised; the schedule is reset', async () => {
		const tankId = await tanks.create(viewerOf(owner), tankInput({ name: 'Form tank', visibility: 'public', setUpOn: daysAgo(40) }));
		await upkeep.saveSchedule(viewerOf(owner), tankId, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
		const [first, second] = [await upload(owner, '#2f7a58'), await upload(owner, '#1d6f8c')];
		const response = await request(`/journals/${tankId}/entries/new`, {
			cookie: owner.cookie,
			form: {
				entryOn: daysAgo(1),
				title: 'Week six',
				body: 'Hello <script>alert(1)</script> [link](javascript:alert(2)) **bold**',
				'photos[0][id]': String(second),
				'photos[0][alt]': 'Blue one first',
				'photos[0][caption]': '',
				'photos[1][id]': String(first),
				'photos[1][alt]': 'Green one',
				'photos[1][caption]': 'after the trim',
				'events[0][kind]': 'water-change',
				'events[0][percent]': '40'
			}
		});
		expect(response.status).toBe(303);
		const entryId = Number(response.headers.get('location')!.split('/').pop());
		const found = (await entries.get(viewerOf(owner), tankId, entryId))!;
		expect(found.entry.photos.map((p) => [p.id, p.alt, p.caption])).toEqual([
			[second, 'Blue one first', ''],
			[first, 'Green one', 'after the trim']
		]);
		expect(found.entry.events.map((e) => [e.kind, e.percent, e.occurredOn])).toEqual([['water-change', 40, daysAgo(1)]]);
		expect(found.entry.html).toContain('<strong>bold</strong>');
		expect(found.entry.html).not.toMatch(/<script|javascript:/);
		const html = await (await request(`/journals/${tankId}/entries/${entryId}`)).text();
		expect(html).not.toContain('<script>alert(1)');
		expect(html).not.toContain('javascript:alert(2)');
		const [task] = await upkeep.listForTank(tankId);
		expect(task!.lastDoneOn).toBe(daysAgo(1));
	});

	test('errors keep what was typed; a day before set-up is refused', async () => {
		const tankId = await tanks.create(viewerOf(owner), tankInput({ name: 'Typo tank', setUpOn: daysAgo(10) }));
		const response = await request(`/journals/${tankId}/entries/new`, {
			cookie: owner.cookie,
			form: { entryOn: daysAgo(20), title: 'Kept title', body: 'x', 'events[0][kind]': 'water-change', 'events[0][percent]': 'lots' }
		});
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain('value="Kept title"');
		expect(html).toContain('That is before the tank was set up.');
		expect(html).toContain('Enter a number.');
	});

	test('plants and animals added or taken out change the tank’s lists, with dates', async () => {
		const keeper = viewerOf(owner);
		const tankId = await tanks.create(
			keeper,
			tankInput({
				name: 'List tank',
				setUpOn: daysAgo(30),
				plants: [{ speciesId: null, name: 'Old stems', placement: null, addedOn: daysAgo(30), removedOn: null }],
				livestock: [{ speciesId: null, name: 'Shrimp', count: 10, addedOn: daysAgo(20), removedOn: null }]
			})
		);
		const tank = (await tanks.getOwn(keeper, tankId))!;
		const response = await request(`/journals/${tankId}/entries/new`, {
			cookie: owner.cookie,
			form: {
				entryOn: daysAgo(2),
				body: 'Rehomed some shrimp through the club.',
				'events[0][kind]': 'plant-removed',
				'events[0][rowId]': String(tank.plants[0]!.id),
				'events[1][kind]': 'plant-added',
				'events[1][speciesName]': 'New carpet plant',
				'events[2][kind]': 'livestock-removed',
				'events[2][rowId]': String(tank.livestock[0]!.id),
				'events[2][count]': '4'
			}
		});
		expect(response.status).toBe(303);
		const after = (await tanks.getOwn(keeper, tankId))!;
		expect(after.plants.map((p) => [p.name, p.addedOn, p.removedOn])).toEqual([
			['Old stems', daysAgo(30), daysAgo(2)],
			['New carpet plant', daysAgo(2), null]
		]);
		expect(after.livestock.map((a) => [a.name, a.count, a.addedOn, a.removedOn])).toEqual([
			['Shrimp', 6, daysAgo(20), null],
			['Shrimp', 4, daysAgo(20), daysAgo(2)]
		]);
		// Taking out more than are listed is refused and changes nothing.
		const refused = await request(`/journals/${tankId}/entries/new`, {
			cookie: owner.cookie,
			form: {
				entryOn: daysAgo(1),
				body: 'x',
				'events[0][kind]': 'livestock-removed',
				'events[0][rowId]': String(tank.livestock[0]!.id),
				'events[0][count]': '9'
			}
		});
		expect(refused.status).toBe(400);
		expect(await refused.text()).toContain('The list has 6; take out at most that many.');
		expect((await tanks.getOwn(keeper, tankId))!.livestock.map((a) => a.count)).toEqual([6, 4]);
	});

	test('deleting an entry deletes its photos’ objects from the bucket, and the schedule goes back', async () => {
		const keeper = viewerOf(owner);
		const tankId = await tanks.create(keeper, tankInput({ name: 'Delete tank', setUpOn: daysAgo(30) }));
		await upkeep.saveSchedule(keeper, tankId, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
		await entries.create(keeper, tankId, { entryOn: daysAgo(9), title: '', body: 'Older change', events: [waterChange(30)] }, []);
		const photos = [await upload(owner), await upload(owner)];
		const entryId = await entries.create(
			keeper,
			tankId,
			{ entryOn: daysAgo(2), title: 'To delete', body: 'x', events: [waterChange(50)] },
			photos.map((id) => ({ id, alt: '', caption: '' }))
		);
		const rows = await db
			.select()
			.from(mediaTable)
			.where(and(eq(mediaTable.scope, 'entry'), eq(mediaTable.scopeId, entryId)));
		const keys = rows.map((r) => r.storageKey);
		expect(keys).toHaveLength(2);
		for (const key of keys) expect(await bucketKeys(key + '/')).toHaveLength(3);
		expect((await upkeep.listForTank(tankId))[0]!.lastDoneOn).toBe(daysAgo(2));

		const response = await request(`/journals/${tankId}/entries/${entryId}?/delete`, { cookie: owner.cookie, form: {} });
		expect(response.status).toBe(303);
		expect(response.headers.get('location')).toBe(`/journals/${tankId}?entryDeleted=1`);
		for (const key of keys) expect(await bucketKeys(key + '/')).toEqual([]);
		expect((await request(`/media/${photos[0]}/thumb`, { cookie: owner.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await upkeep.listForTank(tankId))[0]!.lastDoneOn).toBe(daysAgo(9));
	});

	test('deleting the tank deletes every entry photo too', async () => {
		const keeper = viewerOf(owner);
		const tankId = await tanks.create(keeper, tankInput({ name: 'Gone tank', setUpOn: daysAgo(30) }));
		const photoId = await upload(owner);
		const entryId = await entries.create(keeper, tankId, { entryOn: daysAgo(2), title: '', body: 'x', ...noEvents }, [{ id: photoId, alt: '', caption: '' }]);
		const [row] = await db
			.select()
			.from(mediaTable)
			.where(and(eq(mediaTable.scope, 'entry'), eq(mediaTable.scopeId, entryId)));
		expect(await bucketKeys(row!.storageKey + '/')).toHaveLength(3);
		const response = await request(`/journals/${tankId}?/delete`, { cookie: owner.cookie, form: { confirmName: 'Gone tank' } });
		expect(response.status).toBe(303);
		expect(await bucketKeys(row!.storageKey + '/')).toEqual([]);
	});
});

const waterChange = (percent: number) => ({
	kind: 'water-change' as const,
	percent,
	filterPart: null,
	what: '',
	amount: null,
	amountUnit: null,
	saltId: null,
	speciesId: null,
	speciesName: '',
	count: null,
	algaeKind: null,
	note: '',
	rowId: null
});

describe('comments', () => {
	test('members comment; the keeper and admins remove comments, other members cannot', async () => {
		const { tankId, entryId } = await journalTank('club');
		const other = await makePerson({ label: 'commenter-2' });
		const posted = await request(`/journals/${tankId}/entries/${entryId}?/comment`, {
			cookie: member.cookie,
			form: { comment: 'Lovely **carpet** <img src=x onerror=alert(1)>' }
		});
		expect(posted.status).toBe(200);
		const [comment] = await entries.comments(viewerOf(member), (await tanks.findVisible(viewerOf(member), tankId))!, entryId);
		expect(comment!.html).toContain('<strong>carpet</strong>');
		expect(comment!.html).not.toMatch(/<img|onerror/);
		const byOther = await request(`/journals/${tankId}/entries/${entryId}?/removeComment`, { cookie: other.cookie, form: { commentId: String(comment!.id) } });
		expect(byOther.status).toBe(404);
		const byKeeper = await request(`/journals/${tankId}/entries/${entryId}?/removeComment`, { cookie: owner.cookie, form: { commentId: String(comment!.id) } });
		expect(byKeeper.status).toBe(200);
		expect(await entries.comments(null, (await tanks.findVisible(viewerOf(owner), tankId))!, entryId)).toEqual([]);
		const empty = await request(`/journals/${tankId}/entries/${entryId}?/comment`, { cookie: member.cookie, form: { comment: '   ' } });
		expect(empty.status).toBe(400);
	});
});

describe('water tests', () => {
	test('a test through the form: °F for a US member, estimates and warnings on the tank page, points in the API', async () => {
		const us = await makePerson({ label: 'water-us' });
		await db.update(users).set({ units: 'us' }).where(eq(users.id, us.id));
		const tankId = await tanks.create(viewerOf(us), tankInput({ name: 'Test tank US', setUpOn: daysAgo(20) }));
		const response = await request(`/journals/${tankId}/water-tests/new`, {
			cookie: us.cookie,
			form: { testedOn: daysAgo(1), ph: '7.8', kh: '4', temperatureC: '82.4', ammonia: '1', ammoniaBasis: 'NH3', no2: '0.5', note: '' }
		});
		expect(response.status).toBe(303);
		const [stored] = await water.latestOf(tankId);
		// (82.4 − 32) × 5/9 = 28 °C.
		expect(stored).toMatchObject({ ph: 7.8, kh: 4, temperatureC: 28, ammonia: 1, no2: 0.5 });
		const page = await (await request(`/journals/${tankId}`, { cookie: us.cookie })).text();
		expect(page).toContain('data-testid="co2-estimate"');
		expect(page).toContain('data-testid="ammonia-estimate"');
		// 1 mg/L total at pH 7.8 and 28 °C: pKa 0.09018 + 2729.92 / 301.15 = 9.155 (Emerson et al. 1975), so 4.23 % is NH3,
		// 0.042 mg/L: above the 0.02 concern level (common practice, no source), below the 0.05 of IFAS circular FA16.
		expect(page).toMatch(/Total ammonia read 1 mg\/L\. At pH 7\.8 and 28 °C, 0\.042 mg\/L of it is un-ionised ammonia/);
		expect(page).not.toMatch(/Total ammonia[^<]*a level that harms fish/);
		expect(page).toMatch(/Nitrite \(NO₂\) read 0.5 mg\/L: a level that harms fish/);
		const api = await (await request(`/api/tanks/${tankId}/water-tests`, { cookie: us.cookie, accept: 'application/json' })).json();
		const temp = api.series.find((s: { parameter: string }) => s.parameter === 'temperature');
		expect(temp).toMatchObject({ unit: '°F', points: [{ on: daysAgo(1), value: 82.4, status: 'in-band' }] });
		expect(api.series.find((s: { parameter: string }) => s.parameter === 'ammonia')).toMatchObject({
			dangerous: 0,
			outOfBand: 1,
			band: { low: 0, high: 0.05 }
		});
	});
});

describe('upkeep schedule', () => {
	test('the dashboard lists what is due; "done today" resets it', async () => {
		const keeper = await makePerson({ label: 'schedule-keeper' });
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Schedule tank', setUpOn: daysAgo(50) }));
		const saved = await request(`/journals/${tankId}/schedule`, {
			cookie: keeper.cookie,
			form: {
				'tasks[0][kind]': 'water-change',
				'tasks[0][label]': 'Big water change',
				'tasks[0][intervalDays]': '7',
				'tasks[1][kind]': 'filter-clean',
				'tasks[1][filterPart]': 'prefilter',
				'tasks[1][label]': 'Rinse the sponge',
				'tasks[1][intervalDays]': '14'
			}
		});
		expect(saved.status).toBe(303);
		await entries.create(viewerOf(keeper), tankId, { entryOn: daysAgo(10), title: '', body: 'x', events: [waterChange(30)] }, []);
		let home = await (await request('/', { cookie: keeper.cookie })).text();
		expect(home).toContain('Big water change');
		expect(home).toContain('overdue by 3 days');
		expect(home).toContain('Rinse the sponge');
		expect(home).toContain('not logged yet');

		const task = (await upkeep.listForTank(tankId)).find((t) => t.label === 'Big water change')!;
		const done = await request('/?/done', { cookie: keeper.cookie, form: { taskId: String(task.id) } });
		expect(done.status).toBe(200);
		expect((await upkeep.listForTank(tankId)).find((t) => t.id === task.id)!.lastDoneOn).toBe(today());
		home = await (await request('/', { cookie: keeper.cookie })).text();
		expect(home).not.toContain('Big water change');
		expect(home).toContain('Rinse the sponge');
		// Someone else cannot tick it off.
		expect((await request('/?/done', { cookie: member.cookie, form: { taskId: String(task.id) } })).status).toBe(404);
	});
});

describe('following', () => {
	test('a follower gets at most one "new entry" mail a day per tank', async () => {
		const keeper = await makePerson({ label: 'followed-keeper' });
		const fan = await makePerson({ label: 'fan' });
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Followed tank', visibility: 'public', setUpOn: daysAgo(30) }));
		const followed = await request(`/journals/${tankId}?/follow`, { cookie: fan.cookie, form: { want: 'on' } });
		expect(followed.status).toBe(200);
		expect(await social.standingOf(viewerOf(fan), tankId)).toMatchObject({ following: true, followers: 1 });

		for (const title of ['First of the day', 'Second of the day']) {
			const r = await request(`/journals/${tankId}/entries/new`, { cookie: keeper.cookie, form: { entryOn: today(), title, body: 'Some news.' } });
			expect(r.status).toBe(303);
		}
		const mail = await waitForMail(fan.email, { subject: /New in Followed tank/ });
		expect(mail.subject).toBe('New in Followed tank: First of the day');
		expect(mail.text).toMatch(/\/journals\/\d+\/entries\/\d+/);
		// Give the outbox time to deliver anything else it might hold for the fan.
		await new Promise((r) => setTimeout(r, 2500));
		expect(await mailsTo(fan.email)).toHaveLength(1);
		const queued = await db.select().from(outbox).where(eq(outbox.toAddress, fan.email));
		expect(queued).toHaveLength(1);

		// A day later the next entry mails again.
		const later = new Date(Date.now() + 25 * 60 * 60_000);
		const tank = (await tanks.findVisible(viewerOf(keeper), tankId))!;
		expect(await db.transaction((tx) => social.notifyFollowers(tank, { id: 1, title: 'Next day', entryOn: today() }, { db: tx, now: later }))).toBe(1);
		expect(
			await db.transaction((tx) =>
				social.notifyFollowers(tank, { id: 2, title: 'Same next day', entryOn: today() }, { db: tx, now: new Date(later.getTime() + 60_000) })
			)
		).toBe(0);
		const [row] = await db
			.select()
			.from(tankFollows)
			.where(and(eq(tankFollows.tankId, tankId), eq(tankFollows.userId, fan.id)));
		expect(row!.lastMailedAt!.getTime()).toBe(later.getTime());
	});

	test('no mail to a follower who can no longer see the tank; no admiring or following one’s own tank', async () => {
		const keeper = await makePerson({ label: 'hiding-keeper' });
		const fan = await makePerson({ label: 'fan-2' });
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Hidden later', visibility: 'club', setUpOn: daysAgo(30) }));
		await social.toggleFollow(viewerOf(fan), tankId, true);
		await tanks.update(viewerOf(keeper), tankId, tankInput({ name: 'Hidden later', visibility: 'private', setUpOn: daysAgo(30) }), []);
		await entries.create(viewerOf(keeper), tankId, { entryOn: today(), title: 'Private news', body: 'x', ...noEvents }, []);
		expect(await db.select().from(outbox).where(eq(outbox.toAddress, fan.email))).toEqual([]);
		expect((await request(`/journals/${tankId}?/admire`, { cookie: keeper.cookie, form: { want: 'on' } })).status).toBe(400);
		expect((await request(`/journals/${tankId}?/follow`, { cookie: fan.cookie, form: { want: 'off' } })).status).toBe(404);
	});
});

describe('admiring and the showcase', () => {
	test('one admire per member, a toggle; public running tanks only; filters by style and size', async () => {
		const keeper = await makePerson({ label: 'showcase-keeper' });
		const style = `style-${keeper.id.slice(0, 8)}`;
		const big = await tanks.create(viewerOf(keeper), tankInput({ name: 'Big public', style, visibility: 'public', lengthCm: 150, widthCm: 50, heightCm: 60 }));
		const small = await tanks.create(
			viewerOf(keeper),
			tankInput({ name: 'Small public', style, visibility: 'public', lengthCm: 30, widthCm: 20, heightCm: 20 })
		);
		await tanks.create(viewerOf(keeper), tankInput({ name: 'Club only', style, visibility: 'club' }));
		for (let i = 0; i < 2; i++) await request(`/journals/${small}?/admire`, { cookie: member.cookie, form: { want: 'on' } });
		expect((await social.standingOf(null, small)).admirers).toBe(1);
		await request(`/journals/${small}?/admire`, { cookie: admin.cookie, form: {} });
		expect((await social.standingOf(viewerOf(admin), small)).admired).toBe(true);
		await request(`/journals/${small}?/admire`, { cookie: admin.cookie, form: {} });
		expect((await social.standingOf(viewerOf(admin), small)).admired).toBe(false);

		const names = async (query: string) => {
			const html = await (await request(`/journals/showcase?${query}`)).text();
			return ['Big public', 'Small public', 'Club only'].filter((n) => html.includes(n));
		};
		expect(await names(`style=${style}`)).toEqual(['Big public', 'Small public']);
		expect(await names(`style=${style}&size=nano`)).toEqual(['Small public']);
		expect(await names(`style=${style}&size=large`)).toEqual(['Big public']);
		const admired = await (await request(`/journals/showcase?style=${style}&sort=admired`)).text();
		expect(admired.indexOf('Small public')).toBeLessThan(admired.indexOf('Big public'));
		expect(big).toBeGreaterThan(0);
	});
});

describe('the Atom feed', () => {
	test('valid XML with the public tank’s entries, escaped, with absolute photo links', async () => {
		const keeper = await makePerson({ label: 'feed-keeper', displayName: 'Feed & <Keeper>' });
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Feed "tank" & co', visibility: 'public', setUpOn: daysAgo(30) }));
		const photoId = await upload(keeper);
		await entries.create(
			viewerOf(keeper),
			tankId,
			{ entryOn: daysAgo(2), title: 'Rocks <b>&</b> roots', body: 'Text with <script>alert(1)</script> and [a link](javascript:alert(1)).', ...noEvents },
			[{ id: photoId, alt: 'Front "view"', caption: '' }]
		);
		const response = await request(`/journals/${tankId}/feed.xml`, { accept: 'application/atom+xml' });
		expect(response.status).toBe(200);
		expect(response.headers.get('content-type')).toContain('application/atom+xml');
		const xml = await response.text();
		expect(XMLValidator.validate(xml)).toBe(true);
		const doc = new XMLParser({ ignoreAttributes: false, isArray: (n) => n === 'entry' }).parse(xml).feed;
		expect(doc.title['#text']).toBe('Feed "tank" & co — a tank journal');
		expect(doc.author.name).toBe('Feed & <Keeper>');
		const content: string = doc.entry[0].content['#text'];
		expect(doc.entry[0].title['#text']).toBe('Rocks <b>&</b> roots');
		expect(content).not.toMatch(/<script|javascript:/);
		expect(content).toMatch(new RegExp(`<img src="https?://[^"]+/media/${photoId}/medium" alt="Front &quot;view&quot;" />`));
	});
});

describe('the weekly digest', () => {
	test('lists due upkeep and followed entries, with an unsubscribe link and header; one per week', async () => {
		const reader = await makePerson({ label: 'digest-reader', displayName: 'Digest Reader' });
		await preferences.save(reader.id, { upkeep: 'weekly' });
		const tankId = await tanks.create(viewerOf(reader), tankInput({ name: 'Digest tank', setUpOn: daysAgo(60) }));
		await upkeep.saveSchedule(viewerOf(reader), tankId, [
			{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 },
			{ kind: 'trim', filterPart: null, label: 'Trim the stems', intervalDays: 30 }
		]);
		await entries.create(
			viewerOf(reader),
			tankId,
			{ entryOn: daysAgo(10), title: '', body: 'x', events: [waterChange(40), { ...waterChange(0), kind: 'trim', percent: null }] },
			[]
		);
		const keeper = await makePerson({ label: 'digest-keeper' });
		const followedTank = await tanks.create(viewerOf(keeper), tankInput({ name: 'Followed for digest', visibility: 'club', setUpOn: daysAgo(60) }));
		await social.toggleFollow(viewerOf(reader), followedTank, true);
		await entries.create(viewerOf(keeper), followedTank, { entryOn: daysAgo(1), title: 'Fresh stones', body: 'x', ...noEvents }, []);
		const quiet = await makePerson({ label: 'digest-quiet' });
		await preferences.save(quiet.id, { upkeep: 'weekly' });

		const now = new Date();
		expect(await digest.sendWeeklyDigests({ now })).toBeGreaterThanOrEqual(1);
		const mail = await waitForMail(reader.email, { subject: /Your tanks this week/ });
		expect(mail.subject).toBe('Your tanks this week: 1 task due');
		expect(mail.text).toContain(`Hello Digest Reader, here is your week at the tanks from`);
		expect(mail.text).toContain('• Digest tank: Water change — overdue by 3 days');
		expect(mail.text).not.toContain('Trim the stems');
		expect(mail.text).toMatch(/• Followed for digest: Fresh stones — http\S+\/journals\/\d+\/entries\/\d+/);
		const token = unsubscribeToken(reader.id, 'upkeep');
		expect(mail.text).toContain(`/unsubscribe/${token}`);
		expect(mail.headers['list-unsubscribe']).toContain(`/unsubscribe/${token}>`);

		// A second run in the same week queues nothing more; the quiet member had nothing to hear about.
		await digest.sendWeeklyDigests({ now: new Date(now.getTime() + 3_600_000) });
		const queued = await db.select().from(outbox).where(eq(outbox.toAddress, reader.email));
		expect(queued.filter((m) => m.topic === 'journal-digest').map((m) => m.dedupeKey)).toEqual([`journal-digest:${reader.id}:${weekOf(now)}`]);
		expect(await db.select().from(outbox).where(eq(outbox.toAddress, quiet.email))).toEqual([]);
		const considered = await db
			.select()
			.from(journalDigests)
			.where(and(eq(journalDigests.weekOf, weekOf(now)), inArray(journalDigests.userId, [reader.id, quiet.id])));
		expect(considered.map((r) => [r.userId, r.sentAt !== null]).sort()).toEqual(
			[
				[reader.id, true],
				[quiet.id, false]
			].sort()
		);
	});
});
