// Reading the journal entry form in the new and edit actions: the validated input and the photos
// from the PhotoUploader, or a refusal with a message at each field; and, for a refusal, what the
// form shows again (the draft as typed and the photos).
import type { RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as media from '$lib/server/media';
import { invalid } from '$lib/errors';
import { today } from '$lib/dates';
import { readPhotoFields, type PhotoField, type UploaderPhoto } from '$lib/media/form';
import { entryDraftFrom, parseEntryDraft, type EntryDraft, type EntryInput } from '$lib/journals/journal-entry-form';
import { ENTRY_PHOTOS_MAX } from '$lib/journals/journal-vocabulary';

/** The entry's input and photos, or a refusal with the draft's and the photos' field errors together. */
export function readJournalEntryForm(data: FormData, tank: { setUpOn: string | null }): { input: EntryInput; photos: PhotoField[] } {
	const photos = readPhotoFields(data, 'photos', ENTRY_PHOTOS_MAX);
	const parsed = parseEntryDraft(entryDraftFrom(data), { today: today(), setUpOn: tank.setUpOn, hasPhotos: photos.ok && photos.photos.length > 0 });
	if (parsed.ok && photos.ok) return { input: parsed.input, photos: photos.photos };
	throw invalid({ ...(parsed.ok ? {} : parsed.errors), ...(photos.ok ? {} : { photos: photos.error }) });
}

/** What the form shows again after a refusal: the draft as typed and the photos (of `entryId` when editing). */
export async function journalEntryFormAgain(
	data: FormData,
	event: Pick<RequestEvent, 'locals' | 'url'>,
	entryId: number | null
): Promise<EntryDraft & { photos: UploaderPhoto[] }> {
	const viewer = requireUser(event);
	const fields = readPhotoFields(data, 'photos', ENTRY_PHOTOS_MAX);
	const photos = await media.photosAgain(viewer.id, fields.ok ? fields.photos : [], entryId ? { scope: 'entry', id: entryId } : null);
	return { ...entryDraftFrom(data), photos };
}
