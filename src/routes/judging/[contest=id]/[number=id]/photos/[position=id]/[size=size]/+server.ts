import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/club/guards';
import * as judging from '$lib/server/contests/judging';
import { ContestNotFound } from '$lib/server/contests/errors';
import { renditionResponse } from '$lib/server/media/respond';
import type { RequestHandler } from './$types';

/**
 * A photo of an entry for its judges, by the entry's number and the photo's place, never by the
 * photo's id (see BlindPhoto in $lib/server/contests/judging). Whoever may not judge the entry gets
 * 404. Photos cannot change while an entry is judged; browsers keep their own copy for a day.
 */
export const GET: RequestHandler = async (event) => {
	const viewer = requireRole(event, 'judge', 'admin');
	const { contest, number, position, size } = event.params;
	try {
		const rendition = await judging.entryPhoto(viewer, Number(contest), Number(number), Number(position), size as 'thumb' | 'medium' | 'large');
		return await renditionResponse(event.request, rendition, 'private');
	} catch (e) {
		if (e instanceof ContestNotFound) error(404, 'No such photo.');
		throw e;
	}
};
