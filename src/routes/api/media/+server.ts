import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/club/guards';
import * as media from '$lib/server/media';
import { tooBig } from '$lib/server/media/process';
import { MAX_UPLOAD_BYTES } from '$lib/media/urls';
import type { RequestHandler } from './$types';

const refuse = (status: number, code: string, message: string) => json({ code, message }, { status });

/**
 * One photo per request, as multipart form data with a `file` field. Answers 201 with the new
 * (pending) photo's id, size and rendition URLs, or an error as { code, message }.
 */
export const POST: RequestHandler = async (event) => {
	const viewer = requireUser(event);
	const declared = Number(event.request.headers.get('content-length') ?? 0);
	// Room for the multipart envelope around the file.
	if (declared > MAX_UPLOAD_BYTES + 64 * 1024) {
		const e = tooBig(declared);
		return refuse(e.status, e.code, e.message);
	}
	let form: FormData;
	try {
		form = await event.request.formData();
	} catch (error) {
		const status = (error as { status?: number }).status;
		if (status === 413) {
			const e = tooBig(declared);
			return refuse(413, e.code, e.message);
		}
		return refuse(400, 'bad-form', 'Send the photo as multipart form data with a "file" field.');
	}
	const file = form.get('file');
	if (!(file instanceof File)) return refuse(400, 'no-file', 'Choose a photo to upload.');
	if (file.size > MAX_UPLOAD_BYTES) {
		const e = tooBig(file.size);
		return refuse(e.status, e.code, e.message);
	}
	try {
		const uploaded = await media.upload(viewer.id, new Uint8Array(await file.arrayBuffer()));
		return json(uploaded, { status: 201 });
	} catch (error) {
		if (error instanceof media.MediaError) return refuse(error.status, error.code, error.message);
		throw error;
	}
};
