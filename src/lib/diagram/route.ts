/**
 * Orthogonal wire routing on a grid (a Lee-style shortest path with a cost for each bend and each
 * crossing). The grid forbids, by construction: a wire through a symbol or a label; two wires of
 * different nodes on the same grid edge; a wire of one node turning or ending on a point that another
 * node uses (so a crossing is always a clean perpendicular pass, never mistaken for a junction).
 */

export type Dir = 0 | 1 | 2 | 3; // right, left, down, up
const DX = [1, -1, 0, 0];
const DY = [0, 0, 1, -1];

export const COST_STEP = 1;
export const COST_BEND = 6;
export const COST_CROSS = 10;
export const COST_SHARED_EDGE = 4;

export type RouteEnd = { gx: number; gy: number; exit: 'up' | 'down' | 'any' };

export class RouteGrid {
	readonly nx: number;
	readonly ny: number;
	/** 1 where no wire may go at all. */
	readonly blocked: Uint8Array;
	/** Pin points: only wires of the pin's node may end there; nobody passes through. */
	readonly pinNode: Int32Array;
	/** Node index + 1 occupying each horizontal edge (p -> p+1) and vertical edge (p -> p+nx). */
	readonly hEdge: Int32Array;
	readonly vEdge: Int32Array;
	/** Node index + 1 passing straight horizontally / vertically through a point, or turning/ending on it. */
	readonly passH: Int32Array;
	readonly passV: Int32Array;
	readonly corner: Int32Array;
	/** Row that only the B+ node may enter, and only from below, to end on the bus bar. */
	barRow = -1;
	barNode = -1;

	constructor(nx: number, ny: number) {
		this.nx = nx;
		this.ny = ny;
		const n = nx * ny;
		this.blocked = new Uint8Array(n);
		this.pinNode = new Int32Array(n);
		this.hEdge = new Int32Array(n);
		this.vEdge = new Int32Array(n);
		this.passH = new Int32Array(n);
		this.passV = new Int32Array(n);
		this.corner = new Int32Array(n);
	}

	/**
	 * Blocks a box given in grid units: every grid point inside it or on its edge, and every grid edge
	 * that passes through it (a thin box can lie between two grid points).
	 */
	blockBox(x0: number, y0: number, x1: number, y1: number) {
		const { nx, ny } = this;
		const gx0 = Math.max(0, Math.ceil(x0 - 1e-9));
		const gy0 = Math.max(0, Math.ceil(y0 - 1e-9));
		const gx1 = Math.min(nx - 1, Math.floor(x1 + 1e-9));
		const gy1 = Math.min(ny - 1, Math.floor(y1 + 1e-9));
		for (let y = gy0; y <= gy1; y++) for (let x = gx0; x <= gx1; x++) this.blocked[y * nx + x] = 1;
		// Vertical edges at x in [x0, x1] whose span overlaps (y0, y1).
		for (let x = gx0; x <= gx1; x++)
			for (let y = Math.max(0, Math.floor(y0)); y < Math.min(ny - 1, Math.ceil(y1)); y++)
				if (Math.min(y + 1, y1) - Math.max(y, y0) > 1e-9) this.vEdge[y * nx + x] = -1;
		for (let y = gy0; y <= gy1; y++)
			for (let x = Math.max(0, Math.floor(x0)); x < Math.min(nx - 1, Math.ceil(x1)); x++)
				if (Math.min(x + 1, x1) - Math.max(x, x0) > 1e-9) this.hEdge[y * nx + x] = -1;
	}

	markPin(gx: number, gy: number, node: number) {
		const i = gy * this.nx + gx;
		this.blocked[i] = 0;
		this.pinNode[i] = node + 1;
	}

