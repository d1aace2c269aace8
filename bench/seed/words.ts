// Word lists for the benchmark's large invented club. People's names are built from invented
// syllables (no real person), places sit over open sea, addresses are on the reserved .test domain.

export const BENCH_CLUB_DOMAIN = 'greyreach.test';

/** The club's region: a box over open water, well clear of any coast. */
export const REGION = { lat: 55.6, lng: 3.4, halfLat: 0.8, halfLng: 1.3 };

const GIVEN_HEADS = ['Al', 'Bra', 'Cor', 'Da', 'El', 'Fen', 'Gil', 'Hal', 'Is', 'Jor', 'Ka', 'Lun', 'Mer', 'Nol', 'Or', 'Pel', 'Quin', 'Ros', 'Sel', 'Tam'];
const GIVEN_TAILS = ['wen', 'mar', 'dis', 'lo', 'ric', 'na', 'vey', 'tha', 'mon', 'sa'];
const FAMILY_HEADS = [
	'Ash',
	'Brack',
	'Cold',
	'Dun',
	'Elder',
	'Fallow',
	'Gorse',
	'Hazel',
	'Ives',
	'Kettle',
	'Linden',
	'Marl',
	'Nettle',
	'Osier',
	'Pebble',
	'Rush',
	'Sallow',
	'Thorn',
	'Umber',
	'Wick'
];
const FAMILY_TAILS = ['ford', 'by', 'combe', 'holt', 'mere', 'wick', 'stead', 'ley', 'brook', 'thwaite'];

export const GIVEN_NAMES = GIVEN_HEADS.flatMap((h) => GIVEN_TAILS.map((t) => h + t));
export const FAMILY_NAMES = FAMILY_HEADS.flatMap((h) => FAMILY_TAILS.map((t) => h + t.toLowerCase()));

export const AREA_NAMES = [
	'Greyreach Harbour',
	'Saltmarsh End',
	'Cobble Rise',
	'Tidewater Green',
	'Gull Point',
	'Heronsgate',
	'Shoal Bank',
	'Driftmoor',
	'Kelpwick',
	'Brinefield',
	'Oyster Row',
	'Sandling Cross'
];

export const TANK_WORDS_A = [
	'Slate',
	'Reed',
	'Moss',
	'Fern',
	'Alder',
	'Sedge',
	'Pebble',
	'Willow',
	'Heron',
	'Otter',
	'Lichen',
	'Dune',
	'Ember',
	'Frost',
	'Amber',
	'Cedar'
];
export const TANK_WORDS_B = [
	'hollow',
	'margin',
	'ford',
	'shelf',
	'run',
	'bay',
	'step',
	'bank',
	'weir',
	'corner',
	'arch',
	'spring',
	'light',
	'root',
	'pool',
	'ridge'
];
export const STYLES = ['wood and stone', 'iwagumi', 'jungle', 'biotope', 'nano', 'stem garden', ''];

export const ENTRY_TITLES = [
	'Weekly water change',
	'Big trim',
	'New stems in the back',
	'Algae check',
	'Filter day',
	'Carpet filling in',
	'Moved a stone',
	'CO2 adjusted',
	'Shrimp babies',
	'Light schedule change',
	'Rescaped the left side',
	'Quiet week',
	''
];

export const SENTENCES = [
	'Changed about a third of the water and wiped the front glass.',
	'The stems at the back reached the surface again, so I cut the tops and replanted them.',
	'A little green dust on the glass; I shortened the photoperiod by half an hour.',
	'The moss on the wood is thickening nicely after four months.',
	'Added a few more floating plants to shade the left corner.',
	'The shoal spends most of the day in the open water in front of the stones.',
	'Cleaned the prefilter sponge in old tank water so the bacteria survive.',
	'The carpet has nearly closed the gap on the right.',
	'Dosed the usual macro mix after the water change.',
	'Noticed pearling on the foreground plants an hour after the lights came on.',
	'Replanted a few stems that floated loose after the trim.',
	'Tested the water: nitrate a touch high, so a larger change next week.',
	'Drop checker turned a lime green two hours into the photoperiod.',
	'A snail hitchhiker showed up on the new plants; leaving it for now.',
	'Trimmed the epiphytes on the wood so the light reaches the midground.'
];

export const HEADINGS = ['What I did', 'What I noticed', 'Next time', 'Plants', 'Water'];

export const COMMENTS = [
	'That background looks great now.',
	'How often do you trim the stems?',
	'Lovely colour on the reds.',
	'Which light are you running and for how long?',
	'The carpet came in fast!',
	'Nice to see the moss filling in.',
	'Same algae here last month; a shorter photoperiod fixed it.',
	'Beautiful layout, the stone placement is spot on.'
];

export const LISTING_TITLES = {
	plants: ['Stem trimmings, mixed greens', 'Red stem tops', 'Moss portion', 'Rhizome splits', 'Carpet plant mat', 'Floating plants, a handful', 'Crypt pots'],
	livestock: ['Cherry-red shrimp', 'Ramshorn snails', 'Young livebearers', 'Shrimplets'],
	hardscape: ['Grey stones, a box', 'Branching root', 'Lava rock pieces'],
	equipment: ['Spare canister filter', 'Glass lily pipes', 'CO2 diffuser', 'LED light, 60 cm']
} as const;

export const MESSAGES = [
	'Hello! Are these still available?',
	'Yes, they are. When would suit you?',
	'Could I come by on Saturday morning?',
	'Saturday works. I will put them in a bag for you.',
	'Thanks so much, see you then.',
	'Do you need the bag back?',
	'No need, keep it.',
	'The plants settled in well, thank you again.'
];

export const STATEMENTS = [
	'A sloped path pulls the eye towards the back, where the tallest stems catch the light.',
	'Three stone groups, the largest leaning slightly so the layout does not look placed.',
	'A jungle of mixed stems trimmed into soft steps so the back rises like a hill.',
	'Low-tech: no added CO2, a long gentle photoperiod and a lot of patience.',
	'The wood is one branch, split and re-joined so the grain runs the same way throughout.'
];

/** Our own rubric words for the large club's contests (six criteria). */
export const CRITERIA = [
	{ label: 'Sense of depth', max: 10, weight: 3 },
	{ label: 'Plant vigour', max: 10, weight: 3 },
	{ label: 'Hardscape balance', max: 10, weight: 2 },
	{ label: 'Livestock fit', max: 5, weight: 1 },
	{ label: 'Care in the details', max: 5, weight: 1 },
	{ label: 'Light and shade', max: 5, weight: 1 }
] as const;
