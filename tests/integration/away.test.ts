// Away care through the running app and the domain: who may read a care plan and when, the answer
// to a request, and a visit that lands on the tank's timeline and counts as upkeep done.
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import { awaySitters } from '../../src/lib/server/away/schema';
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

describe('the drafted plan', () => {
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

describe('who may read a plan, and when', () => {
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

describe('a visit', () => {
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
