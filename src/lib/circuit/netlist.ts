/**
 * Compiles a (possibly faulted) circuit, a state and an optional test lamp into index-based arrays
 * for the solver. Everything the settling loop does not change is fixed here once.
 */
import { SolveOptionError } from './errors';
import { FUSE_TYPES, LOAD_TYPES, makeElement, type Circuit, type NetElement } from './model';
import { TEST_LAMP_WATTS } from './tables';
import { unite } from './union-find';

/** Element codes of the compiled network. */
export const enum Code {
	Resistor = 0,
	Ideal = 1,
	Fuse = 2,
	RelayNo = 3,
	RelayNc = 4,
	Coil = 5,
	Diode = 6,
	Source = 7,
	Off = 8
}

/** A compiled network with its solver buffers. Internal to the engine. */
export type Net = {
	circuit: Circuit;
	state: string | null;
	/** Battery EMF in force, V. */
	emf: number;
	nNodes: number;
	els: NetElement[];
	code: Uint8Array;
	ea: Int32Array;
	eb: Int32Array;
	/** Conductance in S (resistive codes), 0 otherwise. */
	g: Float64Array;
	/** Volts of sources and diode drops. */
	ev: Float64Array;
	/** Diode internal node per element (-1 for others). */
	emid: Int32Array;
	/** 1 where a node gets a 10 MΩ meter when it is part of the network. */
	metered: Uint8Array;
	/** 1 for an internal node no element touches. */
	dormant: Uint8Array;
	baseParent: Int32Array;
	fuses: Int32Array;
	fuseRating: Float64Array;
	relayPart: Int32Array;
	relayNo: Int32Array;
	relayNc: Int32Array;
	relayCoil: Int32Array;
	relay85: Int32Array;
	relay86: Int32Array;
	/** 1 when the relay coil is open or shorted: it stays released. */
	relayDead: Uint8Array;
	relayWelded: Uint8Array;
	pullInMv: Int32Array;
	dropOutMv: Int32Array;
	diodes: Int32Array;
	/** Battery and supply-part sources (battery first). */
	sources: Int32Array;
	lampEl: number;
	lampOhms: number;
	/** Node index of each labelled point, in file order. */
	pointNode: Int32Array;
	/** Element indices of part q, in file order: `partElList[partElAt[q]]` up to `partElList[partElAt[q + 1] - 1]`. */
	partElAt: Int32Array;
	partElList: Int32Array;
	/** Fuse slot, diode slot and relay index of each element (-1 where none). */
	fuseSlot: Int32Array;
	diodeSlot: Int32Array;
	relayOfEl: Int32Array;
	/** Relay index of each part (-1 for non-relays). */
	relayOfPart: Int32Array;
	/** What each part reports (see `PartKind`). */
	partKind: Uint8Array;
	/** 1 for the battery's internal resistance (its current is taken from KCL, like the source's). */
	seriesOfSource: Uint8Array;
	/**
	 * True for a network compiled for one use (a diagnosis's faulted networks, see `compileTransient`):
	 * nothing is cached by it, its arrays and solve structure live in shared buffers (valid until the
	 * next transient network is compiled), its results are read right after settling. The arithmetic
	 * is the same as for a cached network.
	 */
	transient: boolean;
};

/** Part kinds for reporting status and current. */
export const enum PartKind {
	Fuse = 0,
	Breaker = 1,
	Relay = 2,
	Switch = 3,
	Positioned = 4,
	Load = 5,
	Diode = 6,
	Supply = 7,
	Resistor = 8,
	Bond = 9,
	Splice = 10
}

function partKindOf(p: Circuit['parts'][number]): PartKind {
	if (p.type === 'breaker') return PartKind.Breaker;
	if (FUSE_TYPES.has(p.type)) return PartKind.Fuse;
	if (p.type === 'relay') return PartKind.Relay;
	if (p.type === 'switch') return p.positions ? PartKind.Positioned : PartKind.Switch;
	if (LOAD_TYPES.has(p.type)) return PartKind.Load;
	if (p.type === 'diode') return PartKind.Diode;
	if (p.type === 'supply') return PartKind.Supply;
	if (p.type === 'resistor') return PartKind.Resistor;
	if (p.type === 'connector' || p.type === 'ground') return PartKind.Bond;
	return PartKind.Splice;
}

