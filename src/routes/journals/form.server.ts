// Reading the tank form in the new and edit actions: the draft (kept on error), the validated
// metric input, and the cover photo fields from the PhotoUploader.
import type { Viewer } from '$lib/server/club/users';
import * as media from '$lib/server/media';
import { readPhotoFields, type PhotoField } from '$lib/media/form';
import { draftFromForm, parseTankDraft, type TankDraft } from '$lib/journals/tank-form';
import type { TankInput } from '$lib/journals/tank-input';
import { TANK_COVER_MAX } from '$lib/journals/tank-vocabulary';
import type { UploaderPhoto } from '$lib/media/form';

export type TankFormRead =
	{ ok: true; input: TankInput; cover: PhotoField[] } | { ok: false; errors: Record<string, string>; draft: TankDraft; cover: UploaderPhoto[] };

/** The cover photos the form named, as the uploader shows them again after an error. */
async function coverAgain(viewer: Viewer, fields: PhotoField[], tankId: number | null): Promise<UploaderPhoto[]> {
	const ids = fields.map((f) => f.id);
	const known = new Map([...(await media.pendingOf(viewer.id, ids)), ...(tankId ? await media.listFor('tank', tankId) : [])].map((p) => [p.id, p]));
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}

export async function readTankForm(request: Request, viewer: Viewer, tankId: number | null): Promise<TankFormRead> {
	const form = await request.formData();
	const draft = draftFromForm(form);
	const photos = readPhotoFields(form, 'cover', TANK_COVER_MAX);
	const parsed = parseTankDraft(draft, viewer.units);
	const errors = parsed.ok ? {} : { ...parsed.errors };
	if (!photos.ok) errors.cover = photos.error;
	if (!parsed.ok || !photos.ok) {
		return { ok: false, errors, draft, cover: await coverAgain(viewer, photos.ok ? photos.photos : [], tankId) };
	}
	return { ok: true, input: parsed.input, cover: photos.photos };
}
