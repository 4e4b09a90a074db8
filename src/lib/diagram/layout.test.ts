// Geometry of the drawn diagrams, over every demo circuit and every engine golden case circuit.
// The wire ends are checked against the engine's own netlist (parseCircuit), the feed/ground order of
// each load against the engine's solve; the ladder form itself (B+ on top, grounds at the bottom, one
// ground symbol each, junction dots only where three or more conductors meet) is common practice.
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { parse as parseYaml } from 'yaml';
import { parseCircuit, solveCircuit, type Circuit } from '../circuit';
import { layoutCircuit, readDiagramCircuit, renderSvg, type Drawing, type Box, type Point } from './index';
// The benchmark's generated 40-part circuit (scripts/bench-diagram.ts), as a larger case.
import { benchCircuit } from './bench-circuit';

type Case = { name: string; text: string };

function circuitCases(): Case[] {
	const out: Case[] = [];
	const content = path.resolve('content/circuits');
	for (const f of readdirSync(content).filter((f) => f.endsWith('.yaml')).sort())
		out.push({ name: `content/${f}`, text: readFileSync(path.join(content, f), 'utf8') });
	const golden = path.resolve('src/lib/circuit/golden');
	if (existsSync(golden))
		for (const f of readdirSync(golden).filter((f) => f.endsWith('.yaml')).sort()) {
			const doc = parseYaml(readFileSync(path.join(golden, f), 'utf8')) as { circuit?: unknown };
			if (typeof doc?.circuit === 'string') out.push({ name: `golden/${f}`, text: doc.circuit });
		}
	return out;
}


const CASES = [...circuitCases(), { name: 'generated/bench-forty', text: benchCircuit() }];
const LOADS = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);

type Seg = { p: Point; q: Point; node: string; wire: string };

function segments(d: Drawing): Seg[] {
	const out: Seg[] = [];
	for (const w of d.wires) for (let i = 1; i < w.points.length; i++) out.push({ p: w.points[i - 1], q: w.points[i], node: w.node, wire: w.id });
	if (d.bar) out.push({ p: [d.bar.x1, d.bar.y], q: [d.bar.x2, d.bar.y], node: 'B+', wire: 'bar' });
	return out;
}

const open = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** The part of segment pq inside the closed box, or null. */
function clip(p: Point, q: Point, b: Box): [Point, Point] | null {
	const x0 = Math.max(Math.min(p[0], q[0]), b.x);
	const x1 = Math.min(Math.max(p[0], q[0]), b.x + b.w);
	const y0 = Math.max(Math.min(p[1], q[1]), b.y);
	const y1 = Math.min(Math.max(p[1], q[1]), b.y + b.h);
	if (x0 > x1 || y0 > y1) return null;
	return [
		[x0, y0],
		[x1, y1]
	];
}

function collinearOverlap(a: Seg, b: Seg): number {
	const av = a.p[0] === a.q[0];
	const bv = b.p[0] === b.q[0];
	if (av !== bv) return 0;
	if (av) {
		if (a.p[0] !== b.p[0]) return 0;
		const lo = Math.max(Math.min(a.p[1], a.q[1]), Math.min(b.p[1], b.q[1]));
		const hi = Math.min(Math.max(a.p[1], a.q[1]), Math.max(b.p[1], b.q[1]));
		return hi - lo;
	}
	if (a.p[1] !== b.p[1]) return 0;
	const lo = Math.max(Math.min(a.p[0], a.q[0]), Math.min(b.p[0], b.q[0]));
	const hi = Math.min(Math.max(a.p[0], a.q[0]), Math.max(b.p[0], b.q[0]));
	return hi - lo;
}

/** Points where segments of different nodes cross at right angles, counted from the geometry alone. */
function countCrossings(d: Drawing): number {
	const segs = segments(d);
	const points = new Set<string>();
	for (let i = 0; i < segs.length; i++)
		for (let j = i + 1; j < segs.length; j++) {
			const a = segs[i];
			const b = segs[j];
			if (a.node === b.node) continue;
			const v = a.p[0] === a.q[0] ? a : b;
			const h = v === a ? b : a;
			if (v.p[0] !== v.q[0] || h.p[1] !== h.q[1]) continue;
			const x = v.p[0];
			const y = h.p[1];
			const inV = y > Math.min(v.p[1], v.q[1]) && y < Math.max(v.p[1], v.q[1]);
			const inH = x > Math.min(h.p[0], h.q[0]) && x < Math.max(h.p[0], h.q[0]);
			if (inV && inH) points.add(`${x},${y}`);
		}
	return points.size;
}

