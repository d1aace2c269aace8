// The swap board through the running app and its domain functions: the nearby search, who may
// read a conversation, restricted species, blocks, accepting a request, batched mail, what the
// admins do (audited) and the owner's nudge about a reservation past its date.
import { describe, expect, test } from 'vitest';
import { and, eq, like, sql } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { outbox } from '../../src/lib/server/mail/schema';
import { listings as listingTable, swapMailState, swapMessages } from '../../src/lib/server/swaps/schema';
import * as nearby from '../../src/lib/server/swaps/nearby';
import * as transitions from '../../src/lib/server/swaps/listing-transitions';
import * as threads from '../../src/lib/server/swaps/threads';
import * as blocks from '../../src/lib/server/swaps/blocks';
import * as reports from '../../src/lib/server/swaps/reports';
import * as notifications from '../../src/lib/server/swaps/notifications';
import * as moderation from '../../src/lib/server/swaps/moderation';
import * as restricted from '../../src/lib/server/swaps/restricted';
import * as cards from '../../src/lib/server/swaps/listing-cards';
import * as audit from '../../src/lib/server/audit';
import { DAY_MS } from '../../src/lib/swaps/listing';
import { DomainError } from '../../src/lib/errors';
import { haversineDistance } from '../../src/lib/swaps/distance';
import { asLiteral, bandsInMetres, labelOf, radiusReachMetres, shownFigure, type DistanceUnit } from '../../src/lib/swaps/display';
import { parseBoardQuery, type BoardFilter } from '../../src/lib/swaps/board-filter';
import type { LatLng } from '../../src/lib/club/location';
import { request } from '../helpers/http';
import { mailsTo, waitForMail } from '../helpers/mail';
import { makePerson } from '../helpers/people';
import { createListing, memberAt, restrictedPlant, token, viewerOf } from '../helpers/swaps';

const filter = (over: Partial<BoardFilter>): BoardFilter => ({ ...parseBoardQuery(new URLSearchParams()), ...over });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The mail fake's messages to an address once there are at least `n` (newest first). */
async function mailsOnceThere(address: string, n: number, timeoutMs = 15_000) {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		const all = await mailsTo(address);
		if (all.length >= n) return all;
		await sleep(250);
	}
	throw new Error(`Fewer than ${n} mails to ${address} arrived in time.`);
}

/** Grid points 0.01° apart around `centre` (members' points are stored with two decimals). */
function gridAround(centre: LatLng, latSteps: number, lngSteps: number): LatLng[] {
	const points: LatLng[] = [];
	for (let i = -latSteps; i <= latSteps; i++) {
		for (let j = -lngSteps; j <= lngSteps; j++)
			points.push({ lat: Math.round((centre.lat + i / 100) * 100) / 100, lng: Math.round((centre.lng + j / 100) * 100) / 100 });
	}
	return points;
}

