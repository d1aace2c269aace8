// The Atom feed of a public tank's journal. Club and private tanks have none (404): a feed
// reader signs in to nothing.
import { absoluteUrl, config } from '../config';
import type { Context } from '../context';
import { buildAtomFeed, plainSummary } from '../../journals/atom';
import { formatDate } from '../../format';
import * as entries from './journal-entries';
import * as tanks from './tanks';

export const FEED_ENTRIES = 30;

/** The feed's XML, or null for a tank that is not public (or does not exist). */
export async function atomFor(tankId: number, context: Context = {}): Promise<string | null> {
	const tank = await tanks.get(null, tankId, context);
	if (!tank || tank.visibility !== 'public') return null;
	const latest = await entries.latestOf(tank.id, FEED_ENTRIES, context);
	const tankUrl = absoluteUrl(`/journals/${tank.id}`);
	return buildAtomFeed(
		{
			id: tankUrl,
			title: `${tank.name} — a tank journal`,
			subtitle: `Kept by ${tank.ownerName}${tank.style ? ` · ${tank.style}` : ''}`,
			url: tankUrl,
			selfUrl: absoluteUrl(`/journals/${tank.id}/feed.xml`),
			author: tank.ownerName,
			updated: tank.updatedAt ?? tank.createdAt,
			entries: latest.map((e) => {
				const url = absoluteUrl(`/journals/${tank.id}/entries/${e.id}`);
				const photos = e.photos
					.map(
						(p) =>
							`<p><img src="${p.urls.medium}" alt="${p.alt.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!)}" /></p>`
					)
					.join('');
				return {
					id: url,
					title: e.title || `Entry of ${formatDate(e.entryOn)}`,
					url,
					published: e.createdAt,
					updated: e.updatedAt ?? e.createdAt,
					html: e.html + photos,
					summary: plainSummary(e.body) || undefined
				};
			})
		},
		config().ORIGIN
	);
}
