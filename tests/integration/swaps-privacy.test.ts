// What the swap board gives away about members: the tank a listing came from only to those who may
// see that tank, and nothing about where a member lives beyond the coarse distance the board shows,
// however often someone moves their own point and searches again.
import { describe, expect, test } from 'vitest';
import { unflatten } from 'devalue';
import * as users from '../../src/lib/server/club/users';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as nearby from '../../src/lib/server/swaps/nearby';
import * as detail from '../../src/lib/server/swaps/listing-detail';
import * as threads from '../../src/lib/server/swaps/threads';
import { parseBoardQuery, type Radius } from '../../src/lib/swaps/board-filter';
import type { UnitSystem } from '../../src/lib/club/roles';
import { roundToKilometre, type LatLng } from '../../src/lib/club/location';
import { haversineDistance } from '../../src/lib/swaps/distance';
import { labelOf, shownFigure } from '../../src/lib/swaps/display';
import { request } from '../helpers/http';
import { tankInput } from '../helpers/tanks';
import { createListing, memberAt, token, viewerOf } from '../helpers/swaps';
import type { TestPerson } from '../helpers/people';

/** A page's server data as the browser receives it (`__data.json`, decoded), with the raw text. */
async function pageData(path: string, person?: TestPerson): Promise<{ text: string; redirect: string | null; nodes: Record<string, unknown>[] }> {
	const response = await request(`${path}/__data.json`, { cookie: person?.cookie, accept: '*/*' });
	const text = await response.text();
	const first = JSON.parse(text.split('\n')[0]!) as { type: string; location?: string; nodes?: ({ type: string; data?: unknown[] } | null)[] };
	if (first.type === 'redirect') return { text, redirect: first.location ?? '', nodes: [] };
	expect(first.type).toBe('data');
	const nodes = (first.nodes ?? []).flatMap((n) => (n?.type === 'data' && n.data ? [unflatten(n.data) as Record<string, unknown>] : []));
	return { text, redirect: null, nodes };
}

/** Every value under a key that names a tank ("tank", "tankId", …), wherever it is nested. */
function tankValues(value: unknown, found: unknown[] = []): unknown[] {
	if (Array.isArray(value)) for (const v of value) tankValues(v, found);
	else if (value && typeof value === 'object' && !(value instanceof Date)) {
		for (const [key, v] of Object.entries(value)) {
			if (/^tank/i.test(key)) found.push(v);
			tankValues(v, found);
		}
	}
	return found;
}

const tankRefs = (value: unknown) => tankValues(value).filter((v) => v !== null && v !== undefined);

