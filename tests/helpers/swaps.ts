// Swap-board set-ups for tests: members placed somewhere (over open sea, like the demo club),
// listings made through the domain, the club's jurisdictions extended for a test's own entries.
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import * as preferences from '../../src/lib/server/mail/preferences';
import type { Preferences } from '../../src/lib/mail/categories';
import type { Viewer } from '../../src/lib/server/club/users';
import type { Context } from '../../src/lib/server/context';
import { species } from '../../src/lib/server/species/schema';
import * as edits from '../../src/lib/server/swaps/listing-edits';
import * as restricted from '../../src/lib/server/swaps/restricted';
import type { LatLng } from '../../src/lib/club/location';
import type { ListingInput } from '../../src/lib/swaps/listing-form';
import { DAY_MS } from '../../src/lib/swaps/listing';
import { makePerson, type TestPerson } from './people';

export const viewerOf = (p: TestPerson): Viewer => ({ id: p.id, email: p.email, displayName: p.displayName, role: p.role, units: 'metric' });

export async function placePerson(person: TestPerson, point: LatLng | null, notify: Preferences['swaps'] = 'daily'): Promise<void> {
	await db
		.update(users)
		.set({ homeLat: point?.lat ?? null, homeLng: point?.lng ?? null, homeAreaId: null })
		.where(eq(users.id, person.id));
	await preferences.save(person.id, { swaps: notify });
}

/** A member living at `point` (rounded points only: give two decimals). */
export async function memberAt(point: LatLng | null, label = 'swapper', notify: Preferences['swaps'] = 'daily'): Promise<TestPerson> {
	const person = await makePerson({ label });
	await placePerson(person, point, notify);
	return person;
}

export function listingInput(overrides: Partial<ListingInput> = {}): ListingInput {
	return {
		kind: 'offer',
		category: 'plants',
		title: 'Test stems',
		speciesId: null,
		speciesName: '',
		quantity: { amount: 5, unit: 'stems' },
		condition: '',
		description: '',
		terms: 'free',
		termsNote: '',
		pickupAreaId: null,
		availableUntil: new Date(Date.now() + 5 * DAY_MS),
		tankId: null,
		...overrides
	};
}

export const createListing = (owner: TestPerson, overrides: Partial<ListingInput> = {}, context: Context = {}) =>
	edits.create(viewerOf(owner), listingInput(overrides), [], context);

export const token = (label: string) => `${label}${randomBytes(4).toString('hex')}`;

/** A catalogue plant of the test's own, with an entry in a jurisdiction of its own that the club applies. */
export async function restrictedPlant(level: 'banned' | 'cautioned') {
	const name = `Testaria ${token(level)}`;
	const [result] = await db.insert(species).values({ kind: 'plant', scientificName: name, commonName: `${level} test weed ${randomBytes(2).toString('hex')}` });
	const jurisdiction = `Test land ${token('j')}`;
	await restricted.add(null, {
		speciesId: result.insertId,
		jurisdiction,
		level,
		source: 'Test land weed order',
		note: 'Keep it out of ponds.',
		checkedOn: '2026-11-30',
		checkBasis: 'source'
	});
	// Other tests may add theirs at the same time: add to what is there, never replace it.
	await restricted.setClubJurisdictions(null, [...(await restricted.clubJurisdictions()), jurisdiction]);
	return { speciesId: result.insertId, name, jurisdiction };
}
