import { describe, expect, test } from 'vitest';
import { parseFragment, type DefaultTreeAdapterMap } from 'parse5';
import { ALLOWED_TAGS, LINK_REL, renderMarkdown } from './markdown';
import { OWN_MEDIA_PATH } from '../media/urls';
import { absoluteLinks } from '../journals/atom';

type Node = DefaultTreeAdapterMap['node'];
type Element = DefaultTreeAdapterMap['element'];

const ALLOWED_ATTRIBUTES: Record<string, string[]> = {
	a: ['href', 'title', 'rel'],
	img: ['src', 'alt', 'title'],
	code: ['class'],
	ol: ['start']
};
const BASE = 'https://riparia.test/';

/**
 * Parses the output as a browser would (parse5 follows the HTML standard's parsing algorithm)
 * and checks every node: only allowlisted elements and attributes, no event handlers, links
 * that resolve to http(s)/mailto, pictures from our own photo route only, links with our rel.
 */
function structuralProblems(html: string): string[] {
	const problems: string[] = [];
	const visit = (node: Node) => {
		if (node.nodeName === '#comment') problems.push('comment node');
		if ('tagName' in node) {
			const el = node as Element;
			if (el.namespaceURI !== 'http://www.w3.org/1999/xhtml') problems.push(`foreign element <${el.tagName}> (${el.namespaceURI})`);
			if (!(ALLOWED_TAGS as readonly string[]).includes(el.tagName)) problems.push(`element <${el.tagName}>`);
			for (const attr of el.attrs) {
				if (/^on/i.test(attr.name)) problems.push(`event handler ${attr.name}`);
				if (!(ALLOWED_ATTRIBUTES[el.tagName] ?? []).includes(attr.name)) problems.push(`attribute ${attr.name} on <${el.tagName}>`);
			}
			const attr = (name: string) => el.attrs.find((a) => a.name === name)?.value;
			if (el.tagName === 'a') {
				const href = attr('href');
				if (href !== undefined) {
					const url = new URL(href, BASE);
					if (!['http:', 'https:', 'mailto:'].includes(url.protocol)) problems.push(`link to ${url.protocol}`);
				}
				if (attr('rel') !== LINK_REL) problems.push(`link rel ${attr('rel')}`);
			}
			if (el.tagName === 'img') {
				const url = new URL(attr('src') ?? '', BASE);
				if (url.origin !== new URL(BASE).origin || !OWN_MEDIA_PATH.test(url.pathname) || url.search) problems.push(`picture from ${attr('src')}`);
			}
			if (el.tagName === 'code' && attr('class') && !/^language-[\w-]+$/.test(attr('class')!)) problems.push(`code class ${attr('class')}`);
		}
		if ('childNodes' in node) for (const child of node.childNodes) visit(child);
		if (node.nodeName === 'template') problems.push('template');
	};
	visit(parseFragment(html));
	return problems;
}

