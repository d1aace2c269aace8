import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import * as catalogue from '$lib/server/species/catalogue';
import { SPECIES_KINDS } from '$lib/species/kinds';
import type { RequestHandler } from './$types';

const query = z.object({
	q: z.string().max(60).default(''),
	kind: z.enum([...SPECIES_KINDS, 'animal']).optional(),
	limit: z.coerce.number().int().min(1).max(25).default(10)
});

/** Autocomplete for species pickers: GET /api/species?q=rotala&kind=plant (kind may be "animal"). */
export const GET: RequestHandler = async (event) => {
	requireUser(event);
	const parsed = query.safeParse(Object.fromEntries(event.url.searchParams));
	if (!parsed.success)
		return json({ message: 'Use q (up to 60 characters), kind (plant, fish, shrimp, snail, invertebrate or animal) and limit (1–25).' }, { status: 400 });
	const results = await catalogue.search(parsed.data.q, { kind: parsed.data.kind, limit: parsed.data.limit });
	return json({ results }, { headers: { 'cache-control': 'private, max-age=300' } });
};
