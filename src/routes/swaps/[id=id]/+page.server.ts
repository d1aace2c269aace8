import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { formAction } from '$lib/server/http/forms';
import * as detail from '$lib/server/swaps/listing-detail';
import * as transitions from '$lib/server/swaps/listing-transitions';
import * as threads from '$lib/server/swaps/threads';
import * as reports from '$lib/server/swaps/reports';
import * as blocks from '$lib/server/swaps/blocks';
import { invalid } from '$lib/errors';
import { availableActions, isReservationOverdue } from '$lib/swaps/listing-state';
import { DAY_MS } from '$lib/swaps/listing';
import { untilEndOf } from '$lib/swaps/listing-form';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const now = new Date();
	const listing = await detail.get(viewer, Number(event.params.id), { now });
	if (!listing) error(404, 'We could not find that listing.');
	const own = listing.ownerId === viewer.id;
	const [threadId, requests, history, relation] = await Promise.all([
		own ? null : threads.ownThreadFor(viewer, listing.id),
		own ? threads.listForListing(viewer, listing.id, { now }) : [],
		own ? detail.history(viewer, listing.id) : [],
		own ? { aBlockedB: false, bBlockedA: false } : blocks.between(viewer.id, listing.ownerId)
	]);
	const { pure, ...rest } = listing;
	// Who the listing is reserved for is the two members' business.
	const party = own || listing.reservedRequesterId === viewer.id;
	const shown = { ...rest, reservedRequesterId: party ? rest.reservedRequesterId : null, reservedRequesterName: party ? rest.reservedRequesterName : null };
	return {
		listing: shown,
		descriptionHtml: listing.descriptionHtml,
		own,
		overdue: own && isReservationOverdue(pure, now),
		threadId,
		requests,
		history,
		youBlocked: relation.aBlockedB,
		theyBlocked: relation.bBlockedA,
		actions: availableActions(pure, { kind: 'member', userId: viewer.id }, now),
		saved: event.url.searchParams.has('saved')
	};
}) satisfies PageServerLoad;

/** A step of the owner (or of either member of the reserved swap): the page's buttons share one form id. */
const step = (action: (data: FormData) => transitions.OwnerAction) =>
	formAction(
		async (event: RequestEvent, data) => {
			const viewer = requireUser(event);
			const id = Number(event.params.id);
			await transitions.act(viewer, id, action(data));
			redirect(303, `/swaps/${id}`);
		},
		{ id: 'step' }
	);

export const actions = {
	request: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const threadId = await threads.request(viewer, Number(event.params.id), String(data.get('body') ?? ''));
			redirect(303, `/swaps/threads/${threadId}`);
		},
		{ id: 'request' }
	),
	withdraw: step(() => ({ type: 'withdraw' })),
	release: step(() => ({ type: 'release' })),
	confirm: step(() => ({ type: 'confirm-handover' })),
	extend: step((data) => {
		const now = new Date();
		const day = String(data.get('availableUntil') ?? '');
		const until = day ? untilEndOf(day, now) : new Date(now.getTime() + 7 * DAY_MS);
		if (!until) throw invalid({ availableUntil: 'Give the day as YYYY-MM-DD.' });
		return { type: 'extend', availableUntil: until };
	}),
	report: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await reports.reportListing(viewer, Number(event.params.id), String(data.get('reason') ?? ''));
			return { reported: true };
		},
		{ id: 'report' }
	)
} satisfies Actions;
