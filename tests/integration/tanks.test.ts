// Tank profiles through the running app: who sees what, and the form round trip.
import { beforeAll, describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import * as tanks from '../../src/lib/server/journals/tanks';
import * as tankDeletion from '../../src/lib/server/journals/tank-deletion';
import { tankLights, tanks as tankTable } from '../../src/lib/server/journals/schema';
import * as catalogue from '../../src/lib/server/species/catalogue';
import type { Viewer } from '../../src/lib/server/club/users';
import { request } from '../helpers/http';
import { uploadFile } from '../helpers/media';
import { makePerson, type TestPerson } from '../helpers/people';
import { tankInput } from '../helpers/tanks';

const viewerOf = (p: TestPerson, units: Viewer['units'] = 'metric'): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units });

let owner: TestPerson;
let member: TestPerson;
let admin: TestPerson;

beforeAll(async () => {
	owner = await makePerson({ label: 'tank-owner' });
	member = await makePerson({ label: 'tank-member' });
	admin = await makePerson({ role: 'admin', label: 'tank-admin' });
});

async function tankWithCover(visibility: 'public' | 'club' | 'private') {
	const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#2f7a58' } })
		.jpeg()
		.toBuffer();
	const { id: photoId } = await (await uploadFile(owner, jpeg)).json();
	const id = await tanks.create(viewerOf(owner), tankInput({ name: `Visibility ${visibility} ${photoId}`, visibility }), [
		{ id: photoId, alt: 'Front', caption: '' }
	]);
	return { id, photoId };
}

describe('who may see a tank and its photos', () => {
	test.each([
		['private', { owner: 200, member: 404, admin: 404, anonymous: 404 }],
		['club', { owner: 200, member: 200, admin: 200, anonymous: 404 }],
		['public', { owner: 200, member: 200, admin: 200, anonymous: 200 }]
	] as const)('a %s tank', async (visibility, expected) => {
		const { id, photoId } = await tankWithCover(visibility);
		for (const [who, person] of [
			['owner', owner],
			['member', member],
			['admin', admin],
			['anonymous', null]
		] as const) {
			const pageResponse = await request(`/journals/${id}`, { cookie: person?.cookie });
			expect(pageResponse.status, `${who} opening a ${visibility} tank`).toBe(expected[who]);
			const body = await pageResponse.text();
			if (expected[who] === 200) expect(body).toContain(`Visibility ${visibility} ${photoId}`);
			else expect(body).not.toContain(`Visibility ${visibility}`);
			const photo = await request(`/media/${photoId}/medium`, { cookie: person?.cookie, accept: 'image/webp' });
			expect(photo.status, `${who} fetching the cover of a ${visibility} tank`).toBe(expected[who]);
		}
	});

	test('the domain answers the same: get() is null where the page is 404', async () => {
		const { id } = await tankWithCover('private');
		expect(await tanks.get(viewerOf(owner), id)).not.toBeNull();
		expect(await tanks.get(viewerOf(member), id)).toBeNull();
		expect(await tanks.get(null, id)).toBeNull();
		expect(tanks.canView(null, { ownerId: owner.id, visibility: 'club' })).toBe(false);
		expect(tanks.canView({ id: member.id }, { ownerId: owner.id, visibility: 'club' })).toBe(true);
	});

	test('listVisibleOf shows another member only the running tanks they may see', async () => {
		const keeper = await makePerson({ label: 'tank-keeper' });
		const viewer = viewerOf(keeper);
		const open = await tanks.create(viewer, tankInput({ name: 'Open one', visibility: 'public' }));
		const club = await tanks.create(viewer, tankInput({ name: 'Club one', visibility: 'club' }));
		await tanks.create(viewer, tankInput({ name: 'Hidden one', visibility: 'private' }));
		const old = await tanks.create(viewer, tankInput({ name: 'Old one', visibility: 'public' }));
		await tanks.retire(viewer, old, '2026-02-01');
		expect((await tanks.listVisibleOf(viewerOf(member), keeper.id)).map((t) => t.id).sort()).toEqual([open, club].sort());
		expect((await tanks.listVisibleOf(null, keeper.id)).map((t) => t.id)).toEqual([open]);
		expect((await tanks.listVisibleOf(viewer, keeper.id)).map((t) => t.name).sort()).toEqual(['Club one', 'Hidden one', 'Open one']);
	});

	test('someone else cannot change, retire or delete a tank', async () => {
		const { id } = await tankWithCover('public');
		const notFound = { status: 404, code: 'not-found' };
		await expect(tanks.update(viewerOf(member), id, tankInput({ name: 'Taken' }), [])).rejects.toMatchObject(notFound);
		await expect(tanks.retire(viewerOf(member), id, '2026-01-01')).rejects.toMatchObject(notFound);
		await expect(tankDeletion.deleteTank(viewerOf(member), id)).rejects.toMatchObject(notFound);
		expect((await tanks.get(null, id))!.name).toMatch(/^Visibility public/);
	});
});

