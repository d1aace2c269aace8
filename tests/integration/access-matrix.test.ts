// Who may reach what: every page load, form action and endpoint method, for each kind of viewer,
// with the status each one gets written in one table. The table is kept by hand and checked
// against the route files (tests/helpers/routes.ts): a new page, action or endpoint without a row
// here fails the first test below.
//
// The columns are the kinds of viewer. Who each one is lives in two places only: KINDS (what the
// row helpers read: signed in or not, role, whose things they are) and makeViewers(). A new kind
// of viewer is an entry in each, and the rows where it is treated differently from its role.
import { beforeAll, describe, expect, test } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { entryComments, tanks as tankTable } from '../../src/lib/server/journals/schema';
import { contestCards, contests } from '../../src/lib/server/contests/schema';
import { makePerson, type TestPerson } from '../helpers/people';
import { request } from '../helpers/http';
import { describeOperation, discoverOperations, operationFor, operationKey, type Operation } from '../helpers/routes';
import type { Role } from '../../src/lib/club/roles';
import * as restricted from '../../src/lib/server/swaps/restricted';
import { emptyTest, tankInput } from '../helpers/tanks';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as water from '../../src/lib/server/journals/water';
import * as threads from '../../src/lib/server/swaps/threads';
import { createListing, placePerson, viewerOf } from '../helpers/swaps';
import * as judging from '../../src/lib/server/contests/judging';
import * as plans from '../../src/lib/server/away/plans';
import * as news from '../../src/lib/server/news/posts';
import { dayNumber, isoDay } from '../../src/lib/journals/calc';
import { today } from '../../src/lib/dates';
import { cardIdOf, contestFixture, fields, photoOf, type Fixture } from '../helpers/contests';

// ---- The columns -----------------------------------------------------------------------------

interface Kind {
	/** Null for anyone who is not a member: signed out, waiting to be admitted, or suspended. */
	role: Role | null;
	/** Signed in but not admitted yet (a request to join is waiting): sent to their membership page. */
	applicant?: true;
}

/**
 * Every kind of viewer. The owner owns every `:thing` in the rows' paths (a tank, its entries, a
 * listing, one side of a conversation, a contest entry); "member" is another member. Of the
 * contest's judges, the panel judge has a card for the owner's entry, the conflicted judge is on
 * the panel but stepped back from that entry, the other judge is not on the panel. The pending
 * applicant signed in under a club that admits by approval; the suspended member signed in before
 * an admin suspended them.
 */
const KINDS = {
	anonymous: { role: null },
	pending: { role: null, applicant: true },
	// A member suspended after signing in: their session is still in the database, and the hooks
	// treat it as no session at all.
	suspended: { role: null },
	member: { role: 'member' },
	panelJudge: { role: 'judge' },
	conflictedJudge: { role: 'judge' },
	otherJudge: { role: 'judge' },
	admin: { role: 'admin' },
	owner: { role: 'member' }
} satisfies Record<string, Kind>;

type Viewer = keyof typeof KINDS;
/** The order the requests of a row are sent in: the owner last, so a row that ends one of their things does it after everyone else tried. */
const VIEWERS = Object.keys(KINDS) as Viewer[];
type Expect = Record<Viewer, number>;

/** A row's statuses, worked out per kind of viewer. */
const by = (status: (kind: Kind, viewer: Viewer) => number): Expect =>
	Object.fromEntries(VIEWERS.map((viewer) => [viewer, status(KINDS[viewer], viewer)])) as Expect;

const everyone = (status: number) => by(() => status);
/** Pages: signed-out visitors are sent to sign in. */
const signedIn = (status: number) => by((k) => (k.role ? status : 303));
/** JSON: signed-out visitors get 401, applicants 403. */
const notMemberApi = (k: Kind) => (k.applicant ? 403 : 401);
const apiSignedIn = (status: number) => by((k) => (k.role ? status : notMemberApi(k)));
const adminOnly = (status: number) => by((k) => (!k.role ? 303 : k.role === 'admin' ? status : 403));
const judgesOnly = (status: number) => by((k) => (!k.role ? 303 : k.role === 'member' ? 403 : status));
const judgeApi = (status: number) => by((k) => (!k.role ? notMemberApi(k) : k.role === 'member' ? 403 : status));
/** The owner's own page or action: anyone else signed in finds nothing. */
const ownerOnly = (status: number) => by((k, v) => (!k.role ? 303 : v === 'owner' ? status : 404));
/** Something that exists for its owner alone, signed out included: everyone else gets 404. */
const hidden = (ownerStatus = 404) => by((_, v) => (v === 'owner' ? ownerStatus : 404));

// ---- The rows --------------------------------------------------------------------------------

