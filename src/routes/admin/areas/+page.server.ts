import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as areas from '$lib/server/club/areas';
import { fieldErrors } from '$lib/club/profile';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	return { areas: await areas.list() };
}) satisfies PageServerLoad;

const name = z.string().trim().min(2, 'Use at least 2 characters.').max(80, 'Keep it to 80 characters.');
const coordinate = (min: number, max: number, label: string) =>
	z
		.string()
		.trim()
		.transform((v) => Number(v.replace(',', '.')))
		.refine((v) => Number.isFinite(v) && v >= min && v <= max, `${label} is a number from ${min} to ${max}.`);
const addSchema = z.object({ name, lat: coordinate(-90, 90, 'Latitude'), lng: coordinate(-180, 180, 'Longitude') });

async function nameTaken(candidate: string, except?: number) {
	return (await areas.list()).some((a) => a.name.toLowerCase() === candidate.toLowerCase() && a.id !== except);
}

export const actions = {
	add: async (event) => {
		const admin = requireRole(event, 'admin');
		const values = Object.fromEntries(await event.request.formData()) as Record<string, string>;
		const parsed = addSchema.safeParse(values);
		if (!parsed.success) return fail(400, { addErrors: fieldErrors(parsed.error.issues), values });
		if (await nameTaken(parsed.data.name)) return fail(400, { addErrors: { name: 'There is already an area with that name.' }, values });
		await areas.create(admin, parsed.data.name, { lat: parsed.data.lat, lng: parsed.data.lng });
		return { added: parsed.data.name };
	},
	rename: async (event) => {
		const admin = requireRole(event, 'admin');
		const form = await event.request.formData();
		const id = Number(form.get('id'));
		const parsed = name.safeParse(String(form.get('name') ?? ''));
		if (!parsed.success) return fail(400, { renameId: id, renameError: parsed.error.issues[0]?.message ?? 'Check the name.' });
		if (!(await areas.get(id))) return fail(404, { renameId: id, renameError: 'That area no longer exists.' });
		if (await nameTaken(parsed.data, id)) return fail(400, { renameId: id, renameError: 'There is already an area with that name.' });
		await areas.rename(admin, id, parsed.data);
		return { renamed: parsed.data };
	},
	remove: async (event) => {
		const admin = requireRole(event, 'admin');
		const id = Number((await event.request.formData()).get('id'));
		const area = await areas.get(id);
		if (!area) return fail(404, { removeError: 'That area no longer exists.' });
		await areas.remove(admin, id);
		return { removed: area.name };
	}
} satisfies Actions;