	/**
	 * Shortest orthogonal path from `a` to `b` (or to the bus bar when `b` is null) for a wire of `node`.
	 * Returns grid points of the path including both ends, or null when no path exists.
	 */
	route(node: number, a: RouteEnd, b: RouteEnd | null, bounds?: { x0: number; y0: number; x1: number; y1: number }): [number, number][] | null {
		const { nx, ny } = this;
		const me = node + 1;
		const wx0 = bounds ? Math.max(0, bounds.x0) : 0;
		const wy0 = bounds ? Math.max(0, bounds.y0) : 0;
		const wx1 = bounds ? Math.min(nx - 1, bounds.x1) : nx - 1;
		const wy1 = bounds ? Math.min(ny - 1, bounds.y1) : ny - 1;
		const n = nx * ny;
		const dist = new Float64Array(n * 4).fill(Infinity);
		const prev = new Int32Array(n * 4).fill(-1);
		const heap = new MinHeap();
		const start = a.gy * nx + a.gx;
		const targetIdx = b ? b.gy * nx + b.gx : -1;
		const h = (x: number, y: number) => (b ? Math.abs(x - b.gx) + Math.abs(y - b.gy) : Math.abs(y - this.barRow));
		const startDirs: Dir[] = a.exit === 'up' ? [3] : a.exit === 'down' ? [2] : [0, 1, 2, 3];
		// A state is (point, direction of the move that reached it).
		for (const d of startDirs) {
			const x = a.gx + DX[d];
			const y = a.gy + DY[d];
			if (x < wx0 || y < wy0 || x > wx1 || y > wy1) continue;
			const c = this.stepCost(me, start, x, y, d);
			if (c < 0) continue;
			const s = (y * nx + x) * 4 + d;
			if (c < dist[s]) {
				dist[s] = c;
				prev[s] = -2 - start; // marks "came from the start point"
				heap.push(s, c + h(x, y));
			}
		}
		let found = -1;
		while (heap.size > 0) {
			const [s, pri] = heap.pop();
			const ds = dist[s];
			if (pri - 1e-9 > ds + h(((s >> 2) % nx), Math.floor((s >> 2) / nx))) continue;
			const p = s >> 2;
			const d = (s & 3) as Dir;
			const x = p % nx;
			const y = (p - x) / nx;
			if (this.isTarget(me, p, d, targetIdx, b, y)) {
				found = s;
				break;
			}
			// Pins and the bar row are ends, never passages.
			if (this.pinNode[p] !== 0 || y === this.barRow) continue;
			const crossing = this.othersAt(me, p);
			for (let nd = 0 as Dir; nd < 4; nd = (nd + 1) as Dir) {
				if (nd === (d ^ 1)) continue; // no U-turn
				const bend = nd !== d;
				if (bend && crossing) continue; // never turn on another node's point
				const qx = x + DX[nd];
				const qy = y + DY[nd];
				if (qx < wx0 || qy < wy0 || qx > wx1 || qy > wy1) continue;
				if (crossing && nd !== d) continue;
				const c = this.stepCost(me, p, qx, qy, nd);
				if (c < 0) continue;
				const nds = ds + c + (bend ? COST_BEND : 0);
				const q = (qy * nx + qx) * 4 + nd;
				if (nds < dist[q]) {
					dist[q] = nds;
					prev[q] = s;
					heap.push(q, nds + h(qx, qy));
				}
			}
		}
		if (found < 0) return null;
		const pts: [number, number][] = [];
		let s = found;
		while (s >= 0) {
			const p = s >> 2;
			pts.push([p % nx, Math.floor(p / nx)]);
			const ps = prev[s];
			if (ps <= -2) {
				const sp = -2 - ps;
				pts.push([sp % nx, Math.floor(sp / nx)]);
				break;
			}
			s = ps;
		}
		pts.reverse();
		return pts;
	}

	private isTarget(me: number, p: number, d: Dir, targetIdx: number, b: RouteEnd | null, y: number): boolean {
		if (b) {
			if (p !== targetIdx) return false;
			if (b.exit === 'up') return d === 2;
			if (b.exit === 'down') return d === 3;
			return true;
		}
		return y === this.barRow && d === 3 && me === this.barNode + 1;
	}

	/** True when another node already uses point p (so we may only pass straight across it). */
	private othersAt(me: number, p: number): boolean {
		const a = this.passH[p];
		const v = this.passV[p];
		const c = this.corner[p];
		return (a !== 0 && a !== me) || (v !== 0 && v !== me) || (c !== 0 && c !== me);
	}

