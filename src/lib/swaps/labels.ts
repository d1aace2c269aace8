// Words the board shows for its vocabulary (our own names).
import type { ListingCategory, ListingKind } from './listing';
import type { ListingState } from './listing-state';

export const CATEGORY_LABELS: Readonly<Record<ListingCategory, string>> = {
	plants: 'Plants',
	livestock: 'Livestock',
	hardscape: 'Stones and wood',
	equipment: 'Equipment'
};

export const KIND_LABELS: Readonly<Record<ListingKind, string>> = {
	offer: 'Offered',
	wanted: 'Wanted'
};

export const STATE_LABELS: Readonly<Record<ListingState, string>> = {
	open: 'Open',
	reserved: 'Reserved',
	'handed-over': 'Handed over',
	withdrawn: 'Withdrawn',
	expired: 'Expired'
};