/** Resolves a lamp option to [node index, other end node index]. @throws SolveOptionError. */
function lampEnds(c: Circuit, lamp: string): [number, number] {
	const [where, to, extra] = lamp.split(':');
	if (extra !== undefined || (to !== undefined && to !== 'B+' && to !== 'GND'))
		throw new SolveOptionError('lamp', `lamp "${lamp}" must be POINT (to GND) or POINT:B+`);
	const pt = c.points.find((p) => p.label === where);
	const node = pt ? pt.node : where;
	const i = c.nodeNames.indexOf(node);
	if (i < 0 || i >= c.fileNodeCount)
		throw new SolveOptionError('lamp', `lamp point "${where}" is not a labelled point or node of this circuit; points: ${c.points.map((p) => p.label).join(', ') || 'none'}`);
	return [i, to === 'B+' ? 0 : 1];
}

/**
 * Compiles a circuit for one state (null = defaults) and an optional lamp (`A` or `A:B+`).
 * @throws SolveOptionError for an unknown state or lamp point.
 */
export function compileNet(c: Circuit, state: string | null | undefined, lamp: string | null | undefined): Net {
	let byKey = netCache.get(c);
	if (!byKey) netCache.set(c, (byKey = new Map()));
	const key = `${state ?? ''}\u0000${lamp ?? ''}`;
	const hit = byKey.get(key);
	if (hit) return hit;
	const net = buildNet(c, state, lamp);
	if (byKey.size > 64) byKey.clear();
	byKey.set(key, net);
	return net;
}

/**
 * Compiles a circuit for one state without caching the network (see `Net.transient`): for a
 * diagnosis, which settles each faulted circuit once per state and keeps only what it read. The
 * network is valid until the next call: settle it and read its results before compiling another.
 * @throws SolveOptionError for an unknown state or lamp point.
 */
export function compileTransient(c: Circuit, state: string | null | undefined, lamp: string | null | undefined): Net {
	return buildNet(c, state, lamp, true);
}

/** Compiled networks by circuit, then by state and lamp. A Net is never changed after it is built. */
const netCache = new WeakMap<Circuit, Map<string, Net>>();

/** What a circuit and all its faulted versions share: point nodes and part kinds (read-only). */
const sharedByParts = new WeakMap<object, { pointNode: Int32Array; partKind: Uint8Array }>();

function sharedOf(c: Circuit, nodeIdx: Map<string, number>): { pointNode: Int32Array; partKind: Uint8Array } {
	let sh = sharedByParts.get(c.parts);
	if (!sh) {
		const pointNode = new Int32Array(c.points.length);
		for (let q = 0; q < c.points.length; q++) pointNode[q] = nodeIdx.get(c.points[q].node)!;
		const partKind = new Uint8Array(c.parts.length);
		for (let i = 0; i < c.parts.length; i++) partKind[i] = partKindOf(c.parts[i]);
		sh = { pointNode, partKind };
		sharedByParts.set(c.parts, sh);
	}
	return sh;
}

/** Node name -> index for the file's own nodes (shared by a circuit and its faulted versions). */
const fileNodeIndex = new WeakMap<readonly string[], Map<string, number>>();

function nodeIndexOf(c: Circuit): Map<string, number> {
	const key = c.parts as readonly unknown[] as readonly string[];
	let m = fileNodeIndex.get(key);
	if (!m) {
		m = new Map();
		for (let i = 0; i < c.fileNodeCount; i++) m.set(c.nodeNames[i], i);
		fileNodeIndex.set(key, m);
	}
	return m;
}

