import { error, fail, redirect, type RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as listings from '$lib/server/swaps/listings';
import * as threads from '$lib/server/swaps/threads';
import * as reports from '$lib/server/swaps/reports';
import * as blocks from '$lib/server/swaps/blocks';
import { SwapError } from '$lib/server/swaps/errors';
import { renderMarkdown } from '$lib/server/markdown';
import { availableActions } from '$lib/swaps/listing-state';
import { DAY_MS } from '$lib/swaps/listing';
import { untilEndOf } from '$lib/swaps/listing-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const viewer = requireUser(event);
	const now = new Date();
	const listing = await listings.get(viewer, Number(event.params.id), { now });
	if (!listing) error(404, 'We could not find that listing.');
	const own = listing.ownerId === viewer.id;
	const [threadId, requests, history, relation] = await Promise.all([
		own ? null : threads.ownThreadFor(viewer, listing.id),
		own ? threads.listForListing(viewer, listing.id, { now }) : [],
		own ? listings.history(viewer, listing.id) : [],
		own ? { aBlockedB: false, bBlockedA: false } : blocks.between(viewer.id, listing.ownerId)
	]);
	const { pure, ...rest } = listing;
	// Who the listing is reserved for is the two members' business.
	const party = own || listing.reservedRequesterId === viewer.id;
	const shown = { ...rest, reservedRequesterId: party ? rest.reservedRequesterId : null, reservedRequesterName: party ? rest.reservedRequesterName : null };
	return {
		listing: shown,
		descriptionHtml: listing.description ? renderMarkdown(listing.description) : '',
		own,
		threadId,
		requests,
		history,
		youBlocked: relation.aBlockedB,
		theyBlocked: relation.bBlockedA,
		actions: availableActions(pure, { kind: 'member', userId: viewer.id }, now),
		saved: event.url.searchParams.has('saved')
	};
}) satisfies PageServerLoad;

function refusal(e: unknown, key: string, values: Record<string, unknown> = {}) {
	if (e instanceof SwapError) {
		if (e.status === 404) error(404, e.message);
		return fail(e.status, { [key]: e.message, ...values });
	}
	throw e;
}

async function act(event: RequestEvent, action: listings.OwnerAction) {
	const viewer = requireUser(event);
	const id = Number(event.params.id);
	try {
		await listings.act(viewer, id, action);
	} catch (e) {
		return refusal(e, 'actionError');
	}
	redirect(303, `/swaps/${id}`);
}

export const actions = {
	request: async (event) => {
		const viewer = requireUser(event);
		const body = String((await event.request.formData()).get('body') ?? '');
		let threadId: number;
		try {
			threadId = await threads.request(viewer, Number(event.params.id), body);
		} catch (e) {
			return refusal(e, 'requestError', { body });
		}
		redirect(303, `/swaps/threads/${threadId}`);
	},
	withdraw: (event) => act(event, { type: 'withdraw' }),
	release: (event) => act(event, { type: 'release' }),
	confirm: (event) => act(event, { type: 'confirm-handover' }),
	extend: async (event) => {
		requireUser(event);
		const form = await event.request.formData();
		const now = new Date();
		const day = String(form.get('availableUntil') ?? '');
		const until = day ? untilEndOf(day, now) : new Date(now.getTime() + 7 * DAY_MS);
		if (!until) return fail(400, { actionError: 'Give the day as YYYY-MM-DD.' });
		return act(event, { type: 'extend', availableUntil: until });
	},
	report: async (event) => {
		const viewer = requireUser(event);
		const reason = String((await event.request.formData()).get('reason') ?? '');
		try {
			await reports.reportListing(viewer, Number(event.params.id), reason);
		} catch (e) {
			return refusal(e, 'reportError', { reason });
		}
		return { reported: true };
	}
} satisfies Actions;
