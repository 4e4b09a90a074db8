/**
 * Ladder layout of a circuit: B+ as a bus bar at the top, each current path a lane running down,
 * each part's feed pin on top, grounds in a band at the bottom, a relay's coil lane beside its contact
 * lane. Placement is a depth-first walk from B+ (file order), so the same file always gives the same
 * drawing; wires are then routed orthogonally on a 10 px grid (see `route.ts`).
 *
 * Pure: no DOM, no framework.
 */
import {
	listLanes,
	listPins,
	partName,
	pinKey,
	readEndpoint,
	valueText,
	wireName,
	typeWord,
	type DiagramCircuit,
	type DiagramPart,
	type DiagramWire,
	type PartType
} from './model';
import { buildSymbol, GRID, legendSymbol, type SymbolShape } from './symbols';
import { RouteGrid, simplifyPath, type RouteEnd } from './route';

export type Box = { x: number; y: number; w: number; h: number };
export type Point = [number, number];

export type DrawnLabel = Box & { lines: string[]; kind: 'part' | 'wire' | 'flag' | 'bar'; owner: string };

export type DrawnPart = Box & {
	id: string;
	type: PartType;
	/** True for the ground symbol drawn at the end of a wire to GND (not a part of the file). */
	synthetic: boolean;
	name: string;
	body: string;
	pins: Record<string, { x: number; y: number }>;
	subs: (Box & { id: string })[];
	label: DrawnLabel | null;
	/** Switch setting drawn, for the accessible name and live mode. */
	setting: string | null;
};

export type DrawnWire = {
	id: string;
	/** The electrical node the wire belongs to (its canonical name). */
	node: string;
	from: string;
	to: string;
	color?: string;
	name: string;
	points: Point[];
	label: DrawnLabel | null;
};

/** A test-point flag: a pill of half-height `r` and half-width `hw` centred on (cx, cy), with a leader to `anchor`. */
export type DrawnFlag = { label: string; node: string; target: string; anchor: Point; cx: number; cy: number; r: number; hw: number; box: DrawnLabel };

export type LegendEntry = { key: string; text: string; x: number; y: number; shape: SymbolShape | null; kind: 'symbol' | 'dot' | 'flag' | 'bar' };

export type Drawing = {
	id: string;
	title: string;
	width: number;
	height: number;
	parts: DrawnPart[];
	wires: DrawnWire[];
	dots: { x: number; y: number; node: string }[];
	bar: { x1: number; x2: number; y: number; label: DrawnLabel } | null;
	flags: DrawnFlag[];
	legend: LegendEntry[];
	legendTop: number;
	/** Every file node name (pin keys, B+, GND) -> canonical node name. */
	nodeOf: Record<string, string>;
	/** Number of perpendicular crossings of wires of different nodes. */
	crossings: number;
};

export type LayoutOptions = {
	/** State whose switch settings are drawn; null = defaults. */
	state?: string | null;
	/** Relays drawn pulled in (from a solve). */
	energized?: ReadonlySet<string>;
	/** Print each wire's id beside it. */
	showWireIds?: boolean;
	/** Fuses and links drawn blown, breakers tripped (from a solve). */
	blown?: ReadonlySet<string>;
};

export class DiagramLayoutError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'DiagramLayoutError';
	}
}

const FONT_PART = 11;
const CHAR_W_PART = 6.6; // JetBrains Mono advance is 0.6 em
const LINE_H_PART = 13;
const FONT_WIRE = 10;
const CHAR_W_WIRE = 6;
const LINE_H_WIRE = 12;
export const LABEL_FONTS = { part: FONT_PART, wire: FONT_WIRE, lineHeight: LINE_H_PART, wireLineHeight: LINE_H_WIRE };

const MARGIN = 20;
const MIN_WIDTH = 340;
const BAR_Y = 40;
const ROW0_Y = 90;
const ROW_H = 60;
const snap = (v: number) => Math.round(v / GRID) * GRID;
const snapUp = (v: number) => Math.ceil(v / GRID) * GRID;

type Placed = { lanes: number[]; row: number; top: Set<string> };

/** Union-find of node names joined by wires. */
class Nodes {
	private parent = new Map<string, string>();
	find(a: string): string {
		let p = this.parent.get(a);
		if (p === undefined) {
			this.parent.set(a, a);
			return a;
		}
		if (p === a) return a;
		p = this.find(p);
		this.parent.set(a, p);
		return p;
	}
	union(a: string, b: string) {
		const ra = this.find(a);
		const rb = this.find(b);
		if (ra === rb) return;
		// The canonical name is chosen later (B+, GND, else the first member in file order).
		this.parent.set(ra, rb);
	}
}

function settingOf(c: DiagramCircuit, part: DiagramPart, state: string | null | undefined): string | null {
	if (part.type !== 'switch') return null;
	const s = state ? c.states[state]?.[part.id] : undefined;
	if (typeof s === 'string') return s;
	if (part.positions) return Object.keys(part.positions)[0] ?? null;
	return part.normally ?? 'open';
}

function labelLines(part: DiagramPart, setting: string | null): string[] {
	const lines = [part.id];
	const v = valueText(part);
	if (v) lines.push(v);
	if (part.type === 'switch' && part.positions) {
		lines.push(Object.keys(part.positions).map((p) => (p === setting ? `[${p}]` : p)).join(' '));
	} else if (part.type === 'switch' && setting) lines.push(setting);
	return lines;
}

