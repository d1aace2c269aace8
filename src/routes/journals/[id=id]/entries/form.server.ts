// Reading the entry form in the new and edit actions: the draft (kept on error), the validated
// input, and the photos from the PhotoUploader (shown again after a failed save).
import type { Viewer } from '$lib/server/club/users';
import * as media from '$lib/server/media';
import type { TankRow } from '$lib/server/journals/schema';
import { readPhotoFields, type PhotoField } from '$lib/media/form';
import { entryDraftFrom, parseEntryDraft, type EntryDraft, type EntryInput } from '$lib/journals/entry-form';
import { ENTRY_PHOTOS_MAX } from '$lib/journals/journal-vocabulary';
import type { UploaderPhoto } from '$lib/media/form';

export type EntryFormRead =
	| { ok: true; input: EntryInput; photos: PhotoField[]; draft: EntryDraft; fields: PhotoField[] }
	| { ok: false; errors: Record<string, string>; draft: EntryDraft; photos: UploaderPhoto[] };

/** The photos the form named, as the uploader shows them again after an error. */
export async function photosAgain(viewer: Viewer, fields: PhotoField[], entryId: number | null): Promise<UploaderPhoto[]> {
	const ids = fields.map((f) => f.id);
	const known = new Map([...(await media.pendingOf(viewer.id, ids)), ...(entryId ? await media.listFor('entry', entryId) : [])].map((p) => [p.id, p]));
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}

export async function readEntryForm(
	request: Request,
	viewer: Viewer,
	tank: Pick<TankRow, 'setUpOn'>,
	entryId: number | null,
	today = new Date().toISOString().slice(0, 10)
): Promise<EntryFormRead> {
	const form = await request.formData();
	const draft = entryDraftFrom(form);
	const photos = readPhotoFields(form, 'photos', ENTRY_PHOTOS_MAX);
	const parsed = parseEntryDraft(draft, { today, setUpOn: tank.setUpOn, hasPhotos: photos.ok && photos.photos.length > 0 });
	const errors = parsed.ok ? {} : { ...parsed.errors };
	if (!photos.ok) errors.photos = photos.error;
	if (!parsed.ok || !photos.ok) return { ok: false, errors, draft, photos: await photosAgain(viewer, photos.ok ? photos.photos : [], entryId) };
	return { ok: true, input: parsed.input, photos: photos.photos, draft, fields: photos.photos };
}
