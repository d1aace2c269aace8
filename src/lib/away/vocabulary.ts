// Words of away care shared by forms, pages and the schema. No imports: the schema (read by
// drizzle-kit, which knows no $lib alias) uses these lists.

export const FEEDING_CHOICES = ['none', 'reduced', 'usual'] as const;
export type FeedingChoice = (typeof FEEDING_CHOICES)[number];
export const FEEDING_LABELS: Record<FeedingChoice, string> = {
	none: 'No feeding while I am away',
	reduced: 'A small pinch every other visit',
	usual: 'As I feed them now'
};

export const LIGHTING_CHOICES = ['keep', 'shorten'] as const;
export type LightingChoice = (typeof LIGHTING_CHOICES)[number];
export const LIGHTING_LABELS: Record<LightingChoice, string> = {
	keep: 'Keep the lights as they are',
	shorten: 'Shorten the lighting day while nobody trims'
};

export const SITTER_STATES = ['asked', 'accepted', 'declined', 'withdrawn'] as const;
export type SitterState = (typeof SITTER_STATES)[number];
export const SITTER_STATE_LABELS: Record<SitterState, string> = {
	asked: 'Asked, no answer yet',
	accepted: 'Looking in',
	declined: 'Said no',
	withdrawn: 'Request taken back'
};

export const VISIT_MAIL_CHOICES = ['each', 'daily'] as const;
export type VisitMailChoice = (typeof VISIT_MAIL_CHOICES)[number];
export const VISIT_MAIL_LABELS: Record<VisitMailChoice, string> = {
	each: 'A mail after each visit',
	daily: 'One mail a day with the day’s visits'
};
