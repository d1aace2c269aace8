import { z } from 'zod';
import { requireRole } from '$lib/server/club/guards';
import { formAction, parseForm } from '$lib/server/http/forms';
import * as restricted from '$lib/server/swaps/restricted';
import { today } from '$lib/dates';
import { CHECK_BASES, RESTRICTION_LEVELS } from '$lib/swaps/restrictions';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	requireRole(event, 'admin');
	const [entries, present, chosen] = await Promise.all([restricted.list(), restricted.jurisdictionsPresent(), restricted.clubJurisdictions()]);
	return { entries, present, chosen, today: today() };
}) satisfies PageServerLoad;

const day = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the day as YYYY-MM-DD.')
	.refine((d) => d <= today(), 'A check cannot be in the future.');
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
const entryId = z.coerce.number({ message: 'Choose an entry.' }).int().positive('Choose an entry.');
const updateSchema = z.object({ id: entryId, ...details });
const removeSchema = z.object({ id: entryId });

export const actions = {
	jurisdictions: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const present = await restricted.jurisdictionsPresent();
			const chosen = data
				.getAll('jurisdiction')
				.map(String)
				.filter((j) => present.includes(j));
			await restricted.setClubJurisdictions(admin, chosen);
			return { jurisdictionsSaved: true };
		},
		{ id: 'jurisdictions' }
	),
	add: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const input = parseForm(addSchema, data);
			await restricted.add(admin, input);
			return { added: String(data.get('speciesName') ?? '') || 'The species' };
		},
		{ id: 'add' }
	),
	update: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { id, ...changes } = parseForm(updateSchema, data);
			await restricted.update(admin, id, changes);
			return { updated: id };
		},
		{ id: 'update' }
	),
	remove: formAction(
		async (event, data) => {
			const admin = requireRole(event, 'admin');
			const { id } = parseForm(removeSchema, data);
			await restricted.remove(admin, id);
			return { removed: true };
		},
		{ id: 'remove' }
	)
} satisfies Actions;
