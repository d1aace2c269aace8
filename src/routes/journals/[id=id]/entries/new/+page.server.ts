import { redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import * as journalEntries from '$lib/server/journals/journal-entries';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { emptyEntryDraft } from '$lib/journals/journal-entry-form';
import { ownTank } from '../../own-tank.server';
import { journalEntryFormAgain, readJournalEntryForm } from '../form.server';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const { viewer, tank } = await ownTank(event);
	const day = today(zoneOf(viewer));
	return {
		tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn },
		plants: tank.plants.filter((p) => !p.removedOn).map((p) => ({ id: p.id, name: p.name })),
		livestock: tank.livestock.filter((a) => !a.removedOn).map((a) => ({ id: a.id, name: a.name, count: a.count })),
		draft: emptyEntryDraft(day),
		today: day
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank } = await ownTank(event);
			const { input, photos } = readJournalEntryForm(data, tank, zoneOf(viewer));
			const id = await journalEntries.create(viewer, tank.id, input, photos);
			redirect(303, `/journals/${tank.id}/entries/${id}`);
		},
		{ values: (data, event) => journalEntryFormAgain(data, event, null) }
	)
} satisfies Actions;
