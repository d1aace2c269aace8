import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as media from '$lib/server/media';
import { absoluteUrl } from '$lib/server/config';
import * as plans from '$lib/server/away/plans';
import * as sitters from '$lib/server/away/sitters';
import * as visits from '$lib/server/away/visits';
import { invalid, parseOrThrow } from '$lib/errors';
import { checklistOf } from '$lib/away/care-plan';
import { VISIT_MAIL_CHOICES } from '$lib/away/vocabulary';
import { distanceUnitOf } from '$lib/journals/calc/units';
import { readPhotoFields } from '$lib/media/form';
import { ENTRY_PHOTOS_MAX } from '$lib/journals/journal-vocabulary';
import { pageLoad } from '$lib/server/http/loads';
import type { Actions, PageServerLoad } from './$types';

const RADII = sitters.HELPER_RADII_KM;

export const load = pageLoad(async (event) => {
	const viewer = requireUser(event);
	const planId = Number(event.params.plan);
	const shown = await plans.get(viewer, planId);
	const keeper = shown.role === 'keeper';
	const within = Number(event.url.searchParams.get('within'));
	const radius = (RADII as readonly number[]).includes(within) ? within : 10;
	const name = (event.url.searchParams.get('name') ?? '').slice(0, 60);
	const [nearby, named, tasks] = await Promise.all([
		keeper ? sitters.nearbyHelpers(viewer, radius) : [],
		keeper && name ? sitters.byName(viewer, name) : [],
		keeper ? [] : visits.tasksOf(viewer, planId)
	]);
	// Members already asked (and not answered no) are listed under "Who looks in", not offered again.
	const asked = new Set(shown.sitters.filter((s) => s.state === 'asked' || s.state === 'accepted').map((s) => s.sitterId));
	const offer = <T extends { id: string }>(people: T[]) => people.filter((p) => !asked.has(p.id));
	return {
		...shown,
		unit: distanceUnitOf(viewer.units),
		checklist: checklistOf(shown.plan.body),
		tasks,
		nearby: offer(nearby),
		named: offer(named),
		radius,
		radii: RADII,
		name
	};
}) satisfies PageServerLoad;

const visitMailForm = z.object({ visitMail: z.enum(VISIT_MAIL_CHOICES, { message: 'Choose how you hear of visits.' }) });
const bodyForm = z.object({ body: z.string({ message: 'Write the plan.' }) });
const askForm = z.object({ sitterId: z.string().min(1, 'Choose a member.').max(255) });
const withdrawForm = z.object({
	request: z
		.string()
		.regex(/^[1-9]\d{0,14}$/, 'Choose a request.')
		.transform(Number)
});
const visitForm = z.object({
	done: z.array(z.string().max(300)).max(60).default([]),
	taskIds: z
		.array(
			z
				.string()
				.regex(/^[1-9]\d{0,14}$/)
				.transform(Number)
		)
		.max(40)
		.default([]),
	note: z.string().max(1000, 'Keep the note to 1,000 characters.').default('')
});

export const actions = {
	save: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await plans.saveBody(viewer, Number(event.params.plan), parseForm(bodyForm, data).body);
			return { saved: true };
		},
		{ id: 'save' }
	),
	visitMail: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await plans.setVisitMail(viewer, Number(event.params.plan), parseForm(visitMailForm, data).visitMail);
			return { visitMailSaved: true };
		},
		{ id: 'visitMail' }
	),
	ask: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await sitters.ask(viewer, Number(event.params.plan), parseForm(askForm, data).sitterId);
			return { asked: true };
		},
		{ id: 'ask' }
	),
	withdraw: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			await sitters.withdraw(viewer, Number(event.params.plan), parseForm(withdrawForm, data).request);
			return { withdrawn: true };
		},
		{ id: 'withdraw' }
	),
	share: formAction(
		async (event) => {
			const viewer = requireUser(event);
			return { shareLink: absoluteUrl(await plans.makeShareLink(viewer, Number(event.params.plan))) };
		},
		{ id: 'share' }
	),
	unshare: formAction(
		async (event) => {
			const viewer = requireUser(event);
			await plans.endShareLink(viewer, Number(event.params.plan));
			return { unshared: true };
		},
		{ id: 'unshare' }
	),
	visit: formAction(
		async (event, data) => {
			const viewer = requireUser(event);
			const input = parseOrThrow(visitForm, { done: data.getAll('done'), taskIds: data.getAll('taskIds'), note: data.get('note') ?? '' });
			const photos = readPhotoFields(data, 'photos', ENTRY_PHOTOS_MAX);
			if (!photos.ok) throw invalid({ photos: photos.error });
			await visits.log(viewer, Number(event.params.plan), input, photos.photos);
			return { visited: true };
		},
		{
			id: 'visit',
			values: async (data, event) => ({
				note: String(data.get('note') ?? ''),
				done: data.getAll('done').map(String),
				photos: await media.photosAgainFrom(data, 'photos', ENTRY_PHOTOS_MAX, requireUser(event).id, null)
			})
		}
	)
} satisfies Actions;
