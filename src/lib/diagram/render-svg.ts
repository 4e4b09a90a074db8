/**
 * A drawing as one standalone SVG document: no external references, fonts by family name with
 * generic fallbacks, every part and wire element carrying its id in `data-id`.
 *
 * Pure: string building only.
 */
import type { Drawing, DrawnLabel, DrawnPart, DrawnWire, LegendEntry } from './layout';
import { LABEL_FONTS } from './layout';
import { escapeXml } from './symbols';

/** The project's palette (tailwind.config.ts), repeated here so a standalone SVG needs no stylesheet. */
export const PALETTE = {
	ink: '#1f2933',
	inkSoft: '#52606d',
	paper: '#f6f3ec',
	rule: '#d8d1c2',
	copper: '#a4501c',
	volt: '#1d6a86',
	ok: '#2f7a4b',
	warn: '#9a6200',
	fault: '#b3261e'
} as const;

/**
 * Overlay set styles. Each differs from the others in dash pattern and weight as well as colour, so
 * the sets stay apart in grayscale and for readers with a colour-vision deficiency.
 */
export const OVERLAY_STYLES = [
	{ colour: PALETTE.volt, dash: '10 5', width: 9 },
	{ colour: PALETTE.copper, dash: '', width: 9 },
	{ colour: PALETTE.ink, dash: '2 4', width: 11 },
	{ colour: PALETTE.fault, dash: '14 4 2 4', width: 9 },
	{ colour: PALETTE.ok, dash: '6 3', width: 7 }
] as const;

/** A named set of elements to outline; `style` picks an entry of OVERLAY_STYLES (default: the set's position). */
export type OverlaySet = { name: string; elements: string[]; style?: number };

export const MONO = `'JetBrains Mono', ui-monospace, 'DejaVu Sans Mono', monospace`;
export const SANS = `'Source Sans 3', system-ui, 'DejaVu Sans', sans-serif`;

/** CSS shared by the standalone SVG and the Svelte component. */
export const DIAGRAM_CSS = `
.sp-paper{fill:${PALETTE.paper}}
.sp-body{fill:none;stroke:${PALETTE.ink};stroke-width:1.6;stroke-linecap:round;stroke-linejoin:round}
.sp-thick{stroke-width:2.6}
.sp-thin{stroke-width:1}
.sp-dash{stroke-dasharray:4 3}
.sp-soft{fill:${PALETTE.rule}}
.sp-fill{fill:${PALETTE.ink};stroke:none}
.sp-pin{font-family:${MONO};font-size:8px;fill:${PALETTE.inkSoft}}
.sp-sym-text{font-family:${SANS};font-size:12px;font-weight:700;fill:${PALETTE.ink}}
.sp-wire{fill:none;stroke:${PALETTE.ink};stroke-width:1.6;stroke-linejoin:round}
.sp-bar{stroke:${PALETTE.ink};stroke-width:3.2;stroke-linecap:round}
.sp-dot{fill:${PALETTE.ink}}
.sp-label{font-family:${MONO};font-size:${LABEL_FONTS.part}px;fill:${PALETTE.ink}}
.sp-label-id{font-weight:700}
.sp-wlabel{font-family:${MONO};font-size:${LABEL_FONTS.wire}px;fill:${PALETTE.inkSoft}}
.sp-flag-ring{fill:#ffffff;stroke:${PALETTE.volt};stroke-width:1.6}
.sp-flag-lead{stroke:${PALETTE.volt};stroke-width:1;stroke-dasharray:2 2}
.sp-flag-text{font-family:${SANS};font-size:11px;font-weight:700;fill:${PALETTE.volt}}
.sp-legend-text{font-family:${SANS};font-size:12px;fill:${PALETTE.inkSoft}}
.sp-legend-rule{stroke:${PALETTE.rule};stroke-width:1}
.sp-halo{fill:none;stroke-linecap:butt;stroke-linejoin:round;opacity:0.55}
.sp-halo-box{fill:none;stroke-width:3}
`;

const f = (n: number) => String(Math.round(n * 100) / 100);

export function pointsAttr(pts: [number, number][]): string {
	return pts.map(([x, y]) => `${f(x)},${f(y)}`).join(' ');
}

