/**
 * Compiles a (possibly faulted) circuit, a state and an optional test lamp into index-based arrays
 * for the solver. Everything the settling loop does not change is fixed here once.
 */
import { SolveOptionError } from './errors';
import { FUSE_TYPES, LOAD_TYPES, type Circuit, type NetElement } from './model';
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
	/** Element indices of each part, in file order. */
	partEls: number[][];
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

/** The buffer of the transient network being used (see `compileTransient`), grown as needed. */
let oneUse = new ArrayBuffer(0);
let oneUseBytes = new Uint8Array(oneUse);

/**
 * A bump allocator of typed arrays over one buffer sized up front (zero-filled, like fresh arrays):
 * 64-bit floats first, then 32-bit integers, then bytes. With `reuse`, the buffer is the one shared
 * by every transient network.
 */
function arena(nf64: number, ni32: number, nu8: number, reuse: boolean) {
	const bytes = nf64 * 8 + ni32 * 4 + nu8;
	let buf: ArrayBuffer;
	if (reuse) {
		if (oneUse.byteLength < bytes) {
			oneUse = new ArrayBuffer(Math.max(bytes, 2 * oneUse.byteLength));
			oneUseBytes = new Uint8Array(oneUse);
		} else oneUseBytes.fill(0, 0, bytes);
		buf = oneUse;
	} else buf = new ArrayBuffer(bytes);
	const endF = nf64 * 8;
	const endI = endF + ni32 * 4;
	let pf = 0;
	let pi = endF;
	let pu = endI;
	const room = (end: number, cap: number): void => {
		if (end > cap) throw new Error('network arrays sized too small'); // cannot happen: sizes are bounds
	};
	const i32 = (n: number): Int32Array => {
		room(pi + 4 * n, endI);
		const a = new Int32Array(buf, pi, n);
		pi += 4 * n;
		return a;
	};
	return {
		f64: (n: number): Float64Array => {
			room(pf + 8 * n, endF);
			const a = new Float64Array(buf, pf, n);
			pf += 8 * n;
			return a;
		},
		i32,
		u8: (n: number): Uint8Array => {
			room(pu + n, bytes);
			const a = new Uint8Array(buf, pu, n);
			pu += n;
			return a;
		},
		from: (xs: number[]): Int32Array => {
			const a = i32(xs.length);
			a.set(xs);
			return a;
		}
	};
}

