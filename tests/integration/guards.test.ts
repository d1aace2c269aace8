// Who may reach what: every page load, form action and endpoint, for each kind of visitor. The
// table is kept by hand, and checked against the route files: a new page, action or endpoint
// without a row here fails the first test below.
import { beforeAll, describe, expect, test } from 'vitest';
import { makePerson, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';
import { describeOperation, discoverOperations, operationFor, operationKey, type Operation } from '../helpers/routes';
import * as restricted from '../../src/lib/server/swaps/restricted';
import { tankInput } from '../helpers/tanks';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as threads from '../../src/lib/server/swaps/threads';
import { createListing, placePerson, viewerOf } from '../helpers/swaps';
import * as plans from '../../src/lib/server/away/plans';
import { dayNumber, isoDay } from '../../src/lib/journals/calc';
import { today } from '../../src/lib/dates';

import * as judging from '../../src/lib/server/contests/judging';
import { cardIdOf, contestFixture, fields, photoOf, viewerOf as contestViewer, type Fixture } from '../helpers/contests';

type Visitor = 'anonymous' | 'member' | 'judge' | 'admin';
type Form = Record<string, string | string[]>;
interface Row {
	method?: 'GET' | 'POST' | 'PUT' | 'DELETE';
	/** `:tank` stands for a club-visible tank of another member, `:entry` for a journal entry of it. */
	path: string;
	/** Read when the request is sent. */
	form?: () => Form | Promise<Form>;
	json?: unknown;
	expect: Record<Visitor, number>;
	api?: boolean;
	/** Where a 303 may point, by visitor; otherwise to sign-in with the way back. */
	redirect?: Partial<Record<Visitor, RegExp>>;
	/** The request ends the visitor's session: send it as a new person with the same role. */
	endsSession?: true;
}

const SIGN_IN = /^\/signin\?redirectTo=/;

const signedIn = (status: number) => ({ anonymous: 303, member: status, judge: status, admin: status });
const adminOnly = (status: number) => ({ anonymous: 303, member: 403, judge: 403, admin: status });

let people: Record<Exclude<Visitor, 'anonymous'>, TestPerson>;
let target: TestPerson;
/** A club-visible tank of `target`'s: everyone else may look at it but not change it. */
let targetTank: number;
/** An entry of that tank, a task of its schedule and a comment by its keeper. */
let targetEntry: number;
let targetTask: number;
let targetComment: number;
const apiSignedIn = (status: number) => ({ anonymous: 401, member: status, judge: status, admin: status });
const notOwner = { anonymous: 303, member: 404, judge: 404, admin: 404 };
const hidden = { anonymous: 404, member: 404, judge: 404, admin: 404 };
let targetListing: number;
let targetThread: number;
/** A contest being judged, with an entry of `target`'s and one card by a judge of its panel. */
let contest: Fixture;
let cardId: number;
const judgesOnly = (status: number) => ({ anonymous: 303, member: 403, judge: status, admin: status });
const judgeApi = (status: number) => ({ anonymous: 401, member: 403, judge: status, admin: status });
const blankCard = { baseVersion: 0, saveId: 'guard-test-save', fields: { scores: {}, comments: {}, entrantComment: '', panelNote: '' } };
/** A photo target uploaded and has not saved with anything yet: only its uploader may see it. */
let pendingPhoto: number;
/** A care plan of target's for that tank, nobody asked to look in. */
let targetPlan: number;
const everyone = (status: number) => ({ anonymous: status, member: status, judge: status, admin: status });

const rows: Row[] = [
	{ path: '/account', expect: signedIn(200) },
	{ path: '/welcome', expect: signedIn(200) },
	{ path: '/account/data', expect: signedIn(200) },
	// A confirmation that is not the visitor's name is refused at its field; nothing is deleted.
	{ method: 'POST', path: '/account/data?/delete', form: () => ({ confirm: 'not my name' }), expect: signedIn(400) },
	{ path: '/admin', expect: adminOnly(200) },
	{ path: '/admin/members', expect: adminOnly(200) },
	{ path: '/admin/mail', expect: adminOnly(200) },
	{ path: '/admin/mail/999999999', expect: adminOnly(404) },
	{
		method: 'POST',
		path: '/admin/members?/role',
		form: () => ({ userId: target.id, role: 'member' }),
		expect: adminOnly(200)
	},
	{
		method: 'POST',
		path: '/account?/profile',
		form: () => ({ displayName: 'Guard Test', units: 'metric', locationMode: 'none', notifyMessages: 'hourly', homeLat: '', homeLng: '' }),
		expect: signedIn(200)
	},
	{ method: 'POST', path: '/account?/revoke', form: () => ({ handle: 'no-such-session' }), expect: { anonymous: 303, member: 404, judge: 404, admin: 404 } },
	{
		method: 'POST',
		path: '/account?/revokeAll',
		form: () => ({}),
		expect: everyone(303),
		endsSession: true,
		redirect: { member: /^\/signin\?signedOutEverywhere=1$/, judge: /^\/signin\?signedOutEverywhere=1$/, admin: /^\/signin\?signedOutEverywhere=1$/ }
	},
	{ method: 'POST', path: '/welcome', form: () => ({ displayName: '' }), expect: signedIn(400) },
	{ path: '/signin', expect: { anonymous: 200, member: 303, judge: 303, admin: 303 }, redirect: { member: /^\/$/, judge: /^\/$/, admin: /^\/$/ } },
	// Refused at the field; a signed-in visitor is then sent on, as the page itself does.
	{
		method: 'POST',
		path: '/signin',
		form: () => ({ email: 'not-an-address' }),
		expect: { anonymous: 400, member: 303, judge: 303, admin: 303 },
		redirect: { member: /^\/$/, judge: /^\/$/, admin: /^\/$/ }
	},
	{ path: '/signout', expect: everyone(303), redirect: { anonymous: /^\/$/, member: /^\/$/, judge: /^\/$/, admin: /^\/$/ } },
	{ method: 'POST', path: '/signout', form: () => ({}), expect: everyone(302), endsSession: true },
	{ path: '/unsubscribe/0123456789abcdef0123456789abcdef', expect: hidden },
	{ method: 'POST', path: '/unsubscribe/0123456789abcdef0123456789abcdef', form: () => ({ announcements: 'on' }), expect: hidden },
	{ path: '/media/:photo/thumb', expect: hidden },
	{ path: '/api/me', api: true, expect: { anonymous: 401, member: 200, judge: 200, admin: 200 } },
	{ method: 'POST', path: '/api/me/time-zone', api: true, json: { timeZone: 'Europe/Lisbon' }, expect: apiSignedIn(200) },
	{ path: '/journals', expect: signedIn(200) },
	{ path: '/journals/new', expect: signedIn(200) },
	{ method: 'POST', path: '/journals/new', form: () => ({ name: '' }), expect: signedIn(400) },
	{ path: '/journals/:tank/edit', expect: notOwner },
	{ method: 'POST', path: '/journals/:tank/edit', form: () => ({ name: 'Taken over' }), expect: notOwner },
	{ method: 'POST', path: '/journals/:tank?/retire', form: () => ({ retiredOn: '2026-01-01', retiredNote: '' }), expect: notOwner },
	{ method: 'POST', path: '/journals/:tank?/reopen', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/journals/:tank?/delete', form: () => ({ confirmName: 'Guard tank' }), expect: notOwner },
	{ path: '/api/species?q=rotala', api: true, expect: apiSignedIn(200) },
	{ method: 'POST', path: '/api/markdown/preview', api: true, json: { text: '*hi*' }, expect: apiSignedIn(200) },
	{ method: 'POST', path: '/api/media', api: true, form: () => ({ note: 'no file here' }), expect: apiSignedIn(400) },
	{ method: 'DELETE', path: '/api/media/999999999', api: true, expect: apiSignedIn(404) },
	{ path: '/', expect: everyone(200) },
	{ method: 'POST', path: '/?/done', form: () => ({ taskId: String(targetTask) }), expect: notOwner },
	{ path: '/journals/showcase', expect: { anonymous: 200, member: 200, judge: 200, admin: 200 } },
	{ path: '/journals/dose?tank=:tank', expect: { anonymous: 200, member: 200, judge: 200, admin: 200 } },
	{ method: 'POST', path: '/journals/dose?/log', form: () => ({ tank: String(targetTank), salt: 'KNO3', grams: '1' }), expect: notOwner },
	{ path: '/journals/:tank', expect: { anonymous: 404, member: 200, judge: 200, admin: 200 } },
	{ path: '/journals/:tank/feed.xml', expect: hidden },
	{ path: '/api/tanks/:tank/water-tests', api: true, expect: { anonymous: 404, member: 200, judge: 200, admin: 200 } },
	{ method: 'POST', path: '/journals/:tank?/admire', form: () => ({ want: 'on' }), expect: signedIn(200) },
	{ method: 'POST', path: '/journals/:tank?/follow', form: () => ({ want: 'on' }), expect: signedIn(200) },
	{ method: 'POST', path: '/journals/:tank?/done', form: () => ({ taskId: String(targetTask) }), expect: notOwner },
	{ method: 'POST', path: '/journals/:tank?/undoEvent', form: () => ({ eventId: '1' }), expect: notOwner },
	{ method: 'POST', path: '/journals/:tank?/deleteTest', form: () => ({ testId: '1' }), expect: notOwner },
	{ path: '/journals/:tank/entries/new', expect: notOwner },
	{ method: 'POST', path: '/journals/:tank/entries/new', form: () => ({ entryOn: '2026-02-01', body: 'Taken over' }), expect: notOwner },
	{ path: '/journals/:tank/entries/:entry', expect: { anonymous: 404, member: 200, judge: 200, admin: 200 } },
	{ method: 'POST', path: '/journals/:tank/entries/:entry?/comment', form: () => ({ comment: 'Looks good.' }), expect: signedIn(200) },
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry?/removeComment',
		form: () => ({ commentId: String(targetComment) }),
		expect: { anonymous: 303, member: 404, judge: 404, admin: 200 }
	},
	{ method: 'POST', path: '/journals/:tank/entries/:entry?/delete', form: () => ({}), expect: notOwner },
	{ path: '/journals/:tank/entries/:entry/edit', expect: notOwner },
	{ method: 'POST', path: '/journals/:tank/entries/:entry/edit', form: () => ({ entryOn: '2026-02-01', body: 'Taken over' }), expect: notOwner },
	{ path: '/journals/:tank/water-tests/new', expect: notOwner },
	{ method: 'POST', path: '/journals/:tank/water-tests/new', form: () => ({ testedOn: '2026-02-01', ph: '7' }), expect: notOwner },
	{ path: '/journals/:tank/schedule', expect: notOwner },
	{
		method: 'POST',
		path: '/journals/:tank/schedule',
		form: () => ({ 'tasks[0][kind]': 'other', 'tasks[0][label]': 'Taken over', 'tasks[0][intervalDays]': '3' }),
		expect: notOwner
	},
	// The swap board. `:listing` is an open listing of target's; `:thread` a conversation about it
	// between target and another member, which does not exist for anyone else, signed out included.
	{ path: '/swaps', expect: signedIn(200) },
	{ path: '/swaps/new', expect: signedIn(200) },
	{ method: 'POST', path: '/swaps/new', form: () => ({ title: '' }), expect: signedIn(400) },
	{ path: '/swaps/mine', expect: signedIn(200) },
	{ method: 'POST', path: '/swaps/mine?/unblock', form: () => ({ memberId: target.id }), expect: signedIn(200) },
	{ path: '/swaps/:listing', expect: signedIn(200) },
	{ path: '/swaps/:listing/edit', expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing/edit', form: () => ({ title: 'Taken over' }), expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing?/withdraw', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing?/release', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing?/confirm', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing?/extend', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/swaps/:listing?/request', form: () => ({ body: '' }), expect: signedIn(400) },
	{ method: 'POST', path: '/swaps/:listing?/report', form: () => ({ reason: 'no' }), expect: signedIn(400) },
	{ path: '/swaps/threads/:thread', expect: hidden },
	...['send', 'propose', 'confirmPickup', 'accept', 'release', 'handover', 'block', 'unblock', 'report'].map((action): Row => ({
		method: 'POST',
		path: `/swaps/threads/:thread?/${action}`,
		form: () => ({ body: 'hello' }),
		expect: hidden
	})),
	{ path: '/api/swaps/listings', api: true, expect: apiSignedIn(200) },
	{ path: '/api/swaps/threads/:thread/messages', api: true, expect: hidden },
	{ path: '/members/:member', expect: signedIn(200) },
	{ method: 'POST', path: '/members/not-a-member?/block', form: () => ({}), expect: signedIn(404) },
	{ method: 'POST', path: '/members/not-a-member?/unblock', form: () => ({}), expect: signedIn(404) },
	{ path: '/admin/areas', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/areas?/add', form: () => ({ name: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/areas?/rename', form: () => ({ id: '0', name: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/areas?/remove', form: () => ({ id: '0' }), expect: adminOnly(404) },
	{ path: '/admin/reports', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/reports?/decide', form: () => ({}), expect: adminOnly(400) },
	{ path: '/admin/restricted', expect: adminOnly(200) },
	// Sends back the jurisdictions the club applies at that moment, so the setting stays as it was.
	{
		method: 'POST',
		path: '/admin/restricted?/jurisdictions',
		form: async () => ({ jurisdiction: await restricted.clubJurisdictions() }),
		expect: adminOnly(200)
	},
	{ method: 'POST', path: '/admin/restricted?/add', form: () => ({}), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/restricted?/update', form: () => ({}), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/restricted?/remove', form: () => ({ id: '0' }), expect: adminOnly(400) },
	// Contests. :contest is being judged; :contestEntry is target's contest entry in it, :number its number, :card a card of it.
	{ path: '/contests', expect: everyone(200) },
	{ path: '/contests/:contest', expect: everyone(200) },
	// Nothing is published while the contest is being judged.
	{ path: '/contests/:contest/results/:category', expect: hidden },
	{ path: '/contests/:contest/enter', expect: signedIn(200) },
	{ method: 'POST', path: '/contests/:contest/enter', form: () => ({ statement: '' }), expect: signedIn(400) },
	{ path: '/contests/:contest/entries/:contestEntry', expect: { anonymous: 303, member: 404, judge: 404, admin: 200 } },
	{ path: '/contests/:contest/entries/:contestEntry/edit', expect: notOwner },
	{ method: 'POST', path: '/contests/:contest/entries/:contestEntry/edit', form: () => ({ statement: 'Taken over' }), expect: notOwner },
	{ method: 'POST', path: '/contests/:contest/entries/:contestEntry?/withdraw', form: () => ({ confirm: 'withdraw' }), expect: notOwner },
	{ path: '/judging', expect: judgesOnly(200) },
	// A judge who is not on this contest's panel, and admins (who do not judge), find nothing.
	{ path: '/judging/:contest', expect: judgesOnly(404) },
	{ path: '/judging/:contest/:number', expect: judgesOnly(404) },
	{ path: '/judging/:contest/:number/photos/1/thumb', expect: judgesOnly(404) },
	{ method: 'POST', path: '/judging/:contest/:number?/conflict', form: () => ({ reason: 'guard test', confirm: 'yes' }), expect: judgesOnly(404) },
	{ path: '/api/judging/:contest/:number/card', api: true, expect: judgeApi(404) },
	{ method: 'PUT', path: '/api/judging/:contest/:number/card', api: true, json: blankCard, expect: judgeApi(404) },
	{ method: 'POST', path: '/api/judging/:contest/:number/card/submit', api: true, json: { version: 1 }, expect: judgeApi(404) },
	{ method: 'POST', path: '/api/judging/:contest/:number/card/reopen', api: true, json: {}, expect: judgeApi(404) },
	{ path: '/admin/contests', expect: adminOnly(200) },
	{ path: '/admin/contests/new', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/new', form: () => ({ title: '' }), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest?/step', form: () => ({ step: 'publish' }), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/edit', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest/edit', form: () => ({ title: '' }), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/judging', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest/judging?/assign', form: () => ({ judgeId: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/contests/:contest/judging?/unassign', form: () => ({ judgeId: 'nobody' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/contests/:contest/judging?/remind', form: () => ({}), expect: adminOnly(200) },
	{ path: '/admin/contests/:contest/results', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest/results?/rankBy', form: () => ({ rankBy: 'by-feel' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/contests/:contest/results?/step', form: () => ({ step: 'publish' }), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/cards/:card', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest/cards/:card', form: () => ({ reason: '' }), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/announce', expect: adminOnly(200) },
	{ path: '/admin/contests/:contest/announce/status', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/contests/:contest/announce?/send', form: () => ({}), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/export/results', expect: adminOnly(200) },
	{ path: '/admin/contests/:contest/export/cards', expect: adminOnly(200) },
	// Away care: a care plan is its keeper's, and a sitter's once they said yes; admins have no view of it.
	{ path: '/journals/:tank/away', expect: notOwner },
	{
		method: 'POST',
		path: '/journals/:tank/away',
		form: () => ({ startsOn: '2026-01-01', endsOn: '2026-01-02', feeding: 'none', lighting: 'keep' }),
		expect: notOwner
	},
	{ path: '/away', expect: signedIn(200) },
	{ method: 'POST', path: '/away?/answer', form: () => ({ request: '999999999', answer: 'yes' }), expect: notOwner },
	{ method: 'POST', path: '/away?/helper', form: () => ({ helper: 'off' }), expect: signedIn(200) },
	{ path: '/away/:plan', expect: notOwner },
	{ path: '/away/:plan/print', expect: notOwner },
	{ path: '/away/:plan/summary', expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/save', form: () => ({ body: 'Taken over' }), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/ask', form: () => ({ sitterId: 'nobody' }), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/withdraw', form: () => ({ request: '1' }), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/share', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/unshare', form: () => ({}), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/visitMail', form: () => ({ visitMail: 'daily' }), expect: notOwner },
	{ method: 'POST', path: '/away/:plan?/visit', form: () => ({ done: 'Looked', note: 'x' }), expect: notOwner },
	{ path: '/away/shared/not-a-real-token-of-any-plan-00000', expect: everyone(404) }
];

beforeAll(async () => {
	people = {
		member: await makePerson({ role: 'member' }),
		judge: await makePerson({ role: 'judge' }),
		admin: await makePerson({ role: 'admin' })
	};
	target = await makePerson({ role: 'member', label: 'target' });
	targetTank = await tanks.create({ id: target.id }, tankInput({ name: 'Guard tank', visibility: 'club' }));
	const keeper = { id: target.id, email: target.email, displayName: target.displayName, role: target.role, units: 'metric' as const };
	targetEntry = await entries.create(keeper, targetTank, { entryOn: '2026-02-01', title: 'Guard entry', body: 'Planted.', events: [] }, []);
	await upkeep.saveSchedule(keeper, targetTank, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
	targetTask = (await upkeep.listForTank(targetTank))[0]!.id;
	targetComment = await entries.addComment(keeper, targetTank, targetEntry, 'Keeper’s own note.');
	await placePerson(target, { lat: -50.5, lng: -30.5 });
	targetListing = await createListing(target, { title: 'Guard listing' });
	const asker = await makePerson({ label: 'guard-asker' });
	targetThread = await threads.request(viewerOf(asker), targetListing, 'A guarded question');
	contest = await contestFixture({ judges: 1, entrants: [target] });
	await judging.saveCard(contestViewer(contest.judges[0]!), contest.contestId, contest.entries[0]!.number!, {
		baseVersion: 0,
		saveId: crypto.randomUUID(),
		fields: fields(contest.criteria, [5, null])
	});
	cardId = await cardIdOf(contest.entries[0]!.entryId, contest.judges[0]!.id);
	pendingPhoto = (await photoOf(target)).id;
	const todayNumber = dayNumber(today());
	targetPlan = await plans.start(keeper, targetTank, {
		startsOn: isoDay(todayNumber + 1),
		endsOn: isoDay(todayNumber + 6),
		feeding: 'none',
		lighting: 'keep',
		keeperPhone: '',
		evaporationLitresPerDay: null
	});
});

/** A row's path with its placeholders filled in. */
const pathOf = (row: Row) =>
	row.path
		.replaceAll(':tank', String(targetTank))
		.replaceAll(':contestEntry', String(contest.entries[0]!.entryId))
		.replaceAll(':entry', String(targetEntry))
		.replaceAll(':listing', String(targetListing))
		.replaceAll(':thread', String(targetThread))
		.replaceAll(':member', target.id)
		.replaceAll(':contest', String(contest.contestId))
		.replaceAll(':number', String(contest.entries[0]!.number))
		.replaceAll(':category', String(contest.categories[0]))
		.replaceAll(':card', String(cardId))
		.replaceAll(':photo', String(pendingPhoto))
		.replaceAll(':plan', String(targetPlan));

describe('the guard table', () => {
	let operations: Operation[];
	beforeAll(async () => {
		operations = await discoverOperations();
	});

	test('has a row for every page load, form action and endpoint method', () => {
		expect(operations.length).toBeGreaterThan(50);
		const covered = new Set(rows.flatMap((row) => operationFor(operations, row.method ?? 'GET', row.path) ?? []).map(operationKey));
		const missing = operations.filter((op) => !covered.has(operationKey(op))).map(describeOperation);
		expect(missing, 'Add a row for each of these to the table in guards.test.ts').toEqual([]);
	});

	test('has no row that stands for nothing', () => {
		const stray = rows.filter((row) => !operationFor(operations, row.method ?? 'GET', row.path)).map((row) => `${row.method ?? 'GET'} ${row.path}`);
		expect(stray).toEqual([]);
	});
});

describe('role guards', () => {
	for (const row of rows) {
		for (const visitor of ['anonymous', 'member', 'judge', 'admin'] as const) {
			test(`${row.method ?? 'GET'} ${row.path} as ${visitor} → ${row.expect[visitor]}`, async () => {
				const person = visitor === 'anonymous' ? undefined : row.endsSession ? await makePerson({ role: visitor }) : people[visitor];
				const response = await request(pathOf(row), {
					method: row.method ?? 'GET',
					cookie: person?.cookie,
					form: await row.form?.(),
					json: row.json,
					accept: row.api ? 'application/json' : 'text/html'
				});
				expect(response.status).toBe(row.expect[visitor]);
				if (response.status === 303) expect(response.headers.get('location')).toMatch(row.redirect?.[visitor] ?? SIGN_IN);
				if (row.api && response.status === 401) expect(await response.json()).toHaveProperty('message');
			});
		}
	}

	test('an API route answers an anonymous browser-style request with JSON too', async () => {
		const response = await request('/api/me', { accept: '*/*' });
		expect(response.status).toBe(401);
		expect(response.headers.get('content-type')).toContain('application/json');
	});
});
