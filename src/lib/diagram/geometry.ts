/**
 * Geometry checks of a drawing, for builds that draw many generated circuits (the content build).
 * The diagram's own tests check the same rules independently; this is the reusable form.
 * Pure: no DOM.
 */
import type { Box, Drawing, Point } from './layout';

type Seg = { p: Point; q: Point; node: string; wire: string };
type NetWire = { id: string; from: string; to: string };

const overlap = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

function segmentsOf(d: Drawing): Seg[] {
	const out: Seg[] = [];
	for (const w of d.wires) for (let i = 1; i < w.points.length; i++) out.push({ p: w.points[i - 1], q: w.points[i], node: w.node, wire: w.id });
	if (d.bar) out.push({ p: [d.bar.x1, d.bar.y], q: [d.bar.x2, d.bar.y], node: 'B+', wire: 'the B+ bar' });
	return out;
}

function collinear(a: Seg, b: Seg): boolean {
	const av = a.p[0] === a.q[0];
	if (av !== (b.p[0] === b.q[0])) return false;
	const [k, i] = av ? [0, 1] : [1, 0];
	if (a.p[k] !== b.p[k]) return false;
	const lo = Math.max(Math.min(a.p[i], a.q[i]), Math.min(b.p[i], b.q[i]));
	const hi = Math.min(Math.max(a.p[i], a.q[i]), Math.max(b.p[i], b.q[i]));
	return hi > lo;
}

/** True when segment pq enters the inside of box b (touching its edge does not count). */
function enters(p: Point, q: Point, b: Box): boolean {
	const x0 = Math.min(p[0], q[0]);
	const x1 = Math.max(p[0], q[0]);
	const y0 = Math.min(p[1], q[1]);
	const y1 = Math.max(p[1], q[1]);
	if (x0 === x1) return x0 > b.x && x0 < b.x + b.w && y1 > b.y && y0 < b.y + b.h;
	return y0 > b.y && y0 < b.y + b.h && x1 > b.x && x0 < b.x + b.w;
}

/**
 * Problems with a drawing, as sentences; empty when it is clean: symbols on top of each other, a wire
 * through a symbol, labels on symbols or on each other, segments of two nodes on top of each other,
 * and (given the netlist's wires) a wire that does not end on the pins the file names.
 */
export function checkDrawing(d: Drawing, netWires: NetWire[] = []): string[] {
	const out: string[] = [];
	for (let i = 0; i < d.parts.length; i++)
		for (let j = i + 1; j < d.parts.length; j++) if (overlap(d.parts[i], d.parts[j])) out.push(`symbols ${d.parts[i].id} and ${d.parts[j].id} overlap`);
	const segs = segmentsOf(d);
	for (const s of segs)
		for (const p of d.parts) {
			if (p.type === 'splice') continue;
			if (enters(s.p, s.q, p)) out.push(`${s.wire} runs through ${p.id}`);
		}
	const labels: (Box & { what: string })[] = [];
	for (const p of d.parts) if (p.label) labels.push({ ...p.label, what: `the label of ${p.id}` });
	for (const w of d.wires) if (w.label) labels.push({ ...w.label, what: `the label of ${w.id}` });
	for (const f of d.flags) labels.push({ ...f.box, what: `test point ${f.label}` });
	if (d.bar) labels.push({ ...d.bar.label, what: 'the B+ label' });
	for (const l of labels) for (const p of d.parts) if (overlap(l, p)) out.push(`${l.what} lies on ${p.id}`);
	for (let i = 0; i < labels.length; i++)
		for (let j = i + 1; j < labels.length; j++) if (overlap(labels[i], labels[j])) out.push(`${labels[i].what} lies on ${labels[j].what}`);
	for (let i = 0; i < segs.length; i++)
		for (let j = i + 1; j < segs.length; j++)
			if (segs[i].node !== segs[j].node && collinear(segs[i], segs[j])) out.push(`${segs[i].wire} runs on top of ${segs[j].wire}`);
	for (const nw of netWires) {
		const w = d.wires.find((x) => x.id === nw.id);
		if (!w) {
			out.push(`wire ${nw.id} is not drawn`);
			continue;
		}
		const ends: [string, Point][] = [
			[nw.from, w.points[0]],
			[nw.to, w.points[w.points.length - 1]]
		];
		for (const [name, at] of ends) {
			if (name === 'B+') {
				if (!d.bar || at[1] !== d.bar.y || at[0] < d.bar.x1 || at[0] > d.bar.x2) out.push(`wire ${nw.id} does not end on the B+ bar`);
			} else if (name === 'GND') {
				if (!d.parts.some((p) => p.synthetic && Object.values(p.pins).some((xy) => xy.x === at[0] && xy.y === at[1]))) out.push(`wire ${nw.id} does not end on a ground symbol`);
			} else {
				const dot = name.indexOf('.');
				const part = dot < 0 ? name : name.slice(0, dot);
				const pin = dot < 0 ? name : name.slice(dot + 1);
				const xy = d.parts.find((p) => p.id === part && !p.synthetic)?.pins[pin];
				if (!xy || xy.x !== at[0] || xy.y !== at[1]) out.push(`wire ${nw.id} does not end on ${name}`);
			}
		}
	}
	return out;
}