function boxOverlap(a: Box, b: Box, pad = 0): boolean {
	return a.x < b.x + b.w + pad && b.x < a.x + a.w + pad && a.y < b.y + b.h + pad && b.y < a.y + a.h + pad;
}

function segBoxHit(p: Point, q: Point, b: Box): boolean {
	const x0 = Math.min(p[0], q[0]);
	const x1 = Math.max(p[0], q[0]);
	const y0 = Math.min(p[1], q[1]);
	const y1 = Math.max(p[1], q[1]);
	return x0 < b.x + b.w && b.x < x1 + (x0 === x1 ? 0.001 : 0) && y0 < b.y + b.h && b.y < y1 + (y0 === y1 ? 0.001 : 0);
}

/** Lays out a circuit. Throws DiagramLayoutError when a wire cannot be drawn. */
export function layoutCircuit(c: DiagramCircuit, opts: LayoutOptions = {}): Drawing {
	let lastError: DiagramLayoutError | null = null;
	for (const gap of [30, 50, 80]) {
		try {
			return layoutOnce(c, opts, gap);
		} catch (e) {
			if (e instanceof DiagramLayoutError) lastError = e;
			else throw e;
		}
	}
	throw lastError!;
}

function layoutOnce(c: DiagramCircuit, opts: LayoutOptions, gap: number): Drawing {
	const parts = new Map(c.parts.map((p) => [p.id, p] as const));
	const nodes = new Nodes();
	nodes.find('B+');
	nodes.find('GND');
	const keyOfEnd = (name: string): string => {
		const e = readEndpoint(name);
		if (e.kind === 'battery') return 'B+';
		if (e.kind === 'chassis') return 'GND';
		const p = parts.get(e.part);
		return p ? pinKey(p, e.pin) : name;
	};
	for (const p of c.parts) for (const pin of listPins(p)) nodes.find(pinKey(p, pin));
	for (const w of c.wires) nodes.union(keyOfEnd(w.from), keyOfEnd(w.to));
	// Canonical node name: B+ / GND, else the first member in file order.
	const canon = new Map<string, string>();
	const members: string[] = ['B+', 'GND'];
	for (const p of c.parts) for (const pin of listPins(p)) members.push(pinKey(p, pin));
	for (const m of members) {
		const r = nodes.find(m);
		if (!canon.has(r)) canon.set(r, m);
	}
	const nodeOfKey = (k: string) => canon.get(nodes.find(k)) ?? k;

	// Pins on each node, in part file order.
	const onNode = new Map<string, { part: DiagramPart; pin: string }[]>();
	for (const p of c.parts)
		for (const pin of listPins(p)) {
			const n = nodeOfKey(pinKey(p, pin));
			if (!onNode.has(n)) onNode.set(n, []);
			onNode.get(n)!.push({ part: p, pin });
		}

	// Distance from B+ in parts crossed, for orienting parts the walk does not reach from above.
	const dist = new Map<string, number>();
	{
		const queue: string[] = ['B+'];
		dist.set('B+', 0);
		while (queue.length) {
			const n = queue.shift()!;
			const d = dist.get(n)!;
			for (const { part } of onNode.get(n) ?? []) {
				if (part.type === 'ground') continue;
				for (const pin of listPins(part)) {
					const m = nodeOfKey(pinKey(part, pin));
					if (!dist.has(m)) {
						dist.set(m, d + 1);
						queue.push(m);
					}
				}
			}
		}
	}
	const dOf = (p: DiagramPart, pin: string) => dist.get(nodeOfKey(pinKey(p, pin))) ?? 1e9;
	// Return nodes: GND and every node with a ground part. The walk never goes down through them.
	const groundNodes = new Set<string>(['GND']);
	for (const p of c.parts) if (p.type === 'ground') groundNodes.add(nodeOfKey(p.id));
	const distG = new Map<string, number>();
	{
		const queue = [...groundNodes];
		for (const g of queue) distG.set(g, 0);
		while (queue.length) {
			const n = queue.shift()!;
			const d = distG.get(n)!;
			for (const { part } of onNode.get(n) ?? []) {
				for (const pin of listPins(part)) {
					const m = nodeOfKey(pinKey(part, pin));
					if (!distG.has(m)) {
						distG.set(m, d + 1);
						queue.push(m);
					}
				}
			}
		}
	}
	/** Lower is nearer the feed: distance from B+ minus distance from ground. */
	const feedScore = (p: DiagramPart, pin: string) => {
		const n = nodeOfKey(pinKey(p, pin));
		return (dist.get(n) ?? 1e6) - (distG.get(n) ?? 1e6);
	};
	const entersFromReturn = (q: DiagramPart, qp: string) => {
		const pins = listPins(q);
		if (pins.length !== 2 || q.type === 'supply') return false;
		const other = pins[0] === qp ? pins[1] : pins[0];
		return feedScore(q, qp) > feedScore(q, other);
	};

	// --- Placement: lanes (columns) in an ordered list, rows from the top.
	const order: number[] = [];
	let nextId = 0;
	const newColAtEnd = () => {
		order.push(nextId);
		return nextId++;
	};
	const newColAfter = (col: number) => {
		order.splice(order.indexOf(col) + 1, 0, nextId);
		return nextId++;
	};
	const newColBefore = (col: number) => {
		order.splice(order.indexOf(col), 0, nextId);
		return nextId++;
	};
	const cells = new Map<string, string>();
	const cellKey = (col: number, row: number) => `${col},${row}`;
	const placed = new Map<string, Placed>();
	const expanded = new Set<string>();

	const orient = (part: DiagramPart, entry: string | null): Set<string> => {
		const pins = listPins(part);
		const byD = (a: string, b: string) => feedScore(part, a) - feedScore(part, b) || pins.indexOf(a) - pins.indexOf(b);
		switch (part.type) {
			case 'relay': {
				const coilTop = entry === '85' || entry === '86' ? entry : ['86', '85'].sort(byD)[0];
				return new Set([coilTop, '30']);
			}
			case 'connector': {
				const side = entry ? entry.slice(-1) : dOf(part, '1b') < dOf(part, '1a') ? 'b' : 'a';
				return new Set(pins.filter((p) => p.endsWith(side)));
			}
			case 'supply':
				return new Set(['+']);
			case 'splice':
			case 'ground':
				return new Set(pins);
			default:
				return new Set([entry ?? pins.slice().sort(byD)[0]]);
		}
	};

	// Pinned parts first: their lanes are created in pinned-column order, before any automatic lane.
	const pinnedCols = new Map<number, number>();
	const pinnedCol = (n: number) => {
		if (!pinnedCols.has(n)) {
			const wanted = [...pinnedCols.keys(), n].sort((a, b) => a - b);
			const idx = wanted.indexOf(n);
			const col = nextId++;
			order.splice(idx, 0, col);
			pinnedCols.set(n, col);
		}
		return pinnedCols.get(n)!;
	};
	for (const p of c.parts) {
		if (!p.layout || p.type === 'ground') continue;
		const nl = listLanes(p).length;
		const lanes: number[] = [];
		for (let i = 0; i < nl; i++) lanes.push(pinnedCol(p.layout.column + i));
		const row = Math.max(0, p.layout.row);
		if (lanes.some((l) => cells.has(cellKey(l, row)))) continue; // two parts pinned on one cell: the later one is placed automatically
		for (const l of lanes) cells.set(cellKey(l, row), p.id);
		placed.set(p.id, { lanes, row, top: orient(p, null) });
	}

	const freeAt = (col: number, row: number) => !cells.has(cellKey(col, row));

	/** Lane for a part that starts a new branch: above an already placed child if the cell is free. */
	const adoptLane = (part: DiagramPart, top: Set<string>, row: number): number | null => {
		for (const pin of listPins(part)) {
			if (top.has(pin)) continue;
			for (const { part: q, pin: qp } of onNode.get(nodeOfKey(pinKey(part, pin))) ?? []) {
				const pq = placed.get(q.id);
				if (!pq || q.id === part.id || !pq.top.has(qp) || pq.row <= row) continue;
				const li = listLanes(q).findIndex((l) => l.includes(qp));
				const lane = pq.lanes[li];
				if (listLanes(part).length === 1 && freeAt(lane, row)) return lane;
			}
		}
		return null;
	};

	const place = (part: DiagramPart, entry: string | null, col: number | null, row: number) => {
		const top = orient(part, entry);
		if (part.type === 'splice') {
			// A splice goes below every placed part that feeds it from above, in the deepest feeder's lane.
			let deepest: { row: number; lane: number } | null = null;
			for (const { part: q, pin: qp } of onNode.get(nodeOfKey(part.id)) ?? []) {
				const pq = placed.get(q.id);
				if (!pq || q.id === part.id || pq.top.has(qp)) continue;
				const li = Math.max(0, listLanes(q).findIndex((l) => l.includes(qp)));
				if (!deepest || pq.row > deepest.row) deepest = { row: pq.row, lane: pq.lanes[li] };
			}
			if (deepest && deepest.row >= row) {
				row = deepest.row + 1;
				col = freeAt(deepest.lane, row) ? deepest.lane : null;
			}
		}
		const lanesOf = listLanes(part);
		const k = lanesOf.length;
		const j = Math.max(0, entry ? lanesOf.findIndex((l) => l.includes(entry)) : 0);
		let base = col ?? adoptLane(part, top, row);
		if (base === null || !freeAt(base, row)) base = newColAtEnd();
		const lanes: number[] = new Array(k);
		lanes[j] = base;
		for (let i = j + 1; i < k; i++) lanes[i] = newColAfter(lanes[i - 1]);
		for (let i = j - 1; i >= 0; i--) lanes[i] = newColBefore(lanes[i + 1]);
		for (const l of lanes) cells.set(cellKey(l, row), part.id);
		placed.set(part.id, { lanes, row, top });
	};

	const visit = (part: DiagramPart, entry: string | null, col: number | null, row: number) => {
		if (part.type === 'ground') return;
		if (!placed.has(part.id)) place(part, entry, col, row);
		if (expanded.has(part.id)) return;
		expanded.add(part.id);
		const me = placed.get(part.id)!;
		const lanesOf = listLanes(part);
		const childBearing = listPins(part).filter((p) => !me.top.has(p) || part.type === 'splice' || part.type === 'supply');
		// Place every child first, then walk into each: siblings stay side by side on one row.
		const toExpand: { q: DiagramPart; qp: string }[] = [];
		for (const pin of childBearing) {
			const li = Math.max(0, lanesOf.findIndex((l) => l.includes(pin)));
			let first = part.type !== 'supply' || pin !== '+';
			const nodeName = nodeOfKey(pinKey(part, pin));
			if (groundNodes.has(nodeName)) continue;
			const here = onNode.get(nodeName) ?? [];
			// A splice on this node comes next; the node's other parts hang below the splice.
			const splices = part.type === 'splice' ? [] : here.filter(({ part: q }) => q.type === 'splice');
			for (const { part: q, pin: qp } of splices.length ? splices : here) {
				if (q.id === part.id || q.type === 'ground') continue;
				if (!placed.has(q.id) && entersFromReturn(q, qp)) continue;
				if (!placed.has(q.id)) {
					const lane = me.lanes[li];
					const useLane = first && freeAt(lane, me.row + 1) ? lane : null;
					first = false;
					place(q, qp, useLane, me.row + 1);
				}
				toExpand.push({ q, qp });
			}
		}
		for (const { q, qp } of toExpand) if (!expanded.has(q.id)) visit(q, qp, null, placed.get(q.id)!.row);
	};

	// Roots: parts wired straight to B+, in wire order; then supply parts; then whatever is left.
	const bplus = onNode.get('B+') ?? [];
	const wireOrder = new Map<string, number>();
	c.wires.forEach((w, i) => {
		for (const end of [w.from, w.to]) {
			const k = keyOfEnd(end);
			if (!wireOrder.has(k)) wireOrder.set(k, i);
		}
	});
	const roots = bplus
		.slice()
		.sort((a, b) => (wireOrder.get(pinKey(a.part, a.pin)) ?? 1e9) - (wireOrder.get(pinKey(b.part, b.pin)) ?? 1e9));
	for (const { part, pin } of roots) visit(part, pin, null, placed.get(part.id)?.row ?? 0);
	for (const p of c.parts) if (p.type === 'supply' && !expanded.has(p.id)) visit(p, '+', null, placed.get(p.id)?.row ?? 0);
	for (const p of c.parts) {
		if (p.type === 'ground' || expanded.has(p.id)) continue;
		const pins = listPins(p);
		const entry = pins.slice().sort((a, b) => feedScore(p, a) - feedScore(p, b) || pins.indexOf(a) - pins.indexOf(b))[0] ?? null;
		const d = entry ? dOf(p, entry) : 1e9;
		visit(p, entry, null, placed.get(p.id)?.row ?? (d < 1e9 ? Math.max(0, d - 1) : 0));
	}

	// --- Symbols and lane positions.
	const state = opts.state ?? null;
	const settings = new Map(c.parts.map((p) => [p.id, settingOf(c, p, state)] as const));
	const labels = new Map(c.parts.map((p) => [p.id, labelLines(p, settings.get(p.id) ?? null)] as const));
	// Sized for the widest setting, so toggling a switch never moves the drawing.
	const sizingLines = new Map(c.parts.map((p) => [p.id, p.type === 'switch' && !p.positions ? labelLines(p, 'closed') : labels.get(p.id)!] as const));
	const labelSize = (lines: string[]) => ({
		w: Math.ceil(Math.max(...lines.map((l) => l.length)) * CHAR_W_PART) + 2,
		h: lines.length * LINE_H_PART
	});
	const colIndex = new Map(order.map((col, i) => [col, i] as const));
	const nCols = order.length;
	const minPitch = new Array(nCols).fill(0); // between lane i-1 and i
	const rightExt = new Array(nCols).fill(10);
	const leftExt = new Array(nCols).fill(10);
	const rowsUsed = new Set<number>();
	for (const p of c.parts) {
		const pl = placed.get(p.id);
		if (!pl) continue;
		rowsUsed.add(pl.row);
		const idx = pl.lanes.map((l) => colIndex.get(l)!);
		const proto = buildSymbol(p, { top: pl.top, pitch: 40, setting: settings.get(p.id), energized: opts.energized?.has(p.id) });
		const ls = labelSize(sizingLines.get(p.id)!);
		const first = idx[0];
		const last = idx[idx.length - 1];
		leftExt[first] = Math.max(leftExt[first], proto.laneX[0]);
		const right = proto.w - proto.laneX[proto.laneX.length - 1] + 6 + ls.w;
		rightExt[last] = Math.max(rightExt[last], right);
		for (let i = 1; i < idx.length; i++) {
			const need = p.type === 'relay' ? 40 : 30;
			for (let k = idx[i - 1] + 1; k <= idx[i]; k++) minPitch[k] = Math.max(minPitch[k], need);
		}
	}
	const axis: number[] = new Array(nCols).fill(0);
	for (let i = 0; i < nCols; i++) {
		if (i === 0) axis[i] = snapUp(MARGIN + leftExt[0] + 10);
		else axis[i] = axis[i - 1] + Math.max(minPitch[i], snapUp(rightExt[i - 1] + gap + leftExt[i]));
	}
	// Rows actually used, compacted.
	const rowList = [...rowsUsed].sort((a, b) => a - b);
	const rowY = new Map<number, number>();
	rowList.forEach((r, i) => rowY.set(r, ROW0_Y + i * (ROW_H + gap + 20)));
	const lastRowBottom = rowList.length ? ROW0_Y + (rowList.length - 1) * (ROW_H + gap + 20) + ROW_H : ROW0_Y;
	const groundY = snapUp(lastRowBottom + gap + 20);

	const drawn: DrawnPart[] = [];
	const drawnById = new Map<string, DrawnPart>();
	for (const p of c.parts) {
		const pl = placed.get(p.id);
		if (!pl) continue;
		const idx = pl.lanes.map((l) => colIndex.get(l)!);
		const pitch = idx.length > 1 ? axis[idx[1]] - axis[idx[0]] : 40;
		const shape = buildSymbol(p, { top: pl.top, pitch, setting: settings.get(p.id), energized: opts.energized?.has(p.id), blown: opts.blown?.has(p.id) });
		const x = axis[idx[0]] - shape.laneX[0];
		const y = rowY.get(pl.row)! + (ROW_H - shape.h) / 2;
		const dp = makePart(p, shape, x, y, labels.get(p.id)!, settings.get(p.id) ?? null, labelSize, sizingLines.get(p.id)!);
		drawn.push(dp);
		drawnById.set(p.id, dp);
	}

	// --- Grounds: ground parts and one symbol per wire to GND, under the pin they serve.
	const pinXY = (name: string): { x: number; y: number } | null => {
		const e = readEndpoint(name);
		if (e.kind !== 'pin') return null;
		const d = drawnById.get(e.part);
		if (!d) return null;
		return d.pins[e.part === e.pin ? e.part : e.pin] ?? d.pins[e.pin] ?? null;
	};
	type GroundReq = { id: string; part: DiagramPart | null; wantX: number; wire: DiagramWire | null };
	const groundReqs: GroundReq[] = [];
	for (const p of c.parts) {
		if (p.type !== 'ground') continue;
		let wantX = axis[0];
		for (const w of c.wires) {
			const other = keyOfEnd(w.from) === p.id ? w.to : keyOfEnd(w.to) === p.id ? w.from : null;
			if (!other) continue;
			const xy = pinXY(other);
			if (xy) {
				wantX = xy.x;
				break;
			}
		}
		groundReqs.push({ id: p.id, part: p, wantX, wire: null });
	}
	const syntheticFor = new Map<string, string>(); // wire id -> synthetic ground id
	for (const w of c.wires) {
		const a = keyOfEnd(w.from);
		const b = keyOfEnd(w.to);
		if (a !== 'GND' && b !== 'GND') continue;
		const other = a === 'GND' ? w.to : w.from;
		const xy = pinXY(other);
		const gp = parts.get(keyOfEnd(other));
		const wantX = xy?.x ?? (gp && groundReqs.find((g) => g.id === gp.id)?.wantX) ?? axis[0];
		const id = `${w.id}:GND`;
		syntheticFor.set(w.id, id);
		groundReqs.push({ id, part: null, wantX: wantX + (gp?.type === 'ground' ? 40 : 0), wire: w });
	}
	groundReqs.sort((a, b) => a.wantX - b.wantX);
	let groundRight = -Infinity;
	for (const g of groundReqs) {
		const gpart: DiagramPart = g.part ?? { id: g.id, type: 'ground' };
		const shape = buildSymbol(gpart, { top: new Set([gpart.id]), pitch: 40 });
		const lines = g.part ? labels.get(g.part.id)! : [];
		const ls = lines.length ? labelSize(lines) : { w: 0, h: 0 };
		let px = snap(g.wantX);
		if (px - 10 < groundRight + 20) px = snapUp(groundRight + 30);
		const dp = makePart(gpart, shape, px - 10, groundY, lines, null, labelSize);
		if (!g.part) {
			dp.synthetic = true;
			dp.name = `chassis ground at the end of wire ${g.wire!.id}`;
		}
		groundRight = px + 10 + (ls.w ? 6 + ls.w : 0);
		drawn.push(dp);
		drawnById.set(dp.id, dp);
	}

	// --- Canvas size.
	let width = MARGIN;
	let height = groundY + 30 + MARGIN;
	for (const d of drawn) {
		width = Math.max(width, d.x + d.w + MARGIN, d.label ? d.label.x + d.label.w + MARGIN : 0);
		height = Math.max(height, d.y + d.h + MARGIN);
	}
	width = Math.max(snapUp(width + 2 * GRID), MIN_WIDTH);
	height = snapUp(height);

	// --- Routing grid.
	const nx = width / GRID + 1;
	const ny = height / GRID + 1;
	const grid = new RouteGrid(nx, ny);
	for (const d of drawn) {
		// A splice is only its centre point: wires may come from any side.
		if (d.type !== 'splice') grid.blockBox(d.x / GRID, d.y / GRID, (d.x + d.w) / GRID, (d.y + d.h) / GRID);
		if (d.label) grid.blockBox(d.label.x / GRID, d.label.y / GRID, (d.label.x + d.label.w) / GRID, (d.label.y + d.label.h) / GRID);
	}
	const nodeIndex = new Map<string, number>();
	const idxOfNode = (n: string) => {
		if (!nodeIndex.has(n)) nodeIndex.set(n, nodeIndex.size);
		return nodeIndex.get(n)!;
	};
	idxOfNode('B+');
	idxOfNode('GND');
	for (const d of drawn) {
		for (const [pin, xy] of Object.entries(d.pins)) {
			const key = d.synthetic ? 'GND' : pinKey(parts.get(d.id)!, pin);
			grid.markPin(xy.x / GRID, xy.y / GRID, idxOfNode(nodeOfKey(key)));
		}
	}
	grid.barRow = BAR_Y / GRID;
	grid.barNode = idxOfNode('B+');

	type End = { end: RouteEnd | null; xy: Point | null };
	const endOf = (name: string, wire: DiagramWire): End => {
		const k = keyOfEnd(name);
		if (k === 'B+') return { end: null, xy: null };
		let d: DrawnPart | undefined;
		let pin: string;
		if (k === 'GND') {
			d = drawnById.get(syntheticFor.get(wire.id)!);
			pin = d!.id;
		} else {
			const e = readEndpoint(name);
			if (e.kind !== 'pin') throw new DiagramLayoutError(`wire ${wire.id}: cannot find the end "${name}"`);
			d = drawnById.get(e.part);
			pin = e.pin;
		}
		const xy = d?.pins[pin];
		if (!d || !xy) throw new DiagramLayoutError(`wire ${wire.id}: the end "${name}" names no pin that the diagram knows`);
		const shapeExit = d.type === 'splice' ? 'any' : xy.y === d.y ? 'up' : 'down';
		return { end: { gx: xy.x / GRID, gy: xy.y / GRID, exit: shapeExit }, xy: [xy.x, xy.y] };
	};

	const jobs = c.wires.map((w, i) => {
		const a = endOf(w.from, w);
		const b = endOf(w.to, w);
		const len = a.xy && b.xy ? Math.abs(a.xy[0] - b.xy[0]) + Math.abs(a.xy[1] - b.xy[1]) : (a.xy ?? b.xy ?? [0, 0])[1] - BAR_Y;
		return { w, i, a, b, len };
	});
	jobs.sort((p, q) => p.len - q.len || p.i - q.i);
	const routed = new Map<string, Point[]>();
	const taps: number[] = [];
	for (const job of jobs) {
		const node = nodeOfKey(keyOfEnd(job.w.from));
		const ni = idxOfNode(node);
		let from = job.a.end;
		let to = job.b.end;
		if (!from && !to) throw new DiagramLayoutError(`wire ${job.w.id} joins B+ to B+`);
		if (!from) [from, to] = [to, null];
		let pts: [number, number][] | null = null;
		if (to) {
			const m = 8;
			pts = grid.route(ni, from!, to, {
				x0: Math.min(from!.gx, to.gx) - m,
				y0: Math.min(from!.gy, to.gy) - m,
				x1: Math.max(from!.gx, to.gx) + m,
				y1: Math.max(from!.gy, to.gy) + m
			});
		}
		if (!pts) pts = grid.route(ni, from!, to);
		if (!pts) throw new DiagramLayoutError(`wire ${job.w.id} cannot be drawn without crossing a symbol; pin its parts with a layout entry`);
		grid.commit(ni, pts);
		if (!to) taps.push(pts[pts.length - 1][0] * GRID);
		routed.set(job.w.id, simplifyPath(pts).map(([x, y]) => [x * GRID, y * GRID] as Point));
	}

	const wires: DrawnWire[] = c.wires.map((w) => {
		let pts = routed.get(w.id)!;
		// Draw every wire from its `from` end to its `to` end.
		const fromIsBar = keyOfEnd(w.from) === 'B+';
		const a = endOf(w.from, w);
		if (fromIsBar || (a.xy && (pts[0][0] !== a.xy[0] || pts[0][1] !== a.xy[1]))) pts = pts.slice().reverse();
		return { id: w.id, node: nodeOfKey(keyOfEnd(w.from)), from: w.from, to: w.to, color: w.color, name: wireName(w, parts), points: pts, label: null };
	});

	// --- Bus bar.
	let bar: Drawing['bar'] = null;
	if (taps.length) {
		const x1 = Math.min(...taps) - 20;
		const x2 = Math.max(...taps);
		const text = `B+ ${fmtVolts(c.supplyVolts)}`;
		const lw = Math.ceil(text.length * CHAR_W_PART) + 2;
		bar = { x1, x2, y: BAR_Y, label: { x: x1 - 4, y: BAR_Y - 8 - LINE_H_PART, w: lw, h: LINE_H_PART, lines: [text], kind: 'bar', owner: 'B+' } };
	}

	// --- Splice dots: where three or more conductors of one node meet (pin leads count as one each).
	const arms = new Map<string, { node: string; mask: number }>();
	const addArm = (x: number, y: number, node: string, bit: number) => {
		const k = `${x},${y}`;
		const cur = arms.get(k);
		if (cur && cur.node !== node) return; // a crossing of different nodes: never a junction
		arms.set(k, { node, mask: (cur?.mask ?? 0) | bit });
	};
	// Unit edges per node, so that T-junctions in the middle of a segment are found.
	const edgeSet = new Set<string>();
	const addSeg = (p: Point, q: Point, node: string) => {
		const steps = Math.round((Math.abs(q[0] - p[0]) + Math.abs(q[1] - p[1])) / GRID);
		const sx = Math.sign(q[0] - p[0]) * GRID;
		const sy = Math.sign(q[1] - p[1]) * GRID;
		for (let s = 0; s < steps; s++) {
			const x = p[0] + sx * s;
			const y = p[1] + sy * s;
			const nxp = x + sx;
			const nyp = y + sy;
			const key = `${node}|${Math.min(x, nxp)},${Math.min(y, nyp)},${sx !== 0 ? 'h' : 'v'}`;
			if (edgeSet.has(key)) continue;
			edgeSet.add(key);
			// bits: 1 right, 2 left, 4 down, 8 up
			addArm(x, y, node, sx > 0 ? 1 : sx < 0 ? 2 : sy > 0 ? 4 : 8);
			addArm(nxp, nyp, node, sx > 0 ? 2 : sx < 0 ? 1 : sy > 0 ? 8 : 4);
		}
	};
	for (const w of wires) for (let i = 1; i < w.points.length; i++) addSeg(w.points[i - 1], w.points[i], w.node);
	if (bar) addSeg([bar.x1, bar.y], [bar.x2, bar.y], 'B+');
	const spliceCentres = new Set<string>();
	for (const d of drawn) {
		if (d.type === 'splice') {
			for (const xy of Object.values(d.pins)) spliceCentres.add(`${xy.x},${xy.y}`);
			continue;
		}
		for (const [pin, xy] of Object.entries(d.pins)) {
			const key = d.synthetic ? 'GND' : pinKey(parts.get(d.id)!, pin);
			addArm(xy.x, xy.y, nodeOfKey(key), xy.y === d.y ? 4 : 8); // the lead goes into the body
		}
	}
	const dots: Drawing['dots'] = [];
	for (const [k, v] of arms) {
		let n = 0;
		for (let b = 1; b <= 8; b <<= 1) if (v.mask & b) n++;
		if (n >= 3 && !spliceCentres.has(k)) {
			const [x, y] = k.split(',').map(Number);
			dots.push({ x, y, node: v.node });
		}
	}
	dots.sort((a, b) => a.y - b.y || a.x - b.x);

	// Crossings: points where two nodes' unit edges meet perpendicular.
	let crossings = 0;
	{
		const byPoint = new Map<string, Set<string>>();
		for (const w of wires)
			for (let i = 1; i < w.points.length; i++) {
				const [p, q] = [w.points[i - 1], w.points[i]];
				const steps = Math.round((Math.abs(q[0] - p[0]) + Math.abs(q[1] - p[1])) / GRID);
				const sx = Math.sign(q[0] - p[0]) * GRID;
				const sy = Math.sign(q[1] - p[1]) * GRID;
				for (let s = 1; s < steps; s++) {
					const k = `${p[0] + sx * s},${p[1] + sy * s}`;
					if (!byPoint.has(k)) byPoint.set(k, new Set());
					byPoint.get(k)!.add(w.node);
				}
			}
		for (const s of byPoint.values()) if (s.size > 1) crossings++;
	}

	// --- Labels that come after routing: wire colours / ids, test point flags.
	const obstacles: Box[] = drawn.map((d) => ({ x: d.x, y: d.y, w: d.w, h: d.h }));
	const placedLabels: Box[] = [];
	for (const d of drawn) if (d.label) placedLabels.push(d.label);
	if (bar) placedLabels.push(bar.label);
	const allSegs: { p: Point; q: Point; node: string }[] = [];
	for (const w of wires) for (let i = 1; i < w.points.length; i++) allSegs.push({ p: w.points[i - 1], q: w.points[i], node: w.node });
	if (bar) allSegs.push({ p: [bar.x1, bar.y], q: [bar.x2, bar.y], node: 'B+' });
	const free = (b: Box) =>
		b.x >= 0 && b.y >= 0 && b.x + b.w <= width && b.y + b.h <= height && !obstacles.some((o) => boxOverlap(o, b, 1)) && !placedLabels.some((o) => boxOverlap(o, b, 1));
	const wireHits = (b: Box) => allSegs.filter((s) => segBoxHit(s.p, s.q, b)).length;

	for (const w of wires) {
		const lines: string[] = [];
		if (opts.showWireIds) lines.push(w.id);
		if (w.color) lines.push(w.color);
		if (!lines.length) continue;
		const text = lines.join(' ');
		const lw = Math.ceil(text.length * CHAR_W_WIRE) + 2;
		const lh = LINE_H_WIRE;
		const segs = [];
		for (let i = 1; i < w.points.length; i++) segs.push([w.points[i - 1], w.points[i]] as [Point, Point]);
		segs.sort((s, t) => segLen(t) - segLen(s));
		let best = null as { box: Box; score: number } | null;
		for (const [p, q] of segs) {
			for (const t of [0.5, 0.3, 0.7, 0.15, 0.85]) {
				const mx = p[0] + (q[0] - p[0]) * t;
				const my = p[1] + (q[1] - p[1]) * t;
				const vertical = p[0] === q[0];
				const cands: Box[] = vertical
					? [
							{ x: mx + 3, y: my - lh / 2, w: lw, h: lh },
							{ x: mx - 3 - lw, y: my - lh / 2, w: lw, h: lh }
						]
					: [
							{ x: mx - lw / 2, y: my - 2 - lh, w: lw, h: lh },
							{ x: mx - lw / 2, y: my + 2, w: lw, h: lh }
						];
				for (const b of cands) {
					if (!free(b)) continue;
					const score = wireHits(b) * 10 + Math.abs(t - 0.5);
					if (!best || score < best.score) best = { box: b, score };
				}
			}
			if (best && best.score < 1) break;
		}
		if (best) {
			const label: DrawnLabel = { ...best.box, lines: [text], kind: 'wire', owner: w.id };
			w.label = label;
			placedLabels.push(label);
		}
	}

	const flags: DrawnFlag[] = [];
	const R = 9;
	for (const [label, target] of Object.entries(c.points)) {
		const HW = Math.max(R, Math.ceil((label.length * 6.6) / 2) + 4);
		const key = keyOfEnd(target);
		let anchor: Point | null = null;
		if (key === 'B+' && bar) anchor = [bar.x1, bar.y];
		else if (key === 'GND') {
			const g = drawn.find((d) => d.synthetic);
			if (g) anchor = [g.pins[g.id].x, g.pins[g.id].y];
		} else {
			const xy = pinXY(target);
			if (xy) anchor = [xy.x, xy.y];
		}
		if (!anchor) continue;
		let best = null as { box: Box; score: number } | null;
		for (const dist of [16, 24, 34, 46, 60, 80, 100]) {
			for (const [ux, uy] of [
				[-1, -0.6],
				[1, -0.6],
				[-1, 0.6],
				[1, 0.6],
				[-1, 0],
				[1, 0],
				[0, -1],
				[0, 1]
			]) {
				const cx = anchor[0] + ux * (dist + HW - R);
				const cy = anchor[1] + uy * dist;
				const b = { x: cx - HW, y: cy - R, w: 2 * HW, h: 2 * R };
				if (!free(b)) continue;
				const score = wireHits(b) * 1000 + dist;
				if (!best || score < best.score) best = { box: b, score };
			}
			if (best && best.score < 1000) break;
		}
		if (!best) {
			// Nowhere free near the pin: put the flag in the right margin, level with its pin, and widen the drawing.
			const cy = Math.min(Math.max(anchor[1], R + 2), height - R - 2);
			let x = width + 6;
			while (placedLabels.some((o) => boxOverlap(o, { x, y: cy - R, w: 2 * HW, h: 2 * R }, 1))) x += 2 * HW + 6;
			best = { box: { x, y: cy - R, w: 2 * HW, h: 2 * R }, score: 0 };
			width = Math.max(width, snapUp(x + 2 * HW + MARGIN));
		}
		const box: DrawnLabel = { ...best.box, lines: [label], kind: 'flag', owner: label };
		placedLabels.push(box);
		flags.push({ label, node: nodeOfKey(key), target, anchor, cx: best.box.x + HW, cy: best.box.y + R, r: R, hw: HW, box });
	}

	// --- Legend of the symbols used, below the drawing.
	const legend: LegendEntry[] = [];
	const legendTop = height;
	const used: { key: string; type: PartType | null; text: string; kind: LegendEntry['kind']; led?: boolean }[] = [];
	const seen = new Set<string>();
	for (const p of c.parts) {
		const led = p.type === 'diode' && (p.drop ?? 0.7) >= 1.5;
		const key = p.type === 'switch' && p.positions ? 'switch-positions' : led ? 'led' : p.type;
		if (seen.has(key)) continue;
		seen.add(key);
		const text = key === 'switch-positions' ? 'switch, positions' : typeWord(p);
		used.push({ key, type: p.type, text, kind: 'symbol', led });
	}
	if (!seen.has('ground') && drawn.some((d) => d.synthetic)) used.push({ key: 'ground', type: 'ground', text: 'ground', kind: 'symbol' });
	if (bar) used.push({ key: 'bar', type: null, text: 'B+ bus', kind: 'bar' });
	if (dots.length) used.push({ key: 'dot', type: null, text: 'junction', kind: 'dot' });
	if (flags.length) used.push({ key: 'flag', type: null, text: 'test point', kind: 'flag' });
	const ENTRY_W = 140;
	const perRow = Math.max(1, Math.floor((width - 2 * MARGIN) / ENTRY_W));
	used.forEach((u, i) => {
		const x = MARGIN + (i % perRow) * ENTRY_W;
		const y = legendTop + 6 + Math.floor(i / perRow) * 40;
		const shape = u.type && u.key !== 'switch-positions' ? legendSymbol(u.type, u.led) : null;
		legend.push({ key: u.key, text: u.text, x, y, shape, kind: u.kind });
	});
	const legendRows = Math.ceil(used.length / perRow);
	height = legendTop + 6 + legendRows * 40 + 10;

	const nodeOf: Record<string, string> = { 'B+': 'B+', GND: 'GND' };
	for (const m of members) nodeOf[m] = nodeOfKey(m);

	return {
		id: c.id,
		title: c.title,
		width,
		height,
		parts: drawn,
		wires,
		dots,
		bar,
		flags,
		legend,
		legendTop,
		nodeOf,
		crossings
	};
}

