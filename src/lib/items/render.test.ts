/**
 * The item renderer against script injection: each payload (scripts, event handlers, javascript:
 * and data: links, SVG and MathML tricks, style injection, entity-encoded schemes) is asserted
 * neutralised, both on the allow-list fast path and through DOMPurify. Payload families follow the
 * OWASP XSS Filter Evasion Cheat Sheet.
 */
import { describe, expect, it } from 'vitest';
import { FAMILIES } from './families';
import { FORMS, draftItems } from './families/forms';
import { circuitCtx } from './engine';
import { isAllowListed, markdownHtml, renderMarkdown, sanitizeHtml } from './render';
import { makeRng } from './rng';

const PAYLOADS: [string, string][] = [
	['script tag', '<script>alert(1)</script>'],
	['script in markdown text', 'Read point B. <script src="https://evil.example/x.js"></script>'],
	['img onerror', '<img src=x onerror=alert(1)>'],
	['markdown image with javascript', '![x](javascript:alert(1))'],
	['markdown link with javascript', '[click](javascript:alert(1))'],
	['markdown link with mixed-case scheme', '[click](JaVaScRiPt:alert(1))'],
	['entity-encoded javascript scheme', '<a href="&#106;avascript:alert(1)">x</a>'],
	['markdown link with entity scheme', '[x](&#x6A;avascript:alert(1))'],
	['vbscript link', '[x](vbscript:msgbox(1))'],
	['data URL link', '[x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)'],
	['data URL image', '<img src="data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+">'],
	['svg onload', '<svg onload=alert(1)><circle r=5></circle></svg>'],
	['svg with script', '<svg><script>alert(1)</script></svg>'],
	['svg animate href', '<svg><a><animate attributeName=href values=javascript:alert(1) /><text y=20>x</text></a></svg>'],
	['svg foreignObject', '<svg><foreignObject><iframe src="javascript:alert(1)"></iframe></foreignObject></svg>'],
	['mathml href', '<math><mtext><a href="javascript:alert(1)">x</a></mtext></math>'],
	['mathml mglyph namespace confusion', '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>'],
	['iframe', '<iframe src="https://evil.example"></iframe>'],
	['object and embed', '<object data="x.swf"></object><embed src="x.swf">'],
	['style tag', '<style>body{background:url(javascript:alert(1))}</style>'],
	['style attribute', '<p style="background:url(javascript:alert(1))">x</p>'],
	['event handler on a permitted tag', '<strong onclick="alert(1)">bold</strong>'],
	['event handler on a link', '<a href="https://ok.example" onmouseover="alert(1)">x</a>'],
	['form action', '<form action="javascript:alert(1)"><button>go</button></form>'],
	['meta refresh', '<meta http-equiv="refresh" content="0;url=javascript:alert(1)">'],
	['base href', '<base href="javascript:alert(1)//">'],
	['link stylesheet', '<link rel="stylesheet" href="https://evil.example/x.css">'],
	['details ontoggle', '<details open ontoggle=alert(1)>x</details>'],
	['broken-up tag', '<scr<script>ipt>alert(1)</scr</script>ipt>'],
	['html comment trick', '<!--<img src="--><img src=x onerror=alert(1)//">'],
	['noscript mutation', '<noscript><p title="</noscript><img src=x onerror=alert(1)>">'],
	['srcdoc', '<iframe srcdoc="<script>alert(1)</script>"></iframe>'],
	['formaction', '<button formaction="javascript:alert(1)">x</button>'],
	['autofocus onfocus', '<input autofocus onfocus=alert(1)>'],
	['code span keeps text only', '`<script>alert(1)</script>`']
];

/** What can run script in rendered HTML. */
const DANGER = [/<script/i, /\son\w+\s*=/i, /javascript:/i, /vbscript:/i, /data:/i, /<iframe/i, /<object/i, /<embed/i, /<svg/i, /<math/i, /<style/i, /style=/i, /<form/i, /<meta/i, /<base/i, /<link/i, /<img/i, /<input/i, /srcdoc/i, /formaction/i];

describe('rendering item markdown', () => {
	it('renders ordinary markdown on the fast path, unchanged by the sanitizer', () => {
		const html = renderMarkdown('**Point B** reads *battery voltage*.\n\n- W1\n- W2\n\n[spec](https://example.org/spec)');
		expect(html).toContain('<strong>Point B</strong>');
		expect(html).toContain('<li>W1</li>');
		expect(html).toContain('<a href="https://example.org/spec">spec</a>');
		expect(isAllowListed(html)).toBe(true);
		expect(sanitizeHtml(html).trim()).toBe(html);
	});

	it('the one-line shortcut gives the HTML of marked’s full pass, for every form’s stems and explanations and for edge cases', () => {
		const texts = [
			'Plain text.',
			'**bold** and *em* and `code` and [a link](https://example.org) and a_b_c and 2 * 3 * 4',
			'1. a list?',
			'- a list',
			'> a quote',
			'    indented code',
			'<b>raw</b> html',
			'[ref]: https://example.org',
			'| a | b |',
			'***',
			'Ends with two spaces  ',
			'Tom & Jerry < 5 > 3 "quoted" it’s'
		];
		const cache = new Map();
		for (const f of FAMILIES) {
			const v = f.variant(makeRng(`render|${f.id}`), 0);
			const ctx = circuitCtx(cache, v.circuit);
			for (const form of FORMS) {
				let n = 0;
				for (const d of draftItems(f, v, ctx, form.id, makeRng(`render|${f.id}|${form.id}`), makeRng(`render|${f.id}|c`))) {
					texts.push(d.stem, d.explanation);
					if (++n >= 2) break;
				}
			}
		}
		expect(texts.length).toBeGreaterThan(200);
		for (const t of texts) expect(markdownHtml(t), t).toBe(markdownHtml(t, false));
	});

	it('demotes page-level headings', () => {
		expect(renderMarkdown('# Title\n\n## Part')).toBe('<h3>Title</h3>\n<h3>Part</h3>');
	});

	for (const [name, payload] of PAYLOADS)
		it(`neutralises ${name}`, () => {
			const html = renderMarkdown(`Before. ${payload} After.`);
			for (const d of DANGER) expect(html, `${name}: ${html}`).not.toMatch(d);
			// the same payload as a block of its own
			const block = renderMarkdown(payload);
			for (const d of DANGER) expect(block, `${name} (block): ${block}`).not.toMatch(d);
		});

	it('the fast path refuses anything outside the allow-list', () => {
		expect(isAllowListed('<p onclick="x">a</p>')).toBe(false);
		expect(isAllowListed('<a href="javascript:alert(1)">a</a>')).toBe(false);
		expect(isAllowListed('<a href="&#106;avascript:alert(1)">a</a>')).toBe(false);
		expect(isAllowListed('<img src="x">')).toBe(false);
		expect(isAllowListed('<p>a</p><script>')).toBe(false);
		expect(isAllowListed('<p title="a">b</p>')).toBe(true);
	});
});
