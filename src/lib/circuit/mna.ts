/**
 * One linear solve by modified nodal analysis. Nodes joined by 0 Ω elements are merged first
 * (union-find), so ideal elements never appear in the matrix. Merged nodes tied to GND through
 * voltage sources alone have known volts and leave the matrix; a conducting diode is stamped as its
 * Norton equivalent (conductance 1/ohms and a drop × conductance current). The unknowns are the other
 * merged nodes' volts and the currents of sources not tied to GND (GND is the reference).
 *
 * Everything that depends only on the relays' states (the merge, dead shorts, the numbering of the
 * unknowns, the matrix of the fixed elements and its nonzero pattern) is built once per relay
 * configuration of a compiled network and reused; a solve then adds the fuses and diodes in place.
 */
import { luFactor, luFactorByPlan, luFactorRecorded, luSolve, luSolveByPlan, makeSpans, type LuPlan, type Spans } from './lu';
import { Code, type Net } from './netlist';
import { METER_OHMS } from './tables';
import { findRoot, unite } from './union-find';

/** The settling configuration: fuses opened, relay states (0 released, 1 energized, 2 chattering), diodes conducting. */
export type Config = { fuseOpen: Uint8Array; relay: Int8Array; diodeOn: Uint8Array };

/** What one relay configuration fixes. Never changed once built. */
type Structure = {
	/** Element index of the source that closes a dead short, or -1. */
	dead: number;
	parent: Int32Array;
	root: Int32Array;
	gOf: Int32Array;
	fixedV: Float64Array;
	srcOn: Uint8Array;
	rowOfSrc: Int32Array;
	nv: number;
	n: number;
	baseA: Float64Array;
	baseRhs: Float64Array;
	/** Row k has no nonzero (fuses and diodes included) left of first[k] or right of last[k]. */
	first: Int32Array;
	last: Int32Array;
	/**
	 * Kept structures only: the LU schedule by fuse and diode configuration (see `maskKey`), null
	 * where that factorisation swapped rows. The matrix of a structure and configuration is always
	 * the same, so its schedule, recorded once, replays the same operations.
	 */
	plans: Map<number, LuPlan | null> | null;
};

/** Solver state of the last solve. Internal to the engine; the arrays of a structure are shared, read-only. */
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
	/** Element index of the source that closed a dead short, or -1. */
	deadSource: number;
	/** False when the arrays above are shared buffers, valid only until the next solve (do not cache by them). */
	cacheable: boolean;
};

const NO_F64 = new Float64Array(0);
const NO_I32 = new Int32Array(0);
const NO_U8 = new Uint8Array(0);

/** Shared scratch for the matrix: the engine is synchronous, and nothing keeps these after a solve. */
let A = new Float64Array(0);
let rhs = new Float64Array(0);
let xs = new Float64Array(0);
let perm = new Int32Array(0);
let spans: Spans = makeSpans(0);

function ensureScratch(n: number): void {
	if (spans.cap >= n) return;
	const cap = Math.max(n, 2 * spans.cap);
	A = new Float64Array(cap * cap);
	rhs = new Float64Array(cap);
	xs = new Float64Array(cap);
	perm = new Int32Array(cap);
	spans = makeSpans(cap);
}

/** Allocates the per-solve state for a compiled network. */
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
		deadSource: -1,
		cacheable: true
	};
}

/** True when a relay's contact (nc = the 87a side) conducts in this configuration. */
export function contactClosed(net: Net, cfg: Config, r: number, nc: boolean): boolean {
	if (net.relayWelded[r]) return !nc;
	const s = cfg.relay[r];
	return nc ? s === 0 : s === 1;
}

const structures = new WeakMap<Net, Map<number, Structure>>();
/** Relay configurations of a network solved once so far (their structure was not kept). */
const seenOnce = new WeakMap<Net, Set<number>>();
let sparScratch = new Int32Array(0);
let sParent = new Int32Array(0);
let sRoot = new Int32Array(0);
let sGOf = new Int32Array(0);
let sFixedV = new Float64Array(0);
let sSrcOn = new Uint8Array(0);
let sRowOfSrc = new Int32Array(0);

