// A few demo tanks with drawn cover photos, so the tank pages have something to show. The fuller
// journal demo (entries, events, water tests) builds on these.
import { eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import * as tanks from '../../src/lib/server/journals/tanks';
import { species } from '../../src/lib/server/species/schema';
import type { TankInput } from '../../src/lib/journals/tank-input';
import { demoUserIds } from './club';
import { randomFrom, storeDemoPhoto } from './lib/images';
import { users } from '../../src/lib/server/club/schema';
import { tanks as tankTable } from '../../src/lib/server/journals/schema';
import * as entries from '../../src/lib/server/journals/journal-entries';
import * as water from '../../src/lib/server/journals/water';
import * as upkeep from '../../src/lib/server/journals/upkeep';
import * as social from '../../src/lib/server/journals/social';
import * as preferences from '../../src/lib/server/mail/preferences';
import { defaultSchedule } from '../../src/lib/journals/schedule';
import type { EventInput } from '../../src/lib/journals/journal-entry-form';
import { dayNumber, isoDay } from '../../src/lib/journals/calc';
import type { Viewer } from '../../src/lib/server/club/users';

type DemoTank = {
	owner: string;
	seed: number;
	alt: string;
	input: Omit<TankInput, 'plants' | 'livestock'>;
	plants: [string, string, string | null][];
	livestock: [string, number, string][];
};

const TANKS: DemoTank[] = [
	{
		owner: 'mara',
		seed: 11,
		alt: 'A long tank with tall green and red stem plants behind two grey stones, a low lawn in front and a small shoal of orange fish.',
		input: {
			name: 'Reedholme riverbank',
			style: 'wood and stone',
			setUpOn: '2026-01-24',
			lengthCm: 90,
			widthCm: 45,
			heightCm: 45,
			glassMm: 10,
			substrateKind: 'nutrient-soil',
			substrateNote: 'capped with fine sand at the front',
			substrateDepthCm: 7,
			hardscape: 'Two grey stones and a branch of driftwood',
			hardscapeLitres: 12,
			heaterWatts: 200,
			heaterSetC: 24,
			heaterNote: '',
			co2Method: 'pressurised',
			co2BubblesPerSecond: 2,
			waterLitres: null,
			parAtSubstrate: 95,
			parDepthCm: 38,
			description:
				'A riverbank in a glass box: stem plants at the back, **needle spikerush** in front.\n\n- Water change: 40 % weekly\n- Trim: every second Sunday',
			visibility: 'public',
			lights: [
				{ label: 'LED bar, front', watts: 46, hoursPerDay: 7 },
				{ label: 'LED bar, back', watts: 46, hoursPerDay: 6 }
			],
			filters: [{ label: 'Canister under the stand', ratedFlow: 1200, flowUnit: 'lph', mediaNotes: 'seeded with mature media from the nano' }],
			fertilisers: [
				{ item: 'Macro solution (N, P, K)', amount: '10 mL', frequency: 'three times a week' },
				{ item: 'Trace solution', amount: '5 mL', frequency: 'three times a week' }
			]
		},
		plants: [
			['Rotala rotundifolia', '2026-01-24', null],
			['Ludwigia repens', '2026-01-24', null],
			['Eleocharis acicularis', '2026-01-24', null],
			['Microsorum pteropus', '2026-02-02', null],
			['Glossostigma elatinoides', '2026-01-24', '2026-03-01']
		],
		livestock: [
			['Trigonostigma heteromorpha', 14, '2026-03-07'],
			['Caridina multidentata', 6, '2026-02-20'],
			['Otocinclus vittatus', 4, '2026-03-07']
		]
	},
	{
		owner: 'lio',
		seed: 23,
		alt: 'A low tank with a sloped sand bed, pale grey rocks and a carpet of fine grass.',
		input: {
			name: 'Brackenford stones',
			style: 'iwagumi',
			setUpOn: '2026-02-14',
			lengthCm: 60.96,
			widthCm: 30.48,
			heightCm: 30.48,
			glassMm: 6.35,
			substrateKind: 'nutrient-soil',
			substrateNote: '',
			substrateDepthCm: 7.62,
			hardscape: 'Seven pale rocks',
			hardscapeLitres: 7.57,
			heaterWatts: 75,
			heaterSetC: 23.5,
			heaterNote: '',
			co2Method: 'pressurised',
			co2BubblesPerSecond: 1.5,
			waterLitres: null,
			parAtSubstrate: null,
			parDepthCm: null,
			description: '',
			visibility: 'club',
			lights: [{ label: 'LED panel', watts: 36, hoursPerDay: 6 }],
			filters: [{ label: 'Hang-on-back', ratedFlow: 100, flowUnit: 'usgph', mediaNotes: 'sponge and ceramic rings' }],
			fertilisers: [{ item: 'All-in-one solution', amount: '2 mL', frequency: 'daily' }]
		},
		plants: [
			['Eleocharis parvula', '2026-02-14', null],
			['Hemianthus callitrichoides', '2026-02-14', null]
		],
		livestock: [
			['Boraras brigittae', 12, '2026-03-20'],
			['Neocaridina davidi', 20, '2026-03-10']
		]
	},
	{
		owner: 'dov',
		seed: 5,
		alt: 'A small tank with mosses on a rock and floating plants at the surface.',
		input: {
			name: 'Windowsill nano',
			style: 'nano',
			setUpOn: '2025-11-02',
			lengthCm: 30,
			widthCm: 20,
			heightCm: 25,
			glassMm: 4,
			substrateKind: 'sand',
			substrateNote: 'fine river sand',
			substrateDepthCm: 3,
			hardscape: 'One rock with moss',
			hardscapeLitres: 0.8,
			heaterWatts: null,
			heaterSetC: null,
			heaterNote: 'unheated',
			co2Method: 'none',
			co2BubblesPerSecond: null,
			waterLitres: 12,
			parAtSubstrate: null,
			parDepthCm: null,
			description: '',
			visibility: 'private',
			lights: [{ label: 'Clip-on LED', watts: 8, hoursPerDay: 6 }],
			filters: [{ label: 'Sponge filter', ratedFlow: 60, flowUnit: 'lph', mediaNotes: '' }],
			fertilisers: []
		},
		plants: [
			['Taxiphyllum barbieri', '2025-11-02', null],
			['Phyllanthus fluitans', '2025-12-01', null]
		],
		livestock: [['Planorbella duryi', 3, '2025-11-20']]
	}
];

export async function seedJournalTanks(db: DbOrTx): Promise<void> {
	const people = await demoUserIds(db);
	const names = [...new Set(TANKS.flatMap((t) => [...t.plants.map((p) => p[0]), ...t.livestock.map((l) => l[0])]))];
	const found = await db
		.select({ id: species.id, name: species.scientificName, placement: species.placement })
		.from(species)
		.where(inArray(species.scientificName, names));
	const catalogue = new Map(found.map((s) => [s.name, s.id]));
	const placement = new Map(found.map((s) => [s.name, s.placement]));
	for (const demo of TANKS) {
		const ownerId = people.get(demo.owner);
		if (!ownerId) continue;
		const photo = await storeDemoPhoto(ownerId, demo.seed, db);
		await tanks.create(
			{ id: ownerId },
			{
				...demo.input,
				plants: demo.plants.map(([name, addedOn, removedOn]) => ({
					speciesId: catalogue.get(name) ?? null,
					name,
					placement: placement.get(name) ?? null,
					addedOn,
					removedOn
				})),
				livestock: demo.livestock.map(([name, count, addedOn]) => ({ speciesId: catalogue.get(name) ?? null, name, count, addedOn, removedOn: null }))
			},
			[{ id: photo.id, alt: demo.alt, caption: '' }],
			{ db }
		);
	}
}

// ——— The fuller journal demo: nine more tanks, then for all twelve several weeks of entries with
// events and drawn photos, weekly water tests, an upkeep schedule, and what other members did
// (admires, follows, comments). Dates count back from the day the seed runs, so the dashboard
// always has something due. Every word below is invented for the demo club.

type MoreTank = DemoTank & { ageDays: number; weeks: number };

const base = (over: Partial<TankInput>): Omit<TankInput, 'plants' | 'livestock'> => ({
	name: 'Demo tank',
	style: 'wood and stone',
	setUpOn: null,
	lengthCm: 60,
	widthCm: 30,
	heightCm: 36,
	glassMm: 6,
	substrateKind: 'nutrient-soil',
	substrateNote: '',
	substrateDepthCm: 5,
	hardscape: '',
	hardscapeLitres: null,
	heaterWatts: 100,
	heaterSetC: 25,
	heaterNote: '',
	co2Method: 'none',
	co2BubblesPerSecond: null,
	waterLitres: null,
	parAtSubstrate: null,
	parDepthCm: null,
	description: '',
	visibility: 'public',
	lights: [{ label: 'LED bar', watts: 30, hoursPerDay: 7 }],
	filters: [{ label: 'Canister', ratedFlow: 600, flowUnit: 'lph', mediaNotes: '' }],
	fertilisers: [],
	...over
});

const MORE_TANKS: MoreTank[] = [
	{
		owner: 'fenna',
		seed: 31,
		ageDays: 410,
		weeks: 7,
		alt: 'A tall tank crowded with broad green leaves, red stems reaching the surface and a school of small blue fish.',
		input: base({
			name: 'Alder Quay jungle',
			style: 'jungle',
			lengthCm: 100,
			widthCm: 40,
			heightCm: 50,
			glassMm: 10,
			heaterWatts: 200,
			description: 'Let it grow, trim when it blocks the light. Floating plants keep the corners shaded.',
			lights: [{ label: 'Two LED bars', watts: 60, hoursPerDay: 8 }],
			filters: [{ label: 'Canister', ratedFlow: 1400, flowUnit: 'lph', mediaNotes: 'sponges and sintered rings' }]
		}),
		plants: [
			['Echinodorus grisebachii', '', null],
			['Vallisneria spiralis', '', null],
			['Hygrophila corymbosa', '', null],
			['Limnobium laevigatum', '', null],
			['Cryptocoryne wendtii', '', null]
		],
		livestock: [
			['Paracheirodon axelrodi', 24, ''],
			['Corydoras paleatus', 8, ''],
			['Ancistrus cirrhosus', 2, '']
		]
	},
	{
		owner: 'joss',
		seed: 42,
		ageDays: 180,
		weeks: 6,
		alt: 'Brown-tinted water over a bed of leaves and twisted roots, with a few small fish near the bottom.',
		input: base({
			name: 'Tea-coloured creek',
			style: 'biotope',
			lengthCm: 80,
			widthCm: 35,
			heightCm: 40,
			glassMm: 8,
			substrateKind: 'sand',
			substrateNote: 'fine pale sand with leaf litter',
			substrateDepthCm: 3,
			hardscape: 'Roots and dried leaves',
			hardscapeLitres: 6,
			description: 'Soft, stained water for small fish that like shade. Few plants; most of the green is on the roots.',
			filters: [{ label: 'Sponge filter pair', ratedFlow: 300, flowUnit: 'lph', mediaNotes: '' }]
		}),
		plants: [
			['Microsorum pteropus', '', null],
			['Bolbitis heudelotii', '', null],
			['Phyllanthus fluitans', '', null]
		],
		livestock: [
			['Nannostomus beckfordi', 10, ''],
			['Apistogramma cacatuoides', 3, ''],
			['Carnegiella strigata', 6, '']
		]
	},
	{
		owner: 'ines',
		seed: 53,
		ageDays: 95,
		weeks: 6,
		alt: 'Terraced rows of plants in different greens and reds, like a planted garden bed, in front of a plain background.',
		input: base({
			name: 'Fenwick terraces',
			style: 'stem garden',
			lengthCm: 120,
			widthCm: 50,
			heightCm: 55,
			glassMm: 12,
			heaterWatts: 300,
			co2Method: 'pressurised',
			co2BubblesPerSecond: 3,
			description: 'Streets of stem plants, no rocks, no wood. Trimming is most of the work.',
			lights: [{ label: 'LED panel', watts: 120, hoursPerDay: 8 }],
			filters: [{ label: 'Canister', ratedFlow: 1800, flowUnit: 'lph', mediaNotes: '' }],
			fertilisers: [{ item: 'Dry salts, mixed weekly', amount: 'see entries', frequency: 'three times a week' }]
		}),
		plants: [
			['Rotala macrandra', '', null],
			['Rotala wallichii', '', null],
			['Ludwigia arcuata', '', null],
			['Bacopa caroliniana', '', null],
			['Heteranthera zosterifolia', '', null],
			['Lobelia cardinalis', '', null]
		],
		livestock: [
			['Hemigrammus erythrozonus', 20, ''],
			['Crossocheilus oblongus', 3, '']
		]
	},
	{
		owner: 'rafe',
		seed: 64,
		ageDays: 26,
		weeks: 3,
		alt: 'A newly planted small tank: dark soil, a single large stone and little tufts of grass spaced out in front.',
		input: base({
			name: 'Lowmarsh first light',
			style: 'iwagumi',
			lengthCm: 45,
			widthCm: 27,
			heightCm: 30,
			glassMm: 5,
			hardscape: 'One large stone, two small',
			hardscapeLitres: 2.5,
			heaterWatts: 50,
			co2Method: 'pressurised',
			co2BubblesPerSecond: 1,
			description: 'My first tank with gas. Still cycling: no fish until ammonia and nitrite read zero.',
			lights: [{ label: 'Clip-on LED', watts: 20, hoursPerDay: 6 }],
			filters: [{ label: 'Small canister', ratedFlow: 400, flowUnit: 'lph', mediaNotes: 'seeded with a sponge from the club' }]
		}),
		plants: [
			['Eleocharis acicularis', '', null],
			['Helanthium tenellum', '', null]
		],
		livestock: []
	},
	{
		owner: 'yara',
		seed: 75,
		ageDays: 300,
		weeks: 6,
		alt: 'A cube tank with moss-covered branches like little trees, and red shrimp grazing on the moss.',
		input: base({
			name: 'Mossbank cube',
			style: 'nano',
			lengthCm: 30,
			widthCm: 30,
			heightCm: 30,
			glassMm: 5,
			heaterWatts: 25,
			substrateDepthCm: 4,
			hardscape: 'Branches tied with moss',
			hardscapeLitres: 1.2,
			description: 'A shrimp cube. No fish, soft water, small water changes.',
			lights: [{ label: 'Nano LED', watts: 10, hoursPerDay: 7 }],
			filters: [{ label: 'Sponge filter', ratedFlow: 100, flowUnit: 'lph', mediaNotes: '' }]
		}),
		plants: [
			['Vesicularia montagnei', '', null],
			['Fissidens fontanus', '', null],
			['Riccia fluitans', '', null]
		],
		livestock: [
			['Neocaridina davidi', 40, ''],
			['Clithon corona', 3, '']
		]
	},
	{
		owner: 'corin',
		seed: 86,
		ageDays: 540,
		weeks: 5,
		alt: 'Driftwood arching over a sloped sand path between green cushions of plants, with a shoal of slim silver fish.',
		input: base({
			name: 'Reedholme path',
			style: 'wood and stone',
			lengthCm: 90,
			widthCm: 45,
			heightCm: 45,
			glassMm: 10,
			heaterWatts: 200,
			substrateDepthCm: 7,
			hardscape: 'Driftwood arch and pebbles',
			hardscapeLitres: 10,
			co2Method: 'liquid',
			description: 'A path of sand leading into the wood. Low light, slow plants, very little work.',
			lights: [{ label: 'LED bar', watts: 40, hoursPerDay: 7 }],
			filters: [{ label: 'Canister', ratedFlow: 1000, flowUnit: 'lph', mediaNotes: '' }]
		}),
		plants: [
			['Cryptocoryne parva', '', null],
			['Anubias barteri', '', null],
			['Taxiphyllum barbieri', '', null],
			['Lilaeopsis brasiliensis', '', null]
		],
		livestock: [
			['Danio margaritatus', 15, ''],
			['Otocinclus vittatus', 5, ''],
			['Caridina multidentata', 8, '']
		]
	},
	{
		owner: 'nell',
		seed: 97,
		ageDays: 120,
		weeks: 5,
		alt: 'A low-tech tank with a few broad plants, floating leaves at the top and a single bright fish.',
		input: base({
			name: 'Brackenford windowsill',
			style: 'low-tech',
			lengthCm: 60,
			widthCm: 30,
			heightCm: 30,
			glassMm: 5,
			heaterWatts: 75,
			substrateKind: 'gravel',
			substrateNote: 'soil capped with gravel',
			substrateDepthCm: 6,
			visibility: 'club',
			description: 'No gas, no dosing, light from the room and a small lamp.',
			lights: [{ label: 'Desk lamp', watts: 12, hoursPerDay: 6 }]
		}),
		plants: [
			['Cryptocoryne beckettii', '', null],
			['Ceratopteris thalictroides', '', null],
			['Lemna minor', '', null]
		],
		livestock: [
			['Betta splendens', 1, ''],
			['Neritina natalensis', 2, '']
		]
	},
	{
		owner: 'pim',
		seed: 108,
		ageDays: 60,
		weeks: 4,
		alt: 'A wide, shallow tank with a carpet of round leaves, grey stones and tall grass at the back.',
		input: base({
			name: 'Shallow meadow',
			style: 'wood and stone',
			lengthCm: 90,
			widthCm: 40,
			heightCm: 30,
			glassMm: 8,
			heaterWatts: 150,
			co2Method: 'pressurised',
			co2BubblesPerSecond: 2,
			hardscape: 'Grey stones',
			hardscapeLitres: 8,
			description: 'A meadow seen from above as much as from the front.',
			lights: [{ label: 'LED panel', watts: 50, hoursPerDay: 7 }],
			filters: [{ label: 'Canister', ratedFlow: 900, flowUnit: 'lph', mediaNotes: '' }]
		}),
		plants: [
			['Marsilea hirsuta', '', null],
			['Hydrocotyle verticillata', '', null],
			['Sagittaria subulata', '', null]
		],
		livestock: [['Trigonostigma espei', 16, '']]
	},
	{
		owner: 'sefa',
		seed: 119,
		ageDays: 730,
		weeks: 5,
		alt: 'A large tank of slow-growing ferns and swords around a stack of dark rock, with angelfish above.',
		input: base({
			name: 'Mossbank deep',
			style: 'jungle',
			lengthCm: 150,
			widthCm: 50,
			heightCm: 60,
			glassMm: 12,
			heaterWatts: 2 * 200,
			substrateDepthCm: 8,
			hardscape: 'Dark lava rock stack',
			hardscapeLitres: 25,
			visibility: 'private',
			description: 'My own quiet tank.',
			lights: [{ label: 'Two LED bars', watts: 90, hoursPerDay: 8 }],
			filters: [{ label: 'Two canisters', ratedFlow: 2400, flowUnit: 'lph', mediaNotes: '' }]
		}),
		plants: [
			['Echinodorus cordifolius', '', null],
			['Microsorum pteropus', '', null],
			['Aponogeton crispus', '', null]
		],
		livestock: [
			['Pterophyllum scalare', 4, ''],
			['Corydoras aeneus', 10, '']
		]
	}
];

const EXTRA_PLANTS = ['Rotala rotundifolia', 'Cryptocoryne undulata', 'Bacopa monnieri', 'Anubias barteri'];

const OPENINGS = [
	'Quiet week.',
	'Long evening with the tank.',
	'Everything is growing faster than I can keep up with.',
	'The light was lovely tonight, so photos.',
	'A short one.',
	'Spent the afternoon on upkeep.',
	'The fish were all out in the open today.',
	'Back from a week away; the tank looked after itself.'
];
const MIDDLES = [
	'The stems at the back reached the surface again, so they came down by a third. The tops went back in; the bottoms went to the club swap board.',
	'Some **green dust** on the front glass. Less light by half an hour and it is already clearing.',
	'Rinsed the pre-filter sponge in a bucket of tank water. It was brown, the flow is much better now.',
	'The carpet is finally closing at the front left. Patience pays.',
	'Nitrate crept up this week; a bigger water change and a lighter hand with the food.',
	'Moved two stems to fill a gap behind the stone. The view from the side is better for it.',
	'New leaves on the ferns, and the moss is spreading onto the second branch.',
	'Tested everything after the water change. The numbers are in the water tests below.'
];
const CLOSINGS = ['', '', 'Next: a proper trim at the weekend.', 'Photos next time.', 'Happy with it.', 'Fingers crossed for the carpet.'];
const TITLES = ['Week {n}', 'Trim day', 'Catching up', 'Small changes', 'After the water change', 'Growing in', 'Notes from week {n}', 'A good week'];
const COMMENTS = [
	'That carpet is coming on beautifully.',
	'What light height do you run? The reds are lovely.',
	'Lovely — the path really pulls the eye in.',
	'I had the same dust on the glass; shorter light fixed it for me too.',
	'Would you have trimmings to spare at the next meeting?',
	'The shoal looks so settled. How long did they take to colour up?',
	'Great photo. The stone placement works well.'
];

export async function seedJournals(db: DbOrTx): Promise<void> {
	const people = await demoUserIds(db);
	const now = new Date();
	const today = dayNumber(now);
	const names = [...new Set([...EXTRA_PLANTS, ...MORE_TANKS.flatMap((t) => [...t.plants.map((p) => p[0]), ...t.livestock.map((l) => l[0])])])];
	const found = await db
		.select({ id: species.id, name: species.scientificName, placement: species.placement })
		.from(species)
		.where(inArray(species.scientificName, names));
	const catalogue = new Map(found.map((s) => [s.name, s]));

	// Nine more tanks, set up some while ago.
	for (const demo of MORE_TANKS) {
		const ownerId = people.get(demo.owner);
		if (!ownerId) continue;
		const setUpOn = isoDay(today - demo.ageDays);
		const photo = await storeDemoPhoto(ownerId, demo.seed, db, { width: 1400, height: 900 });
		await tanks.create(
			{ id: ownerId },
			{
				...demo.input,
				setUpOn,
				plants: demo.plants.map(([name]) => ({
					speciesId: catalogue.get(name)?.id ?? null,
					name,
					placement: catalogue.get(name)?.placement ?? null,
					addedOn: setUpOn,
					removedOn: null
				})),
				livestock: demo.livestock.map(([name, count]) => ({
					speciesId: catalogue.get(name)?.id ?? null,
					name,
					count,
					addedOn: isoDay(Math.min(today, today - demo.ageDays + 35)),
					removedOn: null
				}))
			},
			[{ id: photo.id, alt: demo.alt, caption: '' }],
			{ db }
		);
	}
	await tanks.refreshVolumes({ db });

	const viewerOf = async (id: string): Promise<Viewer> => {
		const [u] = await db.select().from(users).where(eq(users.id, id));
		return { id, email: u!.email ?? '', displayName: u!.displayName, role: u!.role, units: u!.units };
	};
	const all = await db.select().from(tankTable);
	const plan = new Map([
		...MORE_TANKS.map((t) => [t.input.name, t.weeks] as const),
		['Reedholme riverbank', 7],
		['Brackenford stones', 6],
		['Windowsill nano', 5]
	]);
	const entryIds: { tankId: number; entryId: number; ownerId: string; visibility: string }[] = [];

	for (const tank of all) {
		const weeks = plan.get(tank.name);
		if (!weeks || !tank.setUpOn) continue;
		const owner = await viewerOf(tank.ownerId);
		const rnd = randomFrom(tank.id * 7919 + 13);
		const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)]!;
		const setUp = dayNumber(tank.setUpOn);
		const young = today - setUp < 42;
		let photoSeed = tank.id * 100;
		for (let w = weeks - 1; w >= 0; w--) {
			const day = today - 2 - w * 7 - Math.floor(rnd() * 2);
			if (day < setUp) continue;
			const on = isoDay(day);
			const at = new Date(day * 86_400_000 + (18 + Math.floor(rnd() * 4)) * 3_600_000);
			const weekNo = Math.floor((day - setUp) / 7) + 1;
			const events: EventInput[] = [];
			const event = (over: Partial<EventInput> & Pick<EventInput, 'kind'>): EventInput => ({
				percent: null,
				filterPart: null,
				what: '',
				amount: null,
				amountUnit: null,
				saltId: null,
				speciesId: null,
				speciesName: '',
				count: null,
				algaeKind: null,
				note: '',
				rowId: null,
				...over
			});
			events.push(event({ kind: 'water-change', percent: young ? 50 : pick([25, 30, 40, 50]) }));
			if (w % 2 === 0) events.push(event({ kind: 'trim', what: pick(['stems at the back', 'the carpet', 'old leaves', '']) }));
			if (w % 3 === 1) events.push(event({ kind: 'filter-clean', filterPart: pick(['prefilter', 'prefilter', 'media', 'hoses'] as const) }));
			if (tank.co2Method === 'pressurised' && w % 2 === 1)
				events.push(event({ kind: 'dose', saltId: 'KNO3', what: 'Potassium nitrate', amount: 1.5, amountUnit: 'g' }));
			if (tank.co2Method === 'pressurised' && w === 2) events.push(event({ kind: 'co2-check', note: 'no leaks at the joints; solenoid on the timer' }));
			if (w === Math.floor(weeks / 2))
				events.push(event({ kind: 'algae', algaeKind: pick(['green-dust', 'threads', 'brown-film'] as const), note: 'shortened the light a little' }));
			if (w === 1) {
				const extra = pick(EXTRA_PLANTS);
				events.push(event({ kind: 'plant-added', speciesId: catalogue.get(extra)?.id ?? null, speciesName: extra }));
			}
			if (w % 2 === 1) events.push(event({ kind: 'glass' }));
			const body = [pick(OPENINGS), pick(MIDDLES), pick(CLOSINGS)].filter(Boolean).join('\n\n');
			const photos = [];
			if (w % 3 === 0) {
				const count = w === 0 ? 2 : 1;
				for (let k = 0; k < count; k++) {
					const p = await storeDemoPhoto(tank.ownerId, ++photoSeed, db, { width: 1200, height: 800 });
					photos.push({
						id: p.id,
						alt: `${tank.name} in week ${weekNo}, ${k === 0 ? 'from the front' : 'a closer look at the plants'}.`,
						caption: k === 0 ? '' : 'The plants a week after the trim.'
					});
				}
			}
			const entryId = await entries.create(owner, tank.id, { entryOn: on, title: pick(TITLES).replace('{n}', String(weekNo)), body, events }, photos, {
				db,
				now: at
			});
			entryIds.push({ tankId: tank.id, entryId, ownerId: tank.ownerId, visibility: tank.visibility });

			// A water test the same day: cycling tanks show ammonia and nitrite, one tank lets nitrate run high.
			const cycling = young && w > 0;
			await water.create(
				owner,
				tank.id,
				{
					testedOn: on,
					ph: Math.round((6.5 + rnd() * 0.8) * 10) / 10,
					kh: Math.round(2 + rnd() * 4),
					gh: Math.round(5 + rnd() * 5),
					no3: tank.name === 'Alder Quay jungle' && w === 0 ? 40 : Math.round(8 + rnd() * 15),
					po4: Math.round((0.4 + rnd() * 1.2) * 10) / 10,
					k: w % 2 ? Math.round(10 + rnd() * 8) : null,
					fe: w % 2 ? 0.1 : null,
					ammonia: cycling ? Math.round((0.5 - w * 0.05) * 100) / 100 : 0,
					ammoniaBasis: 'NH3',
					no2: cycling ? 0.25 : 0,
					temperatureC: Math.round((23.5 + rnd() * 2) * 10) / 10,
					tds: Math.round(120 + rnd() * 80),
					note: ''
				},
				{ db, now: new Date(at.getTime() + 30 * 60_000) }
			);
		}
		// The usual schedule; worked out from the events above, so some tasks are due, some not.
		await upkeep.saveSchedule(owner, tank.id, defaultSchedule(tank), { db, now });
	}

	// Other members admire, follow and comment.
	const members = ['mara', 'lio', 'fenna', 'joss', 'ines', 'yara', 'corin', 'pim', 'nell'].map((k) => people.get(k)).filter((id): id is string => !!id);
	const shareable = all.filter((t) => t.visibility !== 'private');
	const rnd = randomFrom(4242);
	for (const memberId of members) {
		const viewer = await viewerOf(memberId);
		for (const tank of shareable) {
			if (tank.ownerId === memberId) continue;
			if (rnd() < 0.45) await social.toggleAdmire(viewer, tank.id, true, { db });
			if (rnd() < 0.25) await social.toggleFollow(viewer, tank.id, true, { db });
		}
	}
	let c = 0;
	for (const e of entryIds.filter((x) => x.visibility !== 'private')) {
		if (rnd() > 0.3) continue;
		const authorId = members.find((m) => m !== e.ownerId && rnd() < 0.5) ?? members.find((m) => m !== e.ownerId)!;
		await entries.addComment(await viewerOf(authorId), e.tankId, e.entryId, COMMENTS[c++ % COMMENTS.length]!, { db });
	}

	// Two members have asked for the weekly upkeep reminder.
	for (const key of ['mara', 'lio']) {
		const id = people.get(key);
		if (id) await preferences.save(id, { upkeep: 'weekly' }, { db });
	}
}