describe('the tank form', () => {
	test('a measured PAR at the substrate with its depth: stored metric, shown beside watts per litre; refused without a depth', async () => {
		const us = await makePerson({ label: 'tank-par' });
		await db.update(users).set({ units: 'us' }).where(eq(users.id, us.id));
		const form = {
			name: 'Lit tank',
			visibility: 'club',
			length: '24',
			width: '12',
			height: '16',
			co2Method: 'none',
			'lights[0][id]': '',
			'lights[0][label]': 'Bar',
			'lights[0][watts]': '24',
			'lights[0][hours]': '7',
			par: '85',
			parDepth: ''
		};
		const refused = await request('/journals/new', { cookie: us.cookie, form });
		expect(refused.status).toBe(400);
		const html = await refused.text();
		expect(html).toContain('Give the depth under the water surface the reading was taken at.');
		expect(html).toMatch(/id="par"[^>]*value="85"/);
		const tooDeep = await request('/journals/new', { cookie: us.cookie, form: { ...form, parDepth: '20' } });
		expect(tooDeep.status).toBe(400);
		const created = await request('/journals/new', { cookie: us.cookie, form: { ...form, parDepth: '15' } });
		expect(created.status).toBe(303);
		const id = Number(created.headers.get('location')!.split('/').pop());
		const [row] = await db.select().from(tankTable).where(eq(tankTable.id, id));
		// 15 in × 2.54 = 38.1 cm exactly (international inch).
		expect(row).toMatchObject({ parAtSubstrate: 85, parDepthCm: 38.1 });
		const page = await (await request(`/journals/${id}`, { cookie: us.cookie })).text();
		const light = /data-testid="tank-light"[\s\S]*?<\/dd>/.exec(page)![0];
		expect(light).toMatch(/W per US gal/);
		expect(light).toContain('PAR at the substrate: 85 µmol·m⁻²·s⁻¹ at 15 in deep · high light');
		const metricPage = await (await request(`/journals/${id}`, { cookie: (await makePerson({ label: 'par-reader' })).cookie })).text();
		expect(metricPage).toContain('85 µmol·m⁻²·s⁻¹ at 38.1 cm deep');
		// Clearing both removes the reading.
		expect((await request(`/journals/${id}/edit`, { cookie: us.cookie, form: { ...form, par: '', parDepth: '' } })).status).toBe(303);
		const [cleared] = await db.select().from(tankTable).where(eq(tankTable.id, id));
		expect(cleared).toMatchObject({ parAtSubstrate: null, parDepthCm: null });
	});

	test('a US member’s inches, gallons and rows are stored metric; errors keep what was typed', async () => {
		const us = await makePerson({ label: 'tank-us' });
		await db.update(users).set({ units: 'us' }).where(eq(users.id, us.id));
		const [rotala] = await catalogue.search('Rotala rotundifolia', { kind: 'plant' });
		expect(rotala).toBeDefined();

		const refused = await request('/journals/new', {
			cookie: us.cookie,
			form: { name: 'Corner tank', length: '24', width: 'wide', height: '', 'lights[0][label]': 'Bar', 'lights[0][watts]': '', 'lights[0][hours]': '7' }
		});
		expect(refused.status).toBe(400);
		const html = await refused.text();
		expect(html).toContain('value="Corner tank"');
		expect(html).toContain('Enter a number, such as 12 or 12.5.');
		expect(html).toContain('This is needed.');

		const form = {
			name: 'Corner tank',
			style: 'jungle',
			setUpOn: '2026-01-10',
			visibility: 'club',
			length: '24',
			width: '12',
			height: '16',
			glass: '0.25',
			substrateKind: 'sand',
			substrateDepth: '2',
			waterVolume: '',
			co2Method: 'none',
			'lights[0][id]': '',
			'lights[0][label]': 'Bar',
			'lights[0][watts]': '24',
			'lights[0][hours]': '7',
			'filters[0][id]': '',
			'filters[0][label]': 'Hang-on',
			'filters[0][flow]': '100',
			'filters[0][unit]': 'usgph',
			'filters[0][media]': '',
			'plants[0][id]': '',
			'plants[0][speciesId]': String(rotala!.id),
			'plants[0][name]': 'rotala',
			'plants[0][placement]': 'background',
			'plants[0][added]': '2026-01-10',
			'plants[0][removed]': '',
			'livestock[0][id]': '',
			'livestock[0][speciesId]': '',
			'livestock[0][name]': 'Snails from a friend',
			'livestock[0][count]': '3',
			'livestock[0][added]': '',
			'livestock[0][removed]': ''
		};
		const created = await request('/journals/new', { cookie: us.cookie, form });
		expect(created.status).toBe(303);
		const id = Number(created.headers.get('location')!.split('/').pop());
		const tank = (await tanks.getOwn(viewerOf(us, 'us'), id))!;
		// 1 in = 2.54 cm exactly (international inch).
		expect(tank).toMatchObject({
			lengthCm: 60.96,
			widthCm: 30.48,
			heightCm: 40.64,
			glassMm: 6.35,
			substrateDepthCm: 5.08,
			style: 'jungle',
			visibility: 'club'
		});
		expect(tank.filters[0]).toMatchObject({ ratedFlow: 100, flowUnit: 'usgph' });
		expect(tank.plants[0]).toMatchObject({ speciesId: rotala!.id, name: 'Rotala rotundifolia', placement: 'background', commonName: 'roundleaf toothcup' });
		expect(tank.livestock[0]).toMatchObject({ speciesId: null, name: 'Snails from a friend', count: 3 });

		// The page shows it back in inches and US gallons.
		const page = await (await request(`/journals/${id}`, { cookie: us.cookie })).text();
		expect(page).toContain('24 × 12 × 16 in');
		expect(page).toMatch(/US gal of water, estimated/);

		// Editing keeps the light's row (same id) and adds a second one.
		const lightId = tank.lights[0]!.id;
		const edited = await request(`/journals/${id}/edit`, {
			cookie: us.cookie,
			form: {
				...form,
				'lights[0][id]': String(lightId),
				'lights[0][watts]': '30',
				'lights[1][id]': '',
				'lights[1][label]': 'Moon',
				'lights[1][watts]': '2',
				'lights[1][hours]': '2'
			}
		});
		expect(edited.status).toBe(303);
		const lights = await db.select().from(tankLights).where(eq(tankLights.tankId, id));
		expect(lights.map((l) => [l.id === lightId, l.watts, l.position])).toEqual([
			[true, 30, 0],
			[false, 2, 1]
		]);
	});

	test('retiring keeps the tank and everything on it; it can run again', async () => {
		const viewer = viewerOf(owner);
		const id = await tanks.create(
			viewer,
			tankInput({ name: 'To retire', plants: [{ speciesId: null, name: 'Moss', placement: 'epiphyte', addedOn: '2026-01-16', removedOn: null }] })
		);
		const retired = await request(`/journals/${id}?/retire`, { cookie: owner.cookie, form: { retiredOn: '2026-02-01', retiredNote: 'Moved house' } });
		expect(retired.status).toBe(303);
		const [row] = await db.select().from(tankTable).where(eq(tankTable.id, id));
		expect(row).toMatchObject({ retiredOn: '2026-02-01', retiredNote: 'Moved house' });
		const own = await tanks.listOwn(viewer);
		expect(own.find((t) => t.id === id)?.retiredOn).toBe('2026-02-01');
		expect((await tanks.get(viewer, id))!.plants).toHaveLength(1);
		// A retired tank's age is how long it ran: set up 15 Jan, retired 1 Feb = 17 days.
		expect(tanks.tankFigures((await tanks.get(viewer, id))!).age?.days).toBe(17);

		const early = await request(`/journals/${id}?/retire`, { cookie: owner.cookie, form: { retiredOn: '2999-01-01', retiredNote: '' } });
		expect(early.status).toBe(400);
		expect(await request(`/journals/${id}?/reopen`, { cookie: owner.cookie, form: {} })).toHaveProperty('status', 303);
		expect((await tanks.get(viewer, id))!.retiredOn).toBeNull();
	});

	test('deleting asks for the name, then removes the tank', async () => {
		const id = await tanks.create(viewerOf(owner), tankInput({ name: 'Short-lived' }));
		expect((await request(`/journals/${id}?/delete`, { cookie: owner.cookie, form: { confirmName: 'wrong' } })).status).toBe(400);
		const done = await request(`/journals/${id}?/delete`, { cookie: owner.cookie, form: { confirmName: 'Short-lived' } });
		expect(done.status).toBe(303);
		expect(await tanks.get(viewerOf(owner), id)).toBeNull();
	});

	test('your tanks page shows an empty state, then your tanks only', async () => {
		const fresh = await makePerson({ label: 'tank-empty' });
		const empty = await (await request('/journals', { cookie: fresh.cookie })).text();
		expect(empty).toContain('No tanks yet');
		await tanks.create(viewerOf(fresh), tankInput({ name: 'First of mine' }));
		const list = await (await request('/journals', { cookie: fresh.cookie })).text();
		expect(list).toContain('First of mine');
		expect(list).not.toContain('No tanks yet');
		expect(list).not.toContain('Guard tank');
	});
});