function ensureNodeScratch(nn: number, ne: number): void {
	if (sParent.length < nn) {
		sParent = new Int32Array(nn);
		sRoot = new Int32Array(nn);
		sGOf = new Int32Array(nn);
		sFixedV = new Float64Array(nn);
	}
	if (sSrcOn.length < ne) {
		sSrcOn = new Uint8Array(ne);
		sRowOfSrc = new Int32Array(ne);
	}
}
/**
 * The one structure kept for transient networks (see `Net.transient`): its own buffers, reused by
 * the next configuration of any transient network, so a diagnosis over hundreds of faulted networks
 * allocates no structure per configuration. `net`/`key` say which configuration it holds.
 */
const slot = {
	net: null as Net | null,
	key: -1,
	st: null as Structure | null,
	parent: new Int32Array(0),
	root: new Int32Array(0),
	gOf: new Int32Array(0),
	fixedV: new Float64Array(0),
	srcOn: new Uint8Array(0),
	rowOfSrc: new Int32Array(0),
	baseA: new Float64Array(0),
	baseRhs: new Float64Array(0),
	first: new Int32Array(0),
	last: new Int32Array(0)
};

/**
 * Views of shared buffers at one size, kept while the size repeats (a view is an allocation): the
 * slot's node, element and matrix arrays, and those of the scratch structure.
 */
type Views = {
	nn: number;
	ne: number;
	n: number;
	parent: Int32Array;
	root: Int32Array;
	gOf: Int32Array;
	fixedV: Float64Array;
	srcOn: Uint8Array;
	rowOfSrc: Int32Array;
	baseA: Float64Array;
	baseRhs: Float64Array;
	first: Int32Array;
	last: Int32Array;
};

function noViews(): Views {
	return { nn: -1, ne: -1, n: -1, parent: NO_I32, root: NO_I32, gOf: NO_I32, fixedV: NO_F64, srcOn: NO_U8, rowOfSrc: NO_I32, baseA: NO_F64, baseRhs: NO_F64, first: NO_I32, last: NO_I32 };
}

const slotViews = noViews();
const scratchViews = noViews();

function nodeViews(v: Views, nn: number, parent: Int32Array, root: Int32Array, gOf: Int32Array, fixedV: Float64Array): Views {
	if (v.nn !== nn || v.parent.buffer !== parent.buffer) {
		v.nn = nn;
		v.parent = parent.subarray(0, nn);
		v.root = root.subarray(0, nn);
		v.gOf = gOf.subarray(0, nn);
		v.fixedV = fixedV.subarray(0, nn);
	}
	return v;
}

function elementViews(v: Views, ne: number, srcOn: Uint8Array, rowOfSrc: Int32Array): Views {
	if (v.ne !== ne || v.srcOn.buffer !== srcOn.buffer) {
		v.ne = ne;
		v.srcOn = srcOn.subarray(0, ne);
		v.rowOfSrc = rowOfSrc.subarray(0, ne);
	}
	return v;
}

function matrixViews(v: Views, n: number, baseA: Float64Array, baseRhs: Float64Array, first: Int32Array, last: Int32Array): Views {
	if (v.n !== n || v.baseA.buffer !== baseA.buffer || v.first.buffer !== first.buffer) {
		v.n = n;
		v.baseA = baseA.subarray(0, n * n);
		v.baseRhs = baseRhs.subarray(0, n);
		v.first = first.subarray(0, n);
		v.last = last.subarray(0, n);
	}
	return v;
}

function ensureSlot(nn: number, ne: number, n: number): void {
	if (slot.parent.length < nn) {
		const cap = Math.max(nn, 2 * slot.parent.length);
		slot.parent = new Int32Array(cap);
		slot.root = new Int32Array(cap);
		slot.gOf = new Int32Array(cap);
		slot.fixedV = new Float64Array(cap);
	}
	if (slot.srcOn.length < ne) {
		const cap = Math.max(ne, 2 * slot.srcOn.length);
		slot.srcOn = new Uint8Array(cap);
		slot.rowOfSrc = new Int32Array(cap);
	}
	if (slot.baseRhs.length < n) {
		const cap = Math.max(n, 2 * slot.baseRhs.length);
		slot.baseA = new Float64Array(cap * cap);
		slot.baseRhs = new Float64Array(cap);
		slot.first = new Int32Array(cap);
		slot.last = new Int32Array(cap);
	}
}

