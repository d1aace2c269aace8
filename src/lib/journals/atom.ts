// An Atom 1.0 feed (RFC 4287) of a public tank's journal entries. Entry bodies are the sanitised
// HTML of the markdown renderer, carried as escaped text (type="html"); links and pictures in it
// are made absolute so feed readers, which have no page to resolve them against, can follow them.

export interface FeedEntry {
	id: string;
	title: string;
	url: string;
	published: Date;
	updated: Date;
	/** Sanitised HTML (from $lib/server/markdown). */
	html: string;
	/** Plain text, a line or two. */
	summary?: string;
}

export interface FeedInput {
	/** A permanent, unique IRI for the feed. */
	id: string;
	title: string;
	subtitle?: string;
	/** The tank's page. */
	url: string;
	/** This feed's own address. */
	selfUrl: string;
	author: string;
	/** When anything in the feed last changed; the newest entry when not given. */
	updated?: Date;
	entries: readonly FeedEntry[];
}

/** Characters XML 1.0 does not allow at all (control characters other than tab, LF, CR; lone surrogates; U+FFFE/U+FFFF). */
// eslint-disable-next-line no-control-regex
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Text or attribute content escaped for XML, with characters XML cannot carry removed. */
export function escapeXml(text: string): string {
	return text.replace(NOT_XML, '').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

/**
 * Relative href and src values in sanitised HTML made absolute on `origin` (a feed reader or a mail
 * has no base address to resolve them against): root-relative ones as they are, path-relative ones
 * ("x", "#part") as if written at the site's root. Absolute and protocol-relative values are left
 * alone, so nothing here can point a link somewhere new.
 */
export function absoluteLinks(html: string, origin: string): string {
	const base = origin.replace(/\/$/, '');
	return html.replace(/\b(href|src)="([^"]*)"/g, (whole, attribute: string, value: string) => {
		if (/^[a-z][a-z0-9+.-]*:/i.test(value) || value.startsWith('//')) return whole;
		return `${attribute}="${base}${value.startsWith('/') ? '' : '/'}${value}"`;
	});
}

const stamp = (d: Date) => d.toISOString();

export function buildAtomFeed(feed: FeedInput, origin: string): string {
	const newest = feed.entries.reduce<Date | null>((acc, e) => (acc === null || e.updated > acc ? e.updated : acc), null);
	const updated = feed.updated && newest ? (feed.updated > newest ? feed.updated : newest) : (feed.updated ?? newest ?? new Date(0));
	const lines = [
		'<?xml version="1.0" encoding="utf-8"?>',
		'<feed xmlns="http://www.w3.org/2005/Atom">',
		`  <id>${escapeXml(feed.id)}</id>`,
		`  <title type="text">${escapeXml(feed.title)}</title>`,
		...(feed.subtitle ? [`  <subtitle type="text">${escapeXml(feed.subtitle)}</subtitle>`] : []),
		`  <updated>${stamp(updated)}</updated>`,
		`  <link rel="alternate" type="text/html" href="${escapeXml(feed.url)}"/>`,
		`  <link rel="self" type="application/atom+xml" href="${escapeXml(feed.selfUrl)}"/>`,
		`  <author><name>${escapeXml(feed.author)}</name></author>`,
		'  <generator>Riparia</generator>'
	];
	for (const entry of feed.entries) {
		lines.push(
			'  <entry>',
			`    <id>${escapeXml(entry.id)}</id>`,
			`    <title type="text">${escapeXml(entry.title)}</title>`,
			`    <link rel="alternate" type="text/html" href="${escapeXml(entry.url)}"/>`,
			`    <published>${stamp(entry.published)}</published>`,
			`    <updated>${stamp(entry.updated)}</updated>`,
			...(entry.summary ? [`    <summary type="text">${escapeXml(entry.summary)}</summary>`] : []),
			`    <content type="html">${escapeXml(absoluteLinks(entry.html, origin))}</content>`,
			'  </entry>'
		);
	}
	lines.push('</feed>', '');
	return lines.join('\n');
}

/** A line of plain text from markdown for a summary: markup characters dropped, cut at a word. */
export function plainSummary(markdown: string, max = 200): string {
	const text = markdown
		// Raw HTML in the markdown is markup, not words: a summary keeps none of it.
		.replace(/<[^>]*>?/g, ' ')
		.replace(/!\[[^\]]*\]\([^)]*\)/g, '')
		.replace(/\[([^\]]*)\]\([^)]*\)/g, '$1')
		.replace(/^\s*(?:[-+*]|\d+\.)\s+/gm, '')
		.replace(/[#>*_`~|]+/g, ' ')
		.replace(/\s+/g, ' ')
		.trim();
	if (text.length <= max) return text;
	const cut = text.slice(0, max);
	const space = cut.lastIndexOf(' ');
	return `${(space > max * 0.6 ? cut.slice(0, space) : cut).trimEnd()}…`;
}