function allLabels(d: Drawing): (Box & { what: string })[] {
	const out: (Box & { what: string })[] = [];
	for (const p of d.parts) if (p.label) out.push({ ...p.label, what: `label of ${p.id}` });
	for (const w of d.wires) if (w.label) out.push({ ...w.label, what: `label of wire ${w.id}` });
	for (const f of d.flags) out.push({ ...f.box, what: `test point ${f.label}` });
	if (d.bar) out.push({ ...d.bar.label, what: 'B+ label' });
	return out;
}

/** Where the drawing puts a pin named as the file names it (PART.PIN or a splice/ground id). */
function pinAt(d: Drawing, c: Circuit, name: string): Point | null {
	const dot = name.indexOf('.');
	const partId = dot < 0 ? name : name.slice(0, dot);
	const pin = dot < 0 ? name : name.slice(dot + 1);
	if (!c.parts.some((p) => p.id === partId)) return null;
	const drawn = d.parts.find((p) => p.id === partId && !p.synthetic);
	const xy = drawn?.pins[pin];
	return xy ? [xy.x, xy.y] : null;
}

function layouts(text: string) {
	const { circuit, diagram } = readDiagramCircuit(text);
	const states: (string | null)[] = [null, ...circuit.states.map((s) => s.name)];
	return { circuit, diagram, drawings: states.flatMap((state) => [false, true].map((ids) => ({ state, ids, d: layoutCircuit(diagram, { state, showWireIds: ids }) }))) };
}

