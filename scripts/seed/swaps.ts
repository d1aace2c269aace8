// The demo club's swap board: open, reserved, handed-over and expired listings across the
// invented areas, conversations with requests, a proposed and confirmed pickup and one completed
// swap, made through the swap board's own functions so they follow its rules. Photos are drawn in
// code. Everything is invented; times are relative to when the seed runs.
import { and, eq, gt, inArray, isNull, like, notInArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/club/schema';
import type { Viewer } from '../../src/lib/server/club/users';
import { outbox } from '../../src/lib/server/mail/schema';
import { species } from '../../src/lib/server/species/schema';
import { tanks } from '../../src/lib/server/journals/schema';
import { restrictedSpecies, swapMessages } from '../../src/lib/server/swaps/schema';
import * as edits from '../../src/lib/server/swaps/listing-edits';
import * as transitions from '../../src/lib/server/swaps/listing-transitions';
import { expireDue } from '../../src/lib/server/swaps/expiry';
import * as threads from '../../src/lib/server/swaps/threads';
import * as restricted from '../../src/lib/server/swaps/restricted';
import * as reports from '../../src/lib/server/swaps/reports';
import { dayOf } from '../../src/lib/dates';
import type { ListingInput } from '../../src/lib/swaps/listing-form';
import { DAY_MS } from '../../src/lib/swaps/listing';
import { CLUB_NAME, DEMO_PEOPLE } from './people';
import { JURISDICTIONS } from './restricted-data';
import { storeDemoPhoto } from './lib/images';

const HOUR = 3_600_000;
const CLUB_RULES = 'Kettlewater club rules';

type Demo = Omit<ListingInput, 'availableUntil' | 'speciesId' | 'pickupAreaId' | 'tankId'> & {
	key: string;
	owner: string;
	daysAgo: number;
	daysLeft: number;
	tank?: string;
	photo?: { seed: number; alt: string };
};

const base = { condition: '', description: '', terms: 'free' as const, termsNote: '', speciesName: '' };

const LISTINGS: Demo[] = [
	{
		...base,
		key: 'rotala',
		owner: 'mara',
		kind: 'offer',
		category: 'plants',
		title: 'Rotala tops, 10–15 cm',
		speciesName: 'Rotala rotundifolia',
		quantity: { amount: 20, unit: 'stems' },
		condition: 'Grown submerged, pink tips; rinsed, no snails seen.',
		description: 'Fresh from Sunday’s trim. They root within a week in most substrates.\n\n- Bring a bag with some tank water\n- Weekday evenings suit me best',
		tank: 'Reedholme riverbank',
		daysAgo: 1,
		daysLeft: 6,
		photo: { seed: 31, alt: 'A bunch of thin green stems with pink tips in a glass of water.' }
	},
	{
		...base,
		key: 'moss',
		owner: 'dov',
		kind: 'offer',
		category: 'plants',
		title: 'Java moss, a big handful',
		speciesName: 'Taxiphyllum barbieri',
		quantity: { amount: 3, unit: 'portions' },
		terms: 'swap',
		termsNote: 'any carpeting plant, or a few snails for the nano',
		daysAgo: 2,
		daysLeft: 5,
		photo: { seed: 37, alt: 'A dark green tangle of moss on a grey stone.' }
	},
	{
		...base,
		key: 'stones',
		owner: 'lio',
		kind: 'wanted',
		category: 'hardscape',
		title: 'Small grey stones for a nano layout',
		quantity: { amount: 5, unit: 'pieces' },
		description: 'Fist-sized or smaller, any grey stone that does not raise the hardness much.',
		daysAgo: 3,
		daysLeft: 27
	},
	{
		...base,
		key: 'shrimp',
		owner: 'fenna',
		kind: 'offer',
		category: 'livestock',
		title: 'Red cherry shrimp, young adults',
		speciesName: 'Neocaridina davidi',
		quantity: { amount: 10, unit: 'individuals' },
		terms: 'token',
		termsNote: 'the price of a coffee, to cover the bag and the cool box',
		condition: 'Bred in soft water at 22 °C.',
		daysAgo: 4,
		daysLeft: 10
	},
	{
		...base,
		key: 'filter',
		owner: 'joss',
		kind: 'offer',
		category: 'equipment',
		title: 'Hang-on-back filter for a 60 L tank',
		quantity: { amount: 1, unit: 'pieces' },
		condition: 'Working; new impeller last year, cable and plug undamaged.',
		daysAgo: 10,
		daysLeft: 20
	},
	{
		...base,
		key: 'crypts',
		owner: 'ines',
		kind: 'offer',
		category: 'plants',
		title: 'Cryptocoryne wendtii in pots',
		speciesName: 'Cryptocoryne wendtii',
		quantity: { amount: 4, unit: 'pots' },
		daysAgo: 12,
		daysLeft: -5
	},
	{
		...base,
		key: 'wood',
		owner: 'rafe',
		kind: 'offer',
		category: 'hardscape',
		title: 'Driftwood branch, about 40 cm',
		quantity: { amount: 1, unit: 'pieces' },
		terms: 'swap',
		termsNote: 'a few stems of anything red',
		condition: 'Soaked for a month, sinks on its own.',
		daysAgo: 2,
		daysLeft: 28
	},
	{
		...base,
		key: 'frogbit',
		owner: 'yara',
		kind: 'offer',
		category: 'plants',
		title: 'Frogbit for shade, two portions',
		speciesName: 'Limnobium laevigatum',
		quantity: { amount: 2, unit: 'portions' },
		daysAgo: 1,
		daysLeft: 6
	},
	{
		...base,
		key: 'sagittaria',
		owner: 'corin',
		kind: 'wanted',
		category: 'plants',
		title: 'Sagittaria runners for a foreground',
		speciesName: 'Sagittaria subulata',
		quantity: { amount: 6, unit: 'plants' },
		daysAgo: 5,
		daysLeft: 9
	},
	{
		...base,
		key: 'wisteria',
		owner: 'nell',
		kind: 'offer',
		category: 'plants',
		title: 'Water wisteria cuttings',
		speciesName: 'Hygrophila difformis',
		quantity: { amount: 8, unit: 'stems' },
		daysAgo: 0,
		daysLeft: 7,
		photo: { seed: 41, alt: 'Light green stems with deeply divided leaves.' }
	},
	{
		...base,
		key: 'regulator',
		owner: 'pim',
		kind: 'offer',
		category: 'equipment',
		title: 'CO2 regulator with night solenoid',
		quantity: { amount: 1, unit: 'pieces' },
		terms: 'token',
		termsNote: 'a small sum we agree in the messages',
		condition: 'Worked until last month; have it checked by a gas supplier before use.',
		daysAgo: 6,
		daysLeft: 24
	},
	{
		...base,
		key: 'hornwort',
		owner: 'sefa',
		kind: 'offer',
		category: 'plants',
		title: 'Hornwort, as much as you like',
		speciesName: 'Ceratophyllum demersum',
		quantity: { amount: 20, unit: 'stems' },
		daysAgo: 0,
		daysLeft: 7
	}
];

export async function seedSwaps(db: DbOrTx): Promise<void> {
	const now = new Date();
	const at = (daysAgo: number, hours = 0) => new Date(now.getTime() - daysAgo * DAY_MS + hours * HOUR);
	const [{ lastMail }] = (await db.select({ lastMail: sql<number>`COALESCE(MAX(${outbox.id}), 0)` }).from(outbox)) as [{ lastMail: number }];

	const rows = await db
		.select()
		.from(users)
		.where(
			inArray(
				users.email,
				DEMO_PEOPLE.map((p) => p.email)
			)
		);
	const people = new Map<string, Viewer>();
	for (const p of DEMO_PEOPLE) {
		const row = rows.find((r) => r.email === p.email);
		if (row) people.set(p.key, { id: row.id, email: row.email ?? '', displayName: row.displayName, role: row.role, units: row.units });
	}
	const who = (key: string) => people.get(key)!;
	if (people.size < DEMO_PEOPLE.length) return;

	// The demo club sits in England and adds one rule of its own (invented, like the club).
	const [frogbit] = await db.select({ id: species.id }).from(species).where(eq(species.scientificName, 'Limnobium laevigatum'));
	if (frogbit) {
		await db.insert(restrictedSpecies).values({
			speciesId: frogbit.id,
			jurisdiction: CLUB_RULES,
			level: 'cautioned',
			source: `${CLUB_NAME}, committee decision of March 2026`,
			note: 'It spreads fast in garden ponds and ditches: keep it indoors, and dry and bin any surplus.',
			checkedOn: dayOf(now),
			checkBasis: 'source'
		});
	}
	await restricted.setClubJurisdictions(null, [JURISDICTIONS.ENGLAND, CLUB_RULES], { db });

	const names = LISTINGS.map((l) => l.speciesName).filter(Boolean);
	const catalogue = new Map(
		(await db.select({ id: species.id, name: species.scientificName }).from(species).where(inArray(species.scientificName, names))).map((s) => [s.name, s.id])
	);
	const tankRows = await db.select({ id: tanks.id, name: tanks.name }).from(tanks);
	const ids = new Map<string, number>();
	for (const demo of LISTINGS) {
		const owner = who(demo.owner);
		const photos = demo.photo
			? [{ id: (await storeDemoPhoto(owner.id, demo.photo.seed, db, { width: 1200, height: 900 })).id, alt: demo.photo.alt, caption: '' }]
			: [];
		const created = at(demo.daysAgo, -3);
		const { key, owner: _owner, daysAgo: _daysAgo, daysLeft, tank, photo: _photo, ...input } = demo;
		const id = await edits.create(
			owner,
			{
				...input,
				speciesId: catalogue.get(demo.speciesName) ?? null,
				pickupAreaId: null,
				tankId: tank ? (tankRows.find((t) => t.name === tank)?.id ?? null) : null,
				availableUntil: new Date(created.getTime() + (demo.daysAgo + daysLeft) * DAY_MS)
			},
			photos,
			{ now: created, db }
		);
		ids.set(key, id);
	}
	const opts = (daysAgo: number, hours = 0) => ({ now: at(daysAgo, hours), db });

	// Two members ask for Mara's rotala; she has not answered yet.
	const newRequests = [
		await threads.request(
			who('dov'),
			ids.get('rotala')!,
			'Hello Mara, could I have about ten stems? I am replanting the back of my nano this weekend.',
			opts(0, -20)
		),
		await threads.request(who('yara'), ids.get('rotala')!, 'I would take the rest if nobody else does. Any evening this week works for me.', opts(0, -6))
	];

	// Fenna's shrimp: Joss asked, Fenna accepted, Joss proposed a pickup and Fenna confirmed.
	const shrimp = await threads.request(who('joss'), ids.get('shrimp')!, 'I have a cycled 40 L waiting for shrimp. Could I have all ten?', opts(3, -10));
	await threads.request(who('ines'), ids.get('shrimp')!, 'If Joss does not need them all, I would love three or four.', opts(3, -8));
	await transitions.accept(who('fenna'), shrimp, opts(3, -4));
	await threads.post(who('fenna'), shrimp, 'They are yours. I will bag them with plenty of air; bring a cool box if you have one.', opts(3, -4));
	const day = (daysAhead: number) => dayOf(new Date(now.getTime() + daysAhead * DAY_MS));
	const proposal = await threads.propose(
		who('joss'),
		shrimp,
		{ on: day(2), from: '17:30', to: '18:30', place: 'the library entrance at Alder Quay' },
		'I will bring a cool box.',
		opts(2, -9)
	);
	await threads.confirmPickup(who('fenna'), shrimp, proposal, opts(2, -7));

	// Joss's filter went to Mara: request, acceptance, pickup agreed, both confirmed.
	const filter = await threads.request(
		who('mara'),
		ids.get('filter')!,
		'Would the filter suit a 54 L tank? I would love it for my quarantine tank.',
		opts(9, -12)
	);
	await transitions.accept(who('joss'), filter, opts(9, -8));
	const pastDay = dayOf(new Date(now.getTime() - 7 * DAY_MS));
	const filterPickup = await threads.propose(
		who('joss'),
		filter,
		{ on: pastDay, from: '10:00', to: '11:00', place: 'the club meeting at Kettlewater Centre hall' },
		'',
		opts(9, -7)
	);
	await threads.confirmPickup(who('mara'), filter, filterPickup, opts(9, -6));
	await transitions.act(who('joss'), ids.get('filter')!, { type: 'confirm-handover' }, opts(7, 2));
	await threads.post(who('mara'), filter, 'Running since Saturday, quiet as anything. Thank you!', opts(7, 5));
	await transitions.act(who('mara'), ids.get('filter')!, { type: 'confirm-handover' }, opts(7, 5));

	// A member asks the admins to look at the regulator: a faulty gas part is a safety matter.
	await reports.reportListing(
		who('ines'),
		ids.get('regulator')!,
		'It says it stopped working. Should a faulty CO2 regulator be passed on at all? Someone might use it without a check.',
		{ db }
	);

	// Ines's crypts passed their date: the expiry is recorded as the job would.
	await expireDue({ now, db });

	// Demo conversations are history: they are read (except Mara's two new requests) and mailed to nobody.
	await db
		.update(swapMessages)
		.set({ readAt: now })
		.where(and(isNull(swapMessages.readAt), notInArray(swapMessages.threadId, newRequests)));
	await db.update(swapMessages).set({ notifiedAt: now }).where(isNull(swapMessages.notifiedAt));
	await db.delete(outbox).where(and(gt(outbox.id, lastMail), like(outbox.topic, 'swap-%')));
}
