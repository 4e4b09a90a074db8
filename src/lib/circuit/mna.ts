/**
 * One linear solve by modified nodal analysis. Nodes joined by 0 Ω elements are merged first
 * (union-find), so ideal elements never appear in the matrix; unknowns are the merged nodes' volts
 * (GND is the reference) and the currents of the voltage sources.
 */
import { luFactor, luSolve } from './lu';
import { Code, type Net } from './netlist';
import { METER_OHMS } from './tables';
import { findRoot, unite } from './union-find';

/** The settling configuration: fuses opened, relay states (0 released, 1 energized, 2 chattering), diodes conducting. */
export type Config = { fuseOpen: Uint8Array; relay: Int8Array; diodeOn: Uint8Array };

/** Solver buffers and the last solution. Internal to the engine. */
export type Work = {
	parent: Int32Array;
	root: Int32Array;
	/** Unknown index of each root node; -1 for the GND group, -2 for an unused node. */
	gOf: Int32Array;
	nv: number;
	n: number;
	A: Float64Array;
	rhs: Float64Array;
	x: Float64Array;
	perm: Int32Array;
	/** Node volts to GND, unrounded. */
	V: Float64Array;
	/** Unknown index of each source or diode-drop current (-1 when not in the matrix). */
	row: Int32Array;
	/** Source currents in A, + to − through the source (negative while delivering). */
	srcI: Float64Array;
	spar: Int32Array;
	spot: Float64Array;
	/** Element index of the source that closed a dead short, or -1. */
	deadSource: number;
};

/** Allocates the buffers for a compiled network. */
export function makeWork(net: Net): Work {
	const nn = net.nNodes;
	const ne = net.els.length;
	const max = nn + net.sources.length + net.diodes.length;
	return {
		parent: new Int32Array(nn),
		root: new Int32Array(nn),
		gOf: new Int32Array(nn),
		nv: 0,
		n: 0,
		A: new Float64Array(max * max),
		rhs: new Float64Array(max),
		x: new Float64Array(max),
		perm: new Int32Array(max),
		V: new Float64Array(nn),
		row: new Int32Array(ne),
		srcI: new Float64Array(ne),
		spar: new Int32Array(nn),
		spot: new Float64Array(nn),
		deadSource: -1
	};
}

/** True when a relay's contact element conducts in this configuration. */
export function contactClosed(net: Net, cfg: Config, r: number, nc: boolean): boolean {
	if (net.relayWelded[r]) return !nc;
	const s = cfg.relay[r];
	return nc ? s === 0 : s === 1;
}

/** True when element `i` is a 0 Ω element in place in this configuration. */
export function idealActive(net: Net, cfg: Config, i: number, relayOfEl: Int32Array): boolean {
	const c = net.code[i];
	if (c === Code.Ideal) return true;
	if (c === Code.RelayNo) return contactClosed(net, cfg, relayOfEl[i], false);
	if (c === Code.RelayNc) return contactClosed(net, cfg, relayOfEl[i], true);
	return false;
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
	}
	// dormant diode midpoints
	const nd = net.diodes.length;
	for (let d = 0; d < nd; d++) if (!cfg.diodeOn[d]) gOf[net.emid[net.diodes[d]]] = -2;
	const gndRoot = root[1];
	let nv = 0;
	for (let i = 0; i < nn; i++) {
		const r = root[i];
		if (gOf[i] === -2) continue;
		if (r === gndRoot) gOf[r] = -1;
		else if (gOf[r] === -3) gOf[r] = nv++;
	}
	// sources: weighted union-find over merged nodes detects loops of sources and 0 Ω elements
	w.deadSource = -1;
	for (let i = 0; i < nn; i++) {
		w.spar[i] = i;
		w.spot[i] = 0;
	}
	let ns = 0;
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
		if (a === b) {
			if (Math.abs(pa - pb - v) > 1e-9) {
				w.deadSource = e;
				return false;
			}
			w.row[e] = -1;
			continue;
		}
		// potential(rp) - potential(rm) = v
		w.spar[a] = b;
		w.spot[a] = v + pb - pa;
		w.row[e] = nv + ns++;
	}
	for (let d = 0; d < nd; d++) w.row[net.diodes[d]] = cfg.diodeOn[d] ? nv + ns++ : -1;
	const n = nv + ns;
	w.nv = nv;
	w.n = n;
	const A = w.A;
	A.fill(0, 0, n * n);
	w.rhs.fill(0, 0, n);
	const stamp = (a: number, b: number, g: number) => {
		const ia = gOf[root[a]];
		const ib = gOf[root[b]];
		if (ia >= 0) A[ia * n + ia] += g;
		if (ib >= 0) A[ib * n + ib] += g;
		if (ia >= 0 && ib >= 0) {
			A[ia * n + ib] -= g;
			A[ib * n + ia] -= g;
		}
	};
	const stampSrc = (plus: number, minus: number, k: number, v: number) => {
		const ip = gOf[root[plus]];
		const im = gOf[root[minus]];
		if (ip >= 0) {
			A[ip * n + k] += 1;
			A[k * n + ip] += 1;
		}
		if (im >= 0) {
			A[im * n + k] -= 1;
			A[k * n + im] -= 1;
		}
		w.rhs[k] = v;
	};
	const ne = net.els.length;
	const g = net.g;
	let f = 0;
	let d = 0;
	for (let i = 0; i < ne; i++) {
		const c = code[i];
		if (c === Code.Resistor || c === Code.Coil) stamp(ea[i], eb[i], g[i]);
		else if (c === Code.Fuse) {
			if (!cfg.fuseOpen[f]) stamp(ea[i], eb[i], g[i]);
			f++;
		} else if (c === Code.Diode) {
			if (cfg.diodeOn[d]) {
				const mid = net.emid[i];
				stamp(ea[i], mid, g[i]);
				stampSrc(mid, eb[i], w.row[i], net.ev[i]);
			}
			d++;
		} else if (c === Code.Source) {
			if (w.row[i] >= 0) stampSrc(ea[i], eb[i], w.row[i], net.ev[i]);
		}
	}
	// one meter per merged node (not on diode or battery internals)
	const gm = 1 / METER_OHMS;
	const x = w.x;
	x.fill(0, 0, nv);
	for (let i = 0; i < nn; i++) {
		if (!net.metered[i]) continue;
		const k = gOf[root[i]];
		if (k >= 0 && x[k] === 0) {
			x[k] = 1;
			A[k * n + k] += gm;
		}
	}
	luFactor(A, n, w.perm);
	luSolve(A, n, w.perm, w.rhs, x);
	const V = w.V;
	for (let i = 0; i < nn; i++) {
		const k = gOf[i] === -2 ? -2 : gOf[root[i]];
		V[i] = k >= 0 ? x[k] : 0;
	}
	for (let s = 0; s < srcs.length; s++) {
		const e = srcs[s];
		w.srcI[e] = w.row[e] >= 0 ? x[w.row[e]] : 0;
	}
	for (let dd = 0; dd < nd; dd++) {
		const e = net.diodes[dd];
		w.srcI[e] = w.row[e] >= 0 ? x[w.row[e]] : 0;
	}
	return true;
}

/** Current in A through a resistive element (resistor, coil, intact fuse, conducting diode) from its a to its b node. */
export function elementAmps(net: Net, w: Work, i: number): number {
	const c = net.code[i];
	if (c === Code.Diode) {
		const mid = net.emid[i];
		return w.row[i] >= 0 ? (w.V[net.ea[i]] - w.V[mid]) * net.g[i] : 0;
	}
	return (w.V[net.ea[i]] - w.V[net.eb[i]]) * net.g[i];
}