/** Scratch of the numbering of unknowns (adjacency, degrees, stack), valid during one build. */
let oDeg = new Int32Array(0);
let oAdj = new Int32Array(0);
let oFill = new Int32Array(0);
let oLeft = new Int32Array(0);
let oPlaced = new Uint8Array(0);
let oStack = new Int32Array(0);
let oGroups = new Int32Array(0);
let oElRa = new Int32Array(0);
let oElRb = new Int32Array(0);
let oEdgeA = new Int32Array(0);
let oEdgeB = new Int32Array(0);

function ensureOrderScratch(nn: number, ne: number): void {
	if (oDeg.length < nn + 1) {
		oDeg = new Int32Array(nn + 1);
		oFill = new Int32Array(nn);
		oLeft = new Int32Array(nn);
		oPlaced = new Uint8Array(nn);
		oGroups = new Int32Array(nn);
	}
	if (oAdj.length < 2 * ne) oAdj = new Int32Array(2 * ne);
	if (oElRa.length < ne) {
		oElRa = new Int32Array(ne);
		oElRb = new Int32Array(ne);
		oEdgeA = new Int32Array(ne);
		oEdgeB = new Int32Array(ne);
	}
	if (oStack.length < nn + 2 * ne) oStack = new Int32Array(nn + 2 * ne);
}

let spotScratch = new Float64Array(0);
let tmpScratch = new Int32Array(0);

/** Fuses opened and diodes conducting as one number (bit per fuse, then per diode), or -1 when they do not fit 30 bits. */
export function maskKey(cfg: Config): number {
	const nf = cfg.fuseOpen.length;
	if (nf + cfg.diodeOn.length > 30) return -1;
	let k = 0;
	for (let f = 0; f < nf; f++) if (cfg.fuseOpen[f]) k |= 1 << f;
	for (let d = 0; d < cfg.diodeOn.length; d++) if (cfg.diodeOn[d]) k |= 1 << (nf + d);
	return k;
}

function relayKey(relay: Int8Array): number {
	let k = 0;
	for (let r = relay.length - 1; r >= 0; r--) k = k * 3 + relay[r];
	return k;
}

function sfind(spar: Int32Array, x: number): number {
	while (spar[x] !== x) x = spar[x];
	return x;
}
function spotOf(spar: Int32Array, spot: Float64Array, x: number): number {
	let p = 0;
	while (spar[x] !== x) {
		p += spot[x];
		x = spar[x];
	}
	return p;
}

/**
 * What every structure of one network starts from: each node's initial unknown mark (-2 for a
 * dormant node or a diode's midpoint, else -3), the 0 Ω merge of the fixed ideal elements with every
 * node pointing at its root, the conducting elements and the metered nodes (ascending).
 */
type NetStart = { gInit: Int32Array; baseRoot: Int32Array; cond: Int32Array; nCond: number; meteredNodes: Int32Array; nMetered: number };

const startByNet = new WeakMap<Net, NetStart>();
/** The start of the transient network built last (its arrays are shared scratch, reused by the next). */
let transientStart: { net: Net | null; st: NetStart } = {
	net: null,
	st: { gInit: NO_I32, baseRoot: NO_I32, cond: NO_I32, nCond: 0, meteredNodes: NO_I32, nMetered: 0 }
};

function netStart(net: Net): NetStart {
	if (net.transient && transientStart.net === net) return transientStart.st;
	if (!net.transient) {
		const hit = startByNet.get(net);
		if (hit) return hit;
	}
	const nn = net.nNodes;
	const ne = net.code.length;
	let st: NetStart;
	if (net.transient) {
		st = transientStart.st;
		if (st.gInit.length < nn) {
			const cap = Math.max(nn, 2 * st.gInit.length);
			st.gInit = new Int32Array(cap);
			st.baseRoot = new Int32Array(cap);
			st.meteredNodes = new Int32Array(cap);
		}
		if (st.cond.length < ne) st.cond = new Int32Array(Math.max(ne, 2 * st.cond.length));
		transientStart.net = net;
	} else st = { gInit: new Int32Array(nn), baseRoot: new Int32Array(nn), cond: new Int32Array(ne), nCond: 0, meteredNodes: new Int32Array(nn), nMetered: 0 };
	const { gInit, baseRoot, cond, meteredNodes } = st;
	baseRoot.set(net.baseParent);
	let nm = 0;
	for (let i = 0; i < nn; i++) {
		gInit[i] = net.dormant[i] ? -2 : -3;
		baseRoot[i] = findRoot(baseRoot, i);
		if (net.metered[i]) meteredNodes[nm++] = i;
	}
	for (let d = 0; d < net.diodes.length; d++) gInit[net.emid[net.diodes[d]]] = -2;
	let nc = 0;
	for (let i = 0; i < ne; i++) if (conductive(net.code[i])) cond[nc++] = i;
	st.nCond = nc;
	st.nMetered = nm;
	if (!net.transient) startByNet.set(net, st);
	return st;
}

