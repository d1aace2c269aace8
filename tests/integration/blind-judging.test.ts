// Blind means blind: nothing a judge receives while judging may equal a value members can read on
// the entrant's tank pages. For every entry of the demo contest being judged (scripts/seed/contests.ts),
// as every judge of its panel and in every unit system, this collects each value of the judging
// pages' data (SvelteKit's __data.json), of their HTML and of the card API, and compares it with
// what the tank's public pages show: its volume in each unit system, its age, and its photos' ids,
// addresses, descriptions and captions.
import { afterAll, describe, expect, test } from 'vitest';
import { and, eq, like } from 'drizzle-orm';
import { unflatten } from 'devalue';
import { parse } from 'parse5';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import { contestEntries, contestJudges, contests } from '../../src/lib/server/contests/schema';
import type { UnitSystem } from '../../src/lib/club/roles';
import { request } from '../helpers/http';
import { makePerson, sessionFor, type TestPerson } from '../helpers/people';
import { contestFixture, photoOf, viewerOf } from '../helpers/contests';
import { tankInput } from '../helpers/tanks';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as contestsDomain from '../../src/lib/server/contests/contests';
import * as entries from '../../src/lib/server/contests/contest-entries';
import { transition } from '../../src/lib/server/contests/review';

/** A value found in page data or an API answer, or (`html`) a text or attribute of rendered HTML. */
type Leaf = { path: string; value: string | number; html?: boolean };

/** Every primitive in a value, with where it was found; photo-like objects are marked in the path. */
function leaves(value: unknown, path: string, out: Leaf[] = []): Leaf[] {
	if (value === null || value === undefined || typeof value === 'boolean') return out;
	if (typeof value === 'string' || typeof value === 'number') out.push({ path, value });
	else if (value instanceof Date) out.push({ path, value: value.toISOString() });
	else if (value instanceof Map) for (const [k, v] of value) leaves(v, `${path}.${String(k)}`, out);
	else if (Array.isArray(value) || value instanceof Set) [...value].forEach((v, i) => leaves(v, `${path}[${i}]`, out));
	else if (typeof value === 'object') {
		const photoLike = 'urls' in value || 'src' in value;
		for (const [k, v] of Object.entries(value)) leaves(v, `${path}${photoLike ? '<photo>' : ''}.${k}`, out);
	}
	return out;
}

/** The data of every node (layouts and page) of a page, decoded as the browser decodes it. */
async function pageData(path: string, cookie: string): Promise<unknown[]> {
	const [pathname, search] = path.split('?');
	const response = await request(`${pathname === '/' ? '' : pathname}/__data.json${search ? `?${search}` : ''}`, { cookie, accept: 'application/json' });
	expect(response.status, path).toBe(200);
	const body = (await response.json()) as { type: string; nodes: ({ type: string; data?: unknown[] } | null)[] };
	expect(body.type, `${path}: ${JSON.stringify(body).slice(0, 200)}`).toBe('data');
	return body.nodes.filter((n) => n?.type === 'data' && n.data).map((n) => unflatten(n!.data as never));
}

interface HtmlNode {
	nodeName: string;
	tagName?: string;
	value?: string;
	attrs?: { name: string; value: string }[];
	childNodes?: HtmlNode[];
	content?: HtmlNode;
}

/** Text and attribute values of a page as rendered (scripts left out: their data is checked as page data). */
function htmlLeaves(html: string, path: string): Leaf[] {
	const out: Leaf[] = [];
	const walk = (node: HtmlNode) => {
		if (node.nodeName === '#text') {
			const text = node.value?.replace(/\s+/g, ' ').trim();
			if (text) out.push({ path: `${path} text`, value: text, html: true });
			return;
		}
		if (node.tagName === 'script' || node.tagName === 'style') return;
		for (const a of node.attrs ?? []) {
			if (a.name === 'class' || a.name === 'style') continue;
			const values = a.name === 'srcset' ? a.value.split(',').map((part) => part.trim().split(/\s+/)[0]!) : [a.value];
			for (const v of values) if (v.trim()) out.push({ path: `${path} @${a.name}`, value: v.trim(), html: true });
		}
		for (const child of node.childNodes ?? []) walk(child);
		if (node.content) walk(node.content);
	};
	walk(parse(html) as unknown as HtmlNode);
	return out;
}

/** The text inside the element with this data-testid, or null. */
function testIdText(html: string, testId: string): string | null {
	const doc = parse(html) as unknown as HtmlNode;
	let found: HtmlNode | null = null;
	const find = (node: HtmlNode) => {
		if (found) return;
		if (node.attrs?.some((a) => a.name === 'data-testid' && a.value === testId)) found = node;
		for (const child of node.childNodes ?? []) find(child);
	};
	find(doc);
	if (!found) return null;
	const parts: string[] = [];
	const text = (node: HtmlNode) => {
		if (node.nodeName === '#text') parts.push(node.value ?? '');
		for (const child of node.childNodes ?? []) text(child);
	};
	text(found);
	return parts.join('').replace(/\s+/g, ' ').trim();
}

