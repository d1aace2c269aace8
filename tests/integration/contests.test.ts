// Contest judging through the running app and the contest functions: blind judging, conflicts,
// autosave versions under concurrency, publication, results, announcement, export and reminders.
import { describe, expect, test } from 'vitest';
import { and, asc, eq, like } from 'drizzle-orm';
import { parse } from 'csv-parse/sync';
import { db } from '../../src/lib/server/db';
import { auditLog } from '../../src/lib/server/audit/schema';
import { outbox } from '../../src/lib/server/mail/schema';
import { contestCards, contestEntries } from '../../src/lib/server/contests/schema';
import { tanks } from '../../src/lib/server/journals/schema';
import * as contests from '../../src/lib/server/contests/contests';
import * as entries from '../../src/lib/server/contests/contest-entries';
import * as judging from '../../src/lib/server/contests/judging';
import * as panel from '../../src/lib/server/contests/panel';
import * as announce from '../../src/lib/server/contests/announce';
import { DomainError } from '../../src/lib/errors';
import type { Photo } from '../../src/lib/server/media';
import { inputOf, loadData, publicResults, transition } from '../../src/lib/server/contests/review';
import { sendDueReminders } from '../../src/lib/server/contests/reminders';
import { computeResults } from '../../src/lib/contests/results';
import { request } from '../helpers/http';
import { makePerson } from '../helpers/people';
import { waitForMail } from '../helpers/mail';
import { contestFixture, fields, openTank, photoOf, scoreAll, smallTank, viewerOf } from '../helpers/contests';

const api = (contestId: number, number: number | null, tail = '') => `/api/judging/${contestId}/${number}/card${tail}`;
const save = (cookie: string, contestId: number, number: number | null, body: unknown) =>
	request(api(contestId, number), { cookie, method: 'PUT', json: body, accept: 'application/json' });

describe('judges never reach their own entries or conflicted ones', () => {
	test('a judge who entered a tank cannot load, save or see the page for it; a conflict removes them from an entry', async () => {
		const judgeWhoEnters = await makePerson({ role: 'judge', label: 'judge-entrant' });
		const other = await makePerson({ label: 'entrant' });
		const f = await contestFixture({ judges: 2, entrants: [judgeWhoEnters, other] });
		await panel.assign(viewerOf(f.admin), f.contestId, judgeWhoEnters.id);
		const own = f.entries[0]!;
		const theirs = f.entries[1]!;
		const cookie = judgeWhoEnters.cookie;

		for (const response of [
			await request(api(f.contestId, own.number), { cookie, accept: 'application/json' }),
			await save(cookie, f.contestId, own.number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [5, 3]) }),
			await request(api(f.contestId, own.number, '/submit'), { cookie, json: { version: 1 }, accept: 'application/json' }),
			await request(`/judging/${f.contestId}/${own.number}`, { cookie })
		]) {
			expect(response.status).toBe(404);
		}
		expect(await db.select().from(contestCards).where(eq(contestCards.entryId, own.entryId))).toHaveLength(0);
		// Their own entry is not in their list either.
		const list = await (await request(`/judging/${f.contestId}`, { cookie })).text();
		expect(list).not.toContain(`href="/judging/${f.contestId}/${own.number}"`);
		expect(list).toContain(`href="/judging/${f.contestId}/${theirs.number}"`);

		// A draft, then a declared conflict: the draft goes, and so does access.
		expect(
			(await save(cookie, f.contestId, theirs.number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [5, null]) })).status
		).toBe(200);
		const photo = `/judging/${f.contestId}/${theirs.number}/photos/1/thumb`;
		expect((await request(photo, { cookie, accept: 'image/webp' })).status).toBe(200);
		const declared = await request(`/judging/${f.contestId}/${theirs.number}?/conflict`, { cookie, form: { reason: 'I know this tank', confirm: 'yes' } });
		expect(declared.status).toBe(303);
		expect(
			await db
				.select()
				.from(contestCards)
				.where(and(eq(contestCards.entryId, theirs.entryId), eq(contestCards.judgeId, judgeWhoEnters.id)))
		).toHaveLength(0);
		expect((await request(api(f.contestId, theirs.number), { cookie, accept: 'application/json' })).status).toBe(404);
		expect((await save(cookie, f.contestId, theirs.number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [5, 3]) })).status).toBe(
			404
		);
		expect((await request(`/judging/${f.contestId}/${theirs.number}`, { cookie })).status).toBe(404);
		expect((await request(photo, { cookie, accept: 'image/webp' })).status).toBe(404);
		// Another judge still sees the photo; the conflict is in the log.
		expect((await request(photo, { cookie: f.judges[0]!.cookie, accept: 'image/webp' })).status).toBe(200);
		const log = await db
			.select()
			.from(auditLog)
			.where(and(eq(auditLog.subjectId, String(f.contestId)), eq(auditLog.action, 'judge.conflict')));
		expect(log).toHaveLength(1);
	});
});