/** The typed arrays of one network, all views on one buffer (one allocation instead of some thirty). */
type NetArrays = {
	bytes: Uint8Array;
	code: Uint8Array;
	ea: Int32Array;
	eb: Int32Array;
	g: Float64Array;
	ev: Float64Array;
	emid: Int32Array;
	metered: Uint8Array;
	dormant: Uint8Array;
	baseParent: Int32Array;
	fuses: Int32Array;
	fuseRating: Float64Array;
	relayPart: Int32Array;
	relayNo: Int32Array;
	relayNc: Int32Array;
	relayCoil: Int32Array;
	relay85: Int32Array;
	relay86: Int32Array;
	relayDead: Uint8Array;
	relayWelded: Uint8Array;
	pullInMv: Int32Array;
	dropOutMv: Int32Array;
	diodes: Int32Array;
	sources: Int32Array;
	fuseSlot: Int32Array;
	diodeSlot: Int32Array;
	relayOfEl: Int32Array;
	relayOfPart: Int32Array;
	seriesOfSource: Uint8Array;
	partElAt: Int32Array;
	partElList: Int32Array;
};

/** Allocates zero-filled arrays for ne elements, nn nodes, np parts, nr relays, nf fuses, nd diodes, ns sources. */
function makeArrays(ne: number, nn: number, np: number, nr: number, nf: number, nd: number, ns: number): NetArrays {
	const nf64 = 2 * ne + nf;
	const ni32 = 7 * ne + nn + 8 * nr + nf + nd + ns + 2 * np + 1;
	const nu8 = 2 * ne + 2 * nn + 2 * nr;
	const buf = new ArrayBuffer(nf64 * 8 + ni32 * 4 + nu8);
	let pf = 0;
	let pi = nf64 * 8;
	let pu = pi + ni32 * 4;
	const f64 = (n: number): Float64Array => {
		const a = new Float64Array(buf, pf, n);
		pf += 8 * n;
		return a;
	};
	const i32 = (n: number): Int32Array => {
		const a = new Int32Array(buf, pi, n);
		pi += 4 * n;
		return a;
	};
	const u8 = (n: number): Uint8Array => {
		const a = new Uint8Array(buf, pu, n);
		pu += n;
		return a;
	};
	const a: NetArrays = {
		bytes: new Uint8Array(buf),
		g: f64(ne),
		ev: f64(ne),
		fuseRating: f64(nf),
		ea: i32(ne),
		eb: i32(ne),
		emid: i32(ne),
		fuseSlot: i32(ne),
		diodeSlot: i32(ne),
		relayOfEl: i32(ne),
		partElList: i32(ne),
		baseParent: i32(nn),
		relayPart: i32(nr),
		relayNo: i32(nr),
		relayNc: i32(nr),
		relayCoil: i32(nr),
		relay85: i32(nr),
		relay86: i32(nr),
		pullInMv: i32(nr),
		dropOutMv: i32(nr),
		fuses: i32(nf),
		diodes: i32(nd),
		sources: i32(ns),
		relayOfPart: i32(np),
		partElAt: i32(np + 1),
		code: u8(ne),
		seriesOfSource: u8(ne),
		metered: u8(nn),
		dormant: u8(nn),
		relayDead: u8(nr),
		relayWelded: u8(nr)
	};
	if (pf !== nf64 * 8 || pi !== nf64 * 8 + ni32 * 4 || pu !== buf.byteLength) throw new Error('network arrays laid out wrongly'); // cannot happen: the sizes above are the views'
	return a;
}

/**
 * Arrays of transient networks by layout (the sizes above): a transient network reuses the arrays of
 * the last one with its layout (they are valid until the next transient network is compiled).
 */
const transientArrays = new Map<string, NetArrays>();

function arraysFor(ne: number, nn: number, np: number, nr: number, nf: number, nd: number, ns: number, transient: boolean): NetArrays {
	if (!transient) return makeArrays(ne, nn, np, nr, nf, nd, ns);
	const key = `${ne},${nn},${np},${nr},${nf},${nd},${ns}`;
	let a = transientArrays.get(key);
	if (a) a.bytes.fill(0);
	else {
		if (transientArrays.size >= 64) transientArrays.clear();
		transientArrays.set(key, (a = makeArrays(ne, nn, np, nr, nf, nd, ns)));
	}
	return a;
}