describe('swap board: nearby search', () => {
	test('a radius keeps every listing shown at that distance or nearer, by the haversine figure rounded as shown, nearest first', async () => {
		// Over the South Atlantic, away from every other test's listings.
		const centre = { lat: -41.37, lng: -22.61 };
		// "Within 25 km" keeps what is shown as "about 25 km" (up to 27.5 km) and nothing shown as
		// "about 30 km". Of the grid points, the farthest still below 27.5 km and the nearest beyond
		// it, by the haversine function checked against @turf/distance in src/lib/swaps/distance.test.ts
		// (within a few tens of metres of the edge; the circle passes enough grid points).
		const reach = radiusReachMetres(25, 'km');
		const scored = gridAround(centre, 40, 50).map((p) => ({ p, d: haversineDistance(centre, p) }));
		const inside = scored.filter((s) => s.d < reach).sort((a, b) => b.d - a.d)[0]!;
		const outside = scored.filter((s) => s.d >= reach).sort((a, b) => a.d - b.d)[0]!;
		expect(inside.d).toBeGreaterThan(reach - 30);
		expect(outside.d).toBeLessThan(reach + 30);
		const closestTo = (metres: number) => [...scored].sort((a, b) => Math.abs(a.d - metres) - Math.abs(b.d - metres))[0]!;
		const near = closestTo(3_000);
		const middle = closestTo(11_000);

		const viewer = await memberAt(centre, 'nearby-viewer');
		const tag = token('nearby');
		const made: Record<string, number> = {};
		for (const [name, spot] of Object.entries({ inside, outside, near, middle })) {
			const owner = await memberAt(spot.p, `nearby-${name}`);
			made[name] = await createListing(owner, { title: `${tag} ${name}` });
		}

		const within25 = await nearby.search(viewerOf(viewer), filter({ q: tag, radius: 25 }));
		expect(within25.order).toBe('distance');
		expect(within25.rows.map((r) => r.id)).toEqual([made.near, made.middle, made.inside]);
		expect(within25.total).toBe(3);
		const within50 = await nearby.search(viewerOf(viewer), filter({ q: tag, radius: 50 }));
		expect(within50.rows.map((r) => r.id)).toEqual([made.near, made.middle, made.inside, made.outside]);
		// About 11 km away is shown as "about 10 km", so it is within 10 km.
		expect((await nearby.search(viewerOf(viewer), filter({ q: tag, radius: 10 }))).rows.map((r) => r.id)).toEqual([made.near, made.middle]);
		expect(within50.rows.map((r) => r.distance?.text)).toEqual([near, middle, inside, outside].map((s) => labelOf(shownFigure(s.d, 'km'), 'km').text));
		expect(within50.rows.map((r) => r.distance?.text)).toEqual(['about 3 km', 'about 10 km', 'about 25 km', 'about 30 km']);

		// The SQL distance is the haversine figure to well under a millimetre.
		for (const [name, spot] of Object.entries({ inside, outside })) {
			const [row] = await db
				.select({ d: nearby.distanceSql(centre) })
				.from(listingTable)
				.where(eq(listingTable.id, made[name]!));
			expect(Math.abs(Number(row!.d) - spot.d)).toBeLessThan(1e-4);
		}

		// The JSON API answers the same, with labels but no coordinates.
		const response = await request(`/api/swaps/listings?q=${tag}&radius=25`, { cookie: viewer.cookie, accept: 'application/json' });
		expect(response.status).toBe(200);
		const text = await response.text();
		const body = JSON.parse(text) as { rows: { id: number; distance: { text: string } }[]; total: number };
		expect(body.rows.map((r) => r.id)).toEqual([made.near, made.middle, made.inside]);
		expect(text).not.toMatch(/"lat"|"lng"|-41\.3|-22\.6/);
		// And so does the page rendered without JavaScript.
		const page = await (await request(`/swaps?q=${tag}&radius=25`, { cookie: viewer.cookie })).text();
		expect(page).toContain(`${tag} inside`);
		expect(page).not.toContain(`${tag} outside`);
	});

	test.each<DistanceUnit>(['km', 'mi'])('the SQL figure is the pure one, at every band edge and its neighbouring doubles (%s)', async (unit) => {
		const next = (x: number, delta: bigint) => new Float64Array(new BigInt64Array([new BigInt64Array(new Float64Array([x]).buffer)[0]! + delta]).buffer)[0]!;
		const bands = bandsInMetres(unit);
		const edges = bands.flatMap((b) => (Number.isFinite(b.belowMetres) ? [b.belowMetres] : []));
		// Where a figure changes within a band: halfway between two of its figures.
		const halves = bands.flatMap(({ belowMetres, stepMetres, halfStepMetres }, i) => {
			if (stepMetres === 0) return [];
			const first = Math.ceil((bands[i - 1]!.belowMetres - halfStepMetres) / stepMetres);
			return Array.from({ length: 12 }, (_, k) => (first + k) * stepMetres + halfStepMetres).filter((m) => m < belowMetres);
		});
		expect(halves.slice(0, 3)).toEqual(unit === 'km' ? [1_500, 2_500, 3_500] : [1.5 * 1609.344, 2.5 * 1609.344, 3.5 * 1609.344].map(asLiteral));
		let seed = 5;
		const random = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
		const values = [...edges, ...halves].flatMap((m) => [next(m, -1n), m, next(m, 1n)]).concat(Array.from({ length: 60 }, () => random() ** 3 * 2e7));
		for (let i = 0; i < values.length; i += 100) {
			const chunk = values.slice(i, i + 100);
			// A DOUBLE literal (exponent notation), as the haversine expression gives a DOUBLE.
			const columns = chunk.map((v, k) => sql`${nearby.shownSql(sql.raw(`${v.toExponential(17)}`), unit)} AS ${sql.raw(`s${k}`)}`);
			const [rows] = (await db.execute(sql`SELECT ${sql.join(columns, sql`, `)}`)) as unknown as [Record<string, number | string>[]];
			expect(chunk.map((_, k) => Number(rows[0]![`s${k}`]))).toEqual(chunk.map((m) => shownFigure(m, unit)));
		}
	});

	test('across the antimeridian, and without a location the board is newest first with no distances', async () => {
		const west = { lat: -44.12, lng: 179.98 };
		const east = { lat: -44.12, lng: -179.98 };
		const viewer = await memberAt(west, 'dateline-viewer');
		const owner = await memberAt(east, 'dateline-owner');
		const tag = token('dateline');
		const id = await createListing(owner, { title: `${tag} across` });
		// 0.04° of longitude at 44° S: about 3.2 km, straight across ±180°.
		expect(haversineDistance(west, east)).toBeLessThan(5_000);
		expect((await nearby.search(viewerOf(viewer), filter({ q: tag, radius: 5 }))).rows.map((r) => r.id)).toEqual([id]);
		expect((await nearby.search(viewerOf(viewer), filter({ q: tag, radius: 2 }))).rows).toEqual([]);

		const nowhere = await memberAt(null, 'no-location');
		const second = await createListing(owner, { title: `${tag} later` });
		const newest = await nearby.search(viewerOf(nowhere), filter({ q: tag, radius: 2 }));
		expect(newest.order).toBe('newest');
		expect(newest.rows.map((r) => r.id)).toEqual([second, id]);
		expect(newest.rows[0]!.distance).toBeNull();
		const page = await (await request('/swaps', { cookie: nowhere.cookie })).text();
		expect(page).toContain('data-testid="location-prompt"');
	});
});

