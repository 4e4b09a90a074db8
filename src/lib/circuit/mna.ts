/**
 * One linear solve by modified nodal analysis. Nodes joined by 0 Ω elements are merged first
 * (union-find), so ideal elements never appear in the matrix. Merged nodes tied to GND through
 * voltage sources alone have known volts and leave the matrix; a conducting diode is stamped as its
 * Norton equivalent (conductance 1/ohms and a drop × conductance current). The unknowns are the other
 * merged nodes' volts and the currents of sources not tied to GND (GND is the reference).
 */
import { luFactor, luSolve, makeSpans, type Spans } from './lu';
import { Code, type Net } from './netlist';
import { METER_OHMS } from './tables';
import { findRoot, unite } from './union-find';

/** The settling configuration: fuses opened, relay states (0 released, 1 energized, 2 chattering), diodes conducting. */
export type Config = { fuseOpen: Uint8Array; relay: Int8Array; diodeOn: Uint8Array };

/** Solver buffers and the last solution. Internal to the engine. */
export type Work = {
	parent: Int32Array;
	root: Int32Array;
	/** Per root node: unknown index (≥ 0), -1 for known volts (the GND group and nodes tied to it by sources), -2 for an unused node. */
	gOf: Int32Array;
	/** Known volts per root node (where gOf is -1). */
	fixedV: Float64Array;
	nv: number;
	n: number;
	/** Node volts to GND, unrounded (a conducting diode's midpoint included). */
	V: Float64Array;
	/** 1 for a battery or supply source in place (not redundant). */
	srcOn: Uint8Array;
	spar: Int32Array;
	spot: Float64Array;
	/** Element index of the source that closed a dead short, or -1. */
	deadSource: number;
};

/** Shared scratch for the matrix: the engine is synchronous, and nothing keeps these after a solve. */
let A = new Float64Array(0);
let rhs = new Float64Array(0);
let xs = new Float64Array(0);
let perm = new Int32Array(0);
let spans: Spans = makeSpans(0);
let rowOfSrc = new Int32Array(0);

function ensureScratch(n: number, ne: number): void {
	if (A.length < n * n) A = new Float64Array(n * n);
	if (rhs.length < n) {
		rhs = new Float64Array(n);
		xs = new Float64Array(n);
		perm = new Int32Array(n);
		spans = makeSpans(n);
	}
	if (rowOfSrc.length < ne) rowOfSrc = new Int32Array(ne);
}

function widen(row: number, col: number): void {
	if (col < spans.first[row]) spans.first[row] = col;
	if (col > spans.last[row]) spans.last[row] = col;
}

/** Stamps conductance g (S) between nodes a and b, and a current j (A) driven from b to a inside the element (Norton source). */
function stamp(w: Work, n: number, a: number, b: number, g: number, j: number): void {
	const ra = w.root[a];
	const rb = w.root[b];
	const ia = w.gOf[ra];
	const ib = w.gOf[rb];
	if (ia >= 0) {
		A[ia * n + ia] += g;
		if (ib >= 0) {
			A[ia * n + ib] -= g;
			widen(ia, ib);
		} else rhs[ia] += g * w.fixedV[rb];
		rhs[ia] += j;
	}
	if (ib >= 0) {
		A[ib * n + ib] += g;
		if (ia >= 0) {
			A[ib * n + ia] -= g;
			widen(ib, ia);
		} else rhs[ib] += g * w.fixedV[ra];
		rhs[ib] -= j;
	}
}

/** Allocates the per-solve buffers for a compiled network. */
export function makeWork(net: Net): Work {
	const nn = net.nNodes;
	return {
		parent: new Int32Array(nn),
		root: new Int32Array(nn),
		gOf: new Int32Array(nn),
		fixedV: new Float64Array(nn),
		nv: 0,
		n: 0,
		V: new Float64Array(nn),
		srcOn: new Uint8Array(net.els.length),
		spar: new Int32Array(nn),
		spot: new Float64Array(nn),
		deadSource: -1
	};
}

/** True when a relay's contact (nc = the 87a side) conducts in this configuration. */
export function contactClosed(net: Net, cfg: Config, r: number, nc: boolean): boolean {
	if (net.relayWelded[r]) return !nc;
	const s = cfg.relay[r];
	return nc ? s === 0 : s === 1;
}

function sfind(w: Work, x: number): number {
	while (w.spar[x] !== x) x = w.spar[x];
	return x;
}
function spotOf(w: Work, x: number): number {
	let p = 0;
	while (w.spar[x] !== x) {
		p += w.spot[x];
		x = w.spar[x];
	}
	return p;
}

/**
 * Solves the linear network of one configuration into `w`. Returns false when 0 Ω elements join
 * nodes that sources hold at different volts (then `w.deadSource` names the source).
 * @throws SingularMatrixError only for a network the model cannot produce (every node has a meter).
 */