export function labelMarkup(l: DrawnLabel): string {
	const lh = l.kind === 'wire' ? LABEL_FONTS.wireLineHeight : LABEL_FONTS.lineHeight;
	const cls = l.kind === 'wire' ? 'sp-wlabel' : 'sp-label';
	return l.lines
		.map(
			(line, i) =>
				`<text class="${cls}${i === 0 && l.kind === 'part' ? ' sp-label-id' : ''}" x="${f(l.x + 1)}" y="${f(l.y + (i + 1) * lh - 3)}">${escapeXml(line)}</text>`
		)
		.join('');
}

export function legendMarkup(e: LegendEntry): string {
	let sym = '';
	if (e.kind === 'symbol' && e.shape) {
		const s = Math.min(30 / Math.max(e.shape.h, 1), 24 / Math.max(e.shape.w, 1));
		sym = `<g transform="translate(${f(e.x + 12 - (e.shape.w * s) / 2)},${f(e.y + 5)}) scale(${f(s)})">${e.shape.body}</g>`;
	} else if (e.kind === 'symbol') {
		sym = `<rect class="sp-body sp-dash sp-thin" x="${f(e.x + 2)}" y="${f(e.y + 8)}" width="20" height="24" rx="2"/>`;
	} else if (e.kind === 'dot') {
		sym = `<line class="sp-wire" x1="${f(e.x)}" y1="${f(e.y + 20)}" x2="${f(e.x + 24)}" y2="${f(e.y + 20)}"/><line class="sp-wire" x1="${f(e.x + 12)}" y1="${f(e.y + 20)}" x2="${f(e.x + 12)}" y2="${f(e.y + 34)}"/><circle class="sp-dot" cx="${f(e.x + 12)}" cy="${f(e.y + 20)}" r="3.5"/>`;
	} else if (e.kind === 'flag') {
		sym = `<circle class="sp-flag-ring" cx="${f(e.x + 12)}" cy="${f(e.y + 20)}" r="9"/><text class="sp-flag-text" x="${f(e.x + 12)}" y="${f(e.y + 24)}" text-anchor="middle">A</text>`;
	} else if (e.kind === 'bar') {
		sym = `<line class="sp-bar" x1="${f(e.x)}" y1="${f(e.y + 20)}" x2="${f(e.x + 24)}" y2="${f(e.y + 20)}"/>`;
	}
	return `<g class="sp-legend-entry">${sym}<text class="sp-legend-text" x="${f(e.x + 32)}" y="${f(e.y + 24)}">${escapeXml(e.text)}</text></g>`;
}

function haloForWire(w: DrawnWire, style: (typeof OVERLAY_STYLES)[number]): string {
	return `<polyline class="sp-halo" points="${pointsAttr(w.points)}" stroke="${style.colour}" stroke-width="${style.width}"${style.dash ? ` stroke-dasharray="${style.dash}"` : ''}/>`;
}

function haloForBox(b: { x: number; y: number; w: number; h: number }, style: (typeof OVERLAY_STYLES)[number]): string {
	return `<rect class="sp-halo-box" x="${f(b.x - 4)}" y="${f(b.y - 4)}" width="${f(b.w + 8)}" height="${f(b.h + 8)}" rx="4" stroke="${style.colour}"${style.dash ? ` stroke-dasharray="${style.dash}"` : ''}/>`;
}

/** The halo markup of one overlay set: wires by id, parts (or a relay's coil/contact, a cavity) by id. */
export function overlayMarkup(d: Drawing, set: OverlaySet, index: number): string {
	const style = OVERLAY_STYLES[(set.style ?? index) % OVERLAY_STYLES.length];
	const want = new Set(set.elements);
	let out = '';
	for (const w of d.wires) if (want.has(w.id)) out += haloForWire(w, style);
	for (const p of d.parts) {
		if (want.has(p.id)) out += haloForBox(p, style);
		else for (const s of p.subs) if (want.has(s.id)) out += haloForBox(s, style);
	}
	return out;
}

export function partMarkup(p: DrawnPart, extra = ''): string {
	return `<g class="sp-part" data-id="${escapeXml(p.id)}" data-type="${p.type}"${extra}><title>${escapeXml(p.name)}</title><g transform="translate(${f(p.x)},${f(p.y)})">${p.body}</g></g>`;
}

export type RenderOptions = {
	overlays?: OverlaySet[];
	/** Text of the SVG's <title>; defaults to the circuit's title. */
	title?: string;
};