describe('swap conversations: who may read them', () => {
	test('only the two members; a third member, a judge, an admin without a report and anonymous visitors get 404, pages and API alike', async () => {
		const owner = await memberAt({ lat: -38.51, lng: -15.22 }, 'thread-owner');
		const asker = await memberAt({ lat: -38.52, lng: -15.23 }, 'thread-asker');
		const third = await makePerson({ label: 'thread-third' });
		const admin = await makePerson({ role: 'admin', label: 'thread-admin' });
		const judge = await makePerson({ role: 'judge', label: 'thread-judge' });
		const id = await createListing(owner, { title: 'Private talk stems' });

		const asked = await request(`/swaps/${id}?/request`, { cookie: asker.cookie, form: { body: 'Secret pickup details: ring twice' } });
		expect(asked.status).toBe(303);
		const threadPath = asked.headers.get('location')!;
		expect(threadPath).toMatch(/^\/swaps\/threads\/\d+$/);
		const threadId = Number(threadPath.split('/').pop());

		for (const [who, person] of [
			['owner', owner],
			['asker', asker]
		] as const) {
			const page = await request(threadPath, { cookie: person.cookie });
			expect(page.status, who).toBe(200);
			expect(await page.text()).toContain('Secret pickup details');
			expect((await request(`/api/swaps/threads/${threadId}/messages`, { cookie: person.cookie, accept: 'application/json' })).status, who).toBe(200);
		}
		for (const [who, person] of [
			['third member', third],
			['judge', judge],
			['admin', admin],
			['anonymous', null]
		] as const) {
			const page = await request(threadPath, { cookie: person?.cookie });
			expect(page.status, `${who} page`).toBe(404);
			expect(await page.text()).not.toContain('Secret pickup details');
			const api = await request(`/api/swaps/threads/${threadId}/messages`, { cookie: person?.cookie, accept: 'application/json' });
			expect(api.status, `${who} API`).toBe(404);
			expect(JSON.stringify(await api.json())).not.toContain('Secret');
			const post = await request(`${threadPath}?/send`, { cookie: person?.cookie, form: { body: 'sneaking in' } });
			expect(post.status, `${who} posting`).toBe(404);
		}
		expect(await threads.get(viewerOf(third), threadId)).toBeNull();
		expect(await threads.get(null, threadId)).toBeNull();

		// An admin may read it while a report about one of its messages is open, and not after.
		const [first] = await db.select().from(swapMessages).where(eq(swapMessages.threadId, threadId));
		const reportId = await reports.reportMessage(viewerOf(owner), first!.id, 'This message asks me to ring at a house.');
		const adminView = await request(threadPath, { cookie: admin.cookie });
		expect(adminView.status).toBe(200);
		expect(await adminView.text()).toContain('Secret pickup details');
		expect((await request(`/api/swaps/threads/${threadId}/messages`, { cookie: admin.cookie, accept: 'application/json' })).status).toBe(200);
		expect((await request(`${threadPath}?/send`, { cookie: admin.cookie, form: { body: 'admins do not write' } })).status).toBe(404);
		expect((await request(threadPath, { cookie: third.cookie })).status).toBe(404);
		const reportsPage = await (await request('/admin/reports', { cookie: admin.cookie })).text();
		expect(reportsPage).toContain('This message asks me to ring at a house.');
		await reports.decide(viewerOf(admin), reportId, { kind: 'dismiss', note: 'ok' });
		expect((await request(threadPath, { cookie: admin.cookie })).status).toBe(404);
	});
});

