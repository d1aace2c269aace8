// Reading the entry form in the enter and edit actions: validated fields and the photos from the
// PhotoUploader, or the errors with everything the member typed and uploaded, to show again.
import { fail } from '@sveltejs/kit';
import type { Viewer } from '$lib/server/club/users';
import * as media from '$lib/server/media';
import { ContestError } from '$lib/server/contests/errors';
import { SCOPE } from '$lib/server/contests/entries';
import type { EntryInput } from '$lib/server/contests/entries';
import { readPhotoFields, type PhotoField } from '$lib/media/form';
import { ENTRY_PHOTOS_FIELD, ENTRY_PHOTOS_MAX, ENTRY_PHOTOS_MIN, entryFieldsSchema, type EntryDraft } from '$lib/contests/entry-form';
import type { UploaderPhoto } from '$lib/media/form';
import * as contests from '$lib/server/contests/contests';
import * as entries from '$lib/server/contests/entries';
import { describeRule, roundLitres } from '$lib/contests/eligibility';

type ContestWithCategories = Parameters<typeof entries.tankOptions>[1];

/** What the enter and edit pages both list: the categories with their rules, and the member's tanks. */
export async function entryChoices(viewer: Viewer, contest: ContestWithCategories) {
	const options = await entries.tankOptions(viewer, contest);
	return {
		categories: contest.categories.map((c) => ({ id: c.id, name: c.name, description: c.description, rule: describeRule(contests.ruleOf(c)) })),
		tanks: options.map((t) => ({
			id: t.id,
			name: t.name,
			thumb: t.cover?.urls.thumb ?? null,
			litres: t.facts.litres === null ? null : roundLitres(t.facts.litres),
			volumeSource: t.facts.volumeSource,
			ageLabel: t.ageLabel,
			retired: t.facts.retired,
			eligibility: t.eligibility,
			enteredAs: t.enteredAs
		}))
	};
}

async function photosAgain(viewer: Viewer, fields: PhotoField[], entryId: number | null): Promise<UploaderPhoto[]> {
	const ids = fields.map((f) => f.id);
	const known = new Map([...(await media.pendingOf(viewer.id, ids)), ...(entryId ? await media.listFor(SCOPE, entryId) : [])].map((p) => [p.id, p]));
	return fields.flatMap((f) => {
		const photo = known.get(f.id);
		return photo ? [{ id: photo.id, alt: f.alt, caption: f.caption, urls: photo.urls }] : [];
	});
}

export type EntryFormRead =
	| { ok: true; input: EntryInput; draft: EntryDraft; fields: PhotoField[] }
	| { ok: false; errors: Record<string, string>; draft: EntryDraft; photos: UploaderPhoto[] };

export async function readEntryForm(request: Request, viewer: Viewer, entryId: number | null): Promise<EntryFormRead> {
	const form = await request.formData();
	const draft: EntryDraft = {
		categoryId: String(form.get('categoryId') ?? ''),
		tankId: String(form.get('tankId') ?? ''),
		statement: String(form.get('statement') ?? '')
	};
	const photos = readPhotoFields(form, ENTRY_PHOTOS_FIELD, ENTRY_PHOTOS_MAX);
	const parsed = entryFieldsSchema.safeParse(draft);
	const errors: Record<string, string> = {};
	if (!parsed.success) for (const issue of parsed.error.issues) errors[String(issue.path[0])] ??= issue.message;
	if (!photos.ok) errors.photos = photos.error;
	else if (photos.photos.length < ENTRY_PHOTOS_MIN) errors.photos = 'Add at least one photo: the first shows the whole tank from the front.';
	if (Object.keys(errors).length || !parsed.success || !photos.ok) {
		return { ok: false, errors, draft, photos: await photosAgain(viewer, photos.ok ? photos.photos : [], entryId) };
	}
	return { ok: true, input: { ...parsed.data, photos: photos.photos }, draft, fields: photos.photos };
}

/** A refusal from the domain, as the form shows it. */
export async function refused(error: unknown, viewer: Viewer, read: Extract<EntryFormRead, { ok: true }>, entryId: number | null) {
	if (!(error instanceof ContestError)) throw error;
	const errors = Object.keys(error.fields).length ? error.fields : { form: error.message };
	return fail(error.status === 404 ? 404 : 400, { errors, draft: read.draft, photos: await photosAgain(viewer, read.fields, entryId) });
}