export function solveLinear(net: Net, cfg: Config, w: Work): boolean {
	const nn = net.nNodes;
	const parent = w.parent;
	const root = w.root;
	const gOf = w.gOf;
	const code = net.code;
	const ea = net.ea;
	const eb = net.eb;
	const ne = code.length;
	parent.set(net.baseParent);
	const nr = net.relayPart.length;
	for (let r = 0; r < nr; r++) {
		const no = net.relayNo[r];
		const nc = net.relayNc[r];
		if (no >= 0 && contactClosed(net, cfg, r, false)) unite(parent, ea[no], eb[no]);
		if (nc >= 0 && contactClosed(net, cfg, r, true)) unite(parent, ea[nc], eb[nc]);
	}
	for (let i = 0; i < nn; i++) {
		root[i] = findRoot(parent, i);
		gOf[i] = net.dormant[i] ? -2 : -3;
		w.spar[i] = i;
		w.spot[i] = 0;
	}
	const nd = net.diodes.length;
	for (let d = 0; d < nd; d++) gOf[net.emid[net.diodes[d]]] = -2;
	// sources: weighted union-find over merged nodes; a loop of sources and 0 Ω elements is a dead short
	w.deadSource = -1;
	const srcs = net.sources;
	for (let s = 0; s < srcs.length; s++) {
		const e = srcs[s];
		const rp = root[ea[e]];
		const rm = root[eb[e]];
		const v = net.ev[e];
		const a = sfind(w, rp);
		const b = sfind(w, rm);
		const pa = spotOf(w, rp);
		const pb = spotOf(w, rm);
		w.srcOn[e] = 0;
		if (a === b) {
			if (Math.abs(pa - pb - v) > 1e-9) {
				w.deadSource = e;
				return false;
			}
			continue;
		}
		w.spar[a] = b;
		w.spot[a] = v + pb - pa;
		w.srcOn[e] = 1;
	}
	const gndRoot = root[1];
	const gTree = sfind(w, gndRoot);
	const gPot = spotOf(w, gndRoot);
	let nv = 0;
	const order = net.order;
	for (let q = 0; q < nn; q++) {
		const i = order[q];
		if (gOf[i] === -2) continue;
		const r = root[i];
		if (gOf[r] !== -3) continue;
		if (sfind(w, r) === gTree) {
			gOf[r] = -1;
			w.fixedV[r] = spotOf(w, r) - gPot;
		} else gOf[r] = nv++;
	}
	ensureScratch(nn + srcs.length, ne);
	let ns = 0;
	for (let s = 0; s < srcs.length; s++) {
		const e = srcs[s];
		rowOfSrc[e] = w.srcOn[e] && gOf[root[ea[e]]] >= 0 ? nv + ns++ : -1;
	}
	const n = nv + ns;
	w.nv = nv;
	w.n = n;
	A.fill(0, 0, n * n);
	rhs.fill(0, 0, n);
	const first = spans.first;
	const last = spans.last;
	for (let k = 0; k < n; k++) first[k] = last[k] = k;
	const g = net.g;
	let f = 0;
	let d = 0;
	for (let i = 0; i < ne; i++) {
		const c = code[i];
		if (c === Code.Resistor || c === Code.Coil) stamp(w, n, ea[i], eb[i], g[i], 0);
		else if (c === Code.Fuse) {
			if (!cfg.fuseOpen[f]) stamp(w, n, ea[i], eb[i], g[i], 0);
			f++;
		} else if (c === Code.Diode) {
			if (cfg.diodeOn[d]) stamp(w, n, ea[i], eb[i], g[i], g[i] * net.ev[i]);
			d++;
		} else if (c === Code.Source && rowOfSrc[i] >= 0) {
			const k = rowOfSrc[i];
			const ip = gOf[root[ea[i]]];
			const im = gOf[root[eb[i]]];
			A[ip * n + k] += 1;
			A[k * n + ip] += 1;
			widen(ip, k);
			widen(k, ip);
			if (im >= 0) {
				A[im * n + k] -= 1;
				A[k * n + im] -= 1;
				widen(im, k);
				widen(k, im);
			}
			rhs[k] = net.ev[i];
		}
	}
	// one 10 MΩ meter per merged node with an unknown volts (not on diode or battery internals)
	const gm = 1 / METER_OHMS;
	xs.fill(0, 0, nv);
	for (let i = 0; i < nn; i++) {
		if (!net.metered[i]) continue;
		const k = gOf[root[i]];
		if (k >= 0 && xs[k] === 0) {
			xs[k] = 1;
			A[k * n + k] += gm;
		}
	}
	if (n > 0) {
		luFactor(A, n, perm, spans, true);
		luSolve(A, n, perm, rhs, xs, spans);
	}
	const V = w.V;
	for (let i = 0; i < nn; i++) {
		if (gOf[i] === -2) {
			V[i] = 0;
			continue;
		}
		const r = root[i];
		const k = gOf[r];
		V[i] = k >= 0 ? xs[k] : w.fixedV[r];
	}
	for (let dd = 0; dd < nd; dd++) {
		const e = net.diodes[dd];
		V[net.emid[e]] = cfg.diodeOn[dd] ? V[eb[e]] + net.ev[e] : V[eb[e]];
	}
	return true;
}

/** Current in A through a resistive element (resistor, coil, intact fuse, conducting diode) from its a to its b node. */
export function elementAmps(net: Net, w: Work, i: number): number {
	if (net.code[i] === Code.Diode) return (w.V[net.ea[i]] - w.V[net.eb[i]] - net.ev[i]) * net.g[i];
	return (w.V[net.ea[i]] - w.V[net.eb[i]]) * net.g[i];
}
