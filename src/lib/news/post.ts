// Club news as admins write it and members read it: the form, who a post goes to, and how a
// member's home point is matched to "members in an area" (the swap board's shown distance from a
// club area's centre, so a post reaches exactly the members the board would show within that radius).
import { z } from 'zod';
import { haversineDistance } from '../swaps/distance';
import { shownFigure } from '../swaps/display';
import { RADIUS_CHOICES } from '../swaps/board-filter';
import type { LatLng } from '../club/location';
import type { DistanceUnit } from '../journals/calc/units';

export const NEWS_TITLE_MAX = 140;
export const NEWS_BODY_MAX = 20_000;
export const NEWS_PAGE_SIZE = 10;

export const VISIBILITIES = ['public', 'members'] as const;
export type NewsVisibility = (typeof VISIBILITIES)[number];
export const VISIBILITY_LABELS: Record<NewsVisibility, string> = {
	public: 'Everyone (on the news page and in the feed)',
	members: 'Members only'
};

export const AUDIENCE_KINDS = ['all', 'judges', 'entrants', 'area'] as const;
export type AudienceKind = (typeof AUDIENCE_KINDS)[number];
export const AUDIENCE_LABELS: Record<AudienceKind, string> = {
	all: 'All members',
	judges: 'Judges',
	entrants: 'Entrants of a contest',
	area: 'Members in an area'
};

export type Audience =
	{ kind: 'all' } | { kind: 'judges' } | { kind: 'entrants'; contestId: number } | { kind: 'area'; areaId: number; radius: number; unit: DistanceUnit };

const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

/** The post form; the audience's own fields are checked against its kind. */
export const postForm = z
	.object({
		title: z.string().trim().min(3, 'Give the post a title of at least 3 characters.').max(NEWS_TITLE_MAX, `Keep the title to ${NEWS_TITLE_MAX} characters.`),
		body: z
			.string()
			.trim()
			.min(1, 'Write something.')
			.max(NEWS_BODY_MAX, `Keep the post under ${NEWS_BODY_MAX.toLocaleString('en-GB')} characters.`),
		visibility: z.enum(VISIBILITIES, { message: 'Choose who may read it on the site.' }),
		audienceKind: z.enum(AUDIENCE_KINDS, { message: 'Choose who gets it by mail.' }),
		contestId: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
		areaId: z.preprocess(blankToUndefined, z.coerce.number().int().positive().optional()),
		radius: z.preprocess(blankToUndefined, z.coerce.number().optional())
	})
	.superRefine((v, ctx) => {
		if (v.audienceKind === 'entrants' && !v.contestId) ctx.addIssue({ code: 'custom', path: ['contestId'], message: 'Choose a contest.' });
		if (v.audienceKind === 'area') {
			if (!v.areaId) ctx.addIssue({ code: 'custom', path: ['areaId'], message: 'Choose a club area.' });
			if (!RADIUS_CHOICES.some((r) => r === v.radius)) ctx.addIssue({ code: 'custom', path: ['radius'], message: 'Choose a distance.' });
		}
	});
export type PostInput = z.output<typeof postForm>;

/** The audience a valid form names, in the admin's distance unit. */
export function audienceOf(input: PostInput, unit: DistanceUnit): Audience {
	switch (input.audienceKind) {
		case 'entrants':
			return { kind: 'entrants', contestId: input.contestId! };
		case 'area':
			return { kind: 'area', areaId: input.areaId!, radius: input.radius!, unit };
		default:
			return { kind: input.audienceKind };
	}
}

/** Whether a member's home point is within the radius of a centre, as the swap board shows distance. */
export function withinRadius(home: LatLng, centre: LatLng, radius: number, unit: DistanceUnit): boolean {
	return shownFigure(haversineDistance(home, centre), unit) <= radius;
}

/** A short phrase for the admin's pages: "Members within 10 km of Harbour Reach". */
export function describeAudience(audience: Audience, names: { contest?: string; area?: string } = {}): string {
	switch (audience.kind) {
		case 'all':
			return 'All members';
		case 'judges':
			return 'Judges';
		case 'entrants':
			return `Entrants of ${names.contest ? `“${names.contest}”` : 'a contest'}`;
		case 'area':
			return `Members within ${audience.radius} ${audience.unit} of ${names.area ?? 'a club area'}`;
	}
}
