// What a list of listings shows of each one (the board, My swaps, a member's profile), shared by
// the server that builds the cards and the component that draws them. `D` is how dates arrive:
// Date objects in page data, strings in the board's JSON.
import type { DistanceLabel } from './display';
import type { ListingCategory, ListingKind } from './listing';
import type { ListingState } from './listing-state';

export interface ListingCard<D = Date> {
	id: number;
	kind: ListingKind;
	category: ListingCategory;
	title: string;
	speciesName: string;
	commonName: string | null;
	quantityText: string;
	termsText: string;
	pickupLabel: string;
	/** As members see it (a lapsed open listing is expired). */
	state: ListingState;
	availableUntil: D;
	createdAt: D;
	ownerId: string;
	ownerName: string;
	mine: boolean;
	photo: { url: string; alt: string } | null;
	restriction: 'banned' | 'cautioned' | null;
	/** Only on the board, for a viewer with a location. */
	distance?: DistanceLabel | null;
}

/** One page of the board: nearest first by the shown distance when the viewer has a location, else newest first. */
export interface BoardPage<D = Date> {
	rows: ListingCard<D>[];
	total: number;
	page: number;
	pages: number;
	order: 'distance' | 'newest';
}
