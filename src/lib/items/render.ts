/**
 * Item markdown to safe HTML: `marked` (GitHub-flavoured markdown) and then DOMPurify with a strict
 * allow-list. Raw HTML in the markdown passes through marked, so the sanitizer is what makes it safe:
 * only text-formatting tags survive, no attributes but `href`/`title` on links and `align` on table
 * cells, and links only to http(s), mailto or relative addresses.
 */
import DOMPurify from 'isomorphic-dompurify';
import { Marked } from 'marked';

const ALLOWED_TAGS = [
	'p', 'br', 'hr', 'strong', 'em', 'b', 'i', 'del', 'code', 'pre', 'kbd', 'sub', 'sup',
	'ul', 'ol', 'li', 'blockquote', 'h3', 'h4', 'h5', 'h6',
	'table', 'thead', 'tbody', 'tr', 'th', 'td', 'a'
];
const ALLOWED_ATTR = ['href', 'title', 'align'];
const SAFE_URL = /^(?:https?:\/\/|mailto:|\/(?!\/)|#|\.{0,2}\/?[\w-]+(?:[/?#][^\s]*)?$)/i;

/** The sanitizer used: HTML in, safe HTML out. Injectable so a caller can supply its own. */
export type Sanitize = (html: string) => string;

/** The default sanitizer: DOMPurify with the item allow-list. */
export const sanitizeHtml: Sanitize = (html) =>
	DOMPurify.sanitize(html, {
		ALLOWED_TAGS,
		ALLOWED_ATTR,
		ALLOWED_URI_REGEXP: SAFE_URL,
		ALLOW_DATA_ATTR: false,
		ALLOW_ARIA_ATTR: false,
		KEEP_CONTENT: true,
		RETURN_TRUSTED_TYPE: false
	}) as string;

const marked = new Marked({ gfm: true, breaks: false });

const ALLOWED_TAG_SET = new Set(ALLOWED_TAGS);
const TAG = /<(\/?)([a-z][a-z0-9]*)((?:\s+[a-z]+="[^"<>]*")*)\s*(\/?)>/y;
const ATTR = /\s+([a-z]+)="([^"<>]*)"/g;

/**
 * True when HTML already holds only allow-listed tags and attributes, with safe link addresses and no
 * character references other than the five markdown escapes: then DOMPurify would keep it as it is,
 * and the (slow, DOM-based) pass is skipped. Anything else goes through DOMPurify.
 */
export function isAllowListed(html: string): boolean {
	if (/&(?!(?:amp|lt|gt|quot|#39);)/.test(html)) return false;
	let i = html.indexOf('<');
	while (i >= 0) {
		TAG.lastIndex = i;
		const m = TAG.exec(html);
		if (!m || !ALLOWED_TAG_SET.has(m[2])) return false;
		if (m[1] && m[3]) return false;
		for (const a of m[3].matchAll(ATTR)) {
			if (!ALLOWED_ATTR.includes(a[1])) return false;
			if (a[1] === 'href' && (m[2] !== 'a' || !SAFE_URL.test(a[2].replace(/&amp;/g, '&')))) return false;
			if (a[1] === 'align' && !/^(left|right|center)$/.test(a[2])) return false;
		}
		i = html.indexOf('<', TAG.lastIndex);
	}
	return !html.includes('>') || balancedAngles(html);
}

/** Every `>` closes a tag (text `>` is escaped by marked as `&gt;`). */
function balancedAngles(html: string): boolean {
	return html.split('>').length === html.split('<').length;
}

/** Text that can only be one paragraph: one line, starting with nothing that opens a block. */
const BLOCK_START = /^(?:\s|[#>*+\-=_|`~<[!]|\d+[.)])/;

function markdownToHtml(md: string, oneLineFast: boolean): string {
	const demoted = md.replace(/^(#{1,2})(?=\s)/gm, '###');
	// a one-line paragraph renders as <p> around its inline markdown: the same HTML, without the block pass
	if (oneLineFast && demoted && !demoted.includes('\n') && !BLOCK_START.test(demoted)) return `<p>${marked.parseInline(demoted, { async: false }) as string}</p>`;
	return (marked.parse(demoted, { async: false }) as string).trim();
}

/**
 * Renders item markdown to sanitized HTML. Headings `#` and `##` are demoted to `###`, since an item
 * sits inside a page that has its own. Never throws on any text.
 */
export function renderMarkdown(md: string, sanitize: Sanitize = sanitizeHtml): string {
	const html = markdownToHtml(md, true);
	if (sanitize === sanitizeHtml && isAllowListed(html)) return html;
	return sanitize(html).trim();
}

/** The HTML marked makes of item markdown, before sanitizing, with or without the one-line shortcut (for tests). */
export function markdownHtml(md: string, oneLineFast = true): string {
	return markdownToHtml(md, oneLineFast);
}