// Vectors gathered from the OWASP "XSS Filter Evasion" cheat sheet, the HTML5 Security Cheatsheet
// (mutation and namespace-confusion cases) and markdown-specific link tricks, written from memory
// and adapted to markdown input; each must come out structurally harmless.
const VECTORS: string[] = [
	'<script>alert(1)</script>',
	'<SCRIPT SRC=https://evil.example/xss.js></SCRIPT>',
	'<scr<script>ipt>alert(1)</scr</script>ipt>',
	'<<script>script>alert(1)<</script>/script>',
	'<img src=x onerror=alert(1)>',
	'<IMG SRC="javascript:alert(\'XSS\');">',
	'<IMG SRC=JaVaScRiPt:alert(1)>',
	'<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#49;&#41;>',
	'<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x31&#x29>',
	'<IMG SRC="jav&#x09;ascript:alert(1);">',
	'<IMG SRC="jav\tascript:alert(1);">',
	'<img """><script>alert("XSS")</script>">',
	'<img src="/media/1/thumb" onerror="alert(1)" onload="alert(2)">',
	'<img src="/media/1/thumb?x=1">',
	'<img src="/media/1/../../api/me">',
	'<img src="https://evil.example/media/1/thumb">',
	'<a href="javascript:alert(1)">x</a>',
	'<a href="JaVaScRiPt:alert(1)">x</a>',
	'<a href="jav&#x0A;ascript:alert(1)">x</a>',
	'<a href="jav&#x09;ascript:alert(1)">x</a>',
	'<a href="&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058&#0000097&#0000108&#0000101&#0000114&#0000116&#0000040&#0000049&#0000041">x</a>',
	'<a href="&#x6A;avascript:alert(1)">x</a>',
	'<a href="javas&#99;ript:alert(1)">x</a>',
	'<a href="javascript&colon;alert(1)">x</a>',
	'<a href="  &#14;  javascript:alert(1)">x</a>',
	'<a href="\u0001javascript:alert(1)">x</a>',
	'<a href="vbscript:msgbox(1)">x</a>',
	'<a href="livescript:alert(1)">x</a>',
	'<a href="data:text/html,<script>alert(1)</script>">x</a>',
	'<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>',
	'<a href="#" onclick="alert(1)">x</a>',
	'<a href="https://ok.example/" onmouseover=alert(1) target=_blank rel=opener>x</a>',
	'<a href="https://a.example/"><a href="javascript:alert(1)">nested</a></a>',
	'[click](javascript:alert(1))',
	'[click](JAVASCRIPT:alert(1))',
	'[click](  javascript:alert(1) )',
	'[click](<javascript:alert(1)>)',
	'[click](java&#115;cript:alert(1))',
	'[click](&#106;avascript:alert(1))',
	'[click](javascript&#58;alert(1))',
	'[click](vbscript:msgbox(1))',
	'[click](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
	'[click](https://ok.example "title\\" onmouseover=\\"alert(1)")',
	'[ref link][evil]\n\n[evil]: javascript:alert(1)',
	'<javascript:alert(1)>',
	'![x](javascript:alert(1))',
	'![x](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+)',
	'![x](https://evil.example/track.png)',
	'![x](//evil.example/media/1/thumb)',
	'![x](/media/1/thumb" onerror="alert(1))',
	'![x"onerror="alert(1)](/media/1/thumb)',
	'![x](/media/1/thumb?onerror=alert(1))',
	'<svg onload=alert(1)>',
	'<svg><script>alert(1)</script></svg>',
	'<svg><a xlink:href="javascript:alert(1)"><text x="20" y="20">x</text></a></svg>',
	'<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>',
	'<math href="javascript:alert(1)">CLICKME</math>',
	'<math><mi xlink:href="javascript:alert(1)">x</mi></math>',
	'<noscript><p title="</noscript><img src=x onerror=alert(1)>">',
	'<xmp><img src=x onerror=alert(1)></xmp>',
	'<textarea><script>alert(1)</script></textarea>',
	'<title><img src=x onerror=alert(1)></title>',
	'<template><script>alert(1)</script></template>',
	'<select><option><img src=x onerror=alert(1)></option></select>',
	'<style>@import "https://evil.example/x.css";</style><p>after</p>',
	'<div style="background:url(javascript:alert(1))">styled</div>',
	'<p style="position:fixed;inset:0">cover</p>',
	'<iframe src="javascript:alert(1)"></iframe>',
	'<iframe srcdoc="<script>alert(1)</script>"></iframe>',
	'<form action="javascript:alert(1)"><button formaction="javascript:alert(2)">x</button></form>',
	'<input autofocus onfocus=alert(1)>',
	'<object data="javascript:alert(1)"></object>',
	'<embed src="javascript:alert(1)">',
	'<base href="javascript:/a/-alert(1)///////">',
	'<meta http-equiv="refresh" content="0;url=javascript:alert(1)">',
	'<link rel=stylesheet href="javascript:alert(1)">',
	'<body onload=alert(1)>',
	'<details open ontoggle=alert(1)>x</details>',
	'<video><source onerror=alert(1)></video>',
	'<table><tr><td onmouseover=alert(1)>cell</td></tr></table>',
	'<h1 onclick="alert(1)" id="x" class="y">heading</h1>',
	'<code class="language-js onmouseover">x</code>',
	'<!-- <script>alert(1)</script> -->',
	'<![CDATA[<script>alert(1)</script>]]>',
	'<?xml version="1.0"?><script>alert(1)</script>',
	'<p>unclosed <em>em <strong>strong</p> <a href="javascript:alert(1)">',
	'> <script>alert(1)</script>\n> quote',
	'- item <img src=x onerror=alert(1)>\n- [x](javascript:alert(1))',
	'<div>\n\n[inside html](javascript:alert(1))\n\n</div>',
	'<a href="https://ok.example/">ok</a><a href=javascript:alert(1)>bad</a>',
	'<a/href="javascript:alert(1)">slash</a>',
	'<img/src="x"/onerror=alert(1)>',
	'<a href="java\u0000script:alert(1)">null</a>'
];