type Form = Record<string, string | string[]>;
interface Row {
	method?: 'GET' | 'POST' | 'PUT' | 'DELETE';
	/** With placeholders (see pathOf below). */
	path: string;
	/** Read when the request is sent, for the viewer sending it. */
	form?: (viewer: Viewer) => Form | Promise<Form>;
	json?: unknown;
	expect: Expect;
	api?: boolean;
	/** Where a 303 may point, by viewer; otherwise to sign-in with the way back (an applicant: to their membership page). */
	redirect?: Partial<Record<Viewer, RegExp>>;
	/** The request ends the viewer's session: send it as a new person with the same role. */
	endsSession?: true;
}

const SIGN_IN = /^\/signin\?redirectTo=/;
const MEMBERSHIP = /^\/membership$/;
const HOME = /^\/$/;
const toEvery = (pattern: RegExp): Partial<Record<Viewer, RegExp>> => Object.fromEntries(VIEWERS.map((v) => [v, pattern]));

let people: Record<Exclude<Viewer, 'anonymous'>, TestPerson>;
/** Things of the owner's: a club-visible tank, an entry of it, a task of its schedule, two comments on the entry. */
let targetTank: number;
let targetEntry: number;
let targetTask: number;
let targetComment: number;
let ownerComment: number;
/** A water test of the owner's tank. */
let targetWaterTest: number;
/** A private tank of the owner's, an entry of it and a photo on that entry. */
let privateTank: number;
let privateEntry: number;
let privatePhoto: number;
/** A photo the owner uploaded and has not saved with anything yet. */
let pendingPhoto: number;
/** An open listing of the owner's, and a conversation about it with another member. */
let targetListing: number;
let targetThread: number;
/** A care plan of the owner's for `:tank`, nobody asked to look in yet. */
let targetPlan: number;
/** A published members-only news post (mailed to judges), and a draft. */
let clubPost: number;
let draftPost: number;
/** A contest being judged with one entry, the owner's; the panel judge's card of it. */
let contest: Fixture;
let cardId: number;
const blankCard = { baseVersion: 0, saveId: 'guard-test-save', fields: { scores: {}, comments: {}, entrantComment: '', panelNote: '' } };

