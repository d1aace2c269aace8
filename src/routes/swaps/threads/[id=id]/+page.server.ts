import { error, fail, redirect, type RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as threads from '$lib/server/swaps/threads';
import * as listings from '$lib/server/swaps/listings';
import * as blocks from '$lib/server/swaps/blocks';
import * as reports from '$lib/server/swaps/reports';
import { SwapError } from '$lib/server/swaps/errors';
import { availableActions } from '$lib/swaps/listing-state';
import type { Actions, PageServerLoad } from './$types';

// A conversation does not exist for anyone but its two members (and an admin handling a report):
// signed out included, so a link to it reveals nothing. The error page offers to sign in.
const NOT_FOUND = 'We could not find that conversation.';

export const load = (async (event) => {
	if (!event.locals.user) error(404, NOT_FOUND);
	const viewer = requireUser(event);
	const now = new Date();
	const id = Number(event.params.id);
	const thread = await threads.get(viewer, id, { now });
	if (!thread) error(404, NOT_FOUND);
	if (thread.role !== 'admin') await threads.markRead(viewer, id, now);
	const { pure, ...shown } = thread;
	const actions = thread.role === 'admin' ? [] : availableActions(pure, { kind: 'member', userId: viewer.id }, now);
	const relation = thread.otherId ? await blocks.between(viewer.id, thread.otherId) : { aBlockedB: false, bBlockedA: false };
	return {
		thread: shown,
		canAccept: thread.role === 'owner' && thread.status === 'waiting' && actions.includes('accept') && thread.canWrite,
		canConfirmHandover: thread.status === 'accepted' && actions.includes('confirm-handover'),
		canRelease: thread.role === 'owner' && thread.status === 'accepted' && actions.includes('release'),
		youBlocked: relation.aBlockedB,
		today: now.toISOString().slice(0, 10)
	};
}) satisfies PageServerLoad;

/** The thread for one of its two members; 404 for anyone else (admins read, they do not act). */
async function forMember(event: RequestEvent) {
	if (!event.locals.user) error(404, NOT_FOUND);
	const viewer = requireUser(event);
	const thread = await threads.get(viewer, Number(event.params.id));
	if (!thread || thread.role === 'admin') error(404, NOT_FOUND);
	return { viewer, thread };
}

function refusal(e: unknown, key: string, values: Record<string, unknown> = {}) {
	if (e instanceof SwapError) {
		if (e.status === 404) error(404, e.message);
		return fail(e.status, { [key]: e.message, ...values });
	}
	throw e;
}

const back = (id: number) => redirect(303, `/swaps/threads/${id}`);

const text = (form: FormData, name: string) => String(form.get(name) ?? '');

export const actions = {
	send: async (event) => {
		const { viewer, thread } = await forMember(event);
		const body = text(await event.request.formData(), 'body');
		try {
			await threads.post(viewer, thread.id, body);
		} catch (e) {
			return refusal(e, 'sendError', { body });
		}
		back(thread.id);
	},
	propose: async (event) => {
		const { viewer, thread } = await forMember(event);
		const form = await event.request.formData();
		const pickup = { on: text(form, 'on'), from: text(form, 'from'), to: text(form, 'to'), place: text(form, 'place') };
		const note = text(form, 'note');
		try {
			await threads.propose(viewer, thread.id, pickup, note);
		} catch (e) {
			if (e instanceof threads.PickupInvalid) return fail(400, { pickupErrors: e.errors as Record<string, string>, pickupValues: { ...pickup, note } });
			return refusal(e, 'pickupError', { pickupValues: { ...pickup, note } });
		}
		back(thread.id);
	},
	confirmPickup: async (event) => {
		const { viewer, thread } = await forMember(event);
		const proposalId = Number(text(await event.request.formData(), 'proposalId'));
		try {
			await threads.confirmPickup(viewer, thread.id, proposalId);
		} catch (e) {
			return refusal(e, 'pickupError');
		}
		back(thread.id);
	},
	accept: async (event) => {
		const { viewer, thread } = await forMember(event);
		try {
			await listings.accept(viewer, thread.id);
		} catch (e) {
			return refusal(e, 'actionError');
		}
		back(thread.id);
	},
	release: async (event) => {
		const { viewer, thread } = await forMember(event);
		try {
			await listings.act(viewer, thread.listingId, { type: 'release' });
		} catch (e) {
			return refusal(e, 'actionError');
		}
		back(thread.id);
	},
	handover: async (event) => {
		const { viewer, thread } = await forMember(event);
		try {
			await listings.act(viewer, thread.listingId, { type: 'confirm-handover' });
		} catch (e) {
			return refusal(e, 'actionError');
		}
		back(thread.id);
	},
	block: async (event) => {
		const { viewer, thread } = await forMember(event);
		await blocks.block(viewer, thread.otherId!);
		back(thread.id);
	},
	unblock: async (event) => {
		const { viewer, thread } = await forMember(event);
		await blocks.unblock(viewer, thread.otherId!);
		back(thread.id);
	},
	report: async (event) => {
		const { viewer, thread } = await forMember(event);
		const form = await event.request.formData();
		const messageId = Number(text(form, 'messageId'));
		const reason = text(form, 'reason');
		try {
			await reports.reportMessage(viewer, messageId, reason);
		} catch (e) {
			return refusal(e, 'reportError', { reportMessageId: messageId, reason });
		}
		return { reportedMessageId: messageId, threadId: thread.id };
	}
} satisfies Actions;
