// The board's filters: what the nearby search (server/swaps/nearby.ts) is asked for, read from and
// written to the query string. The page's form submits them with GET (it works without
// JavaScript), the page's script sends the same to /api/swaps/listings and keeps the address bar
// in step, so a filtered board can be bookmarked and shared.
import { LISTING_CATEGORIES, LISTING_KINDS, type ListingCategory, type ListingKind } from './listing';

/** The radius filter's choices, in the viewer's distance unit (km or miles): each is a figure the board shows. */
export const RADIUS_CHOICES = [2, 5, 10, 25, 50] as const;
export type Radius = (typeof RADIUS_CHOICES)[number];

export const BOARD_PAGE_SIZE = 20;
export const BOARD_QUERY_MAX = 80;
export const BOARD_MAX_PAGE = 500;

export interface BoardFilter {
	q: string;
	category: ListingCategory | null;
	kind: ListingKind | null;
	speciesId: number | null;
	/** The name shown in the species filter; only for redisplay. */
	speciesName: string;
	/** In the viewer's distance unit (kilometres, or miles for US and imperial members); null: any distance. */
	radius: Radius | null;
	page: number;
}

const oneOf = <T extends string>(list: readonly T[], value: string | null): T | null =>
	value !== null && (list as readonly string[]).includes(value) ? (value as T) : null;

const positiveInt = (value: string | null, max: number): number | null => {
	if (value === null || !/^\d{1,9}$/.test(value)) return null;
	const n = Number(value);
	return n >= 1 && n <= max ? n : null;
};

/** Reads the filters; anything unknown or malformed falls back to "no filter" rather than an error. */
export function parseBoardQuery(params: URLSearchParams): BoardFilter {
	const radius = params.get('radius');
	const radiusFigure = RADIUS_CHOICES.find((r) => String(r) === radius) ?? null;
	const speciesId = positiveInt(params.get('species'), 2 ** 31);
	return {
		q: (params.get('q') ?? '').trim().replace(/\s+/g, ' ').slice(0, BOARD_QUERY_MAX),
		category: oneOf(LISTING_CATEGORIES, params.get('category')),
		kind: oneOf(LISTING_KINDS, params.get('kind')),
		speciesId,
		speciesName: speciesId === null ? '' : (params.get('speciesName') ?? '').trim().slice(0, 160),
		radius: radiusFigure,
		page: positiveInt(params.get('page'), BOARD_MAX_PAGE) ?? 1
	};
}

/** The query string for a filter, with only what differs from no filter ("" when nothing does). */
export function boardQueryString(filter: BoardFilter): string {
	const params = new URLSearchParams();
	if (filter.q) params.set('q', filter.q);
	if (filter.category) params.set('category', filter.category);
	if (filter.kind) params.set('kind', filter.kind);
	if (filter.speciesId !== null) {
		params.set('species', String(filter.speciesId));
		if (filter.speciesName) params.set('speciesName', filter.speciesName);
	}
	if (filter.radius !== null) params.set('radius', String(filter.radius));
	if (filter.page > 1) params.set('page', String(filter.page));
	const text = params.toString();
	return text ? `?${text}` : '';
}

export const pageCount = (total: number) => Math.max(1, Math.ceil(total / BOARD_PAGE_SIZE));