const rows: Row[] = [
	// The club: account, sign-in, members.
	{ path: '/account', expect: signedIn(200) },
	{ path: '/welcome', expect: signedIn(200) },
	{ path: '/admin', expect: adminOnly(200) },
	{ path: '/admin/members', expect: adminOnly(200) },
	{ path: '/admin/mail', expect: adminOnly(200) },
	{ path: '/admin/mail/999999999', expect: adminOnly(404) },
	{ path: '/account/data', expect: signedIn(200) },
	// A confirmation that is not the viewer's name is refused at its field; nothing is deleted.
	{ method: 'POST', path: '/account/data?/delete', form: () => ({ confirm: 'not my name' }), expect: signedIn(400) },
	// Membership: the owner is an active member, so there is nothing to reinstate; no reason, no suspension or removal.
	{ method: 'POST', path: '/admin/members?/suspend', form: () => ({ userId: people.owner.id, reason: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/members?/reinstate', form: () => ({ userId: people.owner.id }), expect: adminOnly(409) },
	{ method: 'POST', path: '/admin/members?/remove', form: () => ({ userId: people.owner.id, reason: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/members?/decide', form: () => ({}), expect: adminOnly(400) },
	{ path: '/admin/invitations', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/invitations?/invite', form: () => ({ addresses: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/invitations?/resend', form: () => ({ id: '0' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/invitations?/revoke', form: () => ({ id: '0' }), expect: adminOnly(400) },
	{ path: '/admin/settings', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/settings', form: () => ({ name: '' }), expect: adminOnly(400) },
	{ path: '/admin/audit', expect: adminOnly(200) },
	{ path: '/admin/audit/export.csv', expect: adminOnly(200) },
	// Everyone signed in is told where they stand; only an applicant may send a request to join.
	{ path: '/membership', expect: by((k) => (k.role || k.applicant ? 200 : 303)) },
	{
		method: 'POST',
		path: '/membership?/request',
		form: () => ({ displayName: 'Guard Applicant', note: 'I keep a small planted tank.' }),
		expect: by((k) => (k.role ? 409 : k.applicant ? 200 : 303))
	},
	{ path: '/members', expect: signedIn(200) },
	{ method: 'POST', path: '/members?/listing', form: () => ({ listed: 'maybe' }), expect: signedIn(400) },
	{ path: '/join/not-a-real-invitation-token', expect: hidden() },
	{ method: 'POST', path: '/join/not-a-real-invitation-token', form: () => ({}), expect: hidden() },
	{ method: 'POST', path: '/api/me/time-zone', api: true, json: { timeZone: 'Europe/Lisbon' }, expect: apiSignedIn(200) },
	{ method: 'POST', path: '/admin/members?/role', form: () => ({ userId: people.owner.id, role: 'member' }), expect: adminOnly(200) },
	{
		method: 'POST',
		path: '/account?/profile',
		form: () => ({ units: 'metric', locationMode: 'none', notifyMessages: 'hourly', homeLat: '', homeLng: '', displayName: 'Guard Test' }),
		expect: signedIn(200)
	},
	{ method: 'POST', path: '/account?/revoke', form: () => ({ handle: 'no-such-session' }), expect: signedIn(404) },
	{
		method: 'POST',
		path: '/account?/revokeAll',
		form: () => ({}),
		expect: everyone(303),
		endsSession: true,
		redirect: { ...toEvery(/^\/signin\?signedOutEverywhere=1$/), anonymous: SIGN_IN, suspended: SIGN_IN, pending: MEMBERSHIP }
	},
	{ method: 'POST', path: '/welcome', form: () => ({ displayName: '' }), expect: signedIn(400) },
	// Anyone signed in is sent on: a member home, an applicant to their membership page.
	{ path: '/signin', expect: by((k) => (k.role || k.applicant ? 303 : 200)), redirect: { ...toEvery(HOME), pending: MEMBERSHIP } },
	// Refused at the field; a signed-in visitor is then sent on, as the page itself does.
	{
		method: 'POST',
		path: '/signin',
		form: () => ({ email: 'not-an-address' }),
		expect: by((k) => (k.role || k.applicant ? 303 : 400)),
		redirect: { ...toEvery(HOME), pending: MEMBERSHIP }
	},
	{ path: '/signout', expect: everyone(303), redirect: toEvery(HOME) },
	{ method: 'POST', path: '/signout', form: () => ({}), expect: everyone(302), endsSession: true },
	{ path: '/unsubscribe/0123456789abcdef0123456789abcdef', expect: hidden() },
	{ method: 'POST', path: '/unsubscribe/0123456789abcdef0123456789abcdef', form: () => ({ announcements: 'on' }), expect: hidden() },
	{ path: '/media/:photo/thumb', expect: hidden(200) },
	{ path: '/media/:privatePhoto/thumb', expect: hidden(200) },
	// An applicant learns who they are signed in as, with no role.
	{ path: '/api/me', api: true, expect: by((k) => (k.role || k.applicant ? 200 : 401)) },
	{ path: '/members/:member', expect: signedIn(200) },
	{ method: 'POST', path: '/members/not-a-member?/block', form: () => ({}), expect: signedIn(404) },
	{ method: 'POST', path: '/members/not-a-member?/unblock', form: () => ({}), expect: signedIn(404) },

	// Journals. `:tank` is visible to the club, `:privateTank` to its owner alone.
	// The home page sends an applicant to where their membership stands.
	{ path: '/', expect: by((k) => (k.applicant ? 303 : 200)) },
	{ method: 'POST', path: '/?/done', form: () => ({ taskId: String(targetTask) }), expect: ownerOnly(200) },
	{ path: '/journals', expect: signedIn(200) },
	{ path: '/journals/new', expect: signedIn(200) },
	{ method: 'POST', path: '/journals/new', form: () => ({ name: '' }), expect: signedIn(400) },
	{ path: '/journals/showcase', expect: everyone(200) },
	{ path: '/journals/dose?tank=:tank', expect: everyone(200) },
	{ method: 'POST', path: '/journals/dose?/log', form: () => ({ tank: String(targetTank), salt: 'KNO3', grams: '1' }), expect: ownerOnly(200) },
	{ path: '/journals/:tank', expect: by((k) => (k.role ? 200 : 404)) },
	{ path: '/journals/:privateTank', expect: hidden(200) },
	{ path: '/journals/:tank/feed.xml', expect: hidden() },
	{ path: '/api/tanks/:tank/water-tests', api: true, expect: by((k) => (k.role ? 200 : 404)) },
	{ path: '/api/tanks/:privateTank/water-tests', api: true, expect: hidden(200) },
	{ path: '/journals/:tank/edit', expect: ownerOnly(200) },
	{ method: 'POST', path: '/journals/:tank/edit', form: () => ({ name: 'Taken over' }), expect: ownerOnly(400) },
	// Before the tank was set up: refused at the field for its owner.
	{ method: 'POST', path: '/journals/:tank?/retire', form: () => ({ retiredOn: '2026-01-01', retiredNote: '' }), expect: ownerOnly(400) },
	// A running tank: reopening it changes nothing.
	{ method: 'POST', path: '/journals/:tank?/reopen', form: () => ({}), expect: ownerOnly(303), redirect: { owner: /^\/journals\/\d+$/ } },
	// The owner types a wrong name, so the tank stays.
	{
		method: 'POST',
		path: '/journals/:tank?/delete',
		form: (v) => ({ confirmName: v === 'owner' ? 'Not its name' : 'Guard tank' }),
		expect: ownerOnly(400)
	},
	{ method: 'POST', path: '/journals/:tank?/admire', form: () => ({ want: 'on' }), expect: { ...signedIn(200), owner: 400 } },
	{ method: 'POST', path: '/journals/:tank?/follow', form: () => ({ want: 'on' }), expect: { ...signedIn(200), owner: 400 } },
	{ method: 'POST', path: '/journals/:tank?/done', form: () => ({ taskId: String(targetTask) }), expect: ownerOnly(200) },
	// Ids of nothing of the owner's: not found for the owner too.
	{ method: 'POST', path: '/journals/:tank?/undoEvent', form: () => ({ eventId: '1' }), expect: ownerOnly(404) },
	{ method: 'POST', path: '/journals/:tank?/deleteTest', form: () => ({ testId: '1' }), expect: ownerOnly(404) },
	{ path: '/journals/:tank/entries/new', expect: ownerOnly(200) },
	{
		method: 'POST',
		path: '/journals/:tank/entries/new',
		form: () => ({ entryOn: '2026-02-01', body: 'Taken over' }),
		expect: ownerOnly(303),
		redirect: { owner: /^\/journals\/\d+\/entries\/\d+/ }
	},
	{ path: '/journals/:tank/entries/:entry', expect: by((k) => (k.role ? 200 : 404)) },
	{ path: '/journals/:privateTank/entries/:privateEntry', expect: hidden(200) },
	{ method: 'POST', path: '/journals/:tank/entries/:entry?/comment', form: () => ({ comment: 'Looks good.' }), expect: signedIn(200) },
	{ method: 'POST', path: '/journals/:privateTank/entries/:privateEntry?/comment', form: () => ({ comment: 'Looks good.' }), expect: ownerOnly(200) },
	// Anyone who may see the entry answers a comment; only its author (the owner here) changes it, admins included get "not found".
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry?/reply',
		form: () => ({ commentId: String(targetComment), reply: 'Agreed.' }),
		expect: signedIn(200)
	},
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry?/editComment',
		form: () => ({ commentId: String(targetComment), body: 'Changed' }),
		expect: ownerOnly(200)
	},
	// Admins remove anyone's comment, the keeper any on their entries (the owner takes another one).
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry?/removeComment',
		form: (v) => ({ commentId: String(v === 'owner' ? ownerComment : targetComment) }),
		expect: { ...ownerOnly(200), admin: 200 }
	},
	{ path: '/journals/:tank/entries/:entry/edit', expect: ownerOnly(200) },
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry/edit',
		form: () => ({ entryOn: '2026-02-01', body: 'Taken over' }),
		expect: ownerOnly(303),
		redirect: { owner: /^\/journals\/\d+\/entries\/\d+/ }
	},
	{ path: '/journals/:tank/water-tests/new', expect: ownerOnly(200) },
	{ path: '/journals/:tank/water-tests/:waterTest/edit', expect: ownerOnly(200) },
	{
		method: 'POST',
		path: '/journals/:tank/water-tests/:waterTest/edit',
		form: () => ({ testedOn: '2026-02-01', ph: '7.2' }),
		expect: ownerOnly(303),
		redirect: { owner: /^\/journals\/\d+\?testEdited=1/ }
	},
	{
		method: 'POST',
		path: '/journals/:tank/water-tests/new',
		form: () => ({ testedOn: '2026-02-01', ph: '7' }),
		expect: ownerOnly(303),
		redirect: { owner: /^\/journals\/\d+/ }
	},
	{ path: '/journals/:tank/schedule', expect: ownerOnly(200) },
	{
		method: 'POST',
		path: '/journals/:tank/schedule',
		form: (v) =>
			v === 'owner'
				? { 'tasks[0][kind]': 'other', 'tasks[0][label]': '', 'tasks[0][intervalDays]': '0' }
				: { 'tasks[0][kind]': 'other', 'tasks[0][label]': 'Taken over', 'tasks[0][intervalDays]': '3' },
		expect: ownerOnly(400)
	},
	{ path: '/api/species?q=rotala', api: true, expect: apiSignedIn(200) },
	{ method: 'POST', path: '/api/markdown/preview', api: true, json: { text: '*hi*' }, expect: apiSignedIn(200) },
	{ method: 'POST', path: '/api/media', api: true, form: () => ({ note: 'no file here' }), expect: apiSignedIn(400) },
	{ method: 'DELETE', path: '/api/media/999999999', api: true, expect: apiSignedIn(404) },
	// Someone else's upload is not found; the owner's own (not attached yet) is theirs to discard: that row is among the last.

	// The swap board. `:thread` is a conversation about the owner's listing with another member
	// (not one of the columns): it does not exist for anyone but its two members.
	{ path: '/swaps', expect: signedIn(200) },
	{ path: '/swaps/new', expect: signedIn(200) },
	{ method: 'POST', path: '/swaps/new', form: () => ({ title: '' }), expect: signedIn(400) },
	{ path: '/swaps/mine', expect: signedIn(200) },
	{ method: 'POST', path: '/swaps/mine?/unblock', form: () => ({ memberId: people.owner.id }), expect: signedIn(200) },
	{ path: '/swaps/:listing', expect: signedIn(200) },
	{ path: '/swaps/:listing/edit', expect: ownerOnly(200) },
	{ method: 'POST', path: '/swaps/:listing/edit', form: () => ({ title: 'Taken over' }), expect: ownerOnly(400) },
	// Nothing is reserved: the owner's steps that need a reservation are refused.
	{ method: 'POST', path: '/swaps/:listing?/release', form: () => ({}), expect: ownerOnly(409) },
	{ method: 'POST', path: '/swaps/:listing?/confirm', form: () => ({}), expect: ownerOnly(409) },
	{ method: 'POST', path: '/swaps/:listing?/extend', form: () => ({}), expect: ownerOnly(303), redirect: { owner: /^\/swaps\/\d+$/ } },
	{ method: 'POST', path: '/swaps/:listing?/request', form: () => ({ body: '' }), expect: signedIn(400) },
	{ method: 'POST', path: '/swaps/:listing?/report', form: () => ({ reason: 'no' }), expect: signedIn(400) },
	{ path: '/swaps/threads/:thread', expect: hidden(200) },
	{
		method: 'POST',
		path: '/swaps/threads/:thread?/send',
		form: () => ({ body: 'hello' }),
		expect: hidden(303),
		redirect: { owner: /^\/swaps\/threads\/\d+$/ }
	},
	{ method: 'POST', path: '/swaps/threads/:thread?/propose', form: () => ({ body: 'hello' }), expect: hidden(400) },
	// Nothing is reserved, so there is no pickup to agree on.
	{ method: 'POST', path: '/swaps/threads/:thread?/confirmPickup', form: () => ({ proposalId: '1' }), expect: hidden(409) },
	// The owner accepts the other member, releases them again, and cannot hand over what is not reserved.
	{ method: 'POST', path: '/swaps/threads/:thread?/accept', form: () => ({}), expect: hidden(303), redirect: { owner: /^\/swaps\/threads\/\d+$/ } },
	{ method: 'POST', path: '/swaps/threads/:thread?/release', form: () => ({}), expect: hidden(303), redirect: { owner: /^\/swaps\/threads\/\d+$/ } },
	{ method: 'POST', path: '/swaps/threads/:thread?/handover', form: () => ({}), expect: hidden(409) },
	{ method: 'POST', path: '/swaps/threads/:thread?/block', form: () => ({}), expect: hidden(303), redirect: { owner: /^\/swaps\/threads\/\d+$/ } },
	{ method: 'POST', path: '/swaps/threads/:thread?/unblock', form: () => ({}), expect: hidden(303), redirect: { owner: /^\/swaps\/threads\/\d+$/ } },
	{ method: 'POST', path: '/swaps/threads/:thread?/report', form: () => ({ messageId: '0', reason: 'hello' }), expect: hidden(404) },
	{ path: '/api/swaps/listings', api: true, expect: apiSignedIn(200) },
	{ path: '/api/swaps/threads/:thread/messages', api: true, expect: hidden(200) },
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

	// Contests. `:contest` is being judged; `:contestEntry` is the owner's entry in it, `:number`
	// its number, `:card` the panel judge's card of it.
	{ path: '/contests', expect: everyone(200) },
	{ path: '/contests/:contest', expect: everyone(200) },
	// Nothing is published while the contest is being judged, not even to the entrant.
	{ path: '/contests/:contest/results/:category', expect: hidden() },
	{ path: '/contests/:contest/enter', expect: signedIn(200) },
	{ method: 'POST', path: '/contests/:contest/enter', form: () => ({ statement: '' }), expect: signedIn(400) },
	{ path: '/contests/:contest/entries/:contestEntry', expect: { ...ownerOnly(200), admin: 200 } },
	// Its owner sees the form (saying entries are closed); an incomplete one is refused at the fields.
	{ path: '/contests/:contest/entries/:contestEntry/edit', expect: ownerOnly(200) },
	{ method: 'POST', path: '/contests/:contest/entries/:contestEntry/edit', form: () => ({ statement: 'Taken over' }), expect: ownerOnly(400) },
	{ path: '/judging', expect: judgesOnly(200) },
	// Admins do not judge; a judge off the panel finds nothing, nor one who stepped back from the entry.
	{ path: '/judging/:contest', expect: { ...judgesOnly(404), panelJudge: 200, conflictedJudge: 200 } },
	{ path: '/judging/:contest/:number', expect: { ...judgesOnly(404), panelJudge: 200 } },
	{ path: '/judging/:contest/:number/photos/1/thumb', expect: { ...judgesOnly(404), panelJudge: 200 } },
	// The panel judge leaves the box unticked, so they stay on the entry.
	{
		method: 'POST',
		path: '/judging/:contest/:number?/conflict',
		form: (v): Form => (v === 'panelJudge' ? { reason: 'guard test' } : { reason: 'guard test', confirm: 'yes' }),
		expect: { ...judgesOnly(404), panelJudge: 400 }
	},
	{ path: '/api/judging/:contest/:number/card', api: true, expect: { ...judgeApi(404), panelJudge: 200 } },
	// A save based on version 0 of a card at version 1 is a conflict; a card with a score missing cannot be submitted; reopening a draft leaves it as it is.
	{ method: 'PUT', path: '/api/judging/:contest/:number/card', api: true, json: blankCard, expect: { ...judgeApi(404), panelJudge: 409 } },
	{ method: 'POST', path: '/api/judging/:contest/:number/card/submit', api: true, json: { version: 1 }, expect: { ...judgeApi(404), panelJudge: 400 } },
	{ method: 'POST', path: '/api/judging/:contest/:number/card/reopen', api: true, json: {}, expect: { ...judgeApi(404), panelJudge: 200 } },
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
	{ path: '/journals/:tank/away', expect: ownerOnly(200) },
	// A period that began long ago is refused at its field for the keeper.
	{
		method: 'POST',
		path: '/journals/:tank/away',
		form: () => ({ startsOn: '2026-01-01', endsOn: '2026-01-02', feeding: 'none', lighting: 'keep' }),
		expect: ownerOnly(400)
	},
	{ path: '/away', expect: signedIn(200) },
	{ method: 'POST', path: '/away?/answer', form: () => ({ request: '999999999', answer: 'yes' }), expect: signedIn(404) },
	{ method: 'POST', path: '/away?/helper', form: () => ({ helper: 'off' }), expect: signedIn(200) },
	{ path: '/away/:plan', expect: ownerOnly(200) },
	{ path: '/away/:plan/print', expect: ownerOnly(200) },
	{ path: '/away/:plan/summary', expect: ownerOnly(200) },
	{ method: 'POST', path: '/away/:plan?/save', form: () => ({ body: 'Look in every other day.' }), expect: ownerOnly(200) },
	// Not a member's id: refused at the field.
	{ method: 'POST', path: '/away/:plan?/ask', form: () => ({ sitterId: 'nobody' }), expect: ownerOnly(400) },
	{ method: 'POST', path: '/away/:plan?/withdraw', form: () => ({ request: '1' }), expect: ownerOnly(404) },
	{ method: 'POST', path: '/away/:plan?/share', form: () => ({}), expect: ownerOnly(200) },
	{ method: 'POST', path: '/away/:plan?/unshare', form: () => ({}), expect: ownerOnly(200) },
	{ method: 'POST', path: '/away/:plan?/visitMail', form: () => ({ visitMail: 'daily' }), expect: ownerOnly(200) },
	// The keeper is not their own sitter (and the period has not begun).
	{ method: 'POST', path: '/away/:plan?/visit', form: () => ({ done: 'Looked', note: 'x' }), expect: ownerOnly(409) },
	{ path: '/away/shared/not-a-real-token-of-any-plan-00000', expect: everyone(404) },

	// Notification settings and club news.
	{ path: '/account/notifications', expect: signedIn(200) },
	{ method: 'POST', path: '/account/notifications', form: () => ({ swaps: 'sometimes' }), expect: signedIn(400) },
	{ path: '/news', expect: everyone(200) },
	{ path: '/news/feed.xml', expect: everyone(200) },
	// A members-only post does not exist for anyone who is not a member; a draft for nobody outside the admin pages.
	{ path: '/news/:clubPost', expect: by((k) => (k.role ? 200 : 404)) },
	{ path: '/news/:draftPost', expect: everyone(404) },
	{ path: '/admin/news', expect: adminOnly(200) },
	{ path: '/admin/news/new', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/news/new', form: () => ({ title: '' }), expect: adminOnly(400) },
	{ path: '/admin/news/:draftPost', expect: adminOnly(200) },
	{ path: '/admin/news/999999999', expect: adminOnly(404) },
	{ path: '/admin/news/:draftPost/status', expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/news/:draftPost?/save', form: () => ({ title: '' }), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/news/:draftPost?/test', form: () => ({}), expect: adminOnly(200) },
	{ method: 'POST', path: '/admin/news/:draftPost?/publish', form: () => ({}), expect: adminOnly(400) },
	{ method: 'POST', path: '/admin/news/999999999?/delete', form: () => ({}), expect: adminOnly(404) },

	// Last, the rows that end something of the owner's (the owner's request is the last of each row).
	{ method: 'DELETE', path: '/api/media/:photo', api: true, expect: by((k, v) => (!k.role ? notMemberApi(k) : v === 'owner' ? 204 : 404)) },
	{
		method: 'POST',
		path: '/journals/:tank/entries/:entry?/delete',
		form: () => ({}),
		expect: ownerOnly(303),
		redirect: { owner: /^\/journals\/\d+\?entryDeleted=1$/ }
	},
	{ method: 'POST', path: '/swaps/:listing?/withdraw', form: () => ({}), expect: ownerOnly(303), redirect: { owner: /^\/swaps\/\d+$/ } },
	// Entries cannot be withdrawn once judging started.
	{ method: 'POST', path: '/contests/:contest/entries/:contestEntry?/withdraw', form: () => ({ confirm: 'withdraw' }), expect: ownerOnly(409) }
];

/** Someone who signed in and is not (or no longer) a member: their session stays in the database. */
async function personIn(state: 'pending' | 'suspended'): Promise<TestPerson> {
	const person = await makePerson({ role: 'member', label: state });
	await db.update(users).set({ state }).where(eq(users.id, person.id));
	return person;
}

/** Who sends a row's requests as this viewer: a new person of the same kind when the row ends their session. */
async function personFor(viewer: Exclude<Viewer, 'anonymous'>, endsSession: boolean): Promise<TestPerson> {
	if (!endsSession) return people[viewer];
	if (viewer === 'pending' || viewer === 'suspended') return personIn(viewer);
	return makePerson({ role: people[viewer].role });
}

async function makeViewers(owner: TestPerson, fixture: Fixture): Promise<typeof people> {
	return {
		pending: await personIn('pending'),
		suspended: await personIn('suspended'),
		member: await makePerson({ role: 'member' }),
		panelJudge: fixture.judges[0]!,
		conflictedJudge: fixture.judges[1]!,
		otherJudge: await makePerson({ role: 'judge' }),
		admin: await makePerson({ role: 'admin' }),
		owner
	};
}

beforeAll(async () => {
	const owner = await makePerson({ role: 'member', label: 'owner' });
	const keeper = viewerOf(owner);
	targetTank = await tanks.create(keeper, tankInput({ name: 'Guard tank', visibility: 'club' }));
	targetEntry = await entries.create(keeper, targetTank, { entryOn: '2026-02-01', title: 'Guard entry', body: 'Planted.', events: [] }, []);
	await upkeep.saveSchedule(keeper, targetTank, [{ kind: 'water-change', filterPart: null, label: 'Water change', intervalDays: 7 }]);
	targetTask = (await upkeep.listForTank(targetTank))[0]!.id;
	targetComment = await entries.addComment(keeper, targetTank, targetEntry, 'Keeper’s own note.');
	ownerComment = await entries.addComment(keeper, targetTank, targetEntry, 'Keeper’s second note.');
	targetWaterTest = await water.create(keeper, targetTank, { ...emptyTest, testedOn: '2026-02-01', ph: 7 });
	privateTank = await tanks.create(keeper, tankInput({ name: 'Private guard tank', visibility: 'private' }));
	const entryPhoto = await photoOf(owner);
	privateEntry = await entries.create(keeper, privateTank, { entryOn: '2026-02-01', title: 'Private entry', body: 'Quiet.', events: [] }, [
		{ id: entryPhoto.id, alt: 'The tank', caption: '' }
	]);
	privatePhoto = entryPhoto.id;
	pendingPhoto = (await photoOf(owner)).id;
	await placePerson(owner, { lat: -50.5, lng: -30.5 });
	targetListing = await createListing(owner, { title: 'Guard listing' });
	const asker = await makePerson({ label: 'guard-asker' });
	targetThread = await threads.request(viewerOf(asker), targetListing, 'A guarded question');
	contest = await contestFixture({ judges: 2, entrants: [owner] });
	const number = contest.entries[0]!.number!;
	await judging.saveCard(viewerOf(contest.judges[0]!), contest.contestId, number, {
		baseVersion: 0,
		saveId: crypto.randomUUID(),
		fields: fields(contest.criteria, [5, null])
	});
	await judging.declareConflict(viewerOf(contest.judges[1]!), contest.contestId, number, 'I helped set this tank up.');
	cardId = await cardIdOf(contest.entries[0]!.entryId, contest.judges[0]!.id);
	const todayNumber = dayNumber(today());
	targetPlan = await plans.start(keeper, targetTank, {
		startsOn: isoDay(todayNumber + 1),
		endsOn: isoDay(todayNumber + 6),
		feeding: 'none',
		lighting: 'keep',
		keeperPhone: '',
		evaporationLitresPerDay: null
	});
	people = await makeViewers(owner, contest);
	const newsInput = { title: 'Guard news', body: 'x', visibility: 'members' as const, audienceKind: 'judges' as const };
	clubPost = await news.create(viewerOf(people.admin), newsInput);
	await news.publish(viewerOf(people.admin), clubPost);
	draftPost = await news.create(viewerOf(people.admin), newsInput);
});

/** A row's path with its placeholders filled in. */
const pathOf = (row: Row) =>
	row.path
		.replaceAll(':privateTank', String(privateTank))
		.replaceAll(':privateEntry', String(privateEntry))
		.replaceAll(':privatePhoto', String(privatePhoto))
		.replaceAll(':tank', String(targetTank))
		.replaceAll(':waterTest', String(targetWaterTest))
		.replaceAll(':contestEntry', String(contest.entries[0]!.entryId))
		.replaceAll(':entry', String(targetEntry))
		.replaceAll(':listing', String(targetListing))
		.replaceAll(':thread', String(targetThread))
		.replaceAll(':member', people.owner.id)
		.replaceAll(':contest', String(contest.contestId))
		.replaceAll(':number', String(contest.entries[0]!.number))
		.replaceAll(':category', String(contest.categories[0]))
		.replaceAll(':card', String(cardId))
		.replaceAll(':plan', String(targetPlan))
		.replaceAll(':clubPost', String(clubPost))
		.replaceAll(':draftPost', String(draftPost))
		.replaceAll(':photo', String(pendingPhoto));

/**
 * Fields no form or body of ours takes from the client, sent with every request of the table
 * (under the row's own fields): who owns or wrote something, roles, states, ids. The last test
 * checks that none of them took.
 */
const extras = (): Record<string, string> => ({
	id: String(targetTank),
	userId: people.member.id,
	ownerId: people.member.id,
	authorId: people.member.id,
	entrantId: people.member.id,
	judgeId: people.otherJudge.id,
	senderId: people.member.id,
	recipientId: people.member.id,
	role: 'admin',
	state: 'published',
	status: 'submitted',
	visibility: 'public',
	emailVerified: '2020-01-01',
	version: '99'
});

describe('the access matrix', () => {
	let operations: Operation[];
	beforeAll(async () => {
		operations = await discoverOperations();
	});

	test('has a row for every page load, form action and endpoint method', () => {
		expect(operations.length).toBeGreaterThan(50);
		const covered = new Set(rows.flatMap((row) => operationFor(operations, row.method ?? 'GET', row.path) ?? []).map(operationKey));
		const missing = operations.filter((op) => !covered.has(operationKey(op))).map(describeOperation);
		expect(missing, 'Add a row for each of these to the table in access-matrix.test.ts').toEqual([]);
	});

	test('has no row that stands for nothing', () => {
		const stray = rows.filter((row) => !operationFor(operations, row.method ?? 'GET', row.path)).map((row) => `${row.method ?? 'GET'} ${row.path}`);
		expect(stray).toEqual([]);
	});
});

describe('access by kind of viewer', () => {
	for (const row of rows) {
		for (const viewer of VIEWERS) {
			test(`${row.method ?? 'GET'} ${row.path} as ${viewer} → ${row.expect[viewer]}`, async () => {
				const person = viewer === 'anonymous' ? undefined : await personFor(viewer, row.endsSession === true);
				const response = await request(pathOf(row), {
					method: row.method ?? 'GET',
					cookie: person?.cookie,
					form: row.form && { ...extras(), ...(await row.form(viewer)) },
					json: row.json && typeof row.json === 'object' ? { ...extras(), ...row.json } : row.json,
					accept: row.api ? 'application/json' : 'text/html'
				});
				expect(response.status).toBe(row.expect[viewer]);
				if (response.status === 303) expect(response.headers.get('location')).toMatch(row.redirect?.[viewer] ?? (viewer === 'pending' ? MEMBERSHIP : SIGN_IN));
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

describe('fields the client may not set', () => {
	test('sent with every request above, none of them took: roles, owners, states and the card are as they were', async () => {
		const roles = await db
			.select({ id: users.id, role: users.role })
			.from(users)
			.where(
				inArray(
					users.id,
					Object.values(people).map((p) => p.id)
				)
			);
		expect(Object.fromEntries(roles.map((r) => [r.id, r.role]))).toEqual(Object.fromEntries(Object.values(people).map((p) => [p.id, p.role])));
		const states = await db
			.select({ id: users.id, state: users.state })
			.from(users)
			.where(inArray(users.id, [people.pending.id, people.suspended.id, people.owner.id]));
		expect(Object.fromEntries(states.map((r) => [r.id, r.state]))).toEqual({
			[people.pending.id]: 'pending',
			[people.suspended.id]: 'suspended',
			[people.owner.id]: 'active'
		});
		const [tank] = await db.select().from(tankTable).where(eq(tankTable.id, targetTank));
		expect(tank).toMatchObject({ ownerId: people.owner.id, visibility: 'club' });
		const [hidden] = await db.select().from(tankTable).where(eq(tankTable.id, privateTank));
		expect(hidden).toMatchObject({ ownerId: people.owner.id, visibility: 'private' });
		const [row] = await db.select({ state: contests.state }).from(contests).where(eq(contests.id, contest.contestId));
		expect(row?.state).toBe('judging');
		const [card] = await db.select().from(contestCards).where(eq(contestCards.id, cardId));
		expect(card).toMatchObject({ judgeId: people.panelJudge.id, status: 'draft', version: 1 });
		const comments = await db.select({ authorId: entryComments.authorId }).from(entryComments).where(eq(entryComments.entryId, privateEntry));
		expect(comments.map((c) => c.authorId)).toEqual([people.owner.id]);
	});
});