/** True for elements stamped as a conductance in some configuration (resistors, coils, fuses, diodes). */
function conductive(c: number): boolean {
	return c === Code.Resistor || c === Code.Coil || c === Code.Fuse || c === Code.Diode;
}

/**
 * Builds the structure of one relay configuration. With `scratch`, everything goes into shared
 * buffers (nothing kept): a configuration solved once costs no lasting memory; the matrix is then
 * built straight into the solve's own buffer.
 */
function buildStructure(net: Net, cfg: Config, mode: 'keep' | 'scratch' | 'slot' = 'keep'): Structure {
	const nn = net.nNodes;
	const code = net.code;
	const ea = net.ea;
	const eb = net.eb;
	const ne = code.length;
	const scratch = mode === 'scratch';
	const inSlot = mode === 'slot';
	const reuse = scratch || inSlot;
	if (scratch) ensureNodeScratch(nn, ne);
	if (inSlot) ensureSlot(nn, ne, 0);
	ensureOrderScratch(nn, ne);
	const nodeV = scratch
		? nodeViews(scratchViews, nn, sParent, sRoot, sGOf, sFixedV)
		: inSlot
			? nodeViews(slotViews, nn, slot.parent, slot.root, slot.gOf, slot.fixedV)
			: null;
	const elV = scratch ? elementViews(scratchViews, ne, sSrcOn, sRowOfSrc) : inSlot ? elementViews(slotViews, ne, slot.srcOn, slot.rowOfSrc) : null;
	const start = netStart(net);
	const parent = nodeV ? nodeV.parent : new Int32Array(nn);
	// the fixed merge with every node at its root: a set's root is its smallest node either way
	for (let i = 0; i < nn; i++) parent[i] = start.baseRoot[i];
	const nr = net.relayPart.length;
	for (let r = 0; r < nr; r++) {
		const no = net.relayNo[r];
		const nc = net.relayNc[r];
		if (no >= 0 && contactClosed(net, cfg, r, false)) unite(parent, ea[no], eb[no]);
		if (nc >= 0 && contactClosed(net, cfg, r, true)) unite(parent, ea[nc], eb[nc]);
	}
	const root = nodeV ? nodeV.root : new Int32Array(nn);
	const gOf = nodeV ? nodeV.gOf : new Int32Array(nn);
	if (sparScratch.length < nn) {
		sparScratch = new Int32Array(nn);
		spotScratch = new Float64Array(nn);
		tmpScratch = new Int32Array(nn);
	}
	const spar = sparScratch;
	const spot = spotScratch;
	spot.fill(0, 0, nn);
	const gInit = start.gInit;
	for (let i = 0; i < nn; i++) {
		root[i] = findRoot(parent, i);
		gOf[i] = gInit[i];
		spar[i] = i;
	}
	const fixedV = nodeV ? nodeV.fixedV : new Float64Array(nn);
	const srcOn = elV ? elV.srcOn : new Uint8Array(ne);
	const rowOfSrc = elV ? elV.rowOfSrc : new Int32Array(ne);
	if (reuse) {
		fixedV.fill(0);
		srcOn.fill(0);
	}
	rowOfSrc.fill(-1);
	// sources: weighted union-find over merged nodes; a loop of sources and 0 Ω elements is a dead short
	const srcs = net.sources;
	for (let s = 0; s < srcs.length; s++) {
		const e = srcs[s];
		const rp = root[ea[e]];
		const rm = root[eb[e]];
		const v = net.ev[e];
		const a = sfind(spar, rp);
		const b = sfind(spar, rm);
		const pa = spotOf(spar, spot, rp);
		const pb = spotOf(spar, spot, rm);
		if (a === b) {
			if (Math.abs(pa - pb - v) > 1e-9)
				return { dead: e, parent, root, gOf, fixedV, srcOn, rowOfSrc, nv: 0, n: 0, baseA: NO_F64, baseRhs: NO_F64, first: NO_I32, last: NO_I32, plans: null };
			continue;
		}
		spar[a] = b;
		spot[a] = v + pb - pa;
		srcOn[e] = 1;
	}
	const gTree = sfind(spar, root[1]);
	const gPot = spotOf(spar, spot, root[1]);
	// unknown merged nodes, numbered leaves first so that elimination makes little fill-in
	const tmp = tmpScratch;
	tmp.fill(-1, 0, nn);
	const groups = oGroups;
	let ng = 0;
	for (let i = 0; i < nn; i++) {
		if (gOf[i] === -2 || root[i] !== i) continue;
		if (sfind(spar, i) === gTree) {
			gOf[i] = -1;
			fixedV[i] = spotOf(spar, spot, i) - gPot;
		} else {
			tmp[i] = ng;
			groups[ng++] = i;
		}
	}
	const nv = ng;
	// adjacency of the unknown merged nodes through conducting elements (compressed rows)
	// (each conducting element's merged end nodes are kept for the stamps below, -1 for others)
	const deg = oDeg;
	deg.fill(0, 0, nv + 1);
	const elRa = oElRa;
	const elRb = oElRb;
	const edgeA = oEdgeA;
	const edgeB = oEdgeB;
	let nEdges = 0;
	const cond = start.cond;
	const nCond = start.nCond;
	for (let q = 0; q < nCond; q++) {
		const i = cond[q];
		const ra = root[ea[i]];
		const rb = root[eb[i]];
		elRa[i] = ra;
		elRb[i] = rb;
		const ta = tmp[ra];
		const tb = tmp[rb];
		if (ta >= 0 && tb >= 0 && ta !== tb) {
			deg[ta + 1]++;
			deg[tb + 1]++;
			edgeA[nEdges] = ta;
			edgeB[nEdges++] = tb;
		}
	}
	for (let t = 0; t < nv; t++) deg[t + 1] += deg[t];
	const adj = oAdj;
	const fillAt = oFill;
	for (let t = 0; t < nv; t++) fillAt[t] = deg[t];
	for (let q = 0; q < nEdges; q++) {
		const ta = edgeA[q];
		const tb = edgeB[q];
		adj[fillAt[ta]++] = tb;
		adj[fillAt[tb]++] = ta;
	}
	// number leaves first (then the least connected), so that elimination makes little fill-in
	const left = oLeft;
	for (let t = 0; t < nv; t++) left[t] = deg[t + 1] - deg[t];
	const placed = oPlaced;
	placed.fill(0, 0, nv);
	const stack = oStack;
	let sp = 0;
	for (let t = nv - 1; t >= 0; t--) if (left[t] <= 1) stack[sp++] = t;
	let next = 0;
	while (next < nv) {
		let t = -1;
		while (sp > 0) {
			const c = stack[--sp];
			if (!placed[c]) {
				t = c;
				break;
			}
		}
		if (t < 0) {
			let best = Infinity;
			for (let c = 0; c < nv; c++)
				if (!placed[c] && left[c] < best) {
					best = left[c];
					t = c;
				}
		}
		placed[t] = 1;
		gOf[groups[t]] = next++;
		for (let q = deg[t]; q < deg[t + 1]; q++) {
			const u = adj[q];
			if (!placed[u] && --left[u] <= 1) stack[sp++] = u;
		}
	}
	let ns = 0;
	for (let s = 0; s < srcs.length; s++) {
		const e = srcs[s];
		if (srcOn[e] && gOf[root[ea[e]]] >= 0) rowOfSrc[e] = nv + ns++;
	}
	const n = nv + ns;
	// the matrix of the fixed elements, and each row's span of nonzeros (fuses and diodes included)
	let baseA: Float64Array;
	let baseRhs: Float64Array;
	let first: Int32Array;
	let last: Int32Array;
	if (scratch) {
		ensureScratch(n);
		baseA = A.subarray(0, n * n);
		baseA.fill(0);
		baseRhs = rhs.subarray(0, n);
		baseRhs.fill(0);
		first = spans.first;
		last = spans.last;
	} else if (inSlot) {
		ensureSlot(nn, ne, n);
		const mv = matrixViews(slotViews, n, slot.baseA, slot.baseRhs, slot.first, slot.last);
		baseA = mv.baseA;
		baseA.fill(0);
		baseRhs = mv.baseRhs;
		baseRhs.fill(0);
		first = mv.first;
		last = mv.last;
	} else {
		baseA = new Float64Array(n * n);
		baseRhs = new Float64Array(n);
		first = new Int32Array(n);
		last = new Int32Array(n);
	}
	for (let k = 0; k < n; k++) first[k] = last[k] = k;
	const st: Structure = { dead: -1, parent, root, gOf, fixedV, srcOn, rowOfSrc, nv, n, baseA, baseRhs, first, last, plans: reuse ? null : new Map() };
	// conducting elements, then sources: their stamps touch disjoint entries (node rows and columns,
	// source rows and columns), so the order between the two groups changes no sum
	const g = net.g;
	for (let q = 0; q < nCond; q++) {
		const i = cond[q];
		const c = code[i];
		const ra = elRa[i];
		const rb = elRb[i];
		const ia = gOf[ra];
		const ib = gOf[rb];
		if (ia >= 0 && ib >= 0) {
			if (ib < first[ia]) first[ia] = ib;
			if (ib > last[ia]) last[ia] = ib;
			if (ia < first[ib]) first[ib] = ia;
			if (ia > last[ib]) last[ib] = ia;
		}
		if (c === Code.Resistor || c === Code.Coil) stampAt(baseA, baseRhs, n, ia, ib, fixedV[ra], fixedV[rb], g[i], 0);
	}
	for (let s = 0; s < srcs.length; s++) {
		const i = srcs[s];
		if (rowOfSrc[i] >= 0) {
			const k = rowOfSrc[i];
			const ip = gOf[root[ea[i]]];
			const im = gOf[root[eb[i]]];
			baseA[ip * n + k] += 1;
			baseA[k * n + ip] += 1;
			first[k] = Math.min(first[k], ip);
			last[ip] = Math.max(last[ip], k);
			if (im >= 0) {
				baseA[im * n + k] -= 1;
				baseA[k * n + im] -= 1;
				first[k] = Math.min(first[k], im);
				last[im] = Math.max(last[im], k);
			}
			baseRhs[k] = net.ev[i];
		}
	}
	// one 10 MΩ meter per merged node with unknown volts (not on diode or battery internals)
	const gm = 1 / METER_OHMS;
	const metered = oPlaced;
	metered.fill(0, 0, nv);
	const meteredNodes = start.meteredNodes;
	for (let q = 0; q < start.nMetered; q++) {
		const k = gOf[root[meteredNodes[q]]];
		if (k >= 0 && !metered[k]) {
			metered[k] = 1;
			baseA[k * n + k] += gm;
		}
	}
	return st;
}