	/** Cost of moving from point p to (qx, qy) in direction d; -1 when the move is forbidden. */
	private stepCost(me: number, p: number, qx: number, qy: number, d: Dir): number {
		const { nx, ny } = this;
		if (qx < 0 || qy < 0 || qx >= nx || qy >= ny) return -1;
		const q = qy * nx + qx;
		if (this.blocked[q]) return -1;
		if (this.pinNode[q] !== 0 && this.pinNode[q] !== me) return -1;
		if (qy === this.barRow && !(me === this.barNode + 1 && d === 3)) return -1;
		const horizontal = d < 2;
		const e = horizontal ? (d === 0 ? this.hEdge[p] : this.hEdge[q]) : d === 2 ? this.vEdge[p] : this.vEdge[q];
		if (e !== 0 && e !== me) return -1;
		let cost = COST_STEP + (e === me ? COST_SHARED_EDGE : 0);
		// Entering q: another node's corner or end there is a wall; its straight pass the same way would overlap.
		const c = this.corner[q];
		if (c !== 0 && c !== me) return -1;
		const same = horizontal ? this.passH[q] : this.passV[q];
		if (same !== 0 && same !== me) return -1;
		const across = horizontal ? this.passV[q] : this.passH[q];
		if (across !== 0 && across !== me) cost += COST_CROSS;
		return cost;
	}

	/** Records a routed path so later wires respect it. */
	commit(node: number, pts: [number, number][]) {
		const me = node + 1;
		const { nx } = this;
		for (let i = 0; i < pts.length; i++) {
			const [x, y] = pts[i];
			const p = y * nx + x;
			if (i > 0) {
				const [px, py] = pts[i - 1];
				if (py === y) this.hEdge[y * nx + Math.min(px, x)] = me;
				else this.vEdge[Math.min(py, y) * nx + x] = me;
			}
			const prev = pts[i - 1];
			const next = pts[i + 1];
			if (!prev || !next) {
				this.corner[p] = me;
				continue;
			}
			const h1 = prev[1] === y;
			const h2 = next[1] === y;
			if (h1 !== h2) this.corner[p] = me;
			else if (h1) this.passH[p] = me;
			else this.passV[p] = me;
		}
	}
}

/** A binary min-heap of (state, priority), ties broken by state index so routes are deterministic. */
class MinHeap {
	private s: number[] = [];
	private k: number[] = [];
	get size() {
		return this.s.length;
	}
	private less(i: number, j: number) {
		return this.k[i] < this.k[j] || (this.k[i] === this.k[j] && this.s[i] < this.s[j]);
	}
	private swap(i: number, j: number) {
		[this.s[i], this.s[j]] = [this.s[j], this.s[i]];
		[this.k[i], this.k[j]] = [this.k[j], this.k[i]];
	}
	push(state: number, key: number) {
		this.s.push(state);
		this.k.push(key);
		let i = this.s.length - 1;
		while (i > 0) {
			const parent = (i - 1) >> 1;
			if (!this.less(i, parent)) break;
			this.swap(i, parent);
			i = parent;
		}
	}
	pop(): [number, number] {
		const top: [number, number] = [this.s[0], this.k[0]];
		const ls = this.s.pop()!;
		const lk = this.k.pop()!;
		if (this.s.length > 0) {
			this.s[0] = ls;
			this.k[0] = lk;
			let i = 0;
			for (;;) {
				const l = 2 * i + 1;
				const r = l + 1;
				let m = i;
				if (l < this.s.length && this.less(l, m)) m = l;
				if (r < this.s.length && this.less(r, m)) m = r;
				if (m === i) break;
				this.swap(i, m);
				i = m;
			}
		}
		return top;
	}
}

/** Drops the points of a path that are not corners. */
export function simplifyPath(pts: [number, number][]): [number, number][] {
	if (pts.length <= 2) return pts.slice();
	const out: [number, number][] = [pts[0]];
	for (let i = 1; i < pts.length - 1; i++) {
		const [ax, ay] = out[out.length - 1];
		const [bx, by] = pts[i];
		const [cx, cy] = pts[i + 1];
		const collinear = (ax === bx && bx === cx) || (ay === by && by === cy);
		if (!collinear) out.push(pts[i]);
	}
	out.push(pts[pts.length - 1]);
	return out;
}
