import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as members from '$lib/server/swaps/members';
import * as listings from '$lib/server/swaps/listing-cards';
import * as blocks from '$lib/server/swaps/blocks';
import * as tanks from '$lib/server/journals/tanks';
import { formAction } from '$lib/server/http/forms';
import type { Actions, PageServerLoad } from './$types';

// Member ids are the sign-in system's UUIDs.
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function memberId(param: string): string {
	if (!UUID.test(param)) error(404, 'We could not find that member.');
	return param;
}

// Signed-in members only: where someone lives, even roughly, is not for the open web.
export const load = (async (event) => {
	const viewer = requireUser(event);
	const id = memberId(event.params.id);
	const profile = await members.profile(viewer, id);
	if (!profile) error(404, 'We could not find that member.');
	const [open, tankList] = await Promise.all([listings.listOpenOf(viewer, id), tanks.listVisibleOf(viewer, id)]);
	return {
		profile,
		listings: open,
		tanks: tankList.map((t) => ({ id: t.id, name: t.name, style: t.style, cover: t.cover ? { url: t.cover.urls.thumb, alt: t.cover.alt } : null }))
	};
}) satisfies PageServerLoad;

export const actions = {
	block: formAction(async (event) => {
		const viewer = requireUser(event);
		const id = memberId(event.params.id);
		await blocks.block(viewer, id);
		redirect(303, `/members/${id}`);
	}),
	unblock: formAction(async (event) => {
		const viewer = requireUser(event);
		const id = memberId(event.params.id);
		await blocks.unblock(viewer, id);
		redirect(303, `/members/${id}`);
	})
} satisfies Actions;