/**
 * `stampInto` with the ends already looked up: unknown indices ia, ib (negative for known volts)
 * and the known volts va, vb of the ends' merged nodes. The same operations in the same order.
 */
function stampAt(M: Float64Array, b: Float64Array, n: number, ia: number, ib: number, va: number, vb: number, g: number, j: number): void {
	if (ia >= 0) {
		M[ia * n + ia] += g;
		if (ib >= 0) M[ia * n + ib] -= g;
		else b[ia] += g * vb;
		b[ia] += j;
	}
	if (ib >= 0) {
		M[ib * n + ib] += g;
		if (ia >= 0) M[ib * n + ia] -= g;
		else b[ib] += g * va;
		b[ib] -= j;
	}
}

/** Stamps conductance g (S) between nodes a and b, and a current j (A) driven from b to a inside the element (Norton source). */
function stampInto(st: Structure, M: Float64Array, b: Float64Array, n: number, na: number, nb: number, g: number, j: number): void {
	const ra = st.root[na];
	const rb = st.root[nb];
	const ia = st.gOf[ra];
	const ib = st.gOf[rb];
	if (ia >= 0) {
		M[ia * n + ia] += g;
		if (ib >= 0) M[ia * n + ib] -= g;
		else b[ia] += g * st.fixedV[rb];
		b[ia] += j;
	}
	if (ib >= 0) {
		M[ib * n + ib] += g;
		if (ia >= 0) M[ib * n + ia] -= g;
		else b[ib] += g * st.fixedV[ra];
		b[ib] -= j;
	}
}