describe('markdown rendering keeps nothing harmful', () => {
	test.each(VECTORS)('%s', (vector) => {
		const html = renderMarkdown(vector);
		expect(structuralProblems(html)).toEqual([]);
		expect(html.toLowerCase()).not.toMatch(/<\s*(script|svg|math|iframe|style|form|textarea|xmp|object|embed|base|meta|link)\b/);
	});

	test('the checker itself flags what it must', () => {
		expect(structuralProblems('<script>x</script>')).toContain('element <script>');
		expect(structuralProblems('<a href="javascript:alert(1)" rel="nofollow ugc noopener">x</a>')).toContain('link to javascript:');
		expect(structuralProblems('<a href="jav&#x09;ascript:x" rel="nofollow ugc noopener">x</a>')).toContain('link to javascript:');
		expect(structuralProblems('<img src="https://evil.example/media/1/thumb">')).toContain('picture from https://evil.example/media/1/thumb');
		expect(structuralProblems('<p onclick="x">y</p>')).toEqual(expect.arrayContaining(['event handler onclick']));
		expect(structuralProblems('<svg></svg>')).toEqual(expect.arrayContaining(['element <svg>']));
	});

	test('a script inside inline code or a code block is shown as text', () => {
		const html = renderMarkdown('Use `<script>alert(1)</script>` carefully.\n\n```html\n<img src=x onerror=alert(1)>\n```');
		expect(html).toContain('<code>&lt;script&gt;alert(1)&lt;/script&gt;</code>');
		expect(html).toContain('<pre><code class="language-html">&lt;img src=x onerror=alert(1)&gt;\n</code></pre>');
		expect(structuralProblems(html)).toEqual([]);
	});

	test('without pictures, our own photos go too, with their alt text; hostile input stays harmless', () => {
		expect(renderMarkdown('Stones. ![Front of my tank](/media/12/medium) **Stems.**', { images: false })).toBe('<p>Stones.  <strong>Stems.</strong></p>\n');
		for (const vector of VECTORS) {
			const html = renderMarkdown(vector, { images: false });
			expect(structuralProblems(html)).toEqual([]);
			expect(html).not.toMatch(/<img/i);
		}
	});

	test('hostile links keep their text but lose the link target', () => {
		expect(renderMarkdown('[click](javascript:alert(1))')).toBe(`<p><a rel="${LINK_REL}">click</a></p>\n`);
		expect(renderMarkdown('![x](https://evil.example/t.png) after')).toBe('<p> after</p>\n');
	});
});

// Journal entries and comments use renderMarkdown as it is; the Atom feed carries the same HTML
// with root-relative addresses made absolute, which must not open a way around the sanitiser.
describe('the feed’s copy of an entry stays harmless', () => {
	test.each(VECTORS)('%s', (vector) => {
		const html = absoluteLinks(renderMarkdown(vector), BASE);
		expect(structuralProblems(html)).toEqual([]);
		expect(html).not.toMatch(/(href|src)="\/\//);
	});
	test('our own pictures and links become absolute on our origin, nothing else changes', () => {
		const html = absoluteLinks(renderMarkdown('![Front](/media/12/medium) and [the tank](/journals/3) and [elsewhere](https://x.test/a)'), BASE);
		expect(html).toBe(
			`<p><img src="https://riparia.test/media/12/medium" alt="Front" /> and <a href="https://riparia.test/journals/3" rel="${LINK_REL}">the tank</a> and <a href="https://x.test/a" rel="${LINK_REL}">elsewhere</a></p>\n`
		);
	});
});

describe('markdown rendering keeps what members write', () => {
	test('headings start at h2 and stop at h4', () => {
		expect(renderMarkdown('# Week one\n\n#### Deep')).toBe('<h2>Week one</h2>\n<h4>Deep</h4>\n');
		expect(renderMarkdown('### Trim')).toBe('<h4>Trim</h4>\n');
	});

	test('emphasis, lists, quotes and code', () => {
		const html = renderMarkdown('*Rotala* **grew** ~~slowly~~\n\n1. trim\n2. replant\n\n- one\n\n> note\n\n`kh`');
		expect(html).toBe(
			'<p><em>Rotala</em> <strong>grew</strong> <del>slowly</del></p>\n<ol>\n<li>trim</li>\n<li>replant</li>\n</ol>\n<ul>\n<li>one</li>\n</ul>\n<blockquote>\n<p>note</p>\n</blockquote>\n<p><code>kh</code></p>\n'
		);
	});

	test('links get rel="nofollow ugc noopener" and keep http, https and mailto', () => {
		expect(renderMarkdown('[guide](https://example.org/a?b=1 "Guide")')).toBe(
			`<p><a href="https://example.org/a?b=1" title="Guide" rel="${LINK_REL}">guide</a></p>\n`
		);
		expect(renderMarkdown('<mailto:club@example.org>')).toContain(`href="mailto:club@example.org" rel="${LINK_REL}"`);
		expect(renderMarkdown('<a href="https://example.org" rel="opener" target="_blank">x</a>')).toBe(
			`<p><a href="https://example.org" rel="${LINK_REL}">x</a></p>\n`
		);
	});

	test('pictures from our own photo route are kept, with their description', () => {
		expect(renderMarkdown('![Carpet after three weeks](/media/42/medium)')).toBe('<p><img src="/media/42/medium" alt="Carpet after three weeks" /></p>\n');
		// An absolute URL to our own site becomes the same path.
		const origin = (process.env.ORIGIN ?? 'http://127.0.0.1:5173').replace(/\/$/, '');
		expect(renderMarkdown(`![x](${origin}/media/7/thumb)`)).toBe('<p><img src="/media/7/thumb" alt="x" /></p>\n');
	});

	test('raw HTML that is allowed stays; the rest keeps only its text', () => {
		expect(renderMarkdown('<strong>bold</strong> and <span class="x">plain</span>')).toBe('<p><strong>bold</strong> and plain</p>\n');
	});
});
