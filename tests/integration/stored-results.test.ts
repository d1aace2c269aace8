// Published results are a record: computed once at publication and at each correction, kept per
// contest and revision, and served as kept. What is kept must equal what the cards compute to.
import { describe, expect, test } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { contestCards, contestResults } from '../../src/lib/server/contests/schema';
import { amendCard, inputOf, loadData, publicResults, setRankBy, transition } from '../../src/lib/server/contests/review';
import { computeResults } from '../../src/lib/contests/results';
import { request } from '../helpers/http';
import { contestFixture, fields, scoreAll, viewerOf } from '../helpers/contests';

/** Place, score and standardised score of every entry per category, as the cards compute them now. */
async function computedNow(contestId: number) {
	const report = computeResults(inputOf((await loadData(contestId))!));
	return report.categories.map((c) => c.entries.map((e) => ({ entryId: Number(e.entryId), place: e.place, score: e.score, standardised: e.standardised })));
}

async function served(contestId: number) {
	const results = (await publicResults(contestId))!;
	return results.categories.map((c) => c.entries.map((e) => ({ entryId: e.entryId, place: e.place, score: e.score, standardised: e.standardised })));
}

const kept = (contestId: number) =>
	db.select({ revision: contestResults.revision }).from(contestResults).where(eq(contestResults.contestId, contestId)).orderBy(contestResults.revision);

describe('stored published results', () => {
	test('publication keeps the results; the kept record equals the computation and is what the page serves', async () => {
		const f = await contestFixture({ judges: 2 });
		await scoreAll(f, (j, e) => [4 + e + j, 2 + (e % 2)]);
		expect(await kept(f.contestId)).toEqual([]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		expect(await kept(f.contestId)).toEqual([{ revision: 0 }]);
		const expected = await computedNow(f.contestId);
		expect(await served(f.contestId)).toEqual(expected);

		// The record is served as kept: a card changed behind the functions' back does not move it.
		const [card] = await db.select().from(contestCards).where(eq(contestCards.entryId, f.entries[0]!.entryId)).limit(1);
		await db
			.update(contestCards)
			.set({ fields: fields(f.criteria, [10, 5]) })
			.where(eq(contestCards.id, card!.id));
		expect(await served(f.contestId)).toEqual(expected);
		expect(await computedNow(f.contestId)).not.toEqual(expected);
		const page = await (await request(`/contests/${f.contestId}/results/${f.categories[1]}`)).text();
		for (const e of f.entries) expect(page).toContain(e.entrant.displayName);
	});

	test('each correction keeps a new revision equal to the computation on the corrected cards', async () => {
		const f = await contestFixture({ judges: 2 });
		await scoreAll(f, (j, e) => [3 + e, 1 + j]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		const before = await served(f.contestId);

		const [card] = await db
			.select()
			.from(contestCards)
			.where(and(eq(contestCards.entryId, f.entries[0]!.entryId), eq(contestCards.judgeId, f.judges[0]!.id)));
		await amendCard(viewerOf(f.admin), card!.id, fields(f.criteria, [10, 5]), 'The judge reported a slip on entry one.');
		expect(await kept(f.contestId)).toEqual([{ revision: 0 }, { revision: 1 }]);
		const corrected = await served(f.contestId);
		expect(corrected).not.toEqual(before);
		expect(corrected).toEqual(await computedNow(f.contestId));

		await setRankBy(viewerOf(f.admin), f.contestId, 'standardised', 'Panels were uneven in this contest.');
		expect(await kept(f.contestId)).toEqual([{ revision: 0 }, { revision: 1 }, { revision: 2 }]);
		expect(await served(f.contestId)).toEqual(await computedNow(f.contestId));
		expect((await publicResults(f.contestId))!.contest.rankBy).toBe('standardised');
	});

	test('results published before records were kept get theirs on first view', async () => {
		const f = await contestFixture({ judges: 1 });
		await scoreAll(f, (_, e) => [5 + e, 2]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		await db.delete(contestResults).where(eq(contestResults.contestId, f.contestId));
		expect(await served(f.contestId)).toEqual(await computedNow(f.contestId));
		expect(await kept(f.contestId)).toEqual([{ revision: 0 }]);
	});

	test('a large category is served a page at a time, and an entrant is told which page holds theirs', async () => {
		const names = Array.from({ length: 22 }, (_, i) => `Paged Entrant ${String.fromCharCode(65 + i)}`);
		const f = await contestFixture({ judges: 2, entrantNames: names });
		await scoreAll(f, (j, e) => [1 + (e % 10), 1 + ((e + j) % 5)]);
		await transition(viewerOf(f.admin), f.contestId, 'publish');
		const results = (await publicResults(f.contestId))!;
		const open = results.categories.find((c) => c.entries.length === 22)!;
		const count = (html: string) => html.split('data-testid="result-entry"').length - 1;

		const first = await (await request(`/contests/${f.contestId}/results/${open.id}`)).text();
		expect(count(first)).toBe(20);
		expect(first).toContain('Places 1–20 of 22 entries.');
		for (const e of open.entries.slice(0, 20)) expect(first).toContain(e.entrantName);
		expect(first).not.toContain(open.entries[21]!.entrantName);

		const second = await (await request(`/contests/${f.contestId}/results/${open.id}?page=2`)).text();
		expect(count(second)).toBe(2);
		expect(second).toContain('Places 21–22 of 22 entries.');
		// A page past the end shows the last one.
		expect(count(await (await request(`/contests/${f.contestId}/results/${open.id}?page=99`)).text())).toBe(2);

		const lastEntrant = f.entries.find((e) => e.entryId === open.entries[21]!.entryId)!.entrant;
		const asEntrant = await (await request(`/contests/${f.contestId}/results/${open.id}`, { cookie: lastEntrant.cookie })).text();
		expect(asEntrant).toContain('Your entry is on page 2');
	});
});