const VOLUME_TOKEN = /(?<![\d.,])(\d[\d,]*(?:\.\d+)?) ?(L|US gal|imp gal)(?![A-Za-z])/g;
const AGE_TOKEN = /\b(\d+) (weeks?|days?)\b/g;

/**
 * The volumes written in a text ("63.4 L", "16.7 US gal"). A bound of a range ("40–60 L",
 * "Under 20 L", "up to 40 L", "at least 30 L", "400 L or more") describes a range, not a tank.
 */
const volumeTokens = (text: string) =>
	[...text.matchAll(VOLUME_TOKEN)]
		.filter((m) => !/(–|\bunder |\bup to |\bat least )$/i.test(text.slice(0, m.index)) && !text.slice(m.index + m[0].length).startsWith(' or more'))
		.map((m) => ({ text: `${m[1]} ${m[2]}`, value: Number(m[1]!.replace(/,/g, '')) }));
const tokens = (text: string) => [...volumeTokens(text).map((t) => t.text), ...[...text.matchAll(AGE_TOKEN)].map((m) => `${m[1]} ${m[2]}`)];
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** What members can read about one tank: volume and age in every form shown, and its photos. */
interface PublicSide {
	tankId: number;
	numbers: Set<number>;
	strings: Set<string>;
	photoIds: Set<number>;
}

async function publicSide(
	tankId: number,
	entry: { litres: number | null; ageWeeks: number | null },
	readers: Record<UnitSystem, TestPerson>
): Promise<PublicSide> {
	const side: PublicSide = { tankId, numbers: new Set(), strings: new Set(), photoIds: new Set() };
	const addNumber = (n: unknown) => {
		if (typeof n === 'number' && Number.isFinite(n)) side.numbers.add(n);
	};
	// The figures as the tank page's data carries them, and as the entry recorded them on its day.
	addNumber(entry.litres);
	if (entry.ageWeeks !== null) {
		addNumber(entry.ageWeeks);
		side.strings.add(plural(entry.ageWeeks, 'week'));
	}
	let pages = 1;
	for (let page = 1; page <= pages; page++) {
		const nodes = await pageData(`/journals/${tankId}?page=${page}`, readers.metric.cookie);
		const data = nodes.find((n) => (n as { tank?: unknown }).tank) as {
			tank: { volumeLitres: number | null; waterLitres: number | null; setUpOn: string | null };
			figures: {
				volume: { litres: number } | null;
				estimate: { waterLitres: number } | null;
				grossLitres: number;
				age: { days: number; weeks: number; label: string } | null;
			};
			timeline: { pages: number };
		};
		expect(data, `tank ${tankId} page data`).toBeTruthy();
		pages = data.timeline.pages;
		if (page === 1) {
			const f = data.figures;
			for (const n of [f.volume?.litres, f.estimate?.waterLitres, f.grossLitres, data.tank.volumeLitres, data.tank.waterLitres]) addNumber(n);
			if (f.age) {
				addNumber(f.age.days);
				addNumber(f.age.weeks);
				for (const s of [f.age.label, plural(f.age.days, 'day'), plural(f.age.weeks, 'week')]) side.strings.add(s);
			}
			if (data.tank.setUpOn) side.strings.add(data.tank.setUpOn);
		}
		// Every photo the tank's pages carry: the cover and the journal entries' photos.
		for (const leaf of nodes.flatMap((n) => leaves(n, 'tank'))) {
			if (!leaf.path.includes('<photo>')) continue;
			const key = leaf.path.slice(leaf.path.lastIndexOf('.') + 1);
			if (key === 'id' && typeof leaf.value === 'number') side.photoIds.add(leaf.value);
			if (['alt', 'caption', 'thumb', 'medium', 'large'].includes(key) && typeof leaf.value === 'string' && leaf.value.trim()) side.strings.add(leaf.value);
		}
	}
	// The volume and age as the tank page shows them to members of each unit system.
	for (const reader of Object.values(readers)) {
		const html = await (await request(`/journals/${tankId}`, { cookie: reader.cookie })).text();
		for (const id of ['tank-volume', 'tank-age']) {
			const text = testIdText(html, id);
			if (!text) continue;
			for (const token of volumeTokens(text)) {
				side.strings.add(token.text);
				addNumber(token.value);
			}
			// The age is taken from the page's data above: the "N days" of "14 weeks 3 days" alone names nothing.
		}
	}
	for (const id of side.photoIds) for (const size of ['thumb', 'medium', 'large']) side.strings.add(`/media/${id}/${size}`);
	return side;
}

