import { requireRole } from '$lib/server/club/guards';
import * as areas from '$lib/server/club/areas';
import { formAction, parseForm } from '$lib/server/http/forms';
import { newAreaForm, removeAreaForm, renameAreaForm } from '$lib/club/area-form';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return { areas: await areas.list() };
}) satisfies PageServerLoad;

export const actions = {
	add: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseForm(newAreaForm, data);
			await areas.create(admin, input);
			return { added: input.name };
		},
		{ id: 'add' }
	),
	rename: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseForm(renameAreaForm, data);
			await areas.rename(admin, input.id, input.name);
			return { renamed: input.name };
		},
		{ id: 'rename' }
	),
	remove: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { id } = parseForm(removeAreaForm, data);
			return { removed: await areas.remove(admin, id) };
		},
		{ id: 'remove' }
	)
} satisfies Actions;
