// Changing a water test, changing a comment and answering one: who may, what is kept, and that
// every id in the address or the form is checked against the viewer ("not found" otherwise).
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { entryComments, tanks as tankTable } from '../../src/lib/server/journals/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as water from '../../src/lib/server/journals/water';
import { dayNumber, isoDay } from '../../src/lib/journals/calc';
import type { Viewer } from '../../src/lib/server/club/users';
import { request } from '../helpers/http';
import { makePerson, type TestPerson } from '../helpers/people';
import { emptyTest, tankInput } from '../helpers/tanks';

const viewerOf = (p: TestPerson, units: Viewer['units'] = 'metric'): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units });
const daysAgo = (n: number) => isoDay(dayNumber(new Date()) - n);

let keeper: TestPerson;
let member: TestPerson;
let admin: TestPerson;

beforeAll(async () => {
	keeper = await makePerson({ label: 'edits-keeper' });
	member = await makePerson({ label: 'edits-member' });
	admin = await makePerson({ role: 'admin', label: 'edits-admin' });
	await db.update(users).set({ units: 'us' }).where(eq(users.id, keeper.id));
});

describe('changing a water test', () => {
	test('the keeper changes a test in their own units; it is marked edited and the rest of the test is as sent', async () => {
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Edited tests', setUpOn: daysAgo(30) }));
		const testId = await water.create(viewerOf(keeper), tankId, { ...emptyTest, testedOn: daysAgo(2), ph: 6.8, kh: 4, temperatureC: 25, note: 'first' });
		const page = await request(`/journals/${tankId}/water-tests/${testId}/edit`, { cookie: keeper.cookie });
		expect(page.status).toBe(200);
		const html = await page.text();
		// 25 °C = 77 °F exactly, (25 × 9/5) + 32 (NIST SP 811, B.8): the form starts in the keeper's unit.
		expect(html).toMatch(/name="temperatureC"[^>]*value="77"/);
		expect(html).toMatch(/Temperature[^<]*\(°F\)/);

		const saved = await request(`/journals/${tankId}/water-tests/${testId}/edit`, {
			cookie: keeper.cookie,
			form: { testedOn: daysAgo(1), ph: '7.1', kh: '', temperatureC: '78.8', ammoniaBasis: 'NH3', note: 'retested' }
		});
		expect(saved.status).toBe(303);
		expect(saved.headers.get('location')).toBe(`/journals/${tankId}?testEdited=1#water-heading`);
		const [row] = await water.many(tankId, [testId]);
		// (78.8 − 32) × 5/9 = 26 °C.
		expect(row).toMatchObject({ testedOn: daysAgo(1), ph: 7.1, kh: null, temperatureC: 26, note: 'retested' });
		expect(row!.editedAt).toBeInstanceOf(Date);
		const tankPage = await (await request(`/journals/${tankId}`, { cookie: member.cookie })).text();
		expect(tankPage).toContain('data-testid="test-edited"');
		// Only the keeper is offered the change.
		expect(tankPage).not.toContain(`/water-tests/${testId}/edit`);
		expect(await (await request(`/journals/${tankId}`, { cookie: keeper.cookie })).text()).toContain(`/water-tests/${testId}/edit`);
	});

	test('the same checks as a new test: a refusal changes nothing and sends back what was typed', async () => {
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Refused edits', setUpOn: daysAgo(10) }));
		const testId = await water.create(viewerOf(keeper), tankId, { ...emptyTest, testedOn: daysAgo(1), ph: 6.5 });
		const tooHot = await request(`/journals/${tankId}/water-tests/${testId}/edit`, {
			cookie: keeper.cookie,
			form: { testedOn: daysAgo(1), ph: '6.5', temperatureC: '140', ammoniaBasis: 'NH3', note: '' }
		});
		expect(tooHot.status).toBe(400);
		expect(await tooHot.text()).toContain('32 and 113 °F');
		const future = await request(`/journals/${tankId}/water-tests/${testId}/edit`, {
			cookie: keeper.cookie,
			form: { testedOn: isoDay(dayNumber(new Date()) + 3), ph: '6.5', ammoniaBasis: 'NH3', note: '' }
		});
		expect(future.status).toBe(400);
		const nothing = await request(`/journals/${tankId}/water-tests/${testId}/edit`, {
			cookie: keeper.cookie,
			form: { testedOn: daysAgo(1), ammoniaBasis: 'NH3' }
		});
		expect(nothing.status).toBe(400);
		expect(await nothing.text()).toContain('Enter at least one reading.');
		const beforeSetUp = await request(`/journals/${tankId}/water-tests/${testId}/edit`, {
			cookie: keeper.cookie,
			form: { testedOn: daysAgo(40), ph: '6.5', ammoniaBasis: 'NH3' }
		});
		expect(beforeSetUp.status).toBe(400);
		const [row] = await water.many(tankId, [testId]);
		expect(row).toMatchObject({ testedOn: daysAgo(1), ph: 6.5, temperatureC: null, editedAt: null });
	});

	test('another member, an admin, a test of another tank and a test that does not exist are all "not found"', async () => {
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: 'Guarded tests', visibility: 'public', setUpOn: daysAgo(10) }));
		const testId = await water.create(viewerOf(keeper), tankId, { ...emptyTest, testedOn: daysAgo(1), ph: 6.5 });
		const otherTank = await tanks.create(viewerOf(keeper), tankInput({ name: 'Second tank', setUpOn: daysAgo(10) }));
		const form = { testedOn: daysAgo(1), ph: '9', ammoniaBasis: 'NH3', note: '' };
		for (const who of [member, admin]) {
			expect((await request(`/journals/${tankId}/water-tests/${testId}/edit`, { cookie: who.cookie })).status).toBe(404);
			expect((await request(`/journals/${tankId}/water-tests/${testId}/edit`, { cookie: who.cookie, form })).status).toBe(404);
		}
		// The keeper's own test, named under the keeper's other tank.
		expect((await request(`/journals/${otherTank}/water-tests/${testId}/edit`, { cookie: keeper.cookie })).status).toBe(404);
		expect((await request(`/journals/${otherTank}/water-tests/${testId}/edit`, { cookie: keeper.cookie, form })).status).toBe(404);
		expect((await request(`/journals/${tankId}/water-tests/999999999/edit`, { cookie: keeper.cookie, form })).status).toBe(404);
		const signedOut = await request(`/journals/${tankId}/water-tests/${testId}/edit`, { form });
		expect(signedOut.status).toBe(303);
		expect(signedOut.headers.get('location')).toMatch(/^\/signin\?redirectTo=/);
		const [row] = await water.many(tankId, [testId]);
		expect(row).toMatchObject({ ph: 6.5, editedAt: null });
	});
});