describe('swap restricted species', () => {
	test('a banned species is refused with the reason, picked from the catalogue or typed', async () => {
		const owner = await memberAt({ lat: -36.2, lng: -12.4 }, 'banned-owner');
		const banned = await restrictedPlant('banned');
		const form = {
			kind: 'offer',
			category: 'plants',
			title: 'Weed cuttings',
			speciesId: String(banned.speciesId),
			speciesName: banned.name,
			amount: '5',
			unit: 'stems',
			terms: 'free',
			termsNote: '',
			pickupAreaId: '',
			availableUntil: new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10),
			condition: '',
			description: '',
			tankId: ''
		};
		const response = await request('/swaps/new', { cookie: owner.cookie, form });
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain(`cannot be offered or asked for on the board: it is banned in ${banned.jurisdiction} (Test land weed order). Keep it out of ponds.`);
		expect(html).toContain('Weed cuttings');

		const typed = await request('/swaps/new', { cookie: owner.cookie, form: { ...form, speciesId: '', speciesName: banned.name.toUpperCase() } });
		expect(typed.status).toBe(400);
		await expect(createListing(owner, { speciesName: banned.name, kind: 'wanted' })).rejects.toMatchObject({ code: 'banned', status: 400 });
		const [count] = await db
			.select({ n: sql<number>`COUNT(*)` })
			.from(listingTable)
			.where(eq(listingTable.ownerId, owner.id));
		expect(Number(count!.n)).toBe(0);
	});

	test('a cautioned species is allowed and carries the warning on the listing and, for both members, in the conversation', async () => {
		const owner = await memberAt({ lat: -36.3, lng: -12.5 }, 'caution-owner');
		const asker = await memberAt({ lat: -36.31, lng: -12.5 }, 'caution-asker');
		const cautioned = await restrictedPlant('cautioned');
		const id = await createListing(owner, { title: 'Cautioned cuttings', speciesId: cautioned.speciesId });
		const warning = `is restricted in ${cautioned.jurisdiction} (Test land weed order). Keep it out of ponds.`;
		const page = await (await request(`/swaps/${id}`, { cookie: asker.cookie })).text();
		expect(page).toContain('data-testid="restriction-caution"');
		expect(page).toContain(warning);
		const threadId = await threads.request(viewerOf(asker), id, 'May I have some?');
		for (const person of [owner, asker]) {
			const thread = await (await request(`/swaps/threads/${threadId}`, { cookie: person.cookie })).text();
			expect(thread).toContain(warning);
		}
		const card = (await nearby.search(viewerOf(asker), filter({ q: 'Cautioned cuttings', radius: 2 }))).rows.find((r) => r.id === id);
		expect(card?.restriction).toBe('cautioned');
	});
});

