import { error, redirect } from '@sveltejs/kit';
import { formAction } from '$lib/server/http/forms';
import * as journalEntries from '$lib/server/journals/journal-entries';
import { today } from '$lib/dates';
import { zoneOf } from '$lib/club/viewer';
import { eventDraftFrom, type EntryDraft } from '$lib/journals/journal-entry-form';
import { ownTank } from '../../../own-tank.server';
import { journalEntryFormAgain, readJournalEntryForm } from '../../form.server';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** The keeper, their tank and the entry named in the URL; "not found" for anyone else. */
async function ownEntry(event: RequestEvent) {
	const { viewer, tank } = await ownTank(event);
	const found = await journalEntries.get(viewer, tank.id, Number(event.params.entry));
	if (!found) error(404, 'We could not find that entry.');
	return { viewer, tank, entry: found.entry };
}

export const load = (async (event) => {
	const { viewer, tank, entry } = await ownEntry(event);
	const draft: EntryDraft = { entryOn: entry.entryOn, title: entry.title, body: entry.body, events: entry.events.map(eventDraftFrom) };
	return {
		tank: { id: tank.id, name: tank.name, setUpOn: tank.setUpOn },
		entryId: entry.id,
		plants: tank.plants.filter((p) => !p.removedOn).map((p) => ({ id: p.id, name: p.name })),
		livestock: tank.livestock.filter((a) => !a.removedOn).map((a) => ({ id: a.id, name: a.name, count: a.count })),
		draft,
		photos: entry.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption, urls: p.urls })),
		today: today(zoneOf(viewer))
	};
}) satisfies PageServerLoad;

export const actions = {
	default: formAction(
		async (event, data) => {
			const { viewer, tank, entry } = await ownEntry(event);
			const { input, photos } = readJournalEntryForm(data, tank, zoneOf(viewer));
			await journalEntries.update(viewer, tank.id, entry.id, input, photos);
			redirect(303, `/journals/${tank.id}/entries/${entry.id}`);
		},
		{ values: (data, event) => journalEntryFormAgain(data, event, Number(event.params.entry)) }
	)
} satisfies Actions;
