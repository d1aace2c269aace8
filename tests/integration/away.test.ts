// Away care through the running app and the domain: who may read a care plan and when, the answer
// to a request, and a visit that lands on the tank's timeline and counts as upkeep done.
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { and, like } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { outbox } from '../../src/lib/server/mail/schema';
import { awayReminders, awaySitters } from '../../src/lib/server/away/schema';
import * as notices from '../../src/lib/server/away/notices';
import * as summary from '../../src/lib/server/away/summary';
import * as water from '../../src/lib/server/journals/water';
import { config } from '../../src/lib/server/config';
import * as plans from '../../src/lib/server/away/plans';
import * as sitters from '../../src/lib/server/away/sitters';
import * as visits from '../../src/lib/server/away/visits';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import { dayNumber, isoDay } from '../../src/lib/journals/calc';
import { today } from '../../src/lib/dates';
import type { Viewer } from '../../src/lib/server/club/users';
import { request } from '../helpers/http';
import { mailsTo, waitForMail } from '../helpers/mail';
import { uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';

const viewerOf = (p: TestPerson): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units: 'metric' });
const day = (offset: number) => isoDay(dayNumber(today()) + offset);
const inDays = (offset: number) => new Date(Date.now() + offset * 86_400_000);

let keeper: TestPerson;
let sitter: TestPerson;
let other: TestPerson;
let admin: TestPerson;
let tankId: number;
let planId: number;
let sitterRow: number;

const planInput = (startsOn: string, endsOn: string) => ({
	startsOn,
	endsOn,
	feeding: 'none' as const,
	lighting: 'shorten' as const,
	keeperPhone: '01632 960001',
	evaporationLitresPerDay: null
});

