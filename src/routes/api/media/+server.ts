import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as media from '$lib/server/media';
import { tooBig } from '$lib/server/media/process';
import { DomainError } from '$lib/errors';
import { MAX_UPLOAD_BYTES } from '$lib/media/urls';
import type { RequestHandler } from './$types';

/**
 * One photo per request, as multipart form data with a `file` field. Answers 201 with the new
 * (pending) photo's id, size and rendition URLs, or a refusal as { code, message }.
 */
export const POST: RequestHandler = endpoint(async (event) => {
	const viewer = requireUser(event);
	const declared = Number(event.request.headers.get('content-length') ?? 0);
	// Room for the multipart envelope around the file.
	if (declared > MAX_UPLOAD_BYTES + 64 * 1024) throw tooBig(declared);
	let form: FormData;
	try {
		form = await event.request.formData();
	} catch (error) {
		if ((error as { status?: number }).status === 413) throw tooBig(declared);
		throw new DomainError(400, 'bad-form', 'Send the photo as multipart form data with a "file" field.');
	}
	const file = form.get('file');
	if (!(file instanceof File)) throw new DomainError(400, 'no-file', 'Choose a photo to upload.');
	if (file.size > MAX_UPLOAD_BYTES) throw tooBig(file.size);
	return json(await media.upload(viewer.id, new Uint8Array(await file.arrayBuffer())), { status: 201 });
});
