// Who may reach what: every protected route, for each kind of visitor. A new protected route
// gets a row here.
import { beforeAll, describe, expect, test } from 'vitest';
import { makePerson, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';
import { tankInput } from '../helpers/tanks';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as judging from '../../src/lib/server/contests/judging';
import { cardIdOf, contestFixture, fields, viewerOf, type Fixture } from '../helpers/contests';

type Visitor = 'anonymous' | 'member' | 'judge' | 'admin';
interface Row {
	method?: 'GET' | 'POST' | 'PUT' | 'DELETE';
	/** `:tank` stands for a club-visible tank of another member. */
	path: string;
	form?: () => Record<string, string>;
	json?: unknown;
	expect: Record<Visitor, number>;
	api?: boolean;
}

const signedIn = (status: number) => ({ anonymous: 303, member: status, judge: status, admin: status });
const adminOnly = (status: number) => ({ anonymous: 303, member: 403, judge: 403, admin: status });

let people: Record<Exclude<Visitor, 'anonymous'>, TestPerson>;
let target: TestPerson;
/** A club-visible tank of `target`'s: everyone else may look at it but not change it. */
let targetTank: number;
const apiSignedIn = (status: number) => ({ anonymous: 401, member: status, judge: status, admin: status });
const notOwner = { anonymous: 303, member: 404, judge: 404, admin: 404 };
/** A contest being judged, with an entry of `target`'s and one card by a judge of its panel. */
let contest: Fixture;
let cardId: number;
const judgesOnly = (status: number) => ({ anonymous: 303, member: 403, judge: status, admin: status });
const judgeApi = (status: number) => ({ anonymous: 401, member: 403, judge: status, admin: status });
const blankCard = { baseVersion: 0, saveId: 'guard-test-save', fields: { scores: {}, comments: {}, entrantComment: '', panelNote: '' } };

const rows: Row[] = [
	{ path: '/account', expect: signedIn(200) },
	{ path: '/welcome', expect: signedIn(200) },
	{ path: '/admin', expect: adminOnly(200) },
	{ path: '/admin/members', expect: adminOnly(200) },
	{ path: '/admin/mail', expect: adminOnly(200) },
	{
		method: 'POST',
		path: '/admin/members?/role',
		form: () => ({ userId: target.id, role: 'member' }),
		expect: adminOnly(200)
	},
	{ method: 'POST', path: '/account?/profile', form: () => ({ displayName: 'Guard Test', units: 'metric', locationMode: 'none', notifyMessages: 'hourly', homeLat: '', homeLng: '' }), expect: signedIn(200) },
	{ path: '/api/me', api: true, expect: { anonymous: 401, member: 200, judge: 200, admin: 200 } },
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
	// Contests. :contest is being judged; :entry is target's entry in it, :number its number, :card a card of it.
	{ path: '/contests', expect: { anonymous: 200, member: 200, judge: 200, admin: 200 } },
	{ path: '/contests/:contest/enter', expect: signedIn(200) },
	{ method: 'POST', path: '/contests/:contest/enter', form: () => ({ statement: '' }), expect: signedIn(400) },
	{ path: '/contests/:contest/entries/:entry', expect: { anonymous: 303, member: 404, judge: 404, admin: 200 } },
	{ path: '/contests/:contest/entries/:entry/edit', expect: notOwner },
	{ method: 'POST', path: '/contests/:contest/entries/:entry/edit', form: () => ({ statement: 'Taken over' }), expect: notOwner },
	{ method: 'POST', path: '/contests/:contest/entries/:entry?/withdraw', form: () => ({ confirm: 'withdraw' }), expect: notOwner },
	{ path: '/judging', expect: judgesOnly(200) },
	// A judge who is not on this contest's panel, and admins (who do not judge), find nothing.
	{ path: '/judging/:contest', expect: judgesOnly(404) },
	{ path: '/judging/:contest/:number', expect: judgesOnly(404) },
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
	{ method: 'POST', path: '/admin/contests/:contest/announce?/send', form: () => ({}), expect: adminOnly(400) },
	{ path: '/admin/contests/:contest/export/results', expect: adminOnly(200) },
	{ path: '/admin/contests/:contest/export/cards', expect: adminOnly(200) }
];

beforeAll(async () => {
	people = {
		member: await makePerson({ role: 'member' }),
		judge: await makePerson({ role: 'judge' }),
		admin: await makePerson({ role: 'admin' })
	};
	target = await makePerson({ role: 'member', label: 'target' });
	targetTank = await tanks.create({ id: target.id }, tankInput({ name: 'Guard tank', visibility: 'club' }));
	contest = await contestFixture({ judges: 1, entrants: [target] });
	await judging.saveCard(viewerOf(contest.judges[0]!), contest.contestId, contest.entries[0]!.number!, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(contest.criteria, [5, null]) });
	cardId = await cardIdOf(contest.entries[0]!.entryId, contest.judges[0]!.id);
});

describe('role guards', () => {
	for (const row of rows) {
		for (const visitor of ['anonymous', 'member', 'judge', 'admin'] as const) {
			test(`${row.method ?? 'GET'} ${row.path} as ${visitor} → ${row.expect[visitor]}`, async () => {
				const cookie = visitor === 'anonymous' ? undefined : people[visitor].cookie;
				const path = row.path
					.replace(':tank', String(targetTank))
					.replace(':contest', String(contest.contestId))
					.replace(':entry', String(contest.entries[0]!.entryId))
					.replace(':number', String(contest.entries[0]!.number))
					.replace(':card', String(cardId));
				const response = await request(path, {
					method: row.method ?? 'GET',
					cookie,
					form: row.form?.(),
					json: row.json,
					accept: row.api ? 'application/json' : 'text/html'
				});
				expect(response.status).toBe(row.expect[visitor]);
				if (response.status === 303) expect(response.headers.get('location')).toMatch(/^\/signin\?redirectTo=/);
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
