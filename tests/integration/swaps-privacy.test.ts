// What the swap board gives away about members: the tank a listing came from only to those who may
// see that tank.
import { describe, expect, test } from 'vitest';
import { unflatten } from 'devalue';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as listings from '../../src/lib/server/swaps/listings';
import * as threads from '../../src/lib/server/swaps/threads';
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
		const detail = await listings.get(viewerOf(other), hidden);
		expect(tankRefs(detail)).toEqual([]);

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