/**
 * Solves the linear network of one configuration into `w`. Returns false when 0 Ω elements join
 * nodes that sources hold at different volts (then `w.deadSource` names the source).
 * @throws SingularMatrixError only for a network the model cannot produce (every node has a meter).
 */
export function solveLinear(net: Net, cfg: Config, w: Work): boolean {
	const key = relayKey(cfg.relay);
	let st: Structure | undefined;
	let inPlace = false;
	if (net.transient) {
		// transient networks share one kept structure: the same configuration solved again in a row
		// (a diode flipped, a fuse opened) reuses it; any other configuration replaces it
		if (slot.net === net && slot.key === key) st = slot.st!;
		else {
			slot.net = null;
			st = buildStructure(net, cfg, 'slot');
			slot.net = net;
			slot.key = key;
			slot.st = st;
		}
	} else {
		let byKey = structures.get(net);
		if (!byKey) structures.set(net, (byKey = new Map()));
		st = byKey.get(key);
	}
	if (!st) {
		// a configuration is kept from its second solve on; the first is solved in shared buffers
		let seen = seenOnce.get(net);
		if (!seen) seenOnce.set(net, (seen = new Set()));
		if (seen.has(key)) structures.get(net)!.set(key, (st = buildStructure(net, cfg)));
		else {
			seen.add(key);
			st = buildStructure(net, cfg, 'scratch');
			inPlace = true;
		}
	}
	w.cacheable = !inPlace && !net.transient;
	w.parent = st.parent;
	w.root = st.root;
	w.gOf = st.gOf;
	w.fixedV = st.fixedV;
	w.srcOn = st.srcOn;
	w.deadSource = st.dead;
	if (st.dead >= 0) return false;
	const n = st.n;
	w.nv = st.nv;
	w.n = n;
	ensureScratch(n);
	const mk = st.plans ? maskKey(cfg) : -1;
	const plan = mk >= 0 ? st.plans!.get(mk) : undefined;
	if (plan) {
		// the replay reads and writes only the plan's positions (and the stamps below, which are in it)
		const pos = plan.pos;
		const baseA = st.baseA;
		for (let q = 0; q < pos.length; q++) A[pos[q]] = baseA[pos[q]];
		rhs.set(st.baseRhs);
	} else if (!inPlace) {
		A.set(st.baseA);
		rhs.set(st.baseRhs);
		spans.first.set(st.first);
		spans.last.set(st.last);
	}
	const ea = net.ea;
	const eb = net.eb;
	const g = net.g;
	const fuses = net.fuses;
	for (let f = 0; f < fuses.length; f++) if (!cfg.fuseOpen[f]) stampInto(st, A, rhs, n, ea[fuses[f]], eb[fuses[f]], g[fuses[f]], 0);
	const diodes = net.diodes;
	for (let d = 0; d < diodes.length; d++) {
		const e = diodes[d];
		if (cfg.diodeOn[d]) stampInto(st, A, rhs, n, ea[e], eb[e], g[e], g[e] * net.ev[e]);
	}
	// the matrix is symmetric by construction (every stamp adds the same to (a, b) and (b, a))
	if (n > 0) {
		if (plan) {
			luFactorByPlan(A, n, plan);
			luSolveByPlan(A, n, plan, rhs, xs);
		} else {
			if (mk >= 0) st.plans!.set(mk, luFactorRecorded(A, n, perm, spans, true, true));
			else luFactor(A, n, perm, spans, true, true);
			luSolve(A, n, perm, rhs, xs, spans);
		}
	}
	const V = w.V;
	const root = st.root;
	const gOf = st.gOf;
	for (let i = 0; i < V.length; i++) {
		if (gOf[i] === -2) {
			V[i] = 0;
			continue;
		}
		const r = root[i];
		const k = gOf[r];
		V[i] = k >= 0 ? xs[k] : st.fixedV[r];
	}
	for (let d = 0; d < diodes.length; d++) {
		const e = diodes[d];
		V[net.emid[e]] = cfg.diodeOn[d] ? V[eb[e]] + net.ev[e] : V[eb[e]];
	}
	return true;
}

/** Current in A through a resistive element (resistor, coil, intact fuse, conducting diode) from its a to its b node. */
export function elementAmps(net: Net, w: Work, i: number): number {
	if (net.code[i] === Code.Diode) return (w.V[net.ea[i]] - w.V[net.eb[i]] - net.ev[i]) * net.g[i];
	return (w.V[net.ea[i]] - w.V[net.eb[i]]) * net.g[i];
}
