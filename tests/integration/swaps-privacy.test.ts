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
import { parseBoardQuery, type RadiusKm } from '../../src/lib/swaps/board-filter';
import { roundToKilometre, type LatLng } from '../../src/lib/club/location';
import { haversineDistance } from '../../src/lib/swaps/distance';
import { labelOf, shownMetres } from '../../src/lib/swaps/display';
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
		const walker = await memberAt(null, 'walker');
		const radii: (RadiusKm | null)[] = [2, 5, null];

		interface Seen {
			step: number;
			labels: Map<number, string>;
			/** Shown kilometres (0 for "under 2 km"). */
			shownKm: Map<number, number>;
			results: Map<RadiusKm | null, number[]>;
		}
		const walk: Seen[] = [];
		for (let step = 0; step <= 133; step++) {
			// 0.0009° of latitude is about 100 m; the account page keeps only the rounded point.
			await users.saveProfile(viewerOf(walker), {
				displayName: walker.displayName,
				units: 'metric',
				locationMode: 'point',
				homeAreaId: null,
				homeLat: -56.56 + step * 0.0009,
				homeLng: lng,
				notifyMessages: 'off',
				weeklyDigest: false,
				announcements: false
			});
			const results = new Map<RadiusKm | null, number[]>();
			const labels = new Map<number, string>();
			const shownKm = new Map<number, number>();
			for (const radiusKm of radii) {
				const page = await nearby.search(viewerOf(walker), { ...parseBoardQuery(new URLSearchParams()), q: tag, radiusKm });
				expect(page.order).toBe('distance');
				results.set(
					radiusKm,
					page.rows.map((r) => r.id)
				);
				for (const r of page.rows) {
					const text = r.distance!.text;
					if (labels.has(r.id)) expect(labels.get(r.id)).toBe(text);
					labels.set(r.id, text);
					shownKm.set(r.id, r.distance!.km ?? 0);
				}
			}
			expect(labels.size).toBe(newestFirst.length);
			walk.push({ step, labels, shownKm, results });
		}

		// Each radius holds exactly the listings shown at that distance or nearer; every list is in
		// order of the shown distance, then newest first: nothing depends on the exact figure.
		for (const seen of walk) {
			for (const radiusKm of radii) {
				const expected = newestFirst
					.filter((id) => radiusKm === null || seen.shownKm.get(id)! <= radiusKm)
					.sort((a, b) => seen.shownKm.get(a)! - seen.shownKm.get(b)!);
				expect({ step: seen.step, radiusKm, ids: seen.results.get(radiusKm) }).toEqual({ step: seen.step, radiusKm, ids: expected });
			}
		}

		// Put the other way round, as the walker sees it: whether a listing is within a radius is
		// decided by its own shown figure alone, and which of two comes first by their two figures
		// alone; when no figure changes from one step to the next, nothing changes at all.
		const membership = new Map<string, Set<boolean>>();
		const pairOrder = new Map<string, Set<boolean>>();
		for (const seen of walk) {
			for (const radiusKm of radii) {
				const ids = seen.results.get(radiusKm)!;
				for (const id of newestFirst) {
					const key = `${id} ${seen.labels.get(id)} within ${radiusKm}`;
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

		// The walk did pass the places where exact figures would tell more (checked on the stored
		// points with the haversine function): the "edge" listing shown "about 2 km" both within
		// and beyond an exact 2 km, and the two far ones both "about 6 km" with either one nearer.
		const stored = walk.map((s) => roundToKilometre({ lat: -56.56 + s.step * 0.0009, lng }));
		const edgeExact = stored.map((p) => haversineDistance(p, victims.edge!)).filter((d) => labelOf(shownMetres(d)).text === 'about 2 km');
		expect(edgeExact.some((d) => d <= 2_000) && edgeExact.some((d) => d > 2_000)).toBe(true);
		const farBoth = stored
			.map((p) => [haversineDistance(p, victims.farNorth!), haversineDistance(p, victims.farSouth!)] as const)
			.filter(([n, s]) => labelOf(shownMetres(n)).text === 'about 6 km' && labelOf(shownMetres(s)).text === 'about 6 km');
		expect(farBoth.some(([n, s]) => n < s) && farBoth.some(([n, s]) => s < n)).toBe(true);
		expect(
			walk.every((s) => s.results.get(2)!.includes(made.edge!) === (s.labels.get(made.edge!) === 'about 2 km' || s.labels.get(made.edge!) === 'under 2 km'))
		).toBe(true);

		// The JSON API the board's script uses answers the same.
		const response = await request(`/api/swaps/listings?q=${tag}&radius=2`, { cookie: walker.cookie, accept: 'application/json' });
		const body = (await response.json()) as { rows: { id: number; distance: { text: string } }[] };
		const last = walk.at(-1)!;
		expect(body.rows.map((r) => r.id)).toEqual(last.results.get(2));
		expect(body.rows.map((r) => r.distance.text)).toEqual(last.results.get(2)!.map((id) => last.labels.get(id)));
	});
});