interface Collision {
	where: string;
	value: string | number;
	tank: number;
}

/**
 * Numbers whose meaning the judging pages fix: ids, entry numbers and their neighbours, a photo's
 * place in its entry, counts of cards, the rubric's points and weights, the judge's own scores and
 * card versions. They are the contest's or the judge's, never the tank's, and a small one that
 * happens to equal a tank's age in weeks or a photo's id names nobody. Every other number, every
 * numeric string and every text is compared; so is any id a photo carries.
 */
const STRUCTURAL =
	/\.(id|categoryId|number|previous|next|position|toScore|submitted|drafts|conflicts|ownEntries|unreadSwaps|maxPoints|weight|version)$|\.fields\.scores\.\d+$/;
const PHOTO_PLACE = /<photo>\.position$/;

const sameNumber = (side: PublicSide, n: number) => [...side.numbers].some((p) => Math.abs(p - n) < 1e-9);

/** The judge-side values that equal something public about one of these tanks. */
function collisions(found: Leaf[], sides: PublicSide[]): Collision[] {
	const hits: Collision[] = [];
	for (const leaf of found) {
		for (const side of sides) {
			const hit = (value: string | number) => hits.push({ where: leaf.path, value, tank: side.tankId });
			const structural = STRUCTURAL.test(leaf.path);
			// A photo's id is an address wherever a photo carries it, under any key but its place.
			const photoId = leaf.path.includes('<photo>') && !PHOTO_PLACE.test(leaf.path) && side.photoIds.has(Number(leaf.value));
			if (typeof leaf.value === 'number') {
				if ((!structural && sameNumber(side, leaf.value)) || photoId) hit(leaf.value);
				continue;
			}
			const text = leaf.value;
			if (side.strings.has(text) || photoId) hit(text);
			for (const token of tokens(text)) if (side.strings.has(token)) hit(token);
			// Numbers sent as text. A bare number in rendered HTML (an entry number, a field's maxlength)
			// comes from the data or the template; the data's are checked above.
			if (!structural && !leaf.html && /^\d+(\.\d+)?$/.test(text) && sameNumber(side, Number(text))) hit(text);
			for (const id of side.photoIds) if (text.includes(`/media/${id}/`)) hit(text);
			if (text.includes(`/journals/${side.tankId}`)) hit(text);
		}
	}
	return hits;
}

/** Everything one judge receives about one entry: its scorecard page (data and HTML) and its card. */
async function entrySide(judge: TestPerson, contestId: number, number: number): Promise<Leaf[]> {
	const path = `/judging/${contestId}/${number}`;
	const found = (await pageData(path, judge.cookie)).flatMap((n) => leaves(n, path));
	expect(
		found.some((l) => typeof l.value === 'string' && l.value.includes('<p>')),
		`${path} carries the statement`
	).toBe(true);
	found.push(...htmlLeaves(await (await request(path, { cookie: judge.cookie })).text(), path));
	const card = await request(`/api/judging/${contestId}/${number}/card`, { cookie: judge.cookie, accept: 'application/json' });
	expect(card.status).toBe(200);
	found.push(...leaves(await card.json(), `GET /api${path}/card`));
	return found;
}

/** The judge's pages about the whole contest: their contests and the contest's list of entries. */
async function contestSide(judge: TestPerson, contestId: number): Promise<Leaf[]> {
	const found: Leaf[] = [];
	for (const path of ['/judging', `/judging/${contestId}`]) {
		found.push(...(await pageData(path, judge.cookie)).flatMap((n) => leaves(n, path)));
		found.push(...htmlLeaves(await (await request(path, { cookie: judge.cookie })).text(), path));
	}
	return found;
}

async function readersInEachUnitSystem(): Promise<Record<UnitSystem, TestPerson>> {
	const readers = {
		metric: await makePerson({ label: 'reader-metric' }),
		us: await makePerson({ label: 'reader-us' }),
		imperial: await makePerson({ label: 'reader-imperial' })
	};
	for (const [units, person] of Object.entries(readers)) await setUnits(person.id, units as UnitSystem);
	return readers;
}

const restoreUnits: { id: string; units: UnitSystem }[] = [];
afterAll(async () => {
	for (const r of restoreUnits) await db.update(users).set({ units: r.units }).where(eq(users.id, r.id));
});

async function setUnits(id: string, units: UnitSystem) {
	const [row] = await db.select({ units: users.units }).from(users).where(eq(users.id, id));
	if (!restoreUnits.some((r) => r.id === id)) restoreUnits.push({ id, units: row!.units });
	await db.update(users).set({ units }).where(eq(users.id, id));
}