describe('species and markdown endpoints', () => {
	test('species search finds by common name, filters by kind and ranks name starts first', async () => {
		const response = await request('/api/species?q=tetra&kind=fish', { cookie: member.cookie, accept: 'application/json' });
		const { results } = await response.json();
		expect(results.map((r: { commonName: string }) => r.commonName)).toEqual(expect.arrayContaining(['neon tetra', 'cardinal tetra', 'ember tetra']));
		expect(results.every((r: { kind: string }) => r.kind === 'fish')).toBe(true);
		const plants = await (await request('/api/species?q=rot&kind=plant', { cookie: member.cookie, accept: 'application/json' })).json();
		expect(plants.results[0].scientificName).toMatch(/^Rotala/);
		const animals = await (await request('/api/species?q=shrimp&kind=animal', { cookie: member.cookie, accept: 'application/json' })).json();
		expect(animals.results.length).toBeGreaterThanOrEqual(4);
		expect((await request('/api/species?kind=tree', { cookie: member.cookie, accept: 'application/json' })).status).toBe(400);
	});

	test('the preview endpoint renders with the same sanitiser', async () => {
		const response = await request('/api/markdown/preview', {
			cookie: member.cookie,
			accept: 'application/json',
			json: { text: '# Hi\n\n<script>alert(1)</script>\n\n[x](javascript:alert(1))' }
		});
		expect(response.status).toBe(200);
		const { html } = await response.json();
		expect(html).toContain('<h2>Hi</h2>');
		expect(html).toBe('<h2>Hi</h2>\n<p><a rel="nofollow ugc noopener">x</a></p>\n');
	});
});
