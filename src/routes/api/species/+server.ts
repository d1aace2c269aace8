import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/club/guards';
import { endpoint } from '$lib/server/http/api';
import * as catalogue from '$lib/server/species/catalogue';
import { parseOrThrow } from '$lib/errors';
import { SPECIES_KINDS } from '$lib/species/kinds';
import type { RequestHandler } from './$types';

const query = z.object({
	q: z.string().max(60).default(''),
	kind: z.enum([...SPECIES_KINDS, 'animal']).optional(),
	limit: z.coerce.number().int().min(1).max(25).default(10)
});

/** Autocomplete for species pickers: GET /api/species?q=rotala&kind=plant (kind may be "animal"). */
export const GET: RequestHandler = endpoint(async (event) => {
	requireUser(event);
	const { q, kind, limit } = parseOrThrow(
		query,
		Object.fromEntries(event.url.searchParams),
		'Use q (up to 60 characters), kind (plant, fish, shrimp, snail, invertebrate or animal) and limit (1–25).'
	);
	const results = await catalogue.search(q, { kind, limit });
	return json({ results }, { headers: { 'cache-control': 'private, max-age=300' } });
});