describe('blind judging of the demo contest', () => {
	test('no value a judge receives equals a public figure, age or photo of the entrant’s tank, in any unit system', { timeout: 120_000 }, async () => {
		const [contest] = await db
			.select()
			.from(contests)
			.where(and(eq(contests.state, 'judging'), like(contests.title, 'Kettlewater Scapes%')));
		expect(contest, 'the demo contest being judged').toBeTruthy();
		const entries = await db.select().from(contestEntries).where(eq(contestEntries.contestId, contest!.id));
		expect(entries.length).toBeGreaterThan(3);
		const panel = (await db.select().from(contestJudges).where(eq(contestJudges.contestId, contest!.id))).map((j) => j.judgeId);
		expect(panel.length).toBeGreaterThan(1);

		const readers = await readersInEachUnitSystem();

		const sides = new Map<number, PublicSide>();
		for (const e of entries) {
			if (e.tankId === null) continue;
			sides.set(e.number!, await publicSide(e.tankId, e, readers));
		}
		expect(sides.size).toBe(entries.length);
		// The public side is really collected: every tank has a volume and an age to compare with.
		for (const side of sides.values()) expect(side.numbers.size, `tank ${side.tankId}`).toBeGreaterThan(3);

		const problems: (Collision & { judge: string; units: UnitSystem; entry: number | null })[] = [];
		const judged = new Set<number>();
		const runs: { judgeId: string; units: UnitSystem }[] = panel.map((judgeId) => ({ judgeId, units: 'metric' }));
		runs.push({ judgeId: panel[0]!, units: 'us' }, { judgeId: panel[0]!, units: 'imperial' });
		for (const run of runs) {
			await setUnits(run.judgeId, run.units);
			const judge = await sessionFor(run.judgeId);
			const record = (found: Leaf[], entry: number | null, against: PublicSide[]) => {
				for (const c of collisions(found, against)) problems.push({ ...c, judge: judge.displayName, units: run.units, entry });
			};

			// The pages about the whole contest are compared with every entry's tank.
			record(await contestSide(judge, contest!.id), null, [...sides.values()]);
			const listing = (await pageData(`/judging/${contest!.id}`, judge.cookie)).find((n) => (n as { listing?: unknown }).listing) as {
				listing: { entries: { number: number; state: string }[] };
			};
			for (const { number, state } of listing.listing.entries) {
				if (state === 'conflicted') continue;
				const found = await entrySide(judge, contest!.id, number);
				record(found, number, [sides.get(number)!]);
				// The volume is there, as a band in the judge's own units.
				const band = found.find((l) => l.path.endsWith('.entry.figures.volume'))?.value;
				expect(band, `entry ${number} for ${run.units}`).toMatch({ metric: /\d L\b/, us: /\d US gal\b/, imperial: /\d imp gal\b/ }[run.units]);
				judged.add(number);
			}
		}
		// Every entry was looked at by someone on the panel.
		expect([...judged].sort((a, b) => a - b)).toEqual([...sides.keys()].sort((a, b) => a - b));
		expect(problems).toEqual([]);
	});
});

describe('blind judging of an entry whose photo texts and statement borrow from the tank’s public page', () => {
	test('the judge gets neither the public photo’s address nor its description or caption', async () => {
		const f = await contestFixture({ judges: 1, state: 'open' });
		const entrant = await makePerson({ label: 'entrant' });
		const alt = `Slate hollow from the front ${crypto.randomUUID().slice(0, 4)}`;
		const caption = `After the spring trim ${crypto.randomUUID().slice(0, 4)}`;
		const cover = await photoOf(entrant, '#4f9470');
		const tankId = await tanks.create({ id: entrant.id }, tankInput({ name: 'Borrowed words', visibility: 'public' }), [{ id: cover.id, alt, caption }]);
		// The entrant reuses the public cover's words for the entry's photo, and shows the cover in the statement.
		const upload = await photoOf(entrant, '#1e5b47');
		const open = (await contestsDomain.load(f.contestId))!.categories.find((c) => c.name === 'Open')!;
		const entryId = await entries.create(viewerOf(entrant), f.contestId, {
			categoryId: open.id,
			tankId,
			statement: `Stones and stems.\n\n![${alt}](${cover.urls.large})`,
			photos: [{ id: upload.id, alt, caption }]
		});
		await transition(viewerOf(f.admin), f.contestId, 'start-judging');
		const [entry] = await db.select().from(contestEntries).where(eq(contestEntries.id, entryId));

		const side = await publicSide(tankId, entry!, await readersInEachUnitSystem());
		expect(side.photoIds).toContain(cover.id);
		expect(side.strings).toContain(alt);
		expect(side.strings).toContain(caption);
		const judge = f.judges[0]!;
		const found = [...(await entrySide(judge, f.contestId, entry!.number!)), ...(await contestSide(judge, f.contestId))];
		expect(collisions(found, [side])).toEqual([]);
	});
});
