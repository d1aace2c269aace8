// The Atom feed of the club's public news posts, every address on the configured ORIGIN.
import { absoluteUrl, config } from '../config';
import type { Context } from '../context';
import { buildAtomFeed, plainSummary } from '../../journals/atom';
import * as posts from './posts';

const FEED_POSTS = 30;

export async function atom(context: Context = {}): Promise<string> {
	const latest = await posts.publicPosts(FEED_POSTS, context);
	return buildAtomFeed(
		{
			id: absoluteUrl('/news'),
			title: 'Club news — Riparia',
			url: absoluteUrl('/news'),
			selfUrl: absoluteUrl('/news/feed.xml'),
			author: 'Riparia',
			entries: latest.map((p) => {
				const url = absoluteUrl(`/news/${p.id}`);
				return { id: url, title: p.title, url, published: p.publishedAt, updated: p.publishedAt, html: p.html, summary: plainSummary(p.body) || undefined };
			})
		},
		config().ORIGIN
	);
}
