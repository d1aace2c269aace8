// A few demo tanks with drawn cover photos, so the tank pages have something to show. The fuller
// journal demo (entries, events, water tests) builds on these.
import { inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../src/lib/server/db';
import * as tanks from '../../src/lib/server/journals/tanks';
import { species } from '../../src/lib/server/species/schema';
import type { TankInput } from '../../src/lib/journals/tank-input';
import { demoUserIds } from './club';
import { storeDemoPhoto } from './lib/images';

type DemoTank = { owner: string; seed: number; alt: string; input: Omit<TankInput, 'plants' | 'livestock'>; plants: [string, string, string | null][]; livestock: [string, number, string][] };

const TANKS: DemoTank[] = [
	{
		owner: 'mara',
		seed: 11,
		alt: 'A long tank with tall green and red stem plants behind two grey stones, a low lawn in front and a small shoal of orange fish.',
		input: {
			name: 'Reedholme riverbank',
			style: 'nature',
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
			heaterNote: 'set to 24 °C',
			co2Method: 'pressurised',
			co2BubblesPerSecond: 2,
			waterLitres: null,
			description: 'A riverbank in a glass box: stem plants at the back, **needle spikerush** in front.\n\n- Water change: 40 % weekly\n- Trim: every second Sunday',
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
			heaterNote: '',
			co2Method: 'pressurised',
			co2BubblesPerSecond: 1.5,
			waterLitres: null,
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
			heaterNote: 'unheated',
			co2Method: 'none',
			co2BubblesPerSecond: null,
			waterLitres: 12,
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
	const found = await db.select({ id: species.id, name: species.scientificName, placement: species.placement }).from(species).where(inArray(species.scientificName, names));
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
				plants: demo.plants.map(([name, addedOn, removedOn]) => ({ speciesId: catalogue.get(name) ?? null, name, placement: placement.get(name) ?? null, addedOn, removedOn })),
				livestock: demo.livestock.map(([name, count, addedOn]) => ({ speciesId: catalogue.get(name) ?? null, name, count, addedOn, removedOn: null }))
			},
			[{ id: photo.id, alt: demo.alt, caption: '' }],
			db
		);
	}
}