describe('blind judging', () => {
	test('before publication no judge-facing page or API response names the entrant, their address or the tank', async () => {
		const f = await contestFixture({ judges: 2 });
		const judge = f.judges[0]!;
		const secrets = f.entries.flatMap((e) => [e.entrant.displayName, e.entrant.email, e.entrant.id, e.tankName]);
		const bodies: string[] = [];
		bodies.push(await (await request('/judging', { cookie: judge.cookie })).text());
		bodies.push(await (await request(`/judging/${f.contestId}`, { cookie: judge.cookie })).text());
		for (const e of f.entries) {
			const pageResponse = await request(`/judging/${f.contestId}/${e.number}`, { cookie: judge.cookie });
			expect(pageResponse.status).toBe(200);
			bodies.push(await pageResponse.text());
			const card = await request(api(f.contestId, e.number), { cookie: judge.cookie, accept: 'application/json' });
			expect(card.status).toBe(200);
			bodies.push(await card.text());
			const saved = await save(judge.cookie, f.contestId, e.number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [6, 3]) });
			bodies.push(await saved.text());
			const submitted = await request(api(f.contestId, e.number, '/submit'), { cookie: judge.cookie, json: { version: 1 }, accept: 'application/json' });
			expect(submitted.status).toBe(200);
			bodies.push(await submitted.text());
		}
		expect(bodies.join('\n')).toContain('Stems at the back'); // the statement is there…
		for (const body of bodies) for (const secret of secrets) expect(body).not.toContain(secret); // …the entrant is not
		// The public contest page does not list entries before publication either.
		const publicPage = await (await request(`/contests/${f.contestId}`, { cookie: judge.cookie })).text();
		for (const secret of secrets) expect(publicPage).not.toContain(secret);
	});

	test('judges get an entry’s photos by entry number and place only, never by the photo’s id', async () => {
		const judgeWhoEnters = await makePerson({ role: 'judge', label: 'judge-entrant' });
		const f = await contestFixture({ judges: 2, entrants: [judgeWhoEnters, await makePerson({ label: 'entrant' })], state: 'open' });
		await panel.assign(viewerOf(f.admin), f.contestId, judgeWhoEnters.id);
		const [judge, other] = f.judges as [Awaited<ReturnType<typeof makePerson>>, Awaited<ReturnType<typeof makePerson>>];
		const own = f.entries[0]!;
		const theirs = f.entries[1]!;
		// A second photo for their entry, then judging starts.
		const before = (await entries.getOwn(viewerOf(theirs.entrant), theirs.entryId))!.entry;
		const second = await photoOf(theirs.entrant, '#b4533a');
		await entries.update(viewerOf(theirs.entrant), theirs.entryId, {
			categoryId: before.categoryId,
			tankId: before.tankId!,
			statement: before.statement,
			photos: [...before.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption })), { id: second.id, alt: 'Closer', caption: '' }]
		});
		await transition(viewerOf(f.admin), f.contestId, 'start-judging');
		for (const e of f.entries) e.number = (await entries.getOwn(viewerOf(e.entrant), e.entryId))!.entry.number;
		const [stored, storedSecond] = (await entries.getOwn(viewerOf(theirs.entrant), theirs.entryId))!.entry.photos as [Photo, Photo];
		const blind = (size: string, number = theirs.number, position = 1) => `/judging/${f.contestId}/${number}/photos/${position}/${size}`;
		const bytes = async (response: Response) => Buffer.from(await response.arrayBuffer());

		// The scorecard points at the entry's address for its photo, not at /media/<id>.
		const page = await (await request(`/judging/${f.contestId}/${theirs.number}`, { cookie: judge.cookie })).text();
		expect(page).toContain(blind('medium'));
		expect(page).not.toContain(`/media/${stored.id}/`);
		const served = await request(blind('large'), { cookie: judge.cookie, accept: 'image/webp' });
		expect(served.status).toBe(200);
		expect(served.headers.get('content-type')).toBe('image/webp');
		expect(served.headers.get('cache-control')).toBe('private, max-age=60, must-revalidate');
		expect(served.headers.get('etag')).not.toContain(String(stored.id));
		const again = await request(blind('large'), { cookie: judge.cookie, headers: { 'if-none-match': served.headers.get('etag')! } });
		expect(again.status).toBe(304);
		// The same bytes as the stored renditions, in the entry's order.
		const direct = (url: string) => request(url, { cookie: theirs.entrant.cookie, accept: 'image/webp' });
		expect((await bytes(served)).equals(await bytes(await direct(stored.urls.large)))).toBe(true);
		const secondServed = await bytes(await request(blind('thumb', theirs.number, 2), { cookie: judge.cookie, accept: 'image/webp' }));
		expect(secondServed.equals(await bytes(await direct(storedSecond.urls.thumb)))).toBe(true);
		expect(secondServed.equals(await bytes(await direct(stored.urls.thumb)))).toBe(false);

		// A judge cannot reach it by its id, nor a photo the entry does not have, nor their own entry's.
		expect((await request(stored.urls.thumb, { cookie: judge.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(blind('thumb', theirs.number, 3), { cookie: judge.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(blind('thumb', own.number), { cookie: judgeWhoEnters.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(blind('thumb', theirs.number), { cookie: judgeWhoEnters.cookie, accept: 'image/webp' })).status).toBe(200);
		// Nobody off the panel: another judge, a member, an admin, someone signed out.
		const outsider = await makePerson({ role: 'judge', label: 'off-panel' });
		expect((await request(blind('thumb'), { cookie: outsider.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(blind('thumb'), { cookie: (await makePerson()).cookie, accept: 'image/webp' })).status).toBe(403);
		expect((await request(blind('thumb'), { cookie: f.admin.cookie, accept: 'image/webp' })).status).toBe(404);
		expect((await request(blind('thumb'), { accept: 'image/webp' })).status).toBe(303);
		// A judge who steps back loses it; once the results are out the address is gone for everyone.
		await judging.declareConflict(viewerOf(other), f.contestId, theirs.number!, 'I know this tank');
		expect((await request(blind('thumb'), { cookie: other.cookie, accept: 'image/webp' })).status).toBe(404);
		await scoreAll({ ...f, judges: [...f.judges, judgeWhoEnters] }, () => [5, 3]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		expect((await request(blind('thumb'), { cookie: judge.cookie, accept: 'image/webp' })).status).toBe(404);
	});

	test('judges cannot see each other’s cards before publication', async () => {
		const f = await contestFixture({ judges: 2 });
		const [a, b] = f.judges as [Awaited<ReturnType<typeof makePerson>>, Awaited<ReturnType<typeof makePerson>>];
		const number = f.entries[0]!.number;
		await save(a.cookie, f.contestId, number, {
			baseVersion: 0,
			saveId: crypto.randomUUID(),
			fields: fields(f.criteria, [9.5, 4.5], { panelNote: 'Note-from-A-for-the-panel', entrantComment: 'Comment-from-A' })
		});
		const seenByB = await (await request(api(f.contestId, number), { cookie: b.cookie, accept: 'application/json' })).json();
		expect(seenByB.version).toBe(0);
		const pageForB = await (await request(`/judging/${f.contestId}/${number}`, { cookie: b.cookie })).text();
		expect(pageForB).not.toContain('Note-from-A');
		expect(pageForB).not.toContain('Comment-from-A');
	});
});

describe('members and judging', () => {
	test('a member cannot reach judging pages or the card API', async () => {
		const f = await contestFixture({ judges: 1 });
		const member = await makePerson({ label: 'plain-member' });
		const number = f.entries[0]!.number;
		for (const path of ['/judging', `/judging/${f.contestId}`, `/judging/${f.contestId}/${number}`]) {
			expect((await request(path, { cookie: member.cookie })).status, path).toBe(403);
		}
		const get = await request(api(f.contestId, number), { cookie: member.cookie, accept: 'application/json' });
		expect(get.status).toBe(403);
		expect(get.headers.get('content-type')).toContain('application/json');
		expect((await save(member.cookie, f.contestId, number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [1, 1]) })).status).toBe(
			403
		);
		expect((await request(api(f.contestId, number, '/submit'), { cookie: member.cookie, json: { version: 1 }, accept: 'application/json' })).status).toBe(403);
		expect((await request(api(f.contestId, number, '/reopen'), { cookie: member.cookie, json: {}, accept: 'application/json' })).status).toBe(403);
		expect((await request(`/judging/${f.contestId}/${number}?/conflict`, { cookie: member.cookie, form: { reason: 'xyz', confirm: 'yes' } })).status).toBe(403);
		expect(await db.select().from(contestCards).where(eq(contestCards.contestId, f.contestId))).toHaveLength(0);
	});

	test('a judge not on the panel finds nothing', async () => {
		const f = await contestFixture({ judges: 1 });
		const outsider = await makePerson({ role: 'judge', label: 'outsider' });
		expect((await request(`/judging/${f.contestId}`, { cookie: outsider.cookie })).status).toBe(404);
		expect((await request(api(f.contestId, f.entries[0]!.number), { cookie: outsider.cookie, accept: 'application/json' })).status).toBe(404);
	});
});

describe('autosave versions', () => {
	test('two judges saving cards at once lose nothing', async () => {
		const f = await contestFixture({ judges: 2 });
		const rounds = 8;
		// Each judge saves every entry's card `rounds` times in a row; all chains run at once.
		const chains = f.judges.flatMap((judge, j) =>
			f.entries.map(async (entry, e) => {
				let version = 0;
				for (let r = 1; r <= rounds; r++) {
					const response = await save(judge.cookie, f.contestId, entry.number, {
						baseVersion: version,
						saveId: crypto.randomUUID(),
						fields: fields(f.criteria, [r, (j + e) % 5], { entrantComment: `judge ${j} entry ${e} round ${r}` })
					});
					expect(response.status).toBe(200);
					version = (await response.json()).version;
				}
				return version;
			})
		);
		expect(await Promise.all(chains)).toEqual(new Array(f.judges.length * f.entries.length).fill(rounds));
		for (const [j, judge] of f.judges.entries()) {
			for (const [e, entry] of f.entries.entries()) {
				const card = await (await request(api(f.contestId, entry.number), { cookie: judge.cookie, accept: 'application/json' })).json();
				expect(card.version).toBe(rounds);
				expect(card.fields.entrantComment).toBe(`judge ${j} entry ${e} round ${rounds}`);
				expect(card.fields.scores[f.criteria[0]!]).toBe(rounds);
			}
		}
	});

	test('of simultaneous saves based on the same version exactly one wins; the others get the winner back', async () => {
		const f = await contestFixture({ judges: 1 });
		const judge = f.judges[0]!;
		const number = f.entries[0]!.number;
		const bodies = Array.from({ length: 6 }, (_, i) => ({ baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [i + 1, 2]) }));
		const responses = await Promise.all(bodies.map((b) => save(judge.cookie, f.contestId, number, b)));
		const statuses = responses.map((r) => r.status).sort();
		expect(statuses).toEqual([200, 409, 409, 409, 409, 409]);
		const winner = bodies[responses.findIndex((r) => r.status === 200)]!;
		for (const r of responses.filter((x) => x.status === 409)) {
			const body = await r.json();
			expect(body.code).toBe('version-conflict');
			expect(body.current).toMatchObject({ version: 1, lastSaveId: winner.saveId });
		}
		const [stored] = await db.select().from(contestCards).where(eq(contestCards.entryId, f.entries[0]!.entryId));
		expect(stored!.fields.scores[f.criteria[0]!]).toBe(winner.fields.scores[f.criteria[0]!]);
	});

	test('an older autosave does not overwrite a newer one; a retried save is recognised', async () => {
		const f = await contestFixture({ judges: 1 });
		const judge = f.judges[0]!;
		const number = f.entries[0]!.number;
		const first = { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [3, 1]) };
		const newer = { baseVersion: 1, saveId: crypto.randomUUID(), fields: fields(f.criteria, [8, 4], { entrantComment: 'newer' }) };
		expect((await (await save(judge.cookie, f.contestId, number, first)).json()).version).toBe(1);
		expect((await (await save(judge.cookie, f.contestId, number, newer)).json()).version).toBe(2);
		// A save another tab based on version 1, arriving late:
		const stale = await save(judge.cookie, f.contestId, number, {
			baseVersion: 1,
			saveId: crypto.randomUUID(),
			fields: fields(f.criteria, [1, 0], { entrantComment: 'stale' })
		});
		expect(stale.status).toBe(409);
		expect((await stale.json()).current.fields.entrantComment).toBe('newer');
		// The first request, retried by a flaky network after the newer one landed:
		expect((await save(judge.cookie, f.contestId, number, first)).status).toBe(409);
		// The newer one retried: answered as before, nothing changes.
		const replay = await save(judge.cookie, f.contestId, number, newer);
		expect(replay.status).toBe(200);
		expect((await replay.json()).version).toBe(2);
		const card = await (await request(api(f.contestId, number), { cookie: judge.cookie, accept: 'application/json' })).json();
		expect(card).toMatchObject({ version: 2, fields: { entrantComment: 'newer' } });
	});

	test('scores out of range are refused; incomplete cards cannot be submitted; submitted cards reopen only while judging lasts', async () => {
		const f = await contestFixture({ judges: 1 });
		const judge = f.judges[0]!;
		const number = f.entries[0]!.number;
		const bad = await save(judge.cookie, f.contestId, number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [10.5, 2]) });
		expect(bad.status).toBe(400);
		const off = await save(judge.cookie, f.contestId, number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [7.25, 2]) });
		expect(off.status).toBe(400);
		await save(judge.cookie, f.contestId, number, { baseVersion: 0, saveId: crypto.randomUUID(), fields: fields(f.criteria, [7.5, null]) });
		expect((await request(api(f.contestId, number, '/submit'), { cookie: judge.cookie, json: { version: 1 }, accept: 'application/json' })).status).toBe(400);
		await save(judge.cookie, f.contestId, number, { baseVersion: 1, saveId: crypto.randomUUID(), fields: fields(f.criteria, [7.5, 4]) });
		const submitted = await request(api(f.contestId, number, '/submit'), { cookie: judge.cookie, json: { version: 2 }, accept: 'application/json' });
		expect(submitted.status).toBe(200);
		expect((await submitted.json()).status).toBe('submitted');
		const afterSubmit = await save(judge.cookie, f.contestId, number, { baseVersion: 3, saveId: crypto.randomUUID(), fields: fields(f.criteria, [1, 1]) });
		expect(afterSubmit.status).toBe(409);
		expect((await afterSubmit.json()).code).toBe('submitted');
		// After the judging window: no reopening (the judge is told why).
		const late = new Date(Date.now() + 30 * 86_400_000);
		await expect(judging.reopenCard(viewerOf(judge), f.contestId, number!, { now: late })).rejects.toMatchObject({ code: 'closed' });
		const reopened = await request(api(f.contestId, number, '/reopen'), { cookie: judge.cookie, json: {}, accept: 'application/json' });
		expect(reopened.status).toBe(200);
		expect((await reopened.json()).status).toBe('draft');
		// The submission and the reopening are in the card's log, by the judge; the refused late reopening is not.
		const [card] = await db.select().from(contestCards).where(eq(contestCards.entryId, f.entries[0]!.entryId));
		const log = await db
			.select()
			.from(auditLog)
			.where(and(eq(auditLog.subjectType, 'contest-card'), eq(auditLog.subjectId, String(card!.id))))
			.orderBy(asc(auditLog.id));
		expect(log.map((r) => [r.action, r.actorId])).toEqual([
			['card.submit', judge.id],
			['card.reopen', judge.id]
		]);
		expect(log[0]!.detail).toMatchObject({ contestId: f.contestId, number, version: 3 });
	});
});

