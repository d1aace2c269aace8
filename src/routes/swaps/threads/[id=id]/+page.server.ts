import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import type { Viewer } from '$lib/server/club/users';
import { formAction } from '$lib/server/http/forms';
import * as threads from '$lib/server/swaps/threads';
import * as transitions from '$lib/server/swaps/listing-transitions';
import * as blocks from '$lib/server/swaps/blocks';
import * as reports from '$lib/server/swaps/reports';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { availableActions } from '$lib/swaps/listing-state';
import type { Actions, PageServerLoad } from './$types';

// A conversation does not exist for anyone but its two members (and an admin handling a report):
// signed out included, so a link to it reveals nothing. The error page offers to sign in.
const NOT_FOUND = 'We could not find that conversation.';
/** A long conversation opens at its newest messages; the earlier ones are a link away. */
const SHOWN_MESSAGES = 50;

export const load = (async (event) => {
	if (!event.locals.user) error(404, NOT_FOUND);
	const viewer = requireUser(event);
	const now = new Date();
	const id = Number(event.params.id);
	const thread = await threads.get(viewer, id, { now });
	if (!thread) error(404, NOT_FOUND);
	if (thread.role !== 'admin' && threads.hasUnread(thread.messages, viewer.id)) await threads.markRead(viewer, id, { now });
	const { pure, messages, ...shown } = thread;
	// The pickup states above were worked out from every message; only the page shows fewer.
	const everything = event.url.searchParams.get('all') === '1';
	const latest = everything ? messages : messages.slice(-SHOWN_MESSAGES);
	const actions = thread.role === 'admin' ? [] : availableActions(pure, { kind: 'member', userId: viewer.id }, now);
	const relation = thread.otherId ? await blocks.between(viewer.id, thread.otherId) : { aBlockedB: false, bBlockedA: false };
	return {
		thread: { ...shown, messages: latest },
		earlier: messages.length - latest.length,
		canAccept: thread.role === 'owner' && thread.status === 'waiting' && actions.includes('accept') && thread.canWrite,
		canConfirmHandover: thread.status === 'accepted' && actions.includes('confirm-handover'),
		canRelease: thread.role === 'owner' && thread.status === 'accepted' && actions.includes('release'),
		youBlocked: relation.aBlockedB,
		today: today(zoneOf(viewer), now)
	};
}) satisfies PageServerLoad;

type Member = { viewer: Viewer; thread: threads.ThreadView };

/**
 * An action of one of the conversation's two members (404 for anyone else; admins read, they do
 * not act), under a form id the page shows its refusal with. Without a redirect of its own, the
 * action comes back to the conversation.
 */
const memberAction = <R>(id: string, run: (member: Member, data: FormData) => Promise<R>) =>
	formAction(
		async (event: RequestEvent, data) => {
			if (!event.locals.user) error(404, NOT_FOUND);
			const viewer = requireUser(event);
			const thread = await threads.get(viewer, Number(event.params.id));
			if (!thread || thread.role === 'admin') error(404, NOT_FOUND);
			const result = await run({ viewer, thread }, data);
			if (result !== undefined) return result;
			redirect(303, `/swaps/threads/${thread.id}`);
		},
		{ id }
	);

const text = (data: FormData, name: string) => String(data.get(name) ?? '');

export const actions = {
	send: memberAction('send', async ({ viewer, thread }, data) => {
		await threads.post(viewer, thread.id, text(data, 'body'));
	}),
	propose: memberAction('pickup', async ({ viewer, thread }, data) => {
		const pickup = { on: text(data, 'on'), from: text(data, 'from'), to: text(data, 'to'), place: text(data, 'place') };
		await threads.propose(viewer, thread.id, pickup, text(data, 'note'));
	}),
	confirmPickup: memberAction('pickup', async ({ viewer, thread }, data) => {
		await threads.confirmPickup(viewer, thread.id, Number(text(data, 'proposalId')));
	}),
	accept: memberAction('step', async ({ viewer, thread }) => {
		await transitions.accept(viewer, thread.id);
	}),
	release: memberAction('step', async ({ viewer, thread }) => {
		await transitions.act(viewer, thread.listingId, { type: 'release' });
	}),
	handover: memberAction('step', async ({ viewer, thread }) => {
		await transitions.act(viewer, thread.listingId, { type: 'confirm-handover' });
	}),
	block: memberAction('block', async ({ viewer, thread }) => {
		await blocks.block(viewer, thread.otherId!);
	}),
	unblock: memberAction('block', async ({ viewer, thread }) => {
		await blocks.unblock(viewer, thread.otherId!);
	}),
	report: memberAction('report', async ({ viewer, thread }, data) => {
		const messageId = Number(text(data, 'messageId'));
		await reports.reportMessage(viewer, messageId, text(data, 'reason'));
		return { reportedMessageId: messageId, threadId: thread.id };
	})
} satisfies Actions;
