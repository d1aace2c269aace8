import { requireRole } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as judging from '$lib/server/contests/judging';
import { renditionResponse } from '$lib/server/media/respond';
import type { RequestHandler } from './$types';

/**
 * A photo of an entry for its judges, by the entry's number and the photo's place, never by the
 * photo's id (see BlindPhoto in $lib/server/contests/judging). Whoever may not judge the entry gets
 * 404. Photos cannot change while an entry is judged; browsers keep their own copy for a day.
 */
export const GET: RequestHandler = endpoint(async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const { contest, number, position, size } = event.params;
	const rendition = await judging.entryPhoto(viewer, Number(contest), Number(number), Number(position), size as 'thumb' | 'medium' | 'large');
	return renditionResponse(event.request, rendition, 'private');
});