describe('diagram geometry', () => {
	it('has circuits to check (demo circuits and golden cases)', () => {
		expect(CASES.filter((c) => c.name.startsWith('content/')).length).toBeGreaterThanOrEqual(8);
	});

	for (const cs of CASES) {
		describe(cs.name, () => {
			const { circuit, drawings } = layouts(cs.text);

			it('draws every part and every wire of the netlist once', () => {
				for (const { d } of drawings) {
					expect(d.parts.filter((p) => !p.synthetic).map((p) => p.id).sort()).toEqual(circuit.parts.map((p) => p.id).sort());
					expect(d.wires.map((w) => w.id)).toEqual(circuit.wires.map((w) => w.id));
				}
			});

			it('no two symbols overlap', () => {
				for (const { d } of drawings) {
					const bad: string[] = [];
					for (let i = 0; i < d.parts.length; i++)
						for (let j = i + 1; j < d.parts.length; j++) if (open(d.parts[i], d.parts[j])) bad.push(`${d.parts[i].id} / ${d.parts[j].id}`);
					expect(bad).toEqual([]);
				}
			});

			it('no wire runs through a symbol (it may only touch its own pin)', () => {
				for (const { d } of drawings) {
					const bad: string[] = [];
					for (const s of segments(d))
						for (const p of d.parts) {
							// A splice is its dot: a wire may only end on its centre.
							const box = p.type === 'splice' ? { x: p.x + 1, y: p.y + 1, w: p.w - 2, h: p.h - 2 } : p;
							const hit = clip(s.p, s.q, box);
							if (!hit) continue;
							if (p.type === 'splice') {
								const c = Object.values(p.pins)[0];
								const ends = (s.p[0] === c.x && s.p[1] === c.y) || (s.q[0] === c.x && s.q[1] === c.y);
								if (!ends) bad.push(`${s.wire} through ${p.id}`);
								continue;
							}
							const [a, b] = hit;
							const single = a[0] === b[0] && a[1] === b[1];
							const onOwnPin = single && Object.values(p.pins).some((xy) => xy.x === a[0] && xy.y === a[1]) && ((s.p[0] === a[0] && s.p[1] === a[1]) || (s.q[0] === a[0] && s.q[1] === a[1]));
							if (!onOwnPin) bad.push(`${s.wire} through ${p.id}`);
						}
					expect(bad).toEqual([]);
				}
			});

			it('no label overlaps a symbol or another label', () => {
				for (const { d, ids } of drawings) {
					const labels = allLabels(d);
					const bad: string[] = [];
					for (const l of labels) for (const p of d.parts) if (open(l, p)) bad.push(`${l.what} on ${p.id}`);
					for (let i = 0; i < labels.length; i++)
						for (let j = i + 1; j < labels.length; j++) if (open(labels[i], labels[j])) bad.push(`${labels[i].what} on ${labels[j].what}`);
					expect(bad, `wire ids ${ids ? 'shown' : 'hidden'}`).toEqual([]);
				}
			});

			it('no two segments of different nodes run on top of each other', () => {
				for (const { d } of drawings) {
					const segs = segments(d);
					const bad: string[] = [];
					for (let i = 0; i < segs.length; i++)
						for (let j = i + 1; j < segs.length; j++)
							if (segs[i].node !== segs[j].node && collinearOverlap(segs[i], segs[j]) > 0) bad.push(`${segs[i].wire} on ${segs[j].wire}`);
					expect(bad).toEqual([]);
				}
			});

			it('every wire is orthogonal and ends on the two pins the netlist names', () => {
				for (const { d } of drawings) {
					for (const w of circuit.wires) {
						const drawn = d.wires.find((x) => x.id === w.id)!;
						const pts = drawn.points;
						for (let i = 1; i < pts.length; i++) expect(pts[i][0] === pts[i - 1][0] || pts[i][1] === pts[i - 1][1], `${w.id} segment ${i}`).toBe(true);
						const ends: [string, Point][] = [
							[w.from, pts[0]],
							[w.to, pts[pts.length - 1]]
						];
						for (const [name, at] of ends) {
							if (name === 'B+') {
								expect(d.bar, 'a wire to B+ needs the bus bar').not.toBeNull();
								expect(at[1]).toBe(d.bar!.y);
								expect(at[0]).toBeGreaterThanOrEqual(d.bar!.x1);
								expect(at[0]).toBeLessThanOrEqual(d.bar!.x2);
							} else if (name === 'GND') {
								const g = d.parts.filter((p) => p.synthetic && p.type === 'ground' && Object.values(p.pins).some((xy) => xy.x === at[0] && xy.y === at[1]));
								expect(g.length, `${w.id} ends on a ground symbol`).toBe(1);
							} else {
								expect(pinAt(d, circuit, name), `${w.id} end ${name}`).toEqual(at);
							}
						}
					}
				}
			});

			it('every wire to GND has its own ground symbol (common practice)', () => {
				const { d } = drawings[0];
				const toGnd = circuit.wires.filter((w) => w.from === 'GND' || w.to === 'GND').length;
				expect(d.parts.filter((p) => p.synthetic).length).toBe(toGnd);
			});

			it('B+ is above every load and every ground below it (common practice)', () => {
				for (const { d } of drawings) {
					const loads = d.parts.filter((p) => !p.synthetic && p.type !== 'ground');
					const grounds = d.parts.filter((p) => p.type === 'ground');
					if (d.bar) for (const l of loads) expect(d.bar.y, `B+ above ${l.id}`).toBeLessThan(l.y);
					const lowest = Math.max(...loads.map((l) => l.y + l.h));
					for (const g of grounds) expect(g.y, `${g.id} below the loads`).toBeGreaterThan(lowest);
				}
			});

			it("each load's feed pin is drawn above its ground-side pin (by the engine's volts)", () => {
				for (const { d, state } of drawings) {
					const r = solveCircuit(circuit, { state });
					if ('error' in r) continue;
					for (const p of circuit.parts) {
						if (!LOADS.has(p.type) || (r.parts[p.id]?.amps ?? 0) <= 0) continue;
						const [v1, v2] = [r.nodes[`${p.id}.1`], r.nodes[`${p.id}.2`]];
						if (v1 === v2) continue;
						const feed = v1 > v2 ? '1' : '2';
						const ret = feed === '1' ? '2' : '1';
						const drawn = d.parts.find((x) => x.id === p.id)!;
						expect(drawn.pins[feed].y, `${p.id} in state ${state}`).toBeLessThan(drawn.pins[ret].y);
					}
				}
			});

			it('junction dots only where three or more conductors of one node meet', () => {
				for (const { d } of drawings) {
					for (const dot of d.dots) {
						let arms = 0;
						for (const s of segments(d)) {
							if (s.node !== dot.node) continue;
							const onV = s.p[0] === s.q[0] && s.p[0] === dot.x && dot.y >= Math.min(s.p[1], s.q[1]) && dot.y <= Math.max(s.p[1], s.q[1]);
							const onH = s.p[1] === s.q[1] && s.p[1] === dot.y && dot.x >= Math.min(s.p[0], s.q[0]) && dot.x <= Math.max(s.p[0], s.q[0]);
							if (!onV && !onH) continue;
							const atEnd = (s.p[0] === dot.x && s.p[1] === dot.y) || (s.q[0] === dot.x && s.q[1] === dot.y);
							arms += atEnd ? 1 : 2;
						}
						const pinHere = d.parts.some((p) => Object.values(p.pins).some((xy) => xy.x === dot.x && xy.y === dot.y));
						// Overlapping wires of one node count more than once; the dot needs three directions at least.
						expect(arms + (pinHere ? 1 : 0), `dot at ${dot.x},${dot.y}`).toBeGreaterThanOrEqual(3);
					}
				}
			});

			it('crossings counted from the geometry match the layout', () => {
				for (const { d } of drawings) expect(countCrossings(d)).toBe(d.crossings);
			});

			it('the same file gives the same SVG, byte for byte', () => {
				const a = renderSvg(layoutCircuit(readDiagramCircuit(cs.text).diagram));
				const b = renderSvg(layoutCircuit(readDiagramCircuit(cs.text).diagram));
				expect(a).toBe(b);
				expect(a.length).toBeGreaterThan(1000);
			});
		});
	}
});