describe('swap blocks', () => {
	test('a blocked member can send neither a request nor a message, and the blocker no longer sees their listings', async () => {
		const owner = await memberAt({ lat: -34.1, lng: -9.8 }, 'block-owner');
		const pest = await memberAt({ lat: -34.11, lng: -9.8 }, 'block-pest');
		const first = await createListing(owner, { title: 'Block test one' });
		const second = await createListing(owner, { title: 'Block test two' });
		const pestListing = await createListing(pest, { title: `${token('pest')} pest listing` });
		const threadId = await threads.request(viewerOf(pest), first, 'Hello there');

		const blocked = await request(`/members/${pest.id}?/block`, { cookie: owner.cookie, form: {} });
		expect(blocked.status).toBe(303);

		const message = await request(`/swaps/threads/${threadId}?/send`, { cookie: pest.cookie, form: { body: 'Why no answer?' } });
		expect(message.status).toBe(403);
		expect(await message.text()).toContain('This member is not taking requests or messages from you.');
		const ask = await request(`/swaps/${second}?/request`, { cookie: pest.cookie, form: { body: 'And this one?' } });
		expect(ask.status).toBe(403);
		await expect(threads.post(viewerOf(pest), threadId, 'again')).rejects.toBeInstanceOf(DomainError);
		await expect(threads.request(viewerOf(pest), second, 'again')).rejects.toMatchObject({ status: 403, code: 'blocked' });
		// Writing is closed both ways, and the blocker cannot accept them either.
		await expect(threads.post(viewerOf(owner), threadId, 'hello?')).rejects.toMatchObject({ code: 'you-blocked' });
		await expect(transitions.accept(viewerOf(owner), threadId)).rejects.toMatchObject({ status: 403 });
		const messages = await db.select().from(swapMessages).where(eq(swapMessages.threadId, threadId));
		expect(messages).toHaveLength(1);

		const ownerBoard = await nearby.search(viewerOf(owner), filter({ q: 'pest listing', radius: 5 }));
		expect(ownerBoard.rows.map((r) => r.id)).not.toContain(pestListing);
		const otherBoard = await nearby.search(viewerOf(await memberAt({ lat: -34.1, lng: -9.81 }, 'block-other')), filter({ q: 'pest listing', radius: 5 }));
		expect(otherBoard.rows.map((r) => r.id)).toContain(pestListing);

		await blocks.unblock(viewerOf(owner), pest.id);
		expect(await threads.post(viewerOf(pest), threadId, 'Sorry for the noise')).toBeGreaterThan(0);
	});
});

describe('swap requests: accepting one', () => {
	test('reserves the listing, tells the chosen member and, politely through the outbox, every other one', async () => {
		const owner = await memberAt({ lat: -32.4, lng: -7.7 }, 'accept-owner');
		const chosen = await memberAt({ lat: -32.41, lng: -7.7 }, 'accept-chosen');
		const others = [await memberAt({ lat: -32.42, lng: -7.7 }, 'accept-other'), await memberAt({ lat: -32.43, lng: -7.7 }, 'accept-other')];
		const id = await createListing(owner, { title: 'Popular stems' });
		const chosenThread = await threads.request(viewerOf(chosen), id, 'Me please');
		const otherThreads = [];
		for (const o of others) otherThreads.push(await threads.request(viewerOf(o), id, 'Me too'));

		const accepted = await request(`/swaps/threads/${chosenThread}?/accept`, { cookie: owner.cookie, form: {} });
		expect(accepted.status).toBe(303);
		const [row] = await db.select().from(listingTable).where(eq(listingTable.id, id));
		expect(row).toMatchObject({ state: 'reserved', reservedRequesterId: chosen.id, reservedThreadId: chosenThread });

		const yes = await waitForMail(chosen.email, { subject: /was accepted/ });
		expect(yes.text).toContain('accepted your request for “Popular stems”');
		for (const [i, o] of others.entries()) {
			const mail = await waitForMail(o.email, { subject: /About your request for “Popular stems”/ });
			expect(mail.text).toContain('Thank you for asking');
			expect(mail.text).toContain('has accepted another request this time');
			const queued = await db
				.select()
				.from(outbox)
				.where(and(eq(outbox.toAddress, o.email), eq(outbox.topic, `swap-listing:${id}`)));
			expect(queued).toHaveLength(1);
			// Their conversation is closed now.
			const view = await threads.get(viewerOf(o), otherThreads[i]!);
			expect(view).toMatchObject({ status: 'not-chosen', canWrite: false });
			expect((await request(`/swaps/threads/${otherThreads[i]}?/send`, { cookie: o.cookie, form: { body: 'still there?' } })).status).toBe(409);
		}
		// A second acceptance is refused by the state machine.
		await expect(transitions.accept(viewerOf(owner), otherThreads[0]!)).rejects.toMatchObject({ status: 409, code: 'already-reserved' });
	});
});

