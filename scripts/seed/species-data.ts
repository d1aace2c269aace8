// The shared species catalogue's starting list. Scientific names as used in the hobby literature
// (a few genera have been revised; the names keepers search for are kept, with the newer one in
// the note where it matters). Common names are generic ones, never trade or brand names.
// Sizes are typical adult lengths in cm and notes are short keeping hints (from memory).
import type { GrowthHabit, GrowthSpeed, Placement, SpeciesKind, Temperament } from '../../src/lib/species/kinds';

export interface SpeciesSeed {
	kind: SpeciesKind;
	scientificName: string;
	commonName: string;
	otherNames?: string;
	placement?: Placement;
	growthHabit?: GrowthHabit;
	growthSpeed?: GrowthSpeed;
	adultSizeCm?: number;
	temperament?: Temperament;
	note?: string;
}

const plant = (
	scientificName: string,
	commonName: string,
	placement: Placement,
	growthHabit: GrowthHabit,
	growthSpeed: GrowthSpeed,
	note = '',
	otherNames = ''
): SpeciesSeed => ({
	kind: 'plant',
	scientificName,
	commonName,
	otherNames,
	placement,
	growthHabit,
	growthSpeed,
	note
});

const animal = (
	kind: Exclude<SpeciesKind, 'plant'>,
	scientificName: string,
	commonName: string,
	adultSizeCm: number,
	temperament: Temperament,
	note = '',
	otherNames = ''
): SpeciesSeed => ({
	kind,
	scientificName,
	commonName,
	otherNames,
	adultSizeCm,
	temperament,
	note
});