describe('swap listings: the tank a listing came from', () => {
	test('only a viewer who may see the tank gets its link, id or name: not in the page data, the conversation or the JSON board', async () => {
		const place = { lat: -52.63, lng: -31.18 };
		const owner = await memberAt(place, 'tank-lister');
		const other = await memberAt(place, 'tank-looker');
		const tag = token('tanklink');
		const hiddenName = `Hidden reef ${tag}`;
		const clubName = `Club jungle ${tag}`;
		const hiddenTank = await tanks.create(viewerOf(owner), tankInput({ name: hiddenName, visibility: 'private' }));
		const clubTank = await tanks.create(viewerOf(owner), tankInput({ name: clubName, visibility: 'club' }));
		const hidden = await createListing(owner, { title: `${tag} from the hidden tank`, tankId: hiddenTank });
		const fromClub = await createListing(owner, { title: `${tag} from the club tank`, tankId: clubTank });

		// Another member: the listing, but nothing of the private tank.
		const seen = await pageData(`/swaps/${hidden}`, other);
		const listing = seen.nodes.at(-1)!.listing as Record<string, unknown>;
		expect(listing.title).toBe(`${tag} from the hidden tank`);
		expect(tankRefs(seen.nodes)).toEqual([]);
		expect(seen.text).not.toContain(hiddenName);
		const html = await (await request(`/swaps/${hidden}`, { cookie: other.cookie })).text();
		expect(html).not.toContain(`/journals/${hiddenTank}`);
		expect(html).not.toContain(hiddenName);
		// The domain itself hands out nothing more.
		const shown = await detail.get(viewerOf(other), hidden);
		expect(tankRefs(shown)).toEqual([]);

		// The owner sees their own tank; a club-wide tank is shown to any member.
		expect((await pageData(`/swaps/${hidden}`, owner)).nodes.at(-1)!.listing).toMatchObject({ tank: { id: hiddenTank, name: hiddenName } });
		expect((await pageData(`/swaps/${fromClub}`, other)).nodes.at(-1)!.listing).toMatchObject({ tank: { id: clubTank, name: clubName } });
		expect(await (await request(`/swaps/${fromClub}`, { cookie: other.cookie })).text()).toContain(`/journals/${clubTank}`);

		// Signed out: sent to sign in, with nothing of the listing or its tank.
		const anonymous = await pageData(`/swaps/${hidden}`);
		expect(anonymous.redirect).toMatch(/^\/signin/);
		expect(anonymous.text).not.toContain(hiddenName);
		expect(anonymous.text).not.toMatch(/tank/i);

		// The conversation about it and the board's JSON carry no tank either.
		const threadId = await threads.request(viewerOf(other), hidden, 'Could I have a few stems on Saturday?');
		const conversation = await pageData(`/swaps/threads/${threadId}`, other);
		expect(conversation.nodes.at(-1)!.thread).toBeTruthy();
		expect(tankRefs(conversation.nodes)).toEqual([]);
		expect(conversation.text).not.toContain(hiddenName);
		const api = await request(`/api/swaps/listings?q=${tag}`, { cookie: other.cookie, accept: 'application/json' });
		const body = (await api.json()) as { rows: { id: number }[] };
		expect(body.rows.map((r) => r.id).sort()).toEqual([hidden, fromClub].sort());
		expect(tankRefs(body)).toEqual([]);
		expect(JSON.stringify(body)).not.toContain(hiddenName);
		// Nor do the owner's profile and My swaps lists for other members' eyes.
		const profile = await pageData(`/members/${owner.id}`, other);
		expect(tankRefs(profile.nodes.at(-1)!.listings)).toEqual([]);
		expect(profile.text).not.toContain(hiddenName);
	});
});

interface Seen {
	step: number;
	labels: Map<number, string>;
	/** Shown figures (0 for "under 2"). */
	shown: Map<number, number>;
	results: Map<Radius | null, number[]>;
}

/**
 * A walker in `units` moves their point north in 100 m steps along `lng` and searches the board for
 * `tag` with each radius: what each step showed them.
 */
async function walkBoard(tag: string, units: UnitSystem, lng: number, radii: (Radius | null)[]): Promise<Seen[]> {
	const walker = await memberAt(null, `walker-${units}`);
	const walk: Seen[] = [];
	for (let step = 0; step <= 133; step++) {
		// 0.0009° of latitude is about 100 m; the account page keeps only the rounded point.
		await users.saveProfile(viewerOf(walker), {
			displayName: walker.displayName,
			units,
			locationMode: 'point',
			homeAreaId: null,
			homeLat: -56.56 + step * 0.0009,
			homeLng: lng
		});
		const results = new Map<Radius | null, number[]>();
		const labels = new Map<number, string>();
		const shown = new Map<number, number>();
		for (const radius of radii) {
			const page = await nearby.search({ ...viewerOf(walker), units }, { ...parseBoardQuery(new URLSearchParams()), q: tag, radius });
			expect(page.order).toBe('distance');
			results.set(
				radius,
				page.rows.map((r) => r.id)
			);
			for (const r of page.rows) {
				const text = r.distance!.text;
				if (labels.has(r.id)) expect(labels.get(r.id)).toBe(text);
				labels.set(r.id, text);
				shown.set(r.id, r.distance!.figure ?? 0);
			}
		}
		walk.push({ step, labels, shown, results });
	}
	// The JSON API the board's script uses answers the same as the last step.
	const response = await request(`/api/swaps/listings?q=${tag}&radius=${radii[0]}`, { cookie: walker.cookie, accept: 'application/json' });
	const body = (await response.json()) as { rows: { id: number; distance: { text: string } }[] };
	const last = walk.at(-1)!;
	expect(body.rows.map((r) => r.id)).toEqual(last.results.get(radii[0]!));
	expect(body.rows.map((r) => r.distance.text)).toEqual(last.results.get(radii[0]!)!.map((id) => last.labels.get(id)));
	return walk;
}

