import * as showcase from '$lib/server/journals/showcase';
import { isShowcaseSort, isVolumeBand } from '$lib/journals/showcase-filters';
import type { PageServerLoad } from './$types';

// Public: anyone may browse the club's public tanks.
export const load = (async ({ url }) => {
	const sortParam = url.searchParams.get('sort') ?? '';
	const bandParam = url.searchParams.get('size') ?? '';
	const style = (url.searchParams.get('style') ?? '').trim().slice(0, 40);
	const page = Math.max(1, Math.floor(Number(url.searchParams.get('page') ?? 1)) || 1);
	const filter = {
		style: style || undefined,
		band: isVolumeBand(bandParam) ? bandParam : undefined,
		sort: isShowcaseSort(sortParam) ? sortParam : 'updated',
		page
	} as const;
	const [result, styles] = await Promise.all([showcase.list(filter), showcase.styles()]);
	return { ...result, styles, filter: { style: filter.style ?? '', size: filter.band ?? '', sort: filter.sort } };
}) satisfies PageServerLoad;