export const SPECIES: SpeciesSeed[] = [
	// Foreground and carpeting plants
	plant('Hemianthus callitrichoides', 'dwarf baby tears', 'foreground', 'carpeting', 'slow', 'Spreads into a dense carpet under strong light with added CO2.'),
	plant(
		'Glossostigma elatinoides',
		'glossostigma',
		'foreground',
		'carpeting',
		'fast',
		'Stays low only under strong light; grows upward when light is weak.',
		'mud mat'
	),
	plant(
		'Eleocharis acicularis',
		'needle spikerush',
		'foreground',
		'carpeting',
		'moderate',
		'Spreads by runners into a grassy lawn; trim to keep it short.',
		'hairgrass'
	),
	plant(
		'Eleocharis parvula',
		'dwarf spikerush',
		'foreground',
		'carpeting',
		'moderate',
		'Shorter than needle spikerush; spreads by runners.',
		'small spikerush'
	),
	plant(
		'Eleocharis vivipara',
		'viviparous spikerush',
		'background',
		'rosette',
		'moderate',
		'Tall, fine stems that bend over and root new plantlets at their tips.'
	),
	plant('Lilaeopsis brasiliensis', 'Brazilian micro sword', 'foreground', 'carpeting', 'slow', 'Slow to settle, then spreads by runners.'),
	plant(
		'Sagittaria subulata',
		'awl-leaf arrowhead',
		'foreground',
		'rosette',
		'moderate',
		'Undemanding; spreads by runners and stays short in bright light.',
		'dwarf sagittaria'
	),
	plant(
		'Helanthium tenellum',
		'narrow-leaf chain sword',
		'foreground',
		'rosette',
		'moderate',
		'Formerly Echinodorus tenellus; spreads by runners.',
		'pygmy chain sword'
	),
	plant('Marsilea hirsuta', 'water clover', 'foreground', 'carpeting', 'slow', 'A fern with clover-like leaves that creeps along the substrate.'),
	plant('Hydrocotyle verticillata', 'whorled marshpennywort', 'foreground', 'carpeting', 'moderate', 'Round leaves on upright stalks from a creeping stem.'),
	plant('Hydrocotyle sibthorpioides', 'lawn marshpennywort', 'foreground', 'carpeting', 'fast', 'Creeps over stone and substrate; trims easily.'),
	plant(
		'Utricularia graminifolia',
		'grass-leaved bladderwort',
		'foreground',
		'carpeting',
		'slow',
		'Carnivorous: tiny bladders catch microscopic animals. Delicate to plant.'
	),
	plant('Eriocaulon cinereum', 'ashy pipewort', 'foreground', 'rosette', 'slow', 'Prefers soft, slightly acidic water and a nutrient-rich substrate.'),
	plant('Ranunculus inundatus', 'river buttercup', 'foreground', 'carpeting', 'moderate', 'Finely divided leaves on runners.'),
	plant(
		'Pilularia globulifera',
		'pillwort',
		'foreground',
		'carpeting',
		'slow',
		'A small fern with needle leaves; rare in the wild, so only from cultivated stock.'
	),
	plant('Elatine hydropiper', 'eight-stamen waterwort', 'foreground', 'carpeting', 'moderate', 'Tiny leaves; a cool-water carpet.'),
	plant('Micranthemum umbrosum', 'shade mudflower', 'midground', 'stem', 'fast', 'Round leaves; can be trimmed into a low bush.', 'giant baby tears'),
	// Rosette plants
	plant('Cryptocoryne parva', 'dwarf water trumpet', 'foreground', 'rosette', 'slow', 'The smallest of the group; very slow to fill in.'),
	plant(
		'Cryptocoryne wendtii',
		'Wendt’s water trumpet',
		'midground',
		'rosette',
		'slow',
		'May drop its leaves after a move ("melt") and regrow them from the roots.'
	),
	plant('Cryptocoryne beckettii', 'Beckett’s water trumpet', 'midground', 'rosette', 'slow', 'Tolerates low light; roots strongly.'),
	plant('Cryptocoryne undulata', 'wavy water trumpet', 'midground', 'rosette', 'slow', 'Leaves with wavy edges; spreads by runners.'),
	plant('Cryptocoryne crispatula', 'crinkled water trumpet', 'background', 'rosette', 'slow', 'Long, crinkled, strap-like leaves; needs a deep substrate.'),
	plant('Echinodorus grisebachii', 'Amazon sword plant', 'midground', 'rosette', 'moderate', 'Grows large; feed its roots with tablets in an inert substrate.'),
	plant('Echinodorus cordifolius', 'creeping burhead', 'background', 'rosette', 'fast', 'Can send leaves above the surface; cutting them keeps it submerged.'),
	plant(
		'Vallisneria spiralis',
		'straight vallisneria',
		'background',
		'rosette',
		'fast',
		'Ribbon leaves that trail at the surface; spreads by runners.',
		'tape grass'
	),
	plant('Vallisneria americana', 'American eelgrass', 'background', 'rosette', 'fast', 'Long ribbons; suits deep tanks.', 'tape grass'),
	plant('Ceratopteris thalictroides', 'water sprite', 'background', 'rosette', 'fast', 'A fern that grows rooted or floating; plantlets form on the leaves.'),
	plant('Cyperus helferi', 'Helfer’s sedge', 'midground', 'rosette', 'slow', 'Grass-like tufts; one of the few fully aquatic sedges.'),
	// Epiphytes, mosses and liverworts
	plant('Anubias barteri', 'Barter’s anubias', 'epiphyte', 'rhizome', 'slow', 'Keep the rhizome out of the substrate: tie or glue it to wood or stone.'),
	plant('Anubias barteri var. nana', 'dwarf anubias', 'epiphyte', 'rhizome', 'slow', 'Small and tough; grows in shade.'),
	plant(
		'Microsorum pteropus',
		'Java fern',
		'epiphyte',
		'rhizome',
		'slow',
		'Tie to wood or stone; plantlets form on old leaves. Now often placed in Leptochilus.'
	),
	plant('Bolbitis heudelotii', 'African water fern', 'epiphyte', 'rhizome', 'slow', 'Likes a current; tie the rhizome to wood.'),
	plant('Taxiphyllum barbieri', 'Java moss', 'epiphyte', 'moss', 'moderate', 'Ties onto almost anything; shelters shrimp and fry.'),
	plant('Vesicularia montagnei', 'Christmas moss', 'epiphyte', 'moss', 'slow', 'Grows in layered, triangular fronds.'),
	plant('Vesicularia dubyana', 'Singapore moss', 'epiphyte', 'moss', 'slow', 'Similar to Java moss with smaller, more triangular fronds.'),
	plant('Leptodictyum riparium', 'stringy moss', 'epiphyte', 'moss', 'fast', 'Grows long, fine strands; tolerates cool and warm water.'),
	plant('Fontinalis antipyretica', 'willow moss', 'epiphyte', 'moss', 'slow', 'A cool-water moss; struggles above about 24 °C.', 'greater water-moss'),
	plant('Fissidens fontanus', 'pocket moss', 'epiphyte', 'moss', 'slow', 'Tiny, feathery and very slow; keep it free of debris.'),
	plant('Riccardia chamedryfolia', 'mini pellia', 'epiphyte', 'moss', 'slow', 'A liverwort forming dense, coral-like cushions.'),
	// Floating plants
	plant('Riccia fluitans', 'crystalwort', 'floating', 'floating', 'fast', 'Floats in mats, or can be held down on stone with a net.'),
	plant(
		'Phyllanthus fluitans',
		'red root floater',
		'floating',
		'floating',
		'moderate',
		'Leaves and roots redden in strong light; keep condensation off the leaves.'
	),
	plant(
		'Limnobium laevigatum',
		'West Indian spongeplant',
		'floating',
		'floating',
		'fast',
		'Shades the tank as it spreads; invasive outdoors in some regions.',
		'Amazon frogbit'
	),
	plant('Lemna minor', 'common duckweed', 'floating', 'floating', 'fast', 'Covers the surface quickly and is hard to remove completely.'),
	// Stem plants
	plant('Hygrophila corymbosa', 'giant hygrophila', 'background', 'stem', 'fast', 'Large leaves; a heavy feeder.'),
	plant('Hygrophila difformis', 'water wisteria', 'background', 'stem', 'fast', 'Leaves are deeply divided under water and simpler above it.'),
	plant('Rotala rotundifolia', 'roundleaf toothcup', 'background', 'stem', 'fast', 'Turns pink to red near the light; trims into bushy groups.'),
	plant('Rotala macrandra', 'giant red rotala', 'background', 'stem', 'moderate', 'Needs strong light, CO2 and iron for its red colour.'),
	plant('Rotala wallichii', 'whorly rotala', 'background', 'stem', 'moderate', 'Fine needle leaves in whorls; prefers soft water.'),
	plant('Rotala indica', 'Indian toothcup', 'midground', 'stem', 'moderate', 'Compact stems; easy for a first red-tinted plant.'),
	plant('Rotala ramosior', 'lowland toothcup', 'midground', 'stem', 'moderate', 'Narrow leaves that redden under strong light.'),
	plant('Ludwigia repens', 'creeping primrose-willow', 'background', 'stem', 'fast', 'Leaves redden in strong light.'),
	plant('Ludwigia palustris', 'marsh seedbox', 'background', 'stem', 'moderate', 'A hardy stem plant of temperate and tropical wetlands.'),
	plant('Ludwigia arcuata', 'piedmont primrose-willow', 'background', 'stem', 'moderate', 'Needle-like leaves with a red-orange tint.'),
	plant('Bacopa caroliniana', 'blue waterhyssop', 'background', 'stem', 'slow', 'Leaves smell of lemon when crushed.', 'lemon bacopa'),
	plant('Bacopa monnieri', 'water hyssop', 'midground', 'stem', 'moderate', 'Small thick leaves; grows above water as readily as below.', 'herb-of-grace'),
	plant('Myriophyllum mattogrossense', 'Mato Grosso milfoil', 'background', 'stem', 'fast', 'Feathery whorls; drops leaves in low light.'),
	plant('Hydrocotyle leucocephala', 'Brazilian pennywort', 'background', 'stem', 'fast', 'Grows toward the surface and along it.'),
	plant('Didiplis diandra', 'water purslane', 'midground', 'stem', 'moderate', 'Fine leaves that turn red-brown near the light.'),
	plant('Proserpinaca palustris', 'marsh mermaidweed', 'background', 'stem', 'slow', 'Leaf shape changes with light and temperature.'),
	plant('Heteranthera zosterifolia', 'stargrass', 'midground', 'stem', 'fast', 'Grows tall, or creeps along the bottom in strong light.'),
	plant('Lobelia cardinalis', 'cardinal flower', 'midground', 'stem', 'slow', 'A marsh plant that keeps a compact submerged form.'),
	plant('Ceratophyllum demersum', 'hornwort', 'background', 'stem', 'fast', 'Has no roots: let it float or weigh the stems down.', 'coontail'),
	plant('Najas guadalupensis', 'southern waternymph', 'background', 'stem', 'fast', 'Brittle stems that break and regrow; often floats.'),
	plant('Hemianthus glomeratus', 'pearlweed', 'midground', 'stem', 'fast', 'Small leaves; trims into a dense bush.', 'baby tears'),
	plant('Lysimachia nummularia', 'creeping Jenny', 'midground', 'stem', 'moderate', 'A marsh plant; lives for months to years fully submerged.', 'moneywort'),
	plant('Shinnersia rivularis', 'Mexican oakleaf', 'background', 'stem', 'fast', 'Oak-shaped leaves; grows quickly toward the surface.'),
	plant('Hottonia palustris', 'water violet', 'background', 'stem', 'slow', 'A cool-water plant with finely divided leaves.'),
	plant('Hippuris vulgaris', 'mare’s-tail', 'background', 'stem', 'slow', 'A cold-water plant for unheated tanks.'),
	// Bulbs and tubers
	plant('Aponogeton madagascariensis', 'Madagascar lace plant', 'background', 'bulb', 'slow', 'Leaves are a lattice of veins; may rest for a few months.'),
	plant('Aponogeton crispus', 'crinkled aponogeton', 'background', 'bulb', 'fast', 'Grows from a tuber; may rest after flowering.'),
	plant('Nymphaea lotus', 'tiger lotus', 'background', 'bulb', 'fast', 'Cut floating leaves to keep the submerged ones coming.', 'Egyptian white water lily'),
	plant('Barclaya longifolia', 'orchid lily', 'background', 'bulb', 'moderate', 'Grows from a tuber; leaves wavy and long.'),
	plant('Crinum calamistratum', 'African onion plant', 'background', 'bulb', 'slow', 'Very long, crinkled leaves from a bulb; plant the bulb half buried.'),

	// Fish
	animal('fish', 'Paracheirodon innesi', 'neon tetra', 3.5, 'peaceful', 'A shoaling fish: keep a group of eight or more.'),
	animal('fish', 'Paracheirodon axelrodi', 'cardinal tetra', 5, 'peaceful', 'A shoaling fish from soft, warm water.'),
	animal('fish', 'Hemigrammus erythrozonus', 'glowlight tetra', 4, 'peaceful', 'A shoaling fish; calm and undemanding.'),
	animal('fish', 'Hyphessobrycon amandae', 'ember tetra', 2, 'peaceful', 'A tiny shoaling fish, at home in small planted tanks.'),
	animal('fish', 'Boraras brigittae', 'chili rasbora', 2, 'peaceful', 'Very small; keep with tankmates of its size.', 'mosquito rasbora'),
	animal('fish', 'Trigonostigma heteromorpha', 'harlequin rasbora', 5, 'peaceful', 'A shoaling fish with a dark triangular patch.'),
	animal('fish', 'Trigonostigma espei', 'lambchop rasbora', 3, 'peaceful', 'A shoaling fish, smaller than its harlequin cousin.'),
	animal('fish', 'Danio margaritatus', 'celestial pearl danio', 2.5, 'peaceful', 'Shy; likes dense planting.', 'galaxy rasbora'),
	animal('fish', 'Danio rerio', 'zebra danio', 5, 'peaceful', 'Very active; needs swimming room and a lid.'),
	animal('fish', 'Tanichthys albonubes', 'white cloud mountain minnow', 4, 'peaceful', 'A cool-water fish for unheated tanks.'),
	animal('fish', 'Puntigrus tetrazona', 'tiger barb', 7, 'semi-aggressive', 'Nips long fins; keep a large group with quick tankmates.'),
	animal('fish', 'Nannostomus beckfordi', 'golden pencilfish', 6.5, 'peaceful', 'Stays near the surface among plants.'),
	animal('fish', 'Carnegiella strigata', 'marbled hatchetfish', 4.5, 'peaceful', 'Lives at the surface and jumps: keep the tank covered.'),
	animal('fish', 'Otocinclus vittatus', 'otocinclus', 4, 'peaceful', 'Grazes algae films; keep a small group in a mature tank.', 'dwarf suckermouth catfish'),
	animal('fish', 'Corydoras pygmaeus', 'pygmy corydoras', 2.5, 'peaceful', 'Swims in mid-water as well as on the bottom; keep a group.'),
	animal('fish', 'Corydoras paleatus', 'peppered corydoras', 7, 'peaceful', 'Sifts sand for food; tolerates cooler water.'),
	animal('fish', 'Corydoras aeneus', 'bronze corydoras', 7, 'peaceful', 'A sociable bottom dweller; give it fine sand.'),
	animal('fish', 'Ancistrus cirrhosus', 'bristlenose catfish', 13, 'peaceful', 'Grazes algae and rasps wood; males grow bristles.'),
	animal('fish', 'Crossocheilus oblongus', 'Siamese algae eater', 15, 'peaceful', 'Grows larger than most keepers expect; eats some algae, including tufts.'),
	animal('fish', 'Pangio kuhlii', 'kuhli loach', 10, 'peaceful', 'Eel-like and nocturnal; hides in soft substrate.'),
	animal('fish', 'Poecilia reticulata', 'guppy', 5, 'peaceful', 'A livebearer that breeds readily.'),
	animal('fish', 'Xiphophorus maculatus', 'southern platyfish', 6, 'peaceful', 'A hardy livebearer.', 'platy'),
	animal('fish', 'Betta splendens', 'Siamese fighting fish', 6.5, 'aggressive', 'Males fight each other: one male per tank.'),
	animal('fish', 'Trichogaster lalius', 'dwarf gourami', 8.5, 'semi-aggressive', 'Males can be territorial.'),
	animal('fish', 'Trichopodus leerii', 'pearl gourami', 12, 'peaceful', 'Calm; likes floating plants.'),
	animal('fish', 'Mikrogeophagus ramirezi', 'ram cichlid', 7, 'semi-aggressive', 'Needs warm, soft, clean water; pairs defend a territory.'),
	animal('fish', 'Apistogramma cacatuoides', 'cockatoo dwarf cichlid', 9, 'semi-aggressive', 'Needs caves; defends them while breeding.'),
	animal('fish', 'Pterophyllum scalare', 'freshwater angelfish', 15, 'semi-aggressive', 'Tall fish for tall tanks; eats very small fish.'),
	animal('fish', 'Dario dario', 'scarlet badis', 2, 'peaceful', 'Tiny; often takes live or frozen food only.'),
	animal('fish', 'Epalzeorhynchos bicolor', 'red-tailed black shark', 15, 'aggressive', 'Territorial toward its own kind and look-alikes.'),
	// Shrimp
	animal('shrimp', 'Neocaridina davidi', 'cherry shrimp', 3, 'peaceful', 'Breeds readily; many colour forms exist.'),
	animal(
		'shrimp',
		'Caridina multidentata',
		'Yamato shrimp',
		5,
		'peaceful',
		'A tireless algae grazer; larvae need brackish water, so it rarely breeds in tanks.',
		'Japanese swamp shrimp'
	),
	animal('shrimp', 'Caridina cantonensis', 'bee shrimp', 3, 'peaceful', 'Needs soft, stable water.'),
	animal('shrimp', 'Atyopsis moluccensis', 'bamboo shrimp', 8, 'peaceful', 'Filters food from the current with fan-like hands.', 'wood shrimp'),
	animal('shrimp', 'Palaemonetes paludosus', 'ghost shrimp', 4, 'semi-aggressive', 'May eat very small shrimp and fry.', 'glass shrimp'),
	// Snails
	animal('snail', 'Neritina natalensis', 'zebra nerite snail', 2.5, 'peaceful', 'Grazes algae; does not breed in fresh water but lays hard white eggs.'),
	animal('snail', 'Clithon corona', 'horned nerite snail', 1.5, 'peaceful', 'A small algae grazer with spiny shell.'),
	animal('snail', 'Planorbella duryi', 'ramshorn snail', 2.5, 'peaceful', 'Breeds readily; eats soft algae and leftovers.'),
	animal('snail', 'Melanoides tuberculata', 'red-rimmed melania', 3, 'peaceful', 'Burrows in the substrate and turns it over.', 'Malaysian trumpet snail'),
	animal('snail', 'Physella acuta', 'bladder snail', 1.5, 'peaceful', 'Often arrives on plants; numbers follow the food supply.'),
	animal('snail', 'Anentome helena', 'assassin snail', 2.5, 'predatory', 'Eats other snails.'),
	// Other invertebrates
	animal('invertebrate', 'Cambarellus patzcuarensis', 'dwarf crayfish', 4, 'semi-aggressive', 'Can catch small fish and shrimp; escapes through gaps.')
];