/** The whole drawing as a standalone SVG document. */
export function renderSvg(d: Drawing, opts: RenderOptions = {}): string {
	const title = opts.title ?? d.title ?? d.id;
	const out: string[] = [];
	out.push(
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${d.width} ${d.height}" width="${d.width}" height="${d.height}" role="img" aria-label="${escapeXml(`Wiring diagram: ${title}`)}" data-circuit="${escapeXml(d.id)}">`
	);
	out.push(`<title>${escapeXml(`Wiring diagram: ${title}`)}</title>`);
	out.push(`<style>${DIAGRAM_CSS.replace(/\n/g, '')}</style>`);
	out.push(`<rect class="sp-paper" x="0" y="0" width="${d.width}" height="${d.height}"/>`);
	(opts.overlays ?? []).forEach((s, i) => out.push(`<g class="sp-overlay" data-overlay="${escapeXml(s.name)}">${overlayMarkup(d, s, i)}</g>`));
	out.push(`<g class="sp-wires">`);
	for (const w of d.wires) {
		out.push(
			`<g class="sp-wire-g" data-id="${escapeXml(w.id)}" data-node="${escapeXml(w.node)}"><title>${escapeXml(w.name)}</title><polyline class="sp-wire" points="${pointsAttr(w.points)}"/></g>`
		);
	}
	out.push(`</g>`);
	if (d.bar) {
		out.push(
			`<g class="sp-bus" data-id="B+"><line class="sp-bar" x1="${f(d.bar.x1)}" y1="${f(d.bar.y)}" x2="${f(d.bar.x2)}" y2="${f(d.bar.y)}"/><circle class="sp-flag-ring" cx="${f(d.bar.x1)}" cy="${f(d.bar.y)}" r="3"/>${labelMarkup(d.bar.label)}</g>`
		);
	}
	out.push(`<g class="sp-parts">`);
	for (const p of d.parts) out.push(partMarkup(p));
	out.push(`</g>`);
	out.push(`<g class="sp-dots">`);
	for (const dot of d.dots) out.push(`<circle class="sp-dot" cx="${f(dot.x)}" cy="${f(dot.y)}" r="3.5" data-node="${escapeXml(dot.node)}"/>`);
	out.push(`</g>`);
	out.push(`<g class="sp-labels">`);
	for (const p of d.parts) if (p.label) out.push(labelMarkup(p.label));
	for (const w of d.wires) if (w.label) out.push(`<g data-label-of="${escapeXml(w.id)}">${labelMarkup(w.label)}</g>`);
	out.push(`</g>`);
	out.push(`<g class="sp-flags">`);
	for (const fl of d.flags) out.push(flagMarkup(fl));
	out.push(`</g>`);
	out.push(`<g class="sp-legend"><line class="sp-legend-rule" x1="10" y1="${f(d.legendTop)}" x2="${f(d.width - 10)}" y2="${f(d.legendTop)}"/>`);
	for (const e of d.legend) out.push(legendMarkup(e));
	out.push(`</g>`);
	out.push(`</svg>`);
	return out.join('\n') + '\n';
}

export function flagMarkup(fl: Drawing['flags'][number]): string {
	const dx = fl.anchor[0] - fl.cx;
	const dy = fl.anchor[1] - fl.cy;
	// The leader starts where the line to the anchor leaves the pill's bounding box.
	const t = Math.min(dx ? fl.hw / Math.abs(dx) : Infinity, dy ? fl.r / Math.abs(dy) : Infinity, 1);
	const ex = fl.cx + dx * t;
	const ey = fl.cy + dy * t;
	return `<g class="sp-flag" data-point="${escapeXml(fl.label)}"><title>${escapeXml(`test point ${fl.label}, at ${fl.target}`)}</title><line class="sp-flag-lead" x1="${f(fl.anchor[0])}" y1="${f(fl.anchor[1])}" x2="${f(ex)}" y2="${f(ey)}"/><rect class="sp-flag-ring" x="${f(fl.cx - fl.hw)}" y="${f(fl.cy - fl.r)}" width="${f(2 * fl.hw)}" height="${f(2 * fl.r)}" rx="${fl.r}"/><text class="sp-flag-text" x="${f(fl.cx)}" y="${f(fl.cy + 4)}" text-anchor="middle">${escapeXml(fl.label)}</text></g>`;
}