describe('swap message mail', () => {
	test('"each": two messages in quick succession give one mail; what is still unread goes an hour later; read messages are not mailed', async () => {
		const owner = await memberAt({ lat: -30.2, lng: -5.5 }, 'mail-owner', 'each');
		const asker = await memberAt({ lat: -30.21, lng: -5.5 }, 'mail-asker', 'hourly');
		const id = await createListing(owner, { title: 'Batched stems' });
		const threadId = await threads.request(viewerOf(asker), id, 'First message');
		await threads.post(viewerOf(asker), threadId, 'Second message, right after');

		const mail = await waitForMail(owner.email, { subject: /New message about “Batched stems”/ });
		expect(mail.text).toContain('First message');
		// Give the outbox worker time to deliver anything else that was queued.
		await sleep(5_000);
		expect(await mailsTo(owner.email)).toHaveLength(1);
		const queued = await db.select().from(outbox).where(eq(outbox.toAddress, owner.email));
		expect(queued).toHaveLength(1);

		// The periodic job an hour later mails the one still unread.
		const later = new Date(Date.now() + 61 * 60_000);
		expect(await notifications.sendDue({ now: later })).toBeGreaterThanOrEqual(1);
		const [second] = await mailsOnceThere(owner.email, 2);
		expect(second!.subject).toBe('New message about “Batched stems”');
		expect(second!.text).toContain('Second message, right after');
		expect(second!.text).not.toContain('First message');

		// Read on the site before its hour is up: no mail at all.
		await threads.post(viewerOf(asker), threadId, 'Third message');
		expect((await request(`/api/swaps/threads/${threadId}/messages`, { cookie: owner.cookie, accept: 'application/json' })).status).toBe(200);
		await notifications.sendDue({ now: new Date(Date.now() + 125 * 60_000) });
		await sleep(3_000);
		expect(await mailsTo(owner.email)).toHaveLength(2);
		expect(await threads.unreadCount(owner.id)).toBe(0);
	});

	test('"hourly": one summary for several messages, then nothing more within the hour; "off": never', async () => {
		const owner = await memberAt({ lat: -30.3, lng: -5.6 }, 'summary-owner', 'hourly');
		const quiet = await memberAt({ lat: -30.31, lng: -5.6 }, 'quiet-owner', 'off');
		const asker = await memberAt({ lat: -30.32, lng: -5.6 }, 'summary-asker');
		// As if a summary went half an hour ago: the app's own job (on real time) stays out of the
		// way, and this test's runs decide when the next one goes.
		const now = new Date();
		await db.insert(swapMailState).values({ userId: owner.id, summaryMailedAt: new Date(now.getTime() - 30 * 60_000) });
		const a = await createListing(owner, { title: 'Summary one' });
		const b = await createListing(owner, { title: 'Summary two' });
		const c = await createListing(quiet, { title: 'Never mailed' });
		await threads.request(viewerOf(asker), a, 'One');
		await threads.request(viewerOf(asker), b, 'Two');
		await threads.request(viewerOf(asker), b, 'Three');
		await threads.request(viewerOf(asker), c, 'Four');

		const queuedFor = async (address: string) => (await db.select().from(outbox).where(eq(outbox.toAddress, address))).length;
		await notifications.sendDue({ now: new Date(now.getTime() + 20 * 60_000) });
		expect(await queuedFor(owner.email)).toBe(0);
		await notifications.sendDue({ now: new Date(now.getTime() + 31 * 60_000) });
		expect(await queuedFor(owner.email)).toBe(1);
		await notifications.sendDue({ now: new Date(now.getTime() + 41 * 60_000) });
		expect(await queuedFor(owner.email)).toBe(1);
		const summary = await waitForMail(owner.email, { subject: /3 new swap messages/ });
		expect(summary.text).toContain('“Summary one”: 1 from');
		expect(summary.text).toContain('“Summary two”: 2 from');
		await sleep(4_000);
		expect(await mailsTo(owner.email)).toHaveLength(1);
		expect(await mailsTo(quiet.email)).toHaveLength(0);
		const pending = await db.select().from(outbox).where(like(outbox.toAddress, quiet.email));
		expect(pending).toHaveLength(0);
	});
});

