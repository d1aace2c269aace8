// Reading the tank form in the new and edit actions: the validated metric input and the cover
// photo from the PhotoUploader, or a refusal with a message at each field; and, for a refusal,
// what the form shows again (the draft as typed and the cover photo).
import type { RequestEvent } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import type { Viewer } from '$lib/server/club/users';
import * as media from '$lib/server/media';
import { invalid } from '$lib/errors';
import { readWithPhotos, type PhotoField, type UploaderPhoto } from '$lib/media/form';
import { draftFromForm, parseTankDraft, type TankDraft } from '$lib/journals/tank-form';
import type { TankInput } from '$lib/journals/tank-input';
import { TANK_COVER_MAX } from '$lib/journals/tank-vocabulary';

/** The form's input and cover, or a refusal with the draft's and the cover's field errors together. */
export function readTankForm(data: FormData, viewer: Pick<Viewer, 'units'>): { input: TankInput; cover: PhotoField[] } {
	const read = readWithPhotos(data, 'cover', TANK_COVER_MAX, () => parseTankDraft(draftFromForm(data), viewer.units));
	if (!read.ok) throw invalid(read.errors);
	return { input: read.input, cover: read.photos };
}

/** What the form shows again after a refusal: the draft as typed and the cover photo (of `tankId` when editing). */
export async function tankFormAgain(
	data: FormData,
	event: Pick<RequestEvent, 'locals' | 'url'>,
	tankId: number | null
): Promise<TankDraft & { cover: UploaderPhoto[] }> {
	const attachedTo = tankId ? { scope: 'tank', id: tankId } : null;
	return { ...draftFromForm(data), cover: await media.photosAgainFrom(data, 'cover', TANK_COVER_MAX, requireUser(event).id, attachedTo) };
}