describe('changing and answering comments', () => {
	async function entryOn(visibility: 'public' | 'club' | 'private') {
		const tankId = await tanks.create(viewerOf(keeper), tankInput({ name: `Talk ${visibility}`, visibility, setUpOn: daysAgo(30) }));
		const entryId = await entries.create(viewerOf(keeper), tankId, { entryOn: daysAgo(1), title: 'Trim day', body: 'Trimmed.', events: [] }, []);
		return { tankId, entryId, at: `/journals/${tankId}/entries/${entryId}` };
	}
	const comment = async (tankId: number, entryId: number, p: TestPerson) =>
		await entries.addComment(viewerOf(p), tankId, entryId, `A comment by ${p.displayName}`);
	const stored = async (id: number) => (await db.select().from(entryComments).where(eq(entryComments.id, id)))[0];

	test('its author changes a comment, marked edited; the keeper, an admin and other members cannot', async () => {
		const { tankId, entryId, at } = await entryOn('club');
		const id = await comment(tankId, entryId, member);
		for (const who of [keeper, admin]) {
			const refused = await request(`${at}?/editComment`, { cookie: who.cookie, form: { commentId: String(id), body: 'Rewritten by someone else' } });
			expect(refused.status).toBe(404);
		}
		expect(await stored(id)).toMatchObject({ body: `A comment by ${member.displayName}`, editedAt: null });
		const empty = await request(`${at}?/editComment`, { cookie: member.cookie, form: { commentId: String(id), body: '  ' } });
		expect(empty.status).toBe(400);
		const changed = await request(`${at}?/editComment`, {
			cookie: member.cookie,
			form: { commentId: String(id), body: 'Now with **more** <script>x</script>' }
		});
		expect(changed.status).toBe(200);
		const row = await stored(id);
		expect(row).toMatchObject({ body: 'Now with **more** <script>x</script>' });
		expect(row!.bodyHtml).toContain('<strong>more</strong>');
		expect(row!.bodyHtml).not.toContain('<script');
		expect(row!.editedAt).toBeInstanceOf(Date);
		const page = await (await request(at, { cookie: keeper.cookie })).text();
		expect(page).toContain('data-testid="comment-edited"');
		// The source goes to its author's form only.
		expect(page).not.toContain('Now with **more**');
		expect(await (await request(at, { cookie: member.cookie })).text()).toContain('Now with **more**');
	});

	test('replies sit one level under a comment; answering a reply joins its thread', async () => {
		const { tankId, entryId, at } = await entryOn('public');
		const first = await comment(tankId, entryId, keeper);
		const answered = await request(`${at}?/reply`, { cookie: member.cookie, form: { commentId: String(first), reply: 'Which scissors?' } });
		expect(answered.status).toBe(200);
		const [thread] = await entries.comments(viewerOf(member), (await tanks.findVisible(viewerOf(member), tankId))!, entryId);
		const replyId = thread!.replies[0]!.id;
		expect(thread!.replies).toMatchObject([{ parentId: first, authorId: member.id, editable: true }]);
		const deeper = await entries.reply(viewerOf(keeper), tankId, entryId, replyId, 'Curved ones.');
		expect(deeper).toEqual({ id: expect.any(Number), parentId: first, parentAuthorId: keeper.id });
		const threads = await entries.comments(null, (await tanks.findVisible(null, tankId))!, entryId);
		expect(threads).toHaveLength(1);
		expect(threads[0]!.replies.map((r) => r.id)).toEqual([replyId, deeper.id]);
		// A reply is changed like a comment, by its author.
		expect((await request(`${at}?/editComment`, { cookie: member.cookie, form: { commentId: String(replyId), body: 'Which scissors, curved?' } })).status).toBe(
			200
		);
		expect((await stored(replyId))!.editedAt).toBeInstanceOf(Date);
		const empty = await request(`${at}?/reply`, { cookie: member.cookie, form: { commentId: String(first), reply: '' } });
		expect(empty.status).toBe(400);
		// Removing the comment takes its replies with it.
		expect((await request(`${at}?/removeComment`, { cookie: keeper.cookie, form: { commentId: String(first) } })).status).toBe(200);
		expect(await stored(replyId)).toBeUndefined();
		expect(await stored(deeper.id)).toBeUndefined();
	});

	test('replies follow the entry: a private tank, a comment of another entry, signed out and nonsense ids are refused', async () => {
		const hidden = await entryOn('private');
		const keeperNote = await comment(hidden.tankId, hidden.entryId, keeper);
		const onHidden = await request(`${hidden.at}?/reply`, { cookie: member.cookie, form: { commentId: String(keeperNote), reply: 'Peeking' } });
		expect(onHidden.status).toBe(404);
		const club = await entryOn('club');
		const other = await entryOn('club');
		const elsewhere = await comment(other.tankId, other.entryId, keeper);
		// A comment of another entry, named under this one.
		const crossed = await request(`${club.at}?/reply`, { cookie: member.cookie, form: { commentId: String(elsewhere), reply: 'Crossed' } });
		expect(crossed.status).toBe(404);
		// The private tank's comment, named under a club tank the member may see.
		expect((await request(`${club.at}?/reply`, { cookie: member.cookie, form: { commentId: String(keeperNote), reply: 'Crossed' } })).status).toBe(404);
		expect((await request(`${club.at}?/reply`, { cookie: member.cookie, form: { commentId: 'x1', reply: 'Nonsense' } })).status).toBe(404);
		const signedOut = await request(`${club.at}?/reply`, { form: { commentId: String(elsewhere), reply: 'Anonymous' } });
		expect(signedOut.status).toBe(303);
		expect(await db.select().from(entryComments).where(eq(entryComments.parentId, elsewhere))).toEqual([]);
		expect(await db.select().from(entryComments).where(eq(entryComments.parentId, keeperNote))).toEqual([]);

		// A member's own comment on a tank that has since gone private cannot be changed any more.
		const fading = await entryOn('club');
		const mine = await comment(fading.tankId, fading.entryId, member);
		await db.update(tankTable).set({ visibility: 'private' }).where(eq(tankTable.id, fading.tankId));
		expect((await request(`${fading.at}?/editComment`, { cookie: member.cookie, form: { commentId: String(mine), body: 'Changed late' } })).status).toBe(404);
		// And under another tank's address, even their own comment is not found.
		const own = await comment(club.tankId, club.entryId, member);
		expect((await request(`${other.at}?/editComment`, { cookie: member.cookie, form: { commentId: String(own), body: 'Crossed' } })).status).toBe(404);
		expect((await stored(own))!.editedAt).toBeNull();
	});
});
