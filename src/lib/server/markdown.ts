// Markdown written by members (journal entries, comments, listing descriptions, contest rules)
// becomes HTML in one place: marked renders it, then sanitize-html keeps only a short allowlist.
// marked does not sanitise anything itself, so nothing reaches a page without the second step.
import { Marked, type Tokens } from 'marked';
import sanitizeHtml from 'sanitize-html';
import { config } from './config';
import { OWN_MEDIA_PATH } from '../media/urls';

/**
 * The version of the rules below. Rendered HTML is stored beside its source (see
 * markdown-fields.ts); raise this whenever the output changes (the allowlist, marked's options,
 * an upgrade of either) and the migration runner renders every stored field again from source.
 */
export const RENDERER_VERSION = 1;

/** Longest markdown we render; longer input is cut (forms enforce their own, smaller limits). */
export const MARKDOWN_MAX_CHARS = 50_000;

export const ALLOWED_TAGS = ['p', 'br', 'hr', 'em', 'strong', 'del', 'ul', 'ol', 'li', 'blockquote', 'code', 'pre', 'h2', 'h3', 'h4', 'a', 'img'] as const;
export const LINK_REL = 'nofollow ugc noopener';

const marked = new Marked({ gfm: true, breaks: false, async: false });
marked.use({
	renderer: {
		// The page has its own h1: a member's "# Heading" becomes h2, and levels below h4 stay h4.
		heading(this: { parser: { parseInline(tokens: Tokens.Generic[]): string } }, token: Tokens.Heading) {
			const level = Math.min(4, Math.max(2, token.depth + 1));
			return `<h${level}>${this.parser.parseInline(token.tokens)}</h${level}>\n`;
		}
	}
});

function ownMediaPath(src: string | undefined): string | null {
	if (!src) return null;
	let candidate = src.trim();
	const origin = config().ORIGIN.replace(/\/$/, '');
	if (candidate.startsWith(origin + '/')) candidate = candidate.slice(origin.length);
	return OWN_MEDIA_PATH.test(candidate) ? candidate : null;
}

const sanitizeOptions: sanitizeHtml.IOptions = {
	allowedTags: [...ALLOWED_TAGS],
	allowedAttributes: {
		a: ['href', 'title', 'rel'],
		img: ['src', 'alt', 'title'],
		code: ['class'],
		ol: ['start']
	},
	allowedClasses: { code: ['language-*'] },
	allowedSchemes: ['http', 'https', 'mailto'],
	allowedSchemesByTag: { img: [] },
	allowedSchemesAppliedToAttributes: ['href', 'src'],
	allowProtocolRelative: false,
	disallowedTagsMode: 'discard',
	// Elements whose content is dropped with them, not kept as text.
	nonTextTags: [
		'script',
		'style',
		'textarea',
		'option',
		'noscript',
		'xmp',
		'iframe',
		'noembed',
		'noframes',
		'template',
		'svg',
		'math',
		'title',
		'select',
		'object'
	],
	transformTags: {
		a: (tagName, attribs) => ({ tagName, attribs: { ...attribs, rel: LINK_REL } }),
		img: (tagName, attribs) => {
			const src = ownMediaPath(attribs.src);
			const kept: sanitizeHtml.Attributes = src ? { ...attribs, src } : { alt: attribs.alt ?? '' };
			return { tagName, attribs: kept };
		}
	},
	// Pictures only from our own photo route; anything else is dropped whole.
	exclusiveFilter: (frame) => frame.tag === 'img' && !ownMediaPath(frame.attribs.src)
};

// Without pictures: every img is dropped whole, its alt text too.
const withoutImagesOptions: sanitizeHtml.IOptions = { ...sanitizeOptions, exclusiveFilter: (frame) => frame.tag === 'img' };

/**
 * Sanitised HTML for a member's markdown. `images: false` leaves pictures out, for readers who must
 * not learn which photos the text points at (a judge reading an entrant's statement: a photo's
 * address can name the tank it belongs to).
 */
export function renderMarkdown(source: string, options: { images?: boolean } = {}): string {
	const html = marked.parse(source.slice(0, MARKDOWN_MAX_CHARS)) as string;
	return sanitizeHtml(html, options.images === false ? withoutImagesOptions : sanitizeOptions);
}

/** A statement as judges read it: rendered without pictures, and how many pictures the full text has. */
export function statementShown(source: string): { statementHtml: string; statementPictures: number } {
	return { statementHtml: renderMarkdown(source, { images: false }), statementPictures: (renderMarkdown(source).match(/<img\b/g) ?? []).length };
}

/** The stored HTML of a markdown field; rendered from source only for a row that has none yet (written by bulk SQL before the migration runner's step). */
export const storedHtml = (html: string | null | undefined, source: string | null | undefined): string => html ?? (source ? renderMarkdown(source) : '');