/** The radius filters and the order follow the shown figures and nothing finer, at every step of a walk. */
function expectOnlyShownFiguresDecide(walk: Seen[], newestFirst: number[], radii: (Radius | null)[]) {
	// Each radius holds exactly the listings shown at that distance or nearer; every list is in
	// order of the shown distance, then newest first: nothing depends on the exact figure.
	for (const seen of walk) {
		for (const radius of radii) {
			const expected = newestFirst.filter((id) => radius === null || seen.shown.get(id)! <= radius).sort((a, b) => seen.shown.get(a)! - seen.shown.get(b)!);
			expect({ step: seen.step, radius, ids: seen.results.get(radius) }).toEqual({ step: seen.step, radius, ids: expected });
		}
	}

	// Put the other way round, as the walker sees it: whether a listing is within a radius is
	// decided by its own shown figure alone, and which of two comes first by their two figures
	// alone; when no figure changes from one step to the next, nothing changes at all.
	const membership = new Map<string, Set<boolean>>();
	const pairOrder = new Map<string, Set<boolean>>();
	for (const seen of walk) {
		for (const radius of radii) {
			const ids = seen.results.get(radius)!;
			for (const id of newestFirst) {
				const key = `${id} ${seen.labels.get(id)} within ${radius}`;
				membership.set(key, (membership.get(key) ?? new Set()).add(ids.includes(id)));
			}
		}
		const all = seen.results.get(null)!;
		for (const a of newestFirst)
			for (const b of newestFirst) {
				if (a >= b) continue;
				const key = `${a} ${seen.labels.get(a)} / ${b} ${seen.labels.get(b)}`;
				pairOrder.set(key, (pairOrder.get(key) ?? new Set()).add(all.indexOf(a) < all.indexOf(b)));
			}
	}
	expect([...membership].filter(([, outcomes]) => outcomes.size > 1).map(([key]) => key)).toEqual([]);
	expect([...pairOrder].filter(([, outcomes]) => outcomes.size > 1).map(([key]) => key)).toEqual([]);
	for (let i = 1; i < walk.length; i++) {
		if ([...walk[i]!.labels].every(([id, text]) => walk[i - 1]!.labels.get(id) === text)) expect([...walk[i]!.results]).toEqual([...walk[i - 1]!.results]);
	}
}

