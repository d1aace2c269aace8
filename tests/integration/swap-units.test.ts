// The unit a plant is counted in follows the way it grows, on the form and at the server.
import { describe, expect, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { species } from '../../src/lib/server/species/schema';
import { listings as listingTable } from '../../src/lib/server/swaps/schema';
import { request } from '../helpers/http';
import { createListing, memberAt, token } from '../helpers/swaps';

/** A catalogue plant of the test's own that grows as `habit`. */
async function plantOf(habit: 'rhizome' | 'bulb' | 'stem') {
	const name = `Unitaria ${token(habit)}`;
	const [result] = await db.insert(species).values({ kind: 'plant', scientificName: name, commonName: '', growthHabit: habit });
	return { id: result.insertId, name };
}

describe('swap units by kind of plant', () => {
	test('a rhizome plant cannot be offered as stems; rhizome pieces are fine, and the edit form starts with its units', async () => {
		const owner = await memberAt({ lat: -37.2, lng: -13.4 }, 'units-owner');
		const fern = await plantOf('rhizome');
		const form = {
			kind: 'offer',
			category: 'plants',
			title: 'Fern rhizome cuttings',
			speciesId: String(fern.id),
			speciesName: fern.name,
			amount: '4',
			unit: 'stems',
			terms: 'free',
			termsNote: '',
			pickupAreaId: '',
			availableUntil: new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10),
			condition: '',
			description: '',
			tankId: '',
			// What the browser says of the plant is only for its own menu: the server asks the catalogue.
			speciesHabit: 'stem'
		};
		const refused = await request('/swaps/new', { cookie: owner.cookie, form });
		expect(refused.status).toBe(400);
		expect(await refused.text()).toContain('does not fit a rhizome plant; choose rhizome pieces, plants, pieces or pots.');
		// A typed name the catalogue knows is held to the same rule.
		await expect(createListing(owner, { speciesName: fern.name, quantity: { amount: 4, unit: 'stems' } })).rejects.toMatchObject({
			status: 400,
			code: 'unit-does-not-fit',
			fields: { unit: expect.stringContaining('rhizome plant') }
		});
		expect(await db.select().from(listingTable).where(eq(listingTable.ownerId, owner.id))).toEqual([]);

		const saved = await request('/swaps/new', { cookie: owner.cookie, form: { ...form, unit: 'rhizome-pieces' } });
		expect(saved.status).toBe(303);
		const [row] = await db.select().from(listingTable).where(eq(listingTable.ownerId, owner.id));
		expect(row).toMatchObject({ speciesId: fern.id, quantityAmount: 4, quantityUnit: 'rhizome-pieces' });
		const shown = await (await request(`/swaps/${row!.id}`, { cookie: owner.cookie })).text();
		expect(shown).toContain('4 rhizome pieces');
		const edit = await (await request(`/swaps/${row!.id}/edit`, { cookie: owner.cookie })).text();
		const menu = /<select id="unit"[\s\S]*?<\/select>/.exec(edit)![0];
		expect([...menu.matchAll(/<option value="([^"]+)"/g)].map((m) => m[1])).toEqual(['rhizome-pieces', 'plants', 'pieces', 'pots']);
		// Changing it keeps the rule.
		const changed = await request(`/swaps/${row!.id}/edit`, { cookie: owner.cookie, form: { ...form, unit: 'bulbs' } });
		expect(changed.status).toBe(400);
	});

	test('a bulb is counted as bulbs; a name the catalogue does not have may use any plant unit', async () => {
		const owner = await memberAt({ lat: -37.3, lng: -13.5 }, 'units-bulbs');
		const bulb = await plantOf('bulb');
		await expect(createListing(owner, { speciesId: bulb.id, quantity: { amount: 2, unit: 'mat-cm2' } })).rejects.toMatchObject({ code: 'unit-does-not-fit' });
		expect(await createListing(owner, { speciesId: bulb.id, quantity: { amount: 2, unit: 'bulbs' } })).toEqual(expect.any(Number));
		expect(await createListing(owner, { speciesName: `Unknownia ${token('free')}`, quantity: { amount: 2, unit: 'bulbs' } })).toEqual(expect.any(Number));
		expect(await createListing(owner, { speciesName: '', quantity: { amount: 3, unit: 'cups' } })).toEqual(expect.any(Number));
		// Livestock keeps its own units whatever the plant rules say.
		await expect(createListing(owner, { category: 'livestock', quantity: { amount: 2, unit: 'bulbs' } })).rejects.toMatchObject({ status: 400 });
	});
});