describe('publication', () => {
	test('refused while a non-conflicted card is missing, unless an admin gives a reason (audited); then cards are locked', async () => {
		const f = await contestFixture({ judges: 2 });
		await scoreAll(f, (j, e) => (j === 1 && e === 2 ? [null, null] : [5 + e, 3]));
		// Judge 1 left the third entry's card as an empty draft.
		const form = { step: 'publish', confirm: 'yes' };
		const refused = await request(`/admin/contests/${f.contestId}/results?/step`, { cookie: f.admin.cookie, form });
		expect(refused.status).toBe(409);
		expect(await refused.text()).toContain('Some cards are still missing');
		expect((await contests.load(f.contestId))!.state).toBe('judging');
		await expect(transition(viewerOf(f.admin), f.contestId, 'publish', { overrideReason: 'short' })).rejects.toBeInstanceOf(DomainError);

		const published = await request(`/admin/contests/${f.contestId}/results?/step`, {
			cookie: f.admin.cookie,
			form: { ...form, reason: 'The second judge is ill and cannot finish.' }
		});
		expect(published.status).toBe(303);
		expect((await contests.load(f.contestId))!.state).toBe('published');
		const [entry] = await db
			.select()
			.from(auditLog)
			.where(and(eq(auditLog.subjectId, String(f.contestId)), eq(auditLog.action, 'contest.publish')));
		expect(entry!.detail).toMatchObject({
			overrideReason: 'The second judge is ill and cannot finish.',
			missing: [{ number: f.entries[2]!.number, state: 'draft' }]
		});
		// Locked: no judge can save or reopen any more.
		const judge = f.judges[0]!;
		expect(
			(await save(judge.cookie, f.contestId, f.entries[0]!.number, { baseVersion: 2, saveId: crypto.randomUUID(), fields: fields(f.criteria, [1, 1]) })).status
		).toBe(404);
		expect((await request(api(f.contestId, f.entries[0]!.number, '/reopen'), { cookie: judge.cookie, json: {}, accept: 'application/json' })).status).toBe(404);
	});

	test('published results rank as computed, reveal names, show comments for entrants and never the notes for the panel', async () => {
		const f = await contestFixture({ judges: 3 });
		// Entry 0: 8/10 and 4/5 from everyone; entry 1: 6 and 3; entry 2: 9 and 5.
		const scores = [
			[8, 4],
			[6, 3],
			[9, 5]
		];
		await scoreAll(
			f,
			(_, e) => scores[e]!,
			(j, e) => ({ entrantComment: `Comment ${j}-${e} for the entrant`, panelNote: `Private note ${j}-${e}` })
		);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		const results = (await publicResults(f.contestId))!;
		const open = results.categories.find((c) => c.name === 'Open')!;
		expect(open.entries.map((e) => e.entryId)).toEqual([f.entries[2]!.entryId, f.entries[0]!.entryId, f.entries[1]!.entryId]);
		// (2·9 + 5) / 25 = 92 %, (2·8 + 4) / 25 = 80 %, (2·6 + 3) / 25 = 60 %
		expect(open.entries.map((e) => e.score)).toEqual([92, 80, 60]);

		const page = await (await request(`/contests/${f.contestId}/results/${f.categories[1]}`)).text();
		for (const e of f.entries) expect(page).toContain(e.entrant.displayName);
		expect(page.indexOf(f.entries[2]!.entrant.displayName)).toBeLessThan(page.indexOf(f.entries[0]!.entrant.displayName));
		expect(page).toContain('92.00 %');
		expect(page).toContain('Comment 0-2 for the entrant');
		expect(page).not.toContain('Private note');

		const feedback = await request(`/contests/${f.contestId}/entries/${f.entries[0]!.entryId}`, { cookie: f.entries[0]!.entrant.cookie });
		const feedbackHtml = await feedback.text();
		expect(feedbackHtml).toContain('Judge 3');
		expect(feedbackHtml).toContain('Comment 2-0 for the entrant');
		expect(feedbackHtml).not.toContain('Private note');
		// Someone else's feedback page is not theirs to read.
		expect((await request(`/contests/${f.contestId}/entries/${f.entries[0]!.entryId}`, { cookie: f.entries[1]!.entrant.cookie })).status).toBe(404);
		// Photos are public now.
		const photo = open.entries[0]!.photos[0]!;
		const anonymous = await request(photo.urls.thumb, { accept: 'image/webp' });
		expect(anonymous.status).toBe(200);
		expect(anonymous.headers.get('cache-control')).toContain('public');
	});

	test('a correction after publication needs a reason, changes the result and is shown publicly', async () => {
		const f = await contestFixture({ judges: 1 });
		await scoreAll(f, (_, e) => [5 + e, 2]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		const [card] = await db.select().from(contestCards).where(eq(contestCards.entryId, f.entries[0]!.entryId));
		const short = await request(`/admin/contests/${f.contestId}/cards/${card!.id}`, {
			cookie: f.admin.cookie,
			form: { [`score-${f.criteria[0]}`]: '10', [`score-${f.criteria[1]}`]: '5', reason: 'typo' }
		});
		expect(short.status).toBe(400);
		const fixed = await request(`/admin/contests/${f.contestId}/cards/${card!.id}`, {
			cookie: f.admin.cookie,
			form: { [`score-${f.criteria[0]}`]: '10', [`score-${f.criteria[1]}`]: '5', entrantComment: '', reason: 'The judge reported a slip on entry one.' }
		});
		expect(fixed.status).toBe(303);
		const results = (await publicResults(f.contestId))!;
		expect(results.categories[1]!.entries[0]!.entryId).toBe(f.entries[0]!.entryId);
		expect(results.contest.resultsRevision).toBe(1);
		expect(await (await request(`/contests/${f.contestId}`)).text()).toContain('The judge reported a slip on entry one.');
		// A member cannot correct anything.
		expect((await request(`/admin/contests/${f.contestId}/cards/${card!.id}`, { cookie: f.entries[1]!.entrant.cookie, form: { reason: 'x' } })).status).toBe(
			403
		);
	});
});

describe('entries', () => {
	test('an ineligible tank is refused with the reason; limits per member hold', async () => {
		const f = await contestFixture({ judges: 1, state: 'open', entrantNames: ['Keen Entrant'], input: { entriesPerMember: 1 } });
		const member = await makePerson({ label: 'big-tank' });
		const big = await openTank(member, 'Big one');
		const photo = await photoOf(member);
		const small = f.categories[0]!;
		const response = await request(`/contests/${f.contestId}/enter`, {
			cookie: member.cookie,
			form: {
				categoryId: String(small),
				tankId: String(big),
				statement: 'A big tank',
				'photos[0][id]': String(photo.id),
				'photos[0][alt]': 'Front',
				'photos[0][caption]': ''
			}
		});
		expect(response.status).toBe(400);
		expect(await response.text()).toMatch(/this category takes at most 40 L/);
		// The same tank fits "Open"; a second entry is over the limit of one.
		await entries.create(viewerOf(member), f.contestId, {
			categoryId: f.categories[1]!,
			tankId: big,
			statement: 'A big tank',
			photos: [{ id: photo.id, alt: 'Front', caption: '' }]
		});
		const tiny = await smallTank(member, 'Tiny one');
		const second = await photoOf(member);
		await expect(
			entries.create(viewerOf(member), f.contestId, { categoryId: small, tankId: tiny, statement: 'Small', photos: [{ id: second.id, alt: '', caption: '' }] })
		).rejects.toMatchObject({ code: 'limit' });
	});

	test('entrants can withdraw until entries close; photos follow the contest’s rules', async () => {
		const f = await contestFixture({ judges: 1, state: 'open', entrantNames: ['Withdrawing Entrant'] });
		const entry = f.entries[0]!;
		const photo = (await entries.getOwn(viewerOf(entry.entrant), entry.entryId))!.entry.photos[0]!;
		expect((await request(photo.urls.thumb, { cookie: entry.entrant.cookie, accept: 'image/webp' })).status).toBe(200);
		expect((await request(photo.urls.thumb, { cookie: f.admin.cookie, accept: 'image/webp' })).status).toBe(200);
		expect((await request(photo.urls.thumb, { cookie: f.judges[0]!.cookie, accept: 'image/webp' })).status).toBe(404); // not judging yet
		expect((await request(photo.urls.thumb, { accept: 'image/webp' })).status).toBe(404);
		const withdrawn = await request(`/contests/${f.contestId}/entries/${entry.entryId}?/withdraw`, {
			cookie: entry.entrant.cookie,
			form: { confirm: 'withdraw' }
		});
		expect(withdrawn.status).toBe(303);
		expect((await request(photo.urls.thumb, { cookie: entry.entrant.cookie, accept: 'image/webp' })).status).toBe(404);
		expect(await entries.listOwn(viewerOf(entry.entrant), f.contestId)).toEqual([]);
	});
});

describe('announcement', () => {
	test('queued once per results version, with unsubscribe links; entrants get their place', { timeout: 120_000 }, async () => {
		const f = await contestFixture({ judges: 1 });
		await scoreAll(f, (_, e) => [4 + e, 3]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		const first = await request(`/admin/contests/${f.contestId}/announce?/send`, { cookie: f.admin.cookie, form: { confirm: 'yes' } });
		expect(first.status).toBe(303);
		const rows = () =>
			db
				.select()
				.from(outbox)
				.where(like(outbox.topic, `contest:${f.contestId}:results:%`));
		const count = (await rows()).length;
		expect(count).toBeGreaterThan(f.entries.length);
		// A double click, or a second admin: nothing new.
		await announce.send(viewerOf(f.admin), f.contestId);
		await request(`/admin/contests/${f.contestId}/announce?/send`, { cookie: f.admin.cookie, form: { confirm: 'yes' } });
		expect((await rows()).length).toBe(count);

		const winner = f.entries[2]!.entrant;
		const queued = (await rows()).filter((r) => r.toAddress === winner.email);
		expect(queued.map((r) => r.topic).sort()).toEqual([`contest:${f.contestId}:results:announce`, `contest:${f.contestId}:results:entrant`]);
		const general = queued.find((r) => r.topic!.endsWith(':announce'))!;
		expect(general.headers!['List-Unsubscribe']).toMatch(/^<http.*\/unsubscribe\/[\w-]+\.results\.[\w-]{43}>$/);
		expect(general.headers!['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
		expect(general.textBody).toMatch(/Unsubscribe from mail about contest results: http\S+\/unsubscribe\//);
		// The entrant's own result is in the same category, so it carries the same one-click link.
		expect(queued.find((r) => r.topic!.endsWith(':entrant'))!.headers!['List-Unsubscribe']).toBe(general.headers!['List-Unsubscribe']);
		// Delivered through the outbox to the mail fake (every member gets the announcement, so allow time).
		const personal = await waitForMail(winner.email, { subject: /Your result/, timeoutMs: 60_000 });
		expect(personal.text).toContain('placed 1st of 3');
		expect(personal.text).toContain(`/contests/${f.contestId}/entries/${f.entries[2]!.entryId}`);
		const delivered = await waitForMail(winner.email, { subject: /^Results: /, timeoutMs: 90_000 });
		expect(delivered.headers['list-unsubscribe']).toMatch(/\/unsubscribe\/[\w-]+\.results\.[\w-]{43}>/);

		const status = await (
			await request(`/admin/contests/${f.contestId}/announce?address=${encodeURIComponent(winner.email)}`, { cookie: f.admin.cookie })
		).text();
		expect(status).toContain(winner.email);
		expect(status).toContain('Personal result');
	});
});

describe('export', () => {
	test('results and cards as CSV with a byte-order mark, for admins only', async () => {
		const f = await contestFixture({ judges: 2, entrantNames: ['Comma, Entrant', 'Quote "Entrant"', '=Formula'] });
		await scoreAll(
			f,
			(j, e) => [5 + e + j, 3],
			(j) => ({ entrantComment: j === 0 ? 'Line one\nline two' : '' })
		);
		const response = await request(`/admin/contests/${f.contestId}/export/cards`, { cookie: f.admin.cookie, accept: 'text/csv' });
		expect(response.status).toBe(200);
		expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
		expect(response.headers.get('content-disposition')).toMatch(/attachment; filename=".*-cards\.csv"/);
		const bytes = new Uint8Array(await response.arrayBuffer());
		expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
		const rows = parse(new TextDecoder().decode(bytes), { bom: true }) as string[][];
		expect(rows).toHaveLength(1 + 2 * 3);
		const entrantColumn = rows[0]!.indexOf('Entrant');
		const names = rows.slice(1).map((r) => r[entrantColumn]!);
		expect(names.filter((n) => n.startsWith('Comma, Entrant '))).toHaveLength(2);
		expect(names.filter((n) => n.startsWith('Quote "Entrant" '))).toHaveLength(2);
		expect(names.filter((n) => n.startsWith("'=Formula "))).toHaveLength(2); // made inert for spreadsheets
		expect(rows.slice(1).some((r) => r.includes('Line one\nline two'))).toBe(true);

		const results = parse(await (await request(`/admin/contests/${f.contestId}/export/results`, { cookie: f.admin.cookie })).text(), {
			bom: true
		}) as string[][];
		expect(results).toHaveLength(1 + 3);
		expect((await request(`/admin/contests/${f.contestId}/export/results`, { cookie: f.judges[0]!.cookie })).status).toBe(403);
	});
});

describe('reminders', () => {
	test('admins hear once when entries closed but judging did not start; judges with open cards as judging closes', async () => {
		const f = await contestFixture({ judges: 2, state: 'open' });
		const contest = (await contests.load(f.contestId))!;
		const afterEntries = new Date(`${contest.entryClosesOn}T12:00:00Z`);
		afterEntries.setUTCDate(afterEntries.getUTCDate() + 1);
		await sendDueReminders({ now: afterEntries });
		await sendDueReminders({ now: afterEntries });
		const reminders = () =>
			db
				.select()
				.from(outbox)
				.where(eq(outbox.topic, `contest:${f.contestId}:reminder`));
		const adminMails = (await reminders()).filter((r) => r.toAddress === f.admin.email);
		expect(adminMails).toHaveLength(1);
		expect(adminMails[0]!.subject).toMatch(/have closed/);

		await transition(viewerOf(f.admin), f.contestId, 'start-judging');
		const nearClose = new Date(`${contest.judgingClosesOn}T08:00:00Z`);
		await sendDueReminders({ now: nearClose });
		await sendDueReminders({ now: nearClose });
		const judgeMails = (await reminders()).filter((r) => f.judges.some((j) => j.email === r.toAddress));
		expect(judgeMails.map((m) => m.toAddress).sort()).toEqual(f.judges.map((j) => j.email).sort());
		expect(judgeMails[0]!.textBody).toContain('3 cards');
		for (const m of judgeMails) for (const e of f.entries) expect(m.textBody).not.toContain(e.entrant.displayName);
	});

	test('the admin’s reminder from the progress page goes to judges with open cards, once an hour', async () => {
		const f = await contestFixture({ judges: 2 });
		await scoreAll(f, (j) => (j === 0 ? [5, 3] : [null, null]));
		const sent = await request(`/admin/contests/${f.contestId}/judging?/remind`, { cookie: f.admin.cookie, form: {} });
		expect(sent.status).toBe(200);
		await request(`/admin/contests/${f.contestId}/judging?/remind`, { cookie: f.admin.cookie, form: {} });
		const nudges = await db
			.select()
			.from(outbox)
			.where(eq(outbox.topic, `contest:${f.contestId}:nudge`));
		expect(nudges.map((n) => n.toAddress)).toEqual([f.judges[1]!.email]);
	});
});

test('the review computes the same results as the pure functions on the stored cards', async () => {
	const f = await contestFixture({ judges: 3 });
	await judging.declareConflict(viewerOf(f.judges[2]!), f.contestId, f.entries[0]!.number!, 'knows the entrant');
	await scoreAll(f, (j, e) => [4 + e + j, 2 + (e % 2)]);
	const data = (await loadData(f.contestId))!;
	const report = computeResults(inputOf(data));
	expect(report.readiness.ready).toBe(true);
	expect(report.duties.excluded).toEqual([{ entryId: String(f.entries[0]!.entryId), judgeId: f.judges[2]!.id, reason: 'conflict' }]);
	expect(report.unevenPanel).toBe(true);
	const page = await (await request(`/admin/contests/${f.contestId}/results`, { cookie: f.admin.cookie })).text();
	expect(page).toContain('Ranking basis');
	expect(page).toContain('Kendall’s coefficient of concordance W');

	// Members read the results in the club's words: places adjusted for each judge's strictness,
	// the method folded away, and no signed standardised figure (nor in the page's data).
	await transition(viewerOf(f.admin), f.contestId, 'publish');
	const signed = /[−+-]\d+\.\d{3}\b/;
	for (const path of [`/contests/${f.contestId}`, `/contests/${f.contestId}/results/${f.categories[1]}`]) {
		const html = await (await request(path)).text();
		expect(html).toContain('How places are worked out');
		expect(html).not.toMatch(signed);
		expect(html).not.toContain('standardised');
		expect(html).not.toContain('Kendall');
	}
	const category = await (await request(`/contests/${f.contestId}/results/${f.categories[1]}`)).text();
	expect(category).toContain('Adjusted for each judge’s strictness:');
	const review = await (await request(`/admin/contests/${f.contestId}/results`, { cookie: f.admin.cookie })).text();
	const empty = review.slice(review.indexOf('data-testid="agreement"'), review.indexOf('</p>', review.indexOf('data-testid="agreement"')));
	expect(empty.replace(/<!--.*?-->/g, '')).toContain('No entries in this category, so there is nothing to compare.');
});

test('after publication a results row links to the tank only while its journal is public', async () => {
	const f = await contestFixture({ judges: 2, entrantNames: ['Linked Entrant', 'Private Entrant'] });
	const entryRows = await db
		.select({ id: contestEntries.id, tankId: contestEntries.tankId })
		.from(contestEntries)
		.where(eq(contestEntries.contestId, f.contestId));
	const tankOf = (entryId: number) => entryRows.find((r) => r.id === entryId)!.tankId!;
	const publicTank = tankOf(f.entries[0]!.entryId);
	const clubTank = tankOf(f.entries[1]!.entryId);
	await db.update(tanks).set({ visibility: 'public' }).where(eq(tanks.id, publicTank));
	await scoreAll(f, (j, e) => [6 + e, 3]);

	// Before publication there are no results, and no page names the tanks.
	expect(await publicResults(f.contestId)).toBeNull();
	await transition(viewerOf(f.admin), f.contestId, 'publish');
	const results = (await publicResults(f.contestId))!;
	const open = results.categories.find((c) => c.id === f.categories[1])!;
	const linkOf = (entryId: number) => open.entries.find((e) => e.entryId === entryId)!.publicTankId;
	expect(linkOf(f.entries[0]!.entryId)).toBe(publicTank);
	expect(linkOf(f.entries[1]!.entryId)).toBeNull();

	const page = await (await request(`/contests/${f.contestId}/results/${f.categories[1]}`)).text();
	expect(page).toContain(`href="/journals/${publicTank}"`);
	expect(page).not.toContain(`/journals/${clubTank}`);
});

test('a judge is told on the dashboard and the judging page how many cards wait for them', async () => {
	const f = await contestFixture({ judges: 1, entrantNames: ['Waiting One', 'Waiting Two'] });
	const judge = f.judges[0]!;
	const home = await (await request('/', { cookie: judge.cookie })).text();
	expect(home).toMatch(/data-testid="cards-waiting"[^>]*>\s*(<!--[^>]*-->)?\s*\d+\s*(<!--[^>]*-->)?\s*cards wait for your scores/);
	const before = Number(/data-testid="cards-waiting"[^>]*>\s*(?:<!--[^>]*-->)?\s*(\d+)/.exec(home)![1]);
	// Submitting one card leaves one fewer waiting.
	const saved = await judging.saveCard(viewerOf(judge), f.contestId, f.entries[0]!.number!, {
		baseVersion: 0,
		saveId: crypto.randomUUID(),
		fields: fields(f.criteria, [7, 3])
	});
	await judging.submitCard(viewerOf(judge), f.contestId, f.entries[0]!.number!, saved.version);
	const after = await (await request('/judging', { cookie: judge.cookie })).text();
	expect(Number(/data-testid="cards-waiting"[^>]*>\s*(?:<!--[^>]*-->)?\s*(\d+)/.exec(after)![1])).toBe(before - 1);
});
