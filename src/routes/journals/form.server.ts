// Reading the tank form in the new and edit actions: the validated metric input and the cover
// photo from the PhotoUploader, or a refusal with a message at each field; and, for a refusal,
// what the form shows again (the draft as typed and the cover photo).
import { requireUser } from '$lib/server/club/guards';
import type { Viewer } from '$lib/server/club/users';
import * as media from '$lib/server/media';
import { invalid } from '$lib/errors';
import { readPhotoFields, type PhotoField, type UploaderPhoto } from '$lib/media/form';
import { draftFromForm, parseTankDraft, type TankDraft } from '$lib/journals/tank-form';
import type { TankInput } from '$lib/journals/tank-input';
import { TANK_COVER_MAX } from '$lib/journals/tank-vocabulary';
import type { RequestEvent } from '@sveltejs/kit';

/** The form's input and cover, or a refusal with the draft's and the cover's field errors together. */
export function readTankForm(data: FormData, viewer: Pick<Viewer, 'units'>): { input: TankInput; cover: PhotoField[] } {
	const parsed = parseTankDraft(draftFromForm(data), viewer.units);
	const photos = readPhotoFields(data, 'cover', TANK_COVER_MAX);
	if (parsed.ok && photos.ok) return { input: parsed.input, cover: photos.photos };
	throw invalid({ ...(parsed.ok ? {} : parsed.errors), ...(photos.ok ? {} : { cover: photos.error }) });
}

/** What the form shows again after a refusal: the draft as typed and the cover photo (of `tankId` when editing). */
export async function tankFormAgain(
	data: FormData,
	event: Pick<RequestEvent, 'locals' | 'url'>,
	tankId: number | null
): Promise<TankDraft & { cover: UploaderPhoto[] }> {
	const viewer = requireUser(event);
	const photos = readPhotoFields(data, 'cover', TANK_COVER_MAX);
	const cover = await media.photosAgain(viewer.id, photos.ok ? photos.photos : [], tankId ? { scope: 'tank', id: tankId } : null);
	return { ...draftFromForm(data), cover };
}