function segLen([p, q]: [Point, Point]) {
	return Math.abs(q[0] - p[0]) + Math.abs(q[1] - p[1]);
}

function fmtVolts(v: number): string {
	return `${Number(v.toPrecision(4))} V`;
}

function makePart(
	p: DiagramPart,
	shape: SymbolShape,
	x: number,
	y: number,
	lines: string[],
	setting: string | null,
	labelSize: (l: string[]) => { w: number; h: number },
	sizing: string[] = lines
): DrawnPart {
	const pins: Record<string, { x: number; y: number }> = {};
	for (const [k, v] of Object.entries(shape.pins)) pins[k] = { x: x + v.x, y: y + v.y };
	let label: DrawnLabel | null = null;
	if (lines.length) {
		const s = labelSize(sizing);
		// A splice's label sits above and right of it, clear of the four directions its wires leave in.
		label =
			p.type === 'splice'
				? { x: x + shape.w + 2, y: y - s.h - 2, w: s.w, h: s.h, lines, kind: 'part', owner: p.id }
				: { x: x + shape.w + 6, y: y + shape.h / 2 - s.h / 2, w: s.w, h: s.h, lines, kind: 'part', owner: p.id };
	}
	return {
		id: p.id,
		type: p.type,
		synthetic: false,
		name: partName(p, setting),
		body: shape.body,
		x,
		y,
		w: shape.w,
		h: shape.h,
		pins,
		subs: shape.subs.map((s) => ({ ...s, x: s.x + x, y: s.y + y })),
		label,
		setting
	};
}
