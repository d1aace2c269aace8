// The shared species catalogue's vocabulary, for forms, filters and the seed.

export const SPECIES_KINDS = ['plant', 'fish', 'shrimp', 'snail', 'invertebrate'] as const;
export type SpeciesKind = (typeof SPECIES_KINDS)[number];
export const SPECIES_KIND_LABELS: Record<SpeciesKind, string> = {
	plant: 'Plant',
	fish: 'Fish',
	shrimp: 'Shrimp',
	snail: 'Snail',
	invertebrate: 'Other invertebrate'
};
export const ANIMAL_KINDS: SpeciesKind[] = ['fish', 'shrimp', 'snail', 'invertebrate'];

export const PLACEMENTS = ['foreground', 'midground', 'background', 'epiphyte', 'floating'] as const;
export type Placement = (typeof PLACEMENTS)[number];
export const PLACEMENT_LABELS: Record<Placement, string> = {
	foreground: 'Foreground',
	midground: 'Midground',
	background: 'Background',
	epiphyte: 'On wood or stone',
	floating: 'Floating'
};

export const GROWTH_HABITS = ['stem', 'rosette', 'rhizome', 'moss', 'carpeting', 'floating', 'bulb'] as const;
export type GrowthHabit = (typeof GROWTH_HABITS)[number];
export const GROWTH_HABIT_LABELS: Record<GrowthHabit, string> = {
	stem: 'Stem plant',
	rosette: 'Rosette',
	rhizome: 'Rhizome',
	moss: 'Moss or liverwort',
	carpeting: 'Carpeting (runners)',
	floating: 'Floating',
	bulb: 'Bulb or tuber'
};

/** The way of growing as a noun for a sentence: "does not fit a stem plant". */
export const GROWTH_HABIT_NOUNS: Record<GrowthHabit, string> = {
	stem: 'a stem plant',
	rosette: 'a rosette plant',
	rhizome: 'a rhizome plant',
	moss: 'a moss',
	carpeting: 'a carpeting plant',
	floating: 'a floating plant',
	bulb: 'a bulb or tuber plant'
};

export const GROWTH_SPEEDS = ['slow', 'moderate', 'fast'] as const;
export type GrowthSpeed = (typeof GROWTH_SPEEDS)[number];

export const TEMPERAMENTS = ['peaceful', 'semi-aggressive', 'aggressive', 'predatory'] as const;
export type Temperament = (typeof TEMPERAMENTS)[number];
export const TEMPERAMENT_LABELS: Record<Temperament, string> = {
	peaceful: 'Peaceful',
	'semi-aggressive': 'Can be quarrelsome',
	aggressive: 'Aggressive',
	predatory: 'Eats smaller tankmates'
};

/** A species as a picker shows it (GET /api/species). */
export interface SpeciesHit {
	id: number;
	kind: SpeciesKind;
	scientificName: string;
	commonName: string;
	otherNames: string;
	placement: Placement | null;
	growthHabit: GrowthHabit | null;
	temperament: Temperament | null;
}

/**
 * A few words on what a species is, for pickers that list plants and animals together: a plant's
 * way of growing ("Stem plant"), an animal's kind, and its temperament when it is not peaceful
 * ("Fish · Eats smaller tankmates").
 */
export function speciesTag(hit: Pick<SpeciesHit, 'kind' | 'growthHabit' | 'temperament'>): string {
	if (hit.kind === 'plant') return hit.growthHabit ? GROWTH_HABIT_LABELS[hit.growthHabit] : SPECIES_KIND_LABELS.plant;
	const kind = SPECIES_KIND_LABELS[hit.kind];
	return hit.temperament && hit.temperament !== 'peaceful' ? `${kind} · ${TEMPERAMENT_LABELS[hit.temperament]}` : kind;
}