describe('swap board: what moving one’s own point reveals', () => {
	test('walking one’s point in 100 m steps, the radius filters, the order and the figures follow the shown distances and nothing finer', async () => {
		// Over the open Southern Ocean, away from every other test's listings. Members' points are
		// on the 0.01° grid; here 0.01° of longitude is about 0.61 km, of latitude about 1.11 km.
		const lng = -20.3;
		const victims: Record<string, LatLng> = {
			// Shown as "about 2 km" from two neighbouring points of the walk, 1.84 km and 2.15 km away:
			// an exact 2 km filter would tell them apart.
			edge: { lat: -56.5, lng: -20.27 },
			west: { lat: -56.49, lng: -20.34 },
			onPath: { lat: -56.47, lng: -20.3 },
			south: { lat: -56.53, lng: -20.33 },
			// Two listings both "about 6 km" away on either side of the walk: nearest first by the exact
			// figure, their order would flip as the walker passes between them.
			farNorth: { lat: -56.49, lng: -20.39 },
			farSouth: { lat: -56.51, lng: -20.39 }
		};
		const tag = token('trilat');
		const made: Record<string, number> = {};
		for (const [name, point] of Object.entries(victims)) made[name] = await createListing(await memberAt(point, `victim-${name}`), { title: `${tag} ${name}` });
		const newestFirst = Object.values(made).sort((a, b) => b - a);
		const radii: (Radius | null)[] = [2, 5, null];
		const walk = await walkBoard(tag, 'metric', lng, radii);
		expect(walk.every((seen) => seen.labels.size === newestFirst.length)).toBe(true);
		expectOnlyShownFiguresDecide(walk, newestFirst, radii);

		// The walk did pass the places where exact figures would tell more (checked on the stored
		// points with the haversine function): the "edge" listing shown "about 2 km" both within
		// and beyond an exact 2 km, and the two far ones both "about 6 km" with either one nearer.
		const stored = walk.map((s) => roundToKilometre({ lat: -56.56 + s.step * 0.0009, lng }));
		const edgeExact = stored.map((p) => haversineDistance(p, victims.edge!)).filter((d) => labelOf(shownFigure(d, 'km'), 'km').text === 'about 2 km');
		expect(edgeExact.some((d) => d <= 2_000) && edgeExact.some((d) => d > 2_000)).toBe(true);
		const farBoth = stored
			.map((p) => [haversineDistance(p, victims.farNorth!), haversineDistance(p, victims.farSouth!)] as const)
			.filter(([n, s]) => labelOf(shownFigure(n, 'km'), 'km').text === 'about 6 km' && labelOf(shownFigure(s, 'km'), 'km').text === 'about 6 km');
		expect(farBoth.some(([n, s]) => n < s) && farBoth.some(([n, s]) => s < n)).toBe(true);
		expect(
			walk.every((s) => s.results.get(2)!.includes(made.edge!) === (s.labels.get(made.edge!) === 'about 2 km' || s.labels.get(made.edge!) === 'under 2 km'))
		).toBe(true);
	}, 180_000);

	test('in miles for US and imperial members: the bands, the radius filters and the order follow the shown miles and nothing finer', async () => {
		const lng = -20.3;
		// The same places as above; in miles "about 2 mi" runs from 1.5 to 2.5 mi (2.41 to 4.02 km).
		const victims: Record<string, LatLng> = {
			edge: { lat: -56.5, lng: -20.27 },
			west: { lat: -56.49, lng: -20.34 },
			onPath: { lat: -56.47, lng: -20.3 },
			farNorth: { lat: -56.49, lng: -20.39 },
			farSouth: { lat: -56.51, lng: -20.39 }
		};
		const tag = token('trimiles');
		const made: Record<string, number> = {};
		for (const [name, point] of Object.entries(victims))
			made[name] = await createListing(await memberAt(point, `mile-victim-${name}`), { title: `${tag} ${name}` });
		const newestFirst = Object.values(made).sort((a, b) => b - a);
		const radii: (Radius | null)[] = [2, 5, null];
		const walk = await walkBoard(tag, 'us', lng, radii);
		expect(walk.every((seen) => seen.labels.size === newestFirst.length)).toBe(true);
		expect(walk.flatMap((seen) => [...seen.labels.values()]).every((text) => /^(under 2 mi|about \d+ mi)$/.test(text))).toBe(true);
		expectOnlyShownFiguresDecide(walk, newestFirst, radii);

		// The walk passed the places where exact figures would tell more: the "edge" listing shown
		// "about 2 mi" both within and beyond an exact 2 miles (3,218.688 m), and the two far ones
		// under the same figure with either one nearer.
		const stored = walk.map((s) => roundToKilometre({ lat: -56.56 + s.step * 0.0009, lng }));
		const miles = (d: number) => labelOf(shownFigure(d, 'mi'), 'mi').text;
		const edgeExact = stored.map((p) => haversineDistance(p, victims.edge!)).filter((d) => miles(d) === 'about 2 mi');
		expect(edgeExact.some((d) => d <= 3_218.688) && edgeExact.some((d) => d > 3_218.688)).toBe(true);
		const farBoth = stored
			.map((p) => [haversineDistance(p, victims.farNorth!), haversineDistance(p, victims.farSouth!)] as const)
			.filter(([n, s]) => miles(n) === miles(s));
		expect(farBoth.some(([n, s]) => n < s) && farBoth.some(([n, s]) => s < n)).toBe(true);
		expect(walk.every((s) => s.results.get(2)!.includes(made.edge!) === ['about 2 mi', 'under 2 mi'].includes(s.labels.get(made.edge!)!))).toBe(true);
	}, 180_000);
});
