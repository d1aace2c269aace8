// Reading the journal entry form in the new and edit actions: the validated input and the photos
// from the PhotoUploader, or a refusal with a message at each field; and, for a refusal, what the
// form shows again (the draft as typed and the photos).
import type { RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as media from '$lib/server/media';
import { invalid } from '$lib/errors';
import { today } from '$lib/dates';
import { readWithPhotos, type PhotoField, type UploaderPhoto } from '$lib/media/form';
import { entryDraftFrom, parseEntryDraft, type EntryDraft, type EntryInput } from '$lib/journals/journal-entry-form';
import { ENTRY_PHOTOS_MAX } from '$lib/journals/journal-vocabulary';

/** The entry's input and photos (an entry may be photos alone), or a refusal with every field's message. */
/** `timeZone` is the keeper's: an entry may be dated up to their today. */
export function readJournalEntryForm(data: FormData, tank: { setUpOn: string | null }, timeZone: string): { input: EntryInput; photos: PhotoField[] } {
	const read = readWithPhotos(data, 'photos', ENTRY_PHOTOS_MAX, (photos) =>
		parseEntryDraft(entryDraftFrom(data), { today: today(timeZone), setUpOn: tank.setUpOn, hasPhotos: photos.length > 0 })
	);
	if (!read.ok) throw invalid(read.errors);
	return { input: read.input, photos: read.photos };
}

/** What the form shows again after a refusal: the draft as typed and the photos (of `entryId` when editing). */
export async function journalEntryFormAgain(
	data: FormData,
	event: Pick<RequestEvent, 'locals' | 'url'>,
	entryId: number | null
): Promise<EntryDraft & { photos: UploaderPhoto[] }> {
	const attachedTo = entryId ? { scope: 'entry', id: entryId } : null;
	return { ...entryDraftFrom(data), photos: await media.photosAgainFrom(data, 'photos', ENTRY_PHOTOS_MAX, requireUser(event).id, attachedTo) };
}
