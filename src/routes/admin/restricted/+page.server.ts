import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import * as restricted from '$lib/server/swaps/restricted';
import { SwapError } from '$lib/server/swaps/errors';
import { fieldErrorsOf } from '$lib/errors';
import { CHECK_BASES, RESTRICTION_LEVELS } from '$lib/swaps/restrictions';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	const [entries, present, chosen] = await Promise.all([restricted.list(), restricted.jurisdictionsPresent(), restricted.clubJurisdictions()]);
	return { entries, present, chosen, today: new Date().toISOString().slice(0, 10) };
}) satisfies PageServerLoad;

const day = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the day as YYYY-MM-DD.')
	.refine((d) => d <= new Date().toISOString().slice(0, 10), 'A check cannot be in the future.');
const details = {
	level: z.enum(RESTRICTION_LEVELS, { message: 'Choose banned or cautioned.' }),
	source: z.string().trim().min(3, 'Name the list this comes from, e.g. the regulation.').max(300, 'Keep it to 300 characters.'),
	note: z.string().trim().max(500, 'Keep it to 500 characters.'),
	checkedOn: day,
	checkBasis: z.enum(CHECK_BASES, { message: 'Say how it was checked.' })
};
const addSchema = z.object({
	speciesId: z.coerce.number({ message: 'Pick the species from the catalogue.' }).int().positive('Pick the species from the catalogue.'),
	jurisdiction: z.string().trim().min(2, 'Name the jurisdiction, e.g. “England”.').max(80, 'Keep it to 80 characters.'),
	...details
});
const updateSchema = z.object({ id: z.coerce.number().int().positive(), ...details });

/** A refusal of the domain, or a rethrow; 404 stays a 404. */
function swapError(e: unknown): SwapError {
	if (!(e instanceof SwapError)) throw e;
	if (e.status === 404) error(404, e.message);
	return e;
}

export const actions = {
	jurisdictions: async (event) => {
		const admin = requireRole(event, 'admin');
		const form = await event.request.formData();
		const present = await restricted.jurisdictionsPresent();
		const chosen = form
			.getAll('jurisdiction')
			.map(String)
			.filter((j) => present.includes(j));
		await restricted.setClubJurisdictions(admin, chosen);
		return { jurisdictionsSaved: true };
	},
	add: async (event) => {
		const admin = requireRole(event, 'admin');
		const values = Object.fromEntries(await event.request.formData()) as Record<string, string>;
		const parsed = addSchema.safeParse(values);
		if (!parsed.success) return fail(400, { addErrors: fieldErrorsOf(parsed.error), values });
		try {
			await restricted.add(admin, parsed.data);
		} catch (e) {
			const refused = swapError(e);
			return fail(refused.status, { addErrors: { [refused.field ?? 'form']: refused.message }, values });
		}
		return { added: values.speciesName || 'The species' };
	},
	update: async (event) => {
		const admin = requireRole(event, 'admin');
		const values = Object.fromEntries(await event.request.formData()) as Record<string, string>;
		const parsed = updateSchema.safeParse(values);
		if (!parsed.success) return fail(400, { updateId: Number(values.id), updateError: parsed.error.issues[0]?.message ?? 'Check the entry.' });
		const { id, ...changes } = parsed.data;
		try {
			await restricted.update(admin, id, changes);
		} catch (e) {
			const refused = swapError(e);
			return fail(refused.status, { updateId: id, updateError: refused.message });
		}
		return { updated: id };
	},
	remove: async (event) => {
		const admin = requireRole(event, 'admin');
		const id = Number((await event.request.formData()).get('id'));
		if (!Number.isSafeInteger(id) || id <= 0) return fail(400, { removeError: 'Choose an entry.' });
		await restricted.remove(admin, id);
		return { removed: true };
	}
} satisfies Actions;
