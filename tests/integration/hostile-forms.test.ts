// Hostile values in forms: over-long text, wrong types, negative and huge numbers, impossible
// dates and Unicode edge cases in names and titles. Each gets a message at its field, what was
// typed comes back, and nothing is written. (Unicode references: U+202E RIGHT-TO-LEFT OVERRIDE,
// U+200D ZERO WIDTH JOINER, U+0301 COMBINING ACUTE ACCENT, from the Unicode Character Database.)
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { tanks as tankTable, waterTests } from '../../src/lib/server/journals/schema';
import { users } from '../../src/lib/server/club/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import { request } from '../helpers/http';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';
import { viewerOf } from '../helpers/swaps';

const goodTank = {
	name: 'Corner tank',
	style: 'jungle',
	setUpOn: '2026-01-10',
	visibility: 'club',
	length: '60',
	width: '30',
	height: '36',
	co2Method: 'none'
};

let member: TestPerson;
beforeAll(async () => {
	member = await makePerson({ label: 'hostile-forms' });
});

const post = (path: string, form: Record<string, string>) => request(path, { method: 'POST', cookie: member.cookie, form });

describe('the tank form refuses hostile values at their fields and writes nothing', () => {
	const cases: [string, Record<string, string>, RegExp][] = [
		['an over-long name', { name: 'x'.repeat(5_000) }, /Keep it to 80 characters/],
		['a word for a length', { length: 'sixty' }, /Enter a number/],
		['a negative length', { length: '-60' }, /\w/],
		['a huge length', { length: '1e308' }, /\w/],
		['an impossible date', { setUpOn: '2026-02-30' }, /\w/],
		['a date that is no date', { setUpOn: 'yesterday' }, /\w/],
		['a right-to-left override in the name', { name: 'Tank\u202Eexe.gpj' }, /direction of the text/],
		['a name of zero-width joiners', { name: '\u200D\u200D\u200D' }, /invisible characters/]
	];
	for (const [what, change, message] of cases) {
		test(what, async () => {
			const response = await post('/journals/new', { ...goodTank, ...change });
			expect(response.status).toBe(400);
			expect(await response.text()).toMatch(message);
			expect(await db.select().from(tankTable).where(eq(tankTable.ownerId, member.id))).toEqual([]);
		});
	}

	test('emoji and a combining accent are kept as typed (composed)', async () => {
		const response = await post('/journals/new', { ...goodTank, name: 'Jose\u0301’s shrimp 🦐 tank' });
		expect(response.status).toBe(303);
		const [tank] = await db.select().from(tankTable).where(eq(tankTable.ownerId, member.id));
		expect(tank?.name).toBe('José’s shrimp 🦐 tank');
		await db.delete(tankTable).where(eq(tankTable.id, tank!.id));
	});
});

describe('other forms', () => {
	test('a water test with impossible readings or day is refused and not stored', async () => {
		const tank = await tanks.create(viewerOf(member), tankInput({ name: 'Water tank' }));
		for (const form of [
			{ testedOn: '2026-02-30', ph: '7' },
			{ testedOn: '2026-02-01', ph: '-3' },
			{ testedOn: '2026-02-01', ph: '1e9' },
			{ testedOn: '2026-02-01', ph: 'seven' }
		]) {
			const response = await post(`/journals/${tank}/water-tests/new`, form);
			expect(response.status, JSON.stringify(form)).toBe(400);
		}
		expect(await db.select().from(waterTests).where(eq(waterTests.tankId, tank))).toEqual([]);
	});

	test('a display name with a direction override or joiners is refused; one with a combining accent is kept composed', async () => {
		for (const displayName of ['Anna\u202Egpj', 'An\u200Dna', 'x'.repeat(500)]) {
			expect((await post('/welcome', { displayName })).status, displayName).toBe(400);
		}
		const [before] = await db.select({ displayName: users.displayName }).from(users).where(eq(users.id, member.id));
		expect(before?.displayName).toBe(member.displayName);
		expect((await post('/welcome', { displayName: 'Jose\u0301 Marti' })).status).toBe(303);
		const [after] = await db.select({ displayName: users.displayName }).from(users).where(eq(users.id, member.id));
		expect(after?.displayName).toBe('José Marti');
	});
});