describe('swap reservations past their date', () => {
	test('the owner is asked to settle one, on the listing and on My swaps; the other member and everyone else are not', async () => {
		const owner = await memberAt({ lat: -28.4, lng: -3.3 }, 'overdue-owner');
		const asker = await memberAt({ lat: -28.41, lng: -3.3 }, 'overdue-asker');
		const other = await memberAt({ lat: -28.42, lng: -3.3 }, 'overdue-other');
		const day = (n: number) => new Date(Date.now() + n * DAY_MS);
		// Posted ten days ago until two days later; the request was accepted the day after posting.
		const id = await createListing(owner, { title: 'Overdue stems', availableUntil: day(-8) }, { now: day(-10) });
		const threadId = await threads.request(viewerOf(asker), id, 'Me please', { now: day(-9.5) });
		await transitions.accept(viewerOf(owner), threadId, { now: day(-9) });
		const fresh = await createListing(owner, { title: 'Fresh stems' });

		const own = await cards.listOwn(viewerOf(owner));
		expect(own.find((l) => l.id === id)).toMatchObject({ state: 'reserved', overdue: true });
		expect(own.find((l) => l.id === fresh)).toMatchObject({ state: 'open', overdue: false });
		const mine = await (await request('/swaps/mine', { cookie: owner.cookie })).text();
		expect(mine.match(/data-testid="reservation-overdue"/g)).toHaveLength(1);
		expect(await (await request(`/swaps/${id}`, { cookie: owner.cookie })).text()).toContain('data-testid="reservation-overdue"');
		for (const person of [asker, other]) expect(await (await request(`/swaps/${id}`, { cookie: person.cookie })).text()).not.toContain('reservation-overdue');
		expect(await (await request(`/swaps/${fresh}`, { cookie: owner.cookie })).text()).not.toContain('reservation-overdue');
	});
});

