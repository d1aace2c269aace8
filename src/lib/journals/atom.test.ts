import { describe, expect, test } from 'vitest';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { absoluteLinks, buildAtomFeed, escapeXml, plainSummary, type FeedInput } from './atom';

const ORIGIN = 'https://riparia.test';
const feed = (over: Partial<FeedInput> = {}): FeedInput => ({
	id: `${ORIGIN}/journals/7`,
	title: 'Reedholme riverbank',
	url: `${ORIGIN}/journals/7`,
	selfUrl: `${ORIGIN}/journals/7/feed.xml`,
	author: 'Mara Quillfeather',
	entries: [
		{
			id: `${ORIGIN}/journals/7/entries/2`,
			title: 'Week two',
			url: `${ORIGIN}/journals/7/entries/2`,
			published: new Date('2026-03-08T10:00:00Z'),
			updated: new Date('2026-03-09T08:30:00Z'),
			html: '<p>Trimmed the <a href="/journals/7" rel="nofollow ugc noopener">stems</a>.</p><p><img src="/media/12/medium" alt="Front" /></p>'
		},
		{
			id: `${ORIGIN}/journals/7/entries/1`,
			title: 'Planted',
			url: `${ORIGIN}/journals/7/entries/1`,
			published: new Date('2026-03-01T10:00:00Z'),
			updated: new Date('2026-03-01T10:00:00Z'),
			html: '<p>Day one.</p>',
			summary: 'Day one.'
		}
	],
	...over
});

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', isArray: (name) => ['entry', 'link'].includes(name), textNodeName: '#text' });
const RFC3339 = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/;
const textOf = (node: unknown) => (typeof node === 'object' && node !== null ? (node as Record<string, string>)['#text'] : String(node));

describe('buildAtomFeed (checked against RFC 4287, The Atom Syndication Format)', () => {
	test('is well-formed XML with the Atom namespace', () => {
		const xml = buildAtomFeed(feed(), ORIGIN);
		expect(XMLValidator.validate(xml)).toBe(true);
		const doc = parser.parse(xml);
		expect(doc.feed['@xmlns']).toBe('http://www.w3.org/2005/Atom');
	});

	test('the feed has exactly one id, title and updated (§4.1.1), an author, and self/alternate links', () => {
		const doc = parser.parse(buildAtomFeed(feed(), ORIGIN)).feed;
		expect(doc.id).toBe(`${ORIGIN}/journals/7`);
		expect(textOf(doc.title)).toBe('Reedholme riverbank');
		expect(doc.updated).toMatch(RFC3339);
		// The feed is as new as its newest entry (§4.2.15: the most recent significant change).
		expect(doc.updated).toBe('2026-03-09T08:30:00.000Z');
		expect(doc.author.name).toBe('Mara Quillfeather');
		const rels = Object.fromEntries(doc.link.map((l: Record<string, string>) => [l['@rel'], l['@href']]));
		expect(rels).toEqual({ alternate: `${ORIGIN}/journals/7`, self: `${ORIGIN}/journals/7/feed.xml` });
	});

	test('each entry has id, title, updated, an alternate link and content (§4.1.2), newest first as given', () => {
		const entries = parser.parse(buildAtomFeed(feed(), ORIGIN)).feed.entry;
		expect(entries).toHaveLength(2);
		for (const e of entries) {
			expect(e.id).toMatch(/^https:\/\/riparia\.test\/journals\/7\/entries\/\d+$/);
			expect(textOf(e.title)).toBeTruthy();
			expect(e.updated).toMatch(RFC3339);
			expect(e.published).toMatch(RFC3339);
			expect(e.link[0]['@rel']).toBe('alternate');
			expect(e.content['@type']).toBe('html');
		}
		expect(textOf(entries[1].summary)).toBe('Day one.');
	});

	test('entry HTML travels escaped and comes back unchanged except for absolute addresses', () => {
		const xml = buildAtomFeed(feed(), ORIGIN);
		expect(xml).not.toContain('<p>Trimmed');
		const content = textOf(parser.parse(xml).feed.entry[0].content);
		expect(content).toBe(
			'<p>Trimmed the <a href="https://riparia.test/journals/7" rel="nofollow ugc noopener">stems</a>.</p><p><img src="https://riparia.test/media/12/medium" alt="Front" /></p>'
		);
	});

	test('markup, ampersands, quotes and control characters in titles cannot break the XML', () => {
		const title = 'Fish & "plants" <script>alert(1)</script> it\'s \u0007done';
		const xml = buildAtomFeed(feed({ title, author: 'A <b>& B', entries: [{ ...feed().entries[0]!, title }] }), ORIGIN);
		expect(XMLValidator.validate(xml)).toBe(true);
		const doc = parser.parse(xml).feed;
		expect(textOf(doc.title)).toBe('Fish & "plants" <script>alert(1)</script> it\'s done');
		expect(doc.author.name).toBe('A <b>& B');
		expect(xml).not.toContain('<script>');
	});

	test('an empty feed is still valid, dated by the given time', () => {
		const xml = buildAtomFeed(feed({ entries: [], updated: new Date('2026-02-01T00:00:00Z') }), ORIGIN);
		expect(XMLValidator.validate(xml)).toBe(true);
		expect(parser.parse(xml).feed.updated).toBe('2026-02-01T00:00:00.000Z');
	});
});

describe('helpers', () => {
	test('escapeXml escapes the five predefined entities (XML 1.0 §4.6)', () => {
		expect(escapeXml(`<a href="x">&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&apos;&lt;/a&gt;');
	});
	test('absoluteLinks leaves absolute and protocol-relative addresses alone', () => {
		expect(absoluteLinks('<a href="https://x.test/a">x</a><a href="//evil.test/">y</a><img src="/media/1/thumb">', ORIGIN)).toBe(
			'<a href="https://x.test/a">x</a><a href="//evil.test/">y</a><img src="https://riparia.test/media/1/thumb">'
		);
	});
	test('absoluteLinks makes path-relative addresses absolute on the origin too', () => {
		expect(absoluteLinks('<img src="x"><a href="#part">p</a><a href="?q=1">q</a>', ORIGIN)).toBe(
			'<img src="https://riparia.test/x"><a href="https://riparia.test/#part">p</a><a href="https://riparia.test/?q=1">q</a>'
		);
	});
	test('plainSummary keeps no raw HTML of the markdown', () => {
		expect(plainSummary('Hello <script>alert(1)</script>\n\n<img src="x" onerror="alert(2)">\n\nBye')).toBe('Hello alert(1) Bye');
	});
	test('plainSummary drops markdown and cuts at a word', () => {
		expect(plainSummary('# Week one\n\n**Planted** the [stems](https://x.test) ![pic](/media/1/thumb) today.')).toBe('Week one Planted the stems today.');
		expect(plainSummary('- long-term plan\n- two\n1. three')).toBe('long-term plan two three');
		const long = plainSummary('word '.repeat(100), 22);
		expect(long).toBe('word word word word…');
	});
});