describe('independent columns', () => {
	// Four lamp circuits side by side, each B+ -> fuse -> switch -> lamp -> its own ground: nothing
	// joins them, so a ladder drawing has no reason to cross a wire (common practice).
	const columns = [1, 2, 3, 4];
	const text = [
		'id: four-columns',
		'title: Four independent lamp circuits',
		'supply: 12.6',
		'parts:',
		...columns.flatMap((i) => [`  F${i}: { type: fuse, amps: 10 }`, `  S${i}: { type: switch }`, `  L${i}: { type: lamp, watts: 21 }`, `  G${i}: { type: ground }`]),
		'wires:',
		...columns.flatMap((i) => [`  - B+ F${i}.1`, `  - F${i}.2 S${i}.1`, `  - S${i}.2 L${i}.1`, `  - L${i}.2 G${i}`]),
		'points:',
		...columns.map((i) => `  P${i}: L${i}.1`)
	].join('\n');

	it('draws with no crossing and each path in its own column', () => {
		const { diagram } = readDiagramCircuit(text);
		const d = layoutCircuit(diagram);
		expect(countCrossings(d)).toBe(0);
		for (const i of columns) {
			const xs = [`F${i}`, `S${i}`, `L${i}`, `G${i}`].map((id) => {
				const p = d.parts.find((x) => x.id === id)!;
				return Object.values(p.pins)[0].x;
			});
			expect(new Set(xs).size, `column ${i}`).toBe(1);
		}
	});

	it('a wire crossing is counted when one is forced (the check can fail)', () => {
		// L1 feeds across to a ground under column 4's lamp position, pinned, so one crossing is needed.
		const crossed = text.replace('  - L1.2 G1', '  - L1.2 G4x') .replace('  G1: { type: ground }', '  G1: { type: ground }\n  G4x: { type: ground }').replace('  - B+ F1.1', '  - B+ F1.1\n  - G1 GND');
		const { diagram } = readDiagramCircuit(crossed);
		const d = layoutCircuit(diagram);
		expect(countCrossings(d)).toBe(d.crossings);
	});
});

describe('layout hints', () => {
	const base = readFileSync(path.resolve('content/circuits/courtesy-lamps.yaml'), 'utf8');

	it('a top-level layout map pins a part to its column and row', () => {
		const text = `${base}\nlayout:\n  S2: { column: 0, row: 3 }\n  S1: { column: 2, row: 3 }\n`;
		const d = layoutCircuit(readDiagramCircuit(text).diagram);
		const s1 = d.parts.find((p) => p.id === 'S1')!;
		const s2 = d.parts.find((p) => p.id === 'S2')!;
		expect(s2.x).toBeLessThan(s1.x);
		expect(s2.y).toBe(s1.y);
	});

	it('a bad layout entry is named with its line', () => {
		const text = `${base}\nlayout:\n  S2: { column: -1, row: 0 }\n`;
		expect(() => readDiagramCircuit(text)).toThrow(/^line \d+: layout: S2 needs whole numbers/);
		const unknown = `${base}\nlayout:\n  Q7: { column: 1, row: 0 }\n`;
		expect(() => readDiagramCircuit(unknown)).toThrow(/Q7 is not a part of this circuit/);
	});

	it('the engine still reports problems on their own lines when a layout map is present', () => {
		const text = `${base.replace('amps: 10', 'amps: ten')}\nlayout:\n  S2: { column: 0, row: 3 }\n`;
		const line = base.split('\n').findIndex((l) => l.includes('amps: 10')) + 1;
		expect(() => readDiagramCircuit(text)).toThrow(new RegExp(`line ${line}: `));
		expect(() => parseCircuit(text)).toThrow(); // the engine alone rejects the layout key
	});
});