function buildNet(c: Circuit, state: string | null | undefined, lamp: string | null | undefined, transient = false): Net {
	const nodeIdx = nodeIndexOf(c);
	const st = state == null ? null : c.states.find((s) => s.name === state);
	if (st === undefined)
		throw new SolveOptionError('state', `unknown state "${state}"; this circuit's states are ${c.states.map((s) => s.name).join(', ') || 'none'}`);
	const emf = st?.supply ?? c.supply.volts;
	const els = c.elements.slice();
	let lampEl = -1;
	let lampOhms = 0;
	if (lamp) {
		const [a, b] = lampEnds(c, lamp);
		lampOhms = (c.supply.volts * c.supply.volts) / TEST_LAMP_WATTS;
		lampEl = els.length;
		els.push({ id: 'lamp', pathId: null, kind: 'lamp', role: 'resistor', a, b, ohms: lampOhms, volts: 0, part: -1 });
	}
	const ne = els.length;
	const nNodes = c.nodeNames.length;
	// every array of the network in one buffer (one allocation instead of some twenty)
	const np = c.parts.length;
	const mem = arena(3 * ne, 7 * ne + nNodes + 9 * np, 2 * ne + 2 * nNodes + 2 * np, transient);
	const code = mem.u8(ne);
	const ea = mem.i32(ne);
	const eb = mem.i32(ne);
	const g = mem.f64(ne);
	const ev = mem.f64(ne);
	const emid = mem.i32(ne).fill(-1);
	const baseParent = mem.i32(nNodes);
	for (let i = 0; i < nNodes; i++) baseParent[i] = i;
	const fuses: number[] = [];
	const diodes: number[] = [];
	const sources: number[] = [];
	const relayIdx = new Map<number, number>();
	const relayPart: number[] = [];
	for (let i = 0; i < ne; i++) {
		const e = els[i];
		ea[i] = e.a;
		eb[i] = e.b;
		const p = e.part >= 0 ? c.parts[e.part] : null;
		switch (e.role) {
			case 'resistor': {
				let ohms = e.ohms;
				if (p && p.type === 'resistor' && st && st.resistors[p.id] !== undefined && e.ohms === p.ohms) ohms = st.resistors[p.id];
				code[i] = Code.Resistor;
				g[i] = 1 / ohms;
				break;
			}
			case 'ideal':
				code[i] = Code.Ideal;
				break;
			case 'fuse':
				code[i] = Code.Fuse;
				g[i] = 1 / e.ohms;
				fuses.push(i);
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
				let r = relayIdx.get(e.part);
				if (r === undefined) {
					r = relayPart.length;
					relayIdx.set(e.part, r);
					relayPart.push(e.part);
				}
				code[i] = e.role === 'no' ? Code.RelayNo : e.role === 'nc' ? Code.RelayNc : Code.Coil;
				if (e.role === 'coil') g[i] = 1 / e.ohms;
				break;
			}
			case 'diode':
				code[i] = Code.Diode;
				g[i] = 1 / e.ohms;
				ev[i] = e.volts;
				emid[i] = e.mid!;
				diodes.push(i);
				break;
			case 'source':
				code[i] = Code.Source;
				ev[i] = e.battery ? emf : e.volts;
				sources.push(i);
				break;
		}
		if (code[i] === Code.Ideal) unite(baseParent, e.a, e.b);
	}
	// relays: from the part list, so a relay with every element removed by a fault still reports
	const nr = relayPart.length;
	const relayNo = mem.i32(nr).fill(-1);
	const relayNc = mem.i32(nr).fill(-1);
	const relayCoil = mem.i32(nr).fill(-1);
	const relay85 = mem.i32(nr);
	const relay86 = mem.i32(nr);
	const relayDead = mem.u8(nr);
	const relayWelded = mem.u8(nr);
	const pullInMv = mem.i32(nr);
	const dropOutMv = mem.i32(nr);
	for (let r = 0; r < nr; r++) {
		const p = c.parts[relayPart[r]];
		relay85[r] = nodeIdx.get(`${p.id}.85`)!;
		relay86[r] = nodeIdx.get(`${p.id}.86`)!;
		pullInMv[r] = Math.round(p.pullIn! * 1000);
		dropOutMv[r] = Math.round(p.dropOut! * 1000);
		relayDead[r] = c.deadCoils.includes(p.id) ? 1 : 0;
	}
	for (let i = 0; i < ne; i++) {
		const e = els[i];
		if (e.role !== 'no' && e.role !== 'nc' && e.role !== 'coil') continue;
		const r = relayIdx.get(e.part)!;
		if (e.role === 'no') {
			relayNo[r] = i;
			if (e.stuck) relayWelded[r] = 1;
		} else if (e.role === 'nc') relayNc[r] = i;
		else {
			relayCoil[r] = i;
			if (e.dead) relayDead[r] = 1;
		}
	}
	for (let r = 0; r < nr; r++) if (relayCoil[r] < 0) relayDead[r] = 1;
	const metered = mem.u8(nNodes);
	for (let i = 0; i < nNodes; i++) {
		const n = c.nodeNames[i];
		metered[i] = i !== 1 && !(i >= c.fileNodeCount && (n.endsWith('#int') || n.endsWith('#emf'))) ? 1 : 0;
	}
	// internal nodes that no element touches (a removed diode's midpoint) stay out of the matrix
	const dormant = mem.u8(nNodes);
	for (let i = c.fileNodeCount; i < nNodes; i++) dormant[i] = metered[i] ? 0 : 1;
	for (let i = 0; i < ne; i++) {
		dormant[ea[i]] = 0;
		dormant[eb[i]] = 0;
		if (emid[i] >= 0) dormant[emid[i]] = 0;
	}
	const fuseRating = mem.f64(fuses.length);
	fuses.forEach((ei, k) => {
		const p = c.parts[els[ei].part];
		fuseRating[k] = FUSE_TYPES.has(p.type) ? p.rating! : Infinity;
	});
	const shared = sharedOf(c, nodeIdx);
	const pointNode = shared.pointNode;
	const partEls: number[][] = c.parts.map(() => []);
	for (let i = 0; i < ne; i++) if (els[i].part >= 0) partEls[els[i].part].push(i);
	const fuseSlot = mem.i32(ne).fill(-1);
	fuses.forEach((e, k) => (fuseSlot[e] = k));
	const diodeSlot = mem.i32(ne).fill(-1);
	diodes.forEach((e, k) => (diodeSlot[e] = k));
	const relayOfEl = mem.i32(ne).fill(-1);
	const relayOfPart = mem.i32(np).fill(-1);
	for (let r = 0; r < nr; r++) {
		relayOfPart[relayPart[r]] = r;
		for (const e of [relayNo[r], relayNc[r], relayCoil[r]]) if (e >= 0) relayOfEl[e] = r;
	}
	const partKind = shared.partKind;
	const seriesOfSource = mem.u8(ne);
	for (let i = 0; i < ne; i++) if (els[i].kind === 'source' && els[i].role === 'resistor') seriesOfSource[i] = 1;
	return {
		partKind,
		seriesOfSource,
		pointNode,
		partEls,
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
		fuses: mem.from(fuses),
		fuseRating,
		relayPart: mem.from(relayPart),
		relayNo,
		relayNc,
		relayCoil,
		relay85,
		relay86,
		relayDead,
		relayWelded,
		pullInMv,
		dropOutMv,
		diodes: mem.from(diodes),
		sources: mem.from(sources),
		lampEl,
		lampOhms,
		transient
	};
}