describe('swap moderation and the restricted list: admins only, and audited', () => {
	test('withdrawing a reported listing records the admin, the reason and the reports it closed', async () => {
		const owner = await memberAt({ lat: -26.2, lng: -1.1 }, 'moderated-owner');
		const reporter = await memberAt({ lat: -26.21, lng: -1.1 }, 'moderated-reporter');
		const admin = await makePerson({ role: 'admin', label: 'moderating-admin' });
		const id = await createListing(owner, { title: 'Doubtful regulator' });
		const reportId = await reports.reportListing(viewerOf(reporter), id, 'It says it leaks gas.');
		expect(await reports.openCount(viewerOf(admin))).toBeGreaterThanOrEqual(1);
		await expect(reports.openCount(viewerOf(reporter))).rejects.toMatchObject({ status: 404 });
		await expect(moderation.withdraw(viewerOf(reporter), id, 'I do not like it')).rejects.toMatchObject({ status: 403 });

		const page = await (await request('/admin/reports', { cookie: admin.cookie })).text();
		expect(page).toContain('data-testid="open-report-count"');
		const tooShort = await request('/admin/reports?/decide', {
			cookie: admin.cookie,
			form: { decision: 'withdraw', reportId: String(reportId), reason: 'no' }
		});
		expect(tooShort.status).toBe(400);
		expect(await tooShort.text()).toContain('Give the owner a reason (at least a few words).');
		const done = await request('/admin/reports?/decide', {
			cookie: admin.cookie,
			form: { decision: 'withdraw', reportId: String(reportId), reason: 'A leaking gas part is not for the board.' }
		});
		expect(done.status).toBe(200);

		const [withdrawn] = await db.select().from(listingTable).where(eq(listingTable.id, id));
		expect(withdrawn!.state).toBe('withdrawn');
		expect(await audit.trail({ type: 'listing', id })).toMatchObject([
			{ action: 'listing.withdraw', actorId: admin.id, detail: { reason: 'A leaking gas part is not for the board.', from: 'open' } }
		]);
		expect(await audit.trail({ type: 'swap_report', id: reportId })).toMatchObject([{ action: 'report.withdraw-listing', actorId: admin.id }]);
		await waitForMail(owner.email, { subject: /withdrawn by the club's admins/ });
	});

	test('restricted species entries: a member may not change them; an admin’s add, change and removal are audited', async () => {
		const member = await makePerson({ label: 'restricted-member' });
		const admin = await makePerson({ role: 'admin', label: 'restricted-admin' });
		const plant = await restrictedPlant('cautioned');
		const input = {
			speciesId: plant.speciesId,
			jurisdiction: `Other land ${token('j')}`,
			level: 'banned' as const,
			source: 'Other land weed order',
			note: '',
			checkedOn: '2026-11-30',
			checkBasis: 'source' as const
		};
		await expect(restricted.add(viewerOf(member), input)).rejects.toMatchObject({ status: 403 });
		await expect(restricted.setClubJurisdictions(viewerOf(member), [])).rejects.toMatchObject({ status: 403 });
		const entryId = await restricted.add(viewerOf(admin), input);
		expect((await restricted.list()).find((e) => e.id === entryId)).toMatchObject({ scientificName: plant.name, level: 'banned' });
		await expect(restricted.add(viewerOf(admin), input)).rejects.toMatchObject({ status: 409, code: 'duplicate', fields: { speciesName: expect.any(String) } });

		// The page's form for one entry: a check in the future is refused next to that entry.
		const future = await request('/admin/restricted?/update', {
			cookie: admin.cookie,
			form: { id: String(entryId), level: 'cautioned', source: 'Other land weed order', note: '', checkedOn: '2999-01-01', checkBasis: 'source' }
		});
		expect(future.status).toBe(400);
		expect(await future.text()).toContain('A check cannot be in the future.');
		await restricted.update(viewerOf(admin), entryId, {
			level: 'cautioned',
			source: input.source,
			note: 'Watch it.',
			checkedOn: '2026-12-01',
			checkBasis: 'memory'
		});
		await restricted.remove(viewerOf(admin), entryId);
		expect((await audit.trail({ type: 'restricted_species', id: entryId })).map((e) => [e.action, e.actorId])).toEqual([
			['restricted.add', admin.id],
			['restricted.update', admin.id],
			['restricted.remove', admin.id]
		]);
	});
});

test('the dashboard counts conversations on my listings with messages I have not read', async () => {
	const owner = await memberAt({ lat: -30.4, lng: -5.7 }, 'news-owner', 'off');
	const askers = [await memberAt({ lat: -30.41, lng: -5.7 }, 'news-asker', 'off'), await memberAt({ lat: -30.42, lng: -5.7 }, 'news-asker', 'off')];
	const id = await createListing(owner, { title: 'Counted stems' });
	const first = await threads.request(viewerOf(askers[0]!), id, 'May I have some?');
	await threads.post(viewerOf(askers[0]!), first, 'Any day suits me.');
	await threads.request(viewerOf(askers[1]!), id, 'Me too, please.');
	// Two conversations, three messages: counted per conversation; my own requests elsewhere do not count.
	expect(await threads.unreadOnOwnListings(owner.id)).toBe(2);
	expect(await threads.unreadOnOwnListings(askers[0]!.id)).toBe(0);
	const home = await (await request('/', { cookie: owner.cookie })).text();
	expect(home).toContain('data-testid="swap-news"');
	await threads.markRead({ id: owner.id }, first);
	expect(await threads.unreadOnOwnListings(owner.id)).toBe(1);
});

describe('a long conversation', () => {
	test('opens at its newest fifty messages, with the earlier ones a link away', async () => {
		const owner = await memberAt({ lat: 51.5, lng: -0.1 }, 'long-owner', 'off');
		const asker = await memberAt({ lat: 51.51, lng: -0.1 }, 'long-asker', 'off');
		const listingId = await createListing(owner, { title: 'Long talk listing' });
		const threadId = await threads.request(viewerOf(asker), listingId, 'Message 1');
		for (let i = 2; i <= 55; i++) await threads.post(viewerOf(i % 2 ? asker : owner), threadId, `Message ${i}`);
		const count = (html: string) => html.split('data-testid="message"').length - 1;

		const page = await (await request(`/swaps/threads/${threadId}`, { cookie: owner.cookie })).text();
		expect(count(page)).toBe(50);
		expect(page).toContain('Show the 5 earlier messages');
		expect(page).toContain('Message 55');
		expect(page).not.toContain('>Message 5<');

		const all = await (await request(`/swaps/threads/${threadId}?all=1`, { cookie: owner.cookie })).text();
		expect(count(all)).toBe(55);
		expect(all).not.toContain('earlier messages');
	});
});