beforeAll(async () => {
	keeper = await makePerson({ label: 'away-keeper' });
	sitter = await makePerson({ label: 'away-sitter' });
	other = await makePerson({ label: 'away-other' });
	admin = await makePerson({ role: 'admin', label: 'away-admin' });
	tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Away test tank', visibility: 'private', setUpOn: day(-90) }));
	await upkeep.saveSchedule(viewerOf(keeper), tankId, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
	// Two top-ups logged: 1.2 L over the 4 days after the first, 0.3 L a day.
	for (const [offset, litres] of [
		[-10, 1.0],
		[-6, 1.2]
	] as const)
		await entries.create(viewerOf(keeper), tankId, { entryOn: day(offset), title: '', body: '', events: [topUp(litres)] }, []);
	planId = await plans.start(viewerOf(keeper), tankId, planInput(day(0), day(7)));
	await sitters.ask(viewerOf(keeper), planId, sitter.id);
	const [row] = await db.select().from(awaySitters).where(eq(awaySitters.planId, planId));
	sitterRow = row!.id;
});

function topUp(litres: number) {
	return {
		kind: 'top-up' as const,
		percent: null,
		filterPart: null,
		what: '',
		amount: litres,
		amountUnit: null,
		saltId: null,
		speciesId: null,
		speciesName: '',
		count: null,
		algaeKind: null,
		note: '',
		rowId: null
	};
}

describe('away care: the drafted plan', () => {
	test('reads the tank’s own schedule and logged top-ups', async () => {
		const { plan } = await plans.readable(viewerOf(keeper), planId);
		expect(plan.body).toContain('Water change');
		// 0.3 L a day for 7 days: 2.1 L, rounded up to the half litre.
		expect(plan.body).toContain('About 2.5 L over the whole period');
		expect(plan.body).toContain('01632 960001');
		expect(await plans.loggedEvaporation(viewerOf(keeper), tankId)).toBeCloseTo(0.3, 10);
	});
	test('a period overlapping another of the same tank, or in the past, is refused', async () => {
		await expect(plans.start(viewerOf(keeper), tankId, planInput(day(3), day(9)))).rejects.toMatchObject({ status: 409, code: 'overlap' });
		await expect(plans.start(viewerOf(keeper), tankId, planInput(day(-9), day(-2)))).rejects.toMatchObject({ status: 400 });
		await expect(plans.start(viewerOf(other), tankId, planInput(day(20), day(22)))).rejects.toMatchObject({ status: 404 });
	});
});

describe('away care: who may read a plan, and when', () => {
	test('before saying yes, the member asked gets 404 like anyone else; the keeper reads it', async () => {
		expect((await request(`/away/${planId}`, { cookie: keeper.cookie })).status).toBe(200);
		for (const person of [sitter, other, admin]) {
			expect((await request(`/away/${planId}`, { cookie: person.cookie })).status).toBe(404);
			expect((await request(`/away/${planId}/print`, { cookie: person.cookie })).status).toBe(404);
		}
		expect((await request(`/away/${planId}`)).status).toBe(303);
	});
	test('the request is mailed; saying yes opens the plan to the sitter, not to others', async () => {
		const ask = await waitForMail(sitter.email, { subject: /Could you look in/ });
		expect(ask.text).toContain('/away');
		expect(await sitters.answer(viewerOf(sitter), sitterRow, true)).toBe(planId);
		expect((await request(`/away/${planId}`, { cookie: sitter.cookie })).status).toBe(200);
		expect((await request(`/away/${planId}/print`, { cookie: sitter.cookie })).status).toBe(200);
		expect((await request(`/away/${planId}`, { cookie: other.cookie })).status).toBe(404);
		await waitForMail(keeper.email, { subject: /will look in/ });
		// Answering twice is refused; another member cannot answer it.
		await expect(sitters.answer(viewerOf(sitter), sitterRow, false)).rejects.toMatchObject({ status: 409 });
		await expect(sitters.answer(viewerOf(other), sitterRow, true)).rejects.toMatchObject({ status: 404 });
	});
	test('the sitter’s access ends the day the keeper is back', async () => {
		await expect(plans.readable(viewerOf(sitter), planId, { now: inDays(6) })).resolves.toMatchObject({ role: 'sitter' });
		await expect(plans.readable(viewerOf(sitter), planId, { now: inDays(7) })).rejects.toMatchObject({ status: 404 });
		await expect(plans.readable(viewerOf(keeper), planId, { now: inDays(30) })).resolves.toMatchObject({ role: 'keeper' });
	});
	test('a declined or taken-back request gives no access', async () => {
		const declining = await makePerson({ label: 'away-declines' });
		const taken = await makePerson({ label: 'away-taken-back' });
		await sitters.ask(viewerOf(keeper), planId, declining.id);
		await sitters.ask(viewerOf(keeper), planId, taken.id);
		const rows = await db.select().from(awaySitters).where(eq(awaySitters.planId, planId));
		const rowOf = (p: TestPerson) => rows.find((r) => r.sitterId === p.id)!.id;
		await sitters.answer(viewerOf(declining), rowOf(declining), false);
		await sitters.withdraw(viewerOf(keeper), planId, rowOf(taken));
		await expect(sitters.answer(viewerOf(taken), rowOf(taken), true)).rejects.toMatchObject({ status: 409 });
		for (const person of [declining, taken]) expect((await request(`/away/${planId}`, { cookie: person.cookie })).status).toBe(404);
	});
	test('a private link shows the plan without an account until it is ended; a wrong one is 404', async () => {
		const path = await plans.makeShareLink(viewerOf(keeper), planId);
		const shown = await request(path);
		expect(shown.status).toBe(200);
		expect(await shown.text()).toContain('Away test tank');
		expect((await request(`${path.slice(0, -2)}xx`)).status).toBe(404);
		await expect(plans.byShareToken(path.split('/').pop()!, { now: inDays(7) })).rejects.toMatchObject({ status: 404 });
		await plans.endShareLink(viewerOf(keeper), planId);
		expect((await request(path)).status).toBe(404);
		await expect(plans.makeShareLink(viewerOf(sitter), planId)).rejects.toMatchObject({ status: 404 });
	});
	test('only the keeper changes the plan or asks others', async () => {
		await expect(plans.saveBody(viewerOf(sitter), planId, 'Mine now')).rejects.toMatchObject({ status: 404 });
		await expect(sitters.ask(viewerOf(sitter), planId, other.id)).rejects.toMatchObject({ status: 404 });
		await plans.saveBody(viewerOf(keeper), planId, '- [ ] Look at the heater\n- [ ] Count the fish');
		expect((await plans.readable(viewerOf(sitter), planId)).plan.body).toContain('Count the fish');
	});
});

describe('away care: a visit', () => {
	test('lands on the tank’s timeline as the sitter’s entry with its photo, marks the ticked upkeep done, and mails the keeper', async () => {
		const [task] = await upkeep.listForTank(tankId);
		const photo = await uploadFile(
			sitter,
			await sharp({ create: { width: 400, height: 300, channels: 3, background: '#3a6f4f' } })
				.jpeg()
				.toBuffer()
		);
		expect(photo.status).toBe(201);
		const photoId = (await photo.json()).id as number;
		await visits.log(viewerOf(sitter), planId, { done: ['Look at the heater'], taskIds: [task!.id], note: 'All well, water clear.' }, [
			{ id: photoId, alt: 'The tank today', caption: '' }
		]);

		const shown = await plans.get(viewerOf(keeper), planId);
		expect(shown.visits).toHaveLength(1);
		const entryId = shown.visits[0]!.entryId!;
		const entry = (await entries.get(viewerOf(keeper), tankId, entryId))?.entry;
		expect(entry?.authorId).toBe(sitter.id);
		expect(entry?.title).toMatch(/away care/);
		expect(entry?.photos.map((p) => p.id)).toEqual([photoId]);
		const [after] = await upkeep.listForTank(tankId);
		expect(after!.lastDoneOn).toBe(today());
		// The sitter may see the photo they took, though the tank is private; another member may not.
		expect((await request(`/media/${photoId}/thumb`, { cookie: sitter.cookie })).status).toBe(200);
		expect((await request(`/media/${photoId}/thumb`, { cookie: other.cookie })).status).toBe(404);
		const mail = await waitForMail(keeper.email, { subject: /looked in on Away test tank/ });
		expect(mail.text).toContain('All well, water clear.');
	});
	test('is the sitter’s to log, and not before the period starts', async () => {
		await expect(visits.log(viewerOf(keeper), planId, { done: ['x'], taskIds: [], note: '' }, [])).rejects.toMatchObject({ status: 409 });
		await expect(visits.log(viewerOf(other), planId, { done: ['x'], taskIds: [], note: '' }, [])).rejects.toMatchObject({ status: 404 });
		await expect(visits.log(viewerOf(sitter), planId, { done: ['x'], taskIds: [], note: '' }, [], { now: inDays(-1) })).rejects.toMatchObject({ status: 409 });
		await expect(visits.log(viewerOf(sitter), planId, { done: [], taskIds: [], note: '' }, [])).rejects.toMatchObject({ status: 400 });
		expect((await mailsTo(other.email)).length).toBe(0);
	});
});

const noReadings = {
	ph: null,
	kh: null,
	gh: null,
	no3: null,
	po4: null,
	k: null,
	fe: null,
	ammonia: null,
	ammoniaBasis: 'NH3' as const,
	no2: null,
	temperatureC: null,
	tds: null,
	note: ''
};

/** A photo uploaded by `person`, pending until saved with something. */
async function photoBy(person: TestPerson, colour: string): Promise<number> {
	const upload = await uploadFile(
		person,
		await sharp({ create: { width: 400, height: 300, channels: 3, background: colour } })
			.jpeg()
			.toBuffer()
	);
	expect(upload.status).toBe(201);
	return ((await upload.json()) as { id: number }).id;
}

/** Mail queued for an address whose subject matches (what the outbox holds, delivered or not). */
const queued = async (address: string, subject: string) =>
	db
		.select({ subject: outbox.subject, text: outbox.textBody })
		.from(outbox)
		.where(and(eq(outbox.toAddress, address), like(outbox.subject, `%${subject}%`)));

describe('away care: mail while away, on each person’s own clock', () => {
	// A period a month ahead, so the app's own job (running on today's clock) leaves it alone; the
	// calls below pass their moment. Zones without summer time keep the hours fixed all year
	// (IANA tz database): America/Phoenix is UTC−7, Asia/Kolkata UTC+5:30.
	const D = (offset: number) => day(30 + offset);
	const at = (offset: number, utcTime: string) => new Date(`${D(offset)}T${utcTime}Z`);
	let far: TestPerson;
	let farSitter: TestPerson;
	let farTank: number;
	let farPlan: number;
	let farBefore: number;

	beforeAll(async () => {
		far = await makePerson({ label: 'away-far-keeper' });
		farSitter = await makePerson({ label: 'away-far-sitter' });
		await db.update(users).set({ timeZone: 'Asia/Kolkata' }).where(eq(users.id, far.id));
		await db.update(users).set({ timeZone: 'America/Phoenix' }).where(eq(users.id, farSitter.id));
		farTank = await tanks.create(viewerOf(far), tankInput({ name: 'Far tank', visibility: 'private', setUpOn: day(-200) }));
		// The last photo and water test before leaving, two days ahead of the period.
		farBefore = await photoBy(far, '#2f5d46');
		await entries.create(viewerOf(far), farTank, { entryOn: D(-1), title: 'Before the trip', body: '', events: [] }, [
			{ id: farBefore, alt: 'Trimmed before leaving', caption: '' }
		]);
		await water.create(viewerOf(far), farTank, { ...noReadings, testedOn: D(-2), ph: 6.8, no3: 10 });
		farPlan = await plans.start(viewerOf(far), farTank, { ...planInput(D(0), D(7)), visitMail: 'daily' });
		await sitters.ask(viewerOf(far), farPlan, farSitter.id);
		const [row] = await db.select().from(awaySitters).where(eq(awaySitters.planId, farPlan));
		await sitters.answer(viewerOf(farSitter), row!.id, true);
	});
	const remindersOf = () => db.select().from(awayReminders).where(eq(awayReminders.planId, farPlan));
	const sitterViewer = () => ({ ...viewerOf(farSitter), timeZone: 'America/Phoenix' });

	test('a visit day with nothing logged reminds the sitter once, from the evening in the sitter’s zone', async () => {
		// 19:00 UTC is noon in Phoenix: evening in UTC, not for the sitter.
		await notices.remindMissedVisits({ now: at(1, '19:00:00') });
		expect(await remindersOf()).toHaveLength(0);
		// 01:30 UTC the next day is 18:30 in Phoenix on day 1.
		await notices.remindMissedVisits({ now: at(2, '01:30:00') });
		await notices.remindMissedVisits({ now: at(2, '03:00:00') });
		expect((await remindersOf()).map((r) => [r.sitterId, r.day])).toEqual([[farSitter.id, D(1)]]);
		const mails = await queued(farSitter.email, 'No visit to Far tank');
		expect(mails).toHaveLength(1);
		expect(mails[0]!.text).toContain(`/away/${farPlan}`);
		expect(mails[0]!.text).toContain('unplug');
		// Nobody else is reminded: the keeper is not a sitter.
		expect(await queued(far.email, 'No visit')).toHaveLength(0);
	});

	test('a day with a visit is not missed; the visit is the sitter’s day and waits for the keeper’s daily mail', async () => {
		// 16:00 UTC is 09:00 in Phoenix on day 2 (and 21:30 in Kolkata).
		await visits.log(sitterViewer(), farPlan, { done: ['Look at the heater'], taskIds: [], note: 'Water level fine.' }, [], { now: at(2, '16:00:00') });
		const shown = await plans.get(viewerOf(far), farPlan);
		expect(shown.visits.map((v) => v.visitedOn)).toEqual([D(2)]);
		// 02:00 UTC on day 3 is 19:00 in Phoenix on day 2: evening of a day with a visit.
		await notices.remindMissedVisits({ now: at(3, '02:00:00') });
		expect((await remindersOf()).map((r) => r.day)).toEqual([D(1)]);
		expect(await queued(far.email, 'looked in on Far tank')).toHaveLength(0);
	});

	test('the daily mail goes once, from 20:00 in the keeper’s zone', async () => {
		// 14:00 UTC is 19:30 in Kolkata: not yet.
		await notices.sendVisitDigests({ now: at(3, '14:00:00') });
		expect(await queued(far.email, 'looked in on Far tank')).toHaveLength(0);
		await notices.sendVisitDigests({ now: at(3, '15:00:00') });
		await notices.sendVisitDigests({ now: at(3, '18:00:00') });
		const mails = await queued(far.email, 'looked in on Far tank');
		expect(mails).toHaveLength(1);
		expect(mails[0]!.text).toContain('Water level fine.');
		expect(mails[0]!.text).toContain(`${config().ORIGIN}/away/${farPlan}`);
	});
	test('coming back: the keeper is mailed the summary once, when their own day reaches the day back', async () => {
		// A visit with a photo on day 4, and the keeper's first test once back.
		const during = await photoBy(farSitter, '#7fb38f');
		await visits.log(sitterViewer(), farPlan, { done: [], taskIds: [], note: 'Plants pearling.' }, [{ id: during, alt: 'Day four', caption: '' }], {
			now: at(4, '16:00:00')
		});
		await water.create(viewerOf(far), farTank, { ...noReadings, testedOn: D(7), ph: 7.1, no3: 25 });
		// 18:00 UTC on day 6 is 23:30 in Kolkata; 18:45 is a quarter past midnight on the day back.
		await notices.sendSummaries({ now: at(6, '18:00:00') });
		expect(await queued(far.email, 'Welcome back')).toHaveLength(0);
		await notices.sendSummaries({ now: at(6, '18:45:00') });
		await notices.sendSummaries({ now: at(8, '09:00:00') });
		const mails = await queued(far.email, 'Welcome back');
		expect(mails).toHaveLength(1);
		expect(mails[0]!.text).toContain(`${config().ORIGIN}/away/${farPlan}/summary`);
		expect(mails[0]!.text).toContain('2 of the 7 days');
		expect(await queued(farSitter.email, 'Welcome back')).toHaveLength(0);

		const shown = await summary.get({ ...viewerOf(far), timeZone: 'Asia/Kolkata' }, farPlan, { now: at(8, '09:00:00') });
		expect(shown.over).toBe(true);
		expect(shown.days.map((d) => d.day)).toEqual([0, 1, 2, 3, 4, 5, 6].map(D));
		expect(shown.days.map((d) => d.visits.length)).toEqual([0, 0, 1, 0, 1, 0, 0]);
		expect(shown.days[2]!.visits[0]).toMatchObject({ sitterName: expect.any(String), done: ['Look at the heater'], note: 'Water level fine.' });
		expect(shown.days[4]!.visits[0]!.photos.map((p) => p.id)).toEqual([during]);
		expect(shown.readings.before).toMatchObject({ testedOn: D(-2), ph: 6.8, no3: 10 });
		expect(shown.readings.since).toMatchObject({ testedOn: D(7), ph: 7.1, no3: 25 });
		expect(shown.photos.then).toMatchObject({ id: farBefore, on: D(-1) });
		expect(shown.photos.now).toMatchObject({ id: during, on: D(4) });
	});

	test('coming back: only the keeper sees the summary, the sitter neither during nor after the period', async () => {
		const response = await request(`/away/${farPlan}/summary`, { cookie: far.cookie });
		expect(response.status).toBe(200);
		const html = await response.text();
		expect(html).toContain('Water level fine.');
		expect(html).toContain('Plants pearling.');
		for (const person of [farSitter, other, admin]) expect((await request(`/away/${farPlan}/summary`, { cookie: person.cookie })).status).toBe(404);
		expect((await request(`/away/${farPlan}/summary`)).status).toBe(303);
		for (const now of [at(3, '12:00:00'), at(9, '12:00:00')])
			await expect(summary.get(viewerOf(farSitter), farPlan, { now })).rejects.toMatchObject({ status: 404 });
	});
});