/** Scratch of the first pass over a circuit's elements: relay index by part, relay parts, elements per part. */
let relayByPart = new Int32Array(0);
let relayParts = new Int32Array(0);
let partFill = new Int32Array(0);

function buildNet(c: Circuit, state: string | null | undefined, lamp: string | null | undefined, transient = false): Net {
	const nodeIdx = nodeIndexOf(c);
	const st = state == null ? null : c.states.find((s) => s.name === state);
	if (st === undefined)
		throw new SolveOptionError('state', `unknown state "${state}"; this circuit's states are ${c.states.map((s) => s.name).join(', ') || 'none'}`);
	const emf = st?.supply ?? c.supply.volts;
	// a network never changes its elements, so without a lamp it shares the circuit's (never changed either)
	let els = c.elements;
	let lampEl = -1;
	let lampOhms = 0;
	if (lamp) {
		const [a, b] = lampEnds(c, lamp);
		lampOhms = (c.supply.volts * c.supply.volts) / TEST_LAMP_WATTS;
		els = els.slice();
		lampEl = els.length;
		els.push(makeElement('lamp', null, 'lamp', 'resistor', a, b, lampOhms, 0, -1));
	}
	const ne = els.length;
	const nNodes = c.nodeNames.length;
	const np = c.parts.length;
	// first pass: counts (array sizes), relays numbered in order of their first element, elements per part
	if (relayByPart.length < np) {
		relayByPart = new Int32Array(np);
		relayParts = new Int32Array(np);
		partFill = new Int32Array(np + 1);
	}
	relayByPart.fill(-1, 0, np);
	partFill.fill(0, 0, np + 1);
	let nr = 0;
	let nf = 0;
	let nd = 0;
	let ns = 0;
	for (let i = 0; i < ne; i++) {
		const e = els[i];
		const role = e.role;
		if (role === 'fuse') nf++;
		else if (role === 'diode') nd++;
		else if (role === 'source') ns++;
		else if ((role === 'no' || role === 'nc' || role === 'coil') && relayByPart[e.part] < 0) {
			relayByPart[e.part] = nr;
			relayParts[nr++] = e.part;
		}
		if (e.part >= 0) partFill[e.part + 1]++;
	}
	const arr = arraysFor(ne, nNodes, np, nr, nf, nd, ns, transient);
	const { code, ea, eb, g, ev, emid, baseParent, fuses, diodes, sources, fuseSlot, diodeSlot, relayOfEl, seriesOfSource } = arr;
	const { relayPart, relayNo, relayNc, relayCoil, relay85, relay86, relayDead, relayWelded, pullInMv, dropOutMv, relayOfPart } = arr;
	const { partElAt, partElList } = arr;
	for (let q = 0; q < np; q++) {
		partFill[q + 1] += partFill[q];
		partElAt[q + 1] = partFill[q + 1];
		relayOfPart[q] = relayByPart[q];
	}
	for (let r = 0; r < nr; r++) {
		relayPart[r] = relayParts[r];
		relayNo[r] = relayNc[r] = relayCoil[r] = -1;
	}
	for (let i = 0; i < nNodes; i++) baseParent[i] = i;
	let kf = 0;
	let kd = 0;
	let ks = 0;
	for (let i = 0; i < ne; i++) {
		const e = els[i];
		ea[i] = e.a;
		eb[i] = e.b;
		emid[i] = -1;
		fuseSlot[i] = -1;
		diodeSlot[i] = -1;
		relayOfEl[i] = -1;
		const p = e.part >= 0 ? c.parts[e.part] : null;
		if (p) partElList[partFill[e.part]++] = i;
		switch (e.role) {
			case 'resistor': {
				let ohms = e.ohms;
				if (p && p.type === 'resistor' && st && st.resistors[p.id] !== undefined && e.ohms === p.ohms) ohms = st.resistors[p.id];
				code[i] = Code.Resistor;
				g[i] = 1 / ohms;
				if (e.kind === 'source') seriesOfSource[i] = 1;
				break;
			}
			case 'ideal':
				code[i] = Code.Ideal;
				break;
			case 'fuse':
				code[i] = Code.Fuse;
				g[i] = 1 / e.ohms;
				fuseSlot[i] = kf;
				fuses[kf++] = i;
				break;
			case 'switch': {
				const setting = (st && st.switches[p!.id]) ?? p!.normally;
				code[i] = e.stuck || setting === 'closed' ? Code.Ideal : Code.Off;
				break;
			}
			case 'position': {
				const setting = (st && st.switches[p!.id]) ?? p!.positions![0].name;
				code[i] = setting === e.position ? Code.Ideal : Code.Off;
				break;
			}
			case 'no':
			case 'nc':
			case 'coil': {
				const r = relayByPart[e.part];
				relayOfEl[i] = r;
				if (e.role === 'no') {
					code[i] = Code.RelayNo;
					relayNo[r] = i;
					if (e.stuck) relayWelded[r] = 1;
				} else if (e.role === 'nc') {
					code[i] = Code.RelayNc;
					relayNc[r] = i;
				} else {
					code[i] = Code.Coil;
					g[i] = 1 / e.ohms;
					relayCoil[r] = i;
					if (e.dead) relayDead[r] = 1;
				}
				break;
			}
			case 'diode':
				code[i] = Code.Diode;
				g[i] = 1 / e.ohms;
				ev[i] = e.volts;
				emid[i] = e.mid!;
				diodeSlot[i] = kd;
				diodes[kd++] = i;
				break;
			case 'source':
				code[i] = Code.Source;
				ev[i] = e.battery ? emf : e.volts;
				sources[ks++] = i;
				break;
		}
		if (code[i] === Code.Ideal) unite(baseParent, e.a, e.b);
	}
	// relays: from the part list, so a relay with every element removed by a fault still reports
	for (let r = 0; r < nr; r++) {
		const p = c.parts[relayPart[r]];
		relay85[r] = nodeIdx.get(`${p.id}.85`)!;
		relay86[r] = nodeIdx.get(`${p.id}.86`)!;
		pullInMv[r] = Math.round(p.pullIn! * 1000);
		dropOutMv[r] = Math.round(p.dropOut! * 1000);
		if (relayCoil[r] < 0 || c.deadCoils.includes(p.id)) relayDead[r] = 1;
	}
	const metered = arr.metered;
	const fileNodes = c.fileNodeCount;
	for (let i = 0; i < nNodes; i++) {
		const n = c.nodeNames[i];
		metered[i] = i !== 1 && !(i >= fileNodes && (n.endsWith('#int') || n.endsWith('#emf'))) ? 1 : 0;
	}
	// internal nodes that no element touches (a removed diode's midpoint) stay out of the matrix
	const dormant = arr.dormant;
	for (let i = fileNodes; i < nNodes; i++) dormant[i] = metered[i] ? 0 : 1;
	for (let i = 0; i < ne; i++) {
		dormant[ea[i]] = 0;
		dormant[eb[i]] = 0;
		if (emid[i] >= 0) dormant[emid[i]] = 0;
	}
	const fuseRating = arr.fuseRating;
	for (let k = 0; k < nf; k++) {
		const p = c.parts[els[fuses[k]].part];
		fuseRating[k] = FUSE_TYPES.has(p.type) ? p.rating! : Infinity;
	}
	const shared = sharedOf(c, nodeIdx);
	return {
		partKind: shared.partKind,
		seriesOfSource,
		pointNode: shared.pointNode,
		partElAt,
		partElList,
		fuseSlot,
		diodeSlot,
		relayOfEl,
		relayOfPart,
		circuit: c,
		state: st ? st.name : null,
		emf,
		nNodes,
		els,
		code,
		ea,
		eb,
		g,
		ev,
		emid,
		metered,
		dormant,
		baseParent,
		fuses,
		fuseRating,
		relayPart,
		relayNo,
		relayNc,
		relayCoil,
		relay85,
		relay86,
		relayDead,
		relayWelded,
		pullInMv,
		dropOutMv,
		diodes,
		sources,
		lampEl,
		lampOhms,
		transient
	};
}
