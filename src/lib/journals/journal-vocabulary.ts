// Words of the journal: what can happen to a tank (events), the parts of a filter, the algae a
// keeper may see, and the kinds of upkeep a schedule tracks. Shared by forms, pages, schema and mail.
// No imports: the schema (read by drizzle-kit, which knows no $lib alias) uses these lists.

export const EVENT_KINDS = [
	'water-change',
	'top-up',
	'trim',
	'filter-clean',
	'media-change',
	'dose',
	'glass',
	'co2-check',
	'plant-added',
	'plant-removed',
	'livestock-added',
	'livestock-removed',
	'algae',
	'note',
	'upkeep'
] as const;
export type EventKind = (typeof EVENT_KINDS)[number];

export const EVENT_LABELS: Record<EventKind, string> = {
	'water-change': 'Water change',
	'top-up': 'Topped up',
	trim: 'Trim',
	'filter-clean': 'Filter clean',
	'media-change': 'Media change',
	dose: 'Dose',
	glass: 'Glass cleaned',
	'co2-check': 'CO2 gear checked',
	'plant-added': 'Plant added',
	'plant-removed': 'Plant taken out',
	'livestock-added': 'Animals added',
	'livestock-removed': 'Animals taken out',
	algae: 'Algae seen',
	note: 'Note',
	upkeep: 'Other upkeep'
};

/** Kinds a member picks in the entry form ('upkeep' is written by the schedule's "done today"). */
export const FORM_EVENT_KINDS = EVENT_KINDS.filter((k) => k !== 'upkeep');

/** Events that change the tank's plant or livestock list; once saved they stay as they are. */
export const LIST_EVENT_KINDS = ['plant-added', 'plant-removed', 'livestock-added', 'livestock-removed'] as const satisfies readonly EventKind[];
export type ListEventKind = (typeof LIST_EVENT_KINDS)[number];
export const isListEvent = (kind: string): kind is ListEventKind => (LIST_EVENT_KINDS as readonly string[]).includes(kind);

export const FILTER_PARTS = ['prefilter', 'media', 'impeller', 'hoses', 'intake', 'whole'] as const;
export type FilterPart = (typeof FILTER_PARTS)[number];
export const FILTER_PART_LABELS: Record<FilterPart, string> = {
	prefilter: 'Pre-filter sponge',
	media: 'Main media',
	impeller: 'Impeller',
	hoses: 'Hoses and pipes',
	intake: 'Intake strainer',
	whole: 'The whole filter'
};

/** Plain names for what keepers see, not taxonomy (several are not algae at all, e.g. the slime). */
export const ALGAE_KINDS = ['green-dust', 'green-spots', 'threads', 'dark-tufts', 'slime', 'brown-film', 'green-water', 'other'] as const;
export type AlgaeKind = (typeof ALGAE_KINDS)[number];
export const ALGAE_LABELS: Record<AlgaeKind, string> = {
	'green-dust': 'Green dust on the glass',
	'green-spots': 'Hard green spots',
	threads: 'Long green threads',
	'dark-tufts': 'Dark bristly tufts',
	slime: 'Blue-green slime',
	'brown-film': 'Brown film',
	'green-water': 'Green, cloudy water',
	other: 'Something else'
};

export const DOSE_UNITS = ['mL', 'g', 'mg', 'drops', 'tablets'] as const;
export type DoseUnit = (typeof DOSE_UNITS)[number];

/** What a schedule can track: the upkeep events, water tests, and anything else by name. */
export const TASK_KINDS = ['water-change', 'trim', 'filter-clean', 'media-change', 'dose', 'glass', 'co2-check', 'water-test', 'other'] as const;
export type TaskKind = (typeof TASK_KINDS)[number];
export const TASK_KIND_LABELS: Record<TaskKind, string> = {
	'water-change': 'Water change',
	trim: 'Trim',
	'filter-clean': 'Filter clean',
	'media-change': 'Media change',
	dose: 'Dose',
	glass: 'Clean the glass',
	'co2-check': 'Check the CO2 gear',
	'water-test': 'Water test',
	other: 'Something else (by name)'
};

/** Longest entry text and comment, in characters. */
export const ENTRY_BODY_MAX = 20_000;
export const COMMENT_MAX = 4_000;
/** Photos one entry keeps. */
export const ENTRY_PHOTOS_MAX = 12;
/** Events one entry records. */
export const ENTRY_EVENTS_MAX = 30;
