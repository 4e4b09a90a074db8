/**
 * Results of a settled solve: rounded node volts, reading classes, part statuses and currents,
 * element-level currents (ideal elements by Kirchhoff's current law, with the equal minimum-norm
 * split where 0 Ω elements form a loop), the linear network, and dead-short loops.
 */
import { luFactor, luSolve } from './lu';
import { contactClosed, elementAmps, maskKey, type Config, type Work } from './mna';
import { FUSE_TYPES, LOAD_TYPES } from './model';
import { Code, PartKind, type Net } from './netlist';
import type { Settled } from './settle';
import {
	LOAD_ON_FRACTION,
	LOAD_WEAK_FRACTION,
	METER_OHMS,
	READING_BAND_MV,
	roundAmps,
	roundVolts,
	toMillivolts
} from './tables';
import type { ElementCurrent, LinearNetwork, Reads, SolveResult } from './types';
import { findRoot, unite } from './union-find';

/** Relay index of every element (-1 for non-relay elements). */
export function relayOfElements(net: Net): Int32Array {
	return net.relayOfEl;
}

/** True when element i is a 0 Ω element in place. */
function isIdealOn(net: Net, cfg: Config, i: number, rel: Int32Array): boolean {
	const c = net.code[i];
	if (c === Code.Ideal) return true;
	if (c === Code.RelayNo) return contactClosed(net, cfg, rel[i], false);
	if (c === Code.RelayNc) return contactClosed(net, cfg, rel[i], true);
	return false;
}

/** Fuse slot of every element (-1 for non-fuses). */
function fuseSlots(net: Net): Int32Array {
	return net.fuseSlot;
}

function diodeSlots(net: Net): Int32Array {
	return net.diodeSlot;
}

/** True when element i conducts as a non-ideal element (resistance, intact fuse, conducting diode). */
function resistiveOn(net: Net, cfg: Config, i: number, fs: Int32Array, ds: Int32Array): boolean {
	const c = net.code[i];
	if (c === Code.Resistor || c === Code.Coil) return true;
	if (c === Code.Fuse) return !cfg.fuseOpen[fs[i]];
	if (c === Code.Diode) return !!cfg.diodeOn[ds[i]];
	return false;
}

/**
 * Currents in A of every element from its a node to its b node: resistive elements by Ohm's law;
 * 0 Ω elements and sources (battery, supply parts) by Kirchhoff's current law over the graph they
 * form, with the equal minimum-norm split where they close a loop (a unit-weight Laplacian solve;
 * a tree is solved exactly by peeling leaves). A source's current is reported from its − node to
 * its + node (positive while delivering). Also returns each merged node's meter current by root node.
 * With `scratch`, both arrays are shared buffers (possibly longer than needed), valid until the next call.
 */
export function elementCurrents(s: Settled, scratch = false): { amps: Float64Array; meter: Float64Array } {
	const { net, cfg, work: w } = s;
	const ne = net.els.length;
	const nn = net.nNodes;
	const plan = currentPlan(s);
	let amps: Float64Array;
	let meter: Float64Array;
	if (scratch) {
		if (ampsScratch.length < ne) ampsScratch = new Float64Array(Math.max(ne, 2 * ampsScratch.length));
		if (meterScratch.length < nn) meterScratch = new Float64Array(Math.max(nn, 2 * meterScratch.length));
		amps = ampsScratch;
		meter = meterScratch;
		amps.fill(0, 0, ne);
		meter.fill(0, 0, nn);
	} else {
		amps = new Float64Array(ne);
		meter = new Float64Array(nn);
	}
	if (inflowScratch.length < nn) inflowScratch = new Float64Array(nn);
	const inflow = inflowScratch;
	inflow.fill(0, 0, nn);
	const fs = net.fuseSlot;
	const ds = net.diodeSlot;
	const V = w.V;
	for (let i = 0; i < ne; i++) {
		if (net.seriesOfSource[i] || !resistiveOn(net, cfg, i, fs, ds)) continue;
		const I = net.code[i] === Code.Diode ? (V[net.ea[i]] - V[net.eb[i]] - net.ev[i]) * net.g[i] : (V[net.ea[i]] - V[net.eb[i]]) * net.g[i];
		amps[i] = I;
		inflow[net.eb[i]] += I;
		inflow[net.ea[i]] -= I;
	}
	const mr = plan.meterRoots;
	for (let q = 0; q < mr.length; q++) {
		const r = mr[q];
		const I = V[r] / METER_OHMS;
		meter[r] = I;
		inflow[r] -= I;
		inflow[1] += I;
	}
	const st = plan.steps;
	for (let q = 0; q < st.length; q += 3) {
		const e = st[q];
		const v = st[q + 1];
		const u = st[q + 2];
		const I = net.ea[e] === v ? inflow[v] : -inflow[v];
		amps[e] = net.code[e] === Code.Source ? -I : I;
		inflow[u] += inflow[v];
		inflow[v] = 0;
	}
	for (const core of plan.cores) {
		const k = core.mem.length - 1;
		const rhsv = new Float64Array(k);
		const phi = new Float64Array(k + 1);
		for (let q = 0; q < k; q++) rhsv[q] = inflow[core.mem[q]];
		if (k > 0) luSolve(core.L, k, core.perm, rhsv, phi);
		for (let q = 0; q < core.edges.length; q++) {
			const e = core.edges[q];
			const I = phi[core.la[q]] - phi[core.lb[q]];
			amps[e] = net.code[e] === Code.Source ? -I : I;
		}
	}
	return { amps, meter };
}

let inflowScratch = new Float64Array(0);
let ampsScratch = new Float64Array(0);
let meterScratch = new Float64Array(0);

/**
 * How currents of 0 Ω elements and sources follow from KCL in one relay configuration: the order in
 * which leaves of their graph are peeled (element, leaf node, other node) and, for what remains (loops
 * of 0 Ω elements), unit-weight Laplacians already factored. Also the merged nodes carrying a meter.
 */
type CurrentPlan = {
	/** Union-find of 0 Ω merges and always-conducting elements (resistors, coils), for reachability. */
	reachBase: Int32Array;
	/** B+, GND and the terminals of sources in place. */
	seeds: Int32Array;
	meterRoots: Int32Array;
	steps: Int32Array;
	cores: { mem: Int32Array; edges: Int32Array; la: Int32Array; lb: Int32Array; L: Float64Array; perm: Int32Array }[];
	/** The conducting sets by fuse and diode configuration (`maskKey`), each fully compressed; read-only. */
	reachByMask: Map<number, { p: Int32Array; live: Uint8Array }>;
};

const plans = new WeakMap<Int32Array, CurrentPlan>();

function currentPlan(s: Settled): CurrentPlan {
	const hit = s.work.cacheable ? plans.get(s.work.root) : undefined;
	if (hit) return hit;
	const { net, cfg, work: w } = s;
	const ne = net.els.length;
	const nn = net.nNodes;
	const rel = net.relayOfEl;
	const meterRoots: number[] = [];
	for (let i = 0; i < nn; i++) {
		if (!net.metered[i] || w.gOf[i] === -2) continue;
		const r = w.root[i];
		if (r === i && r !== w.root[1]) meterRoots.push(r);
	}
	const graphEl: number[] = [];
	for (let i = 0; i < ne; i++)
		if (net.seriesOfSource[i] || (net.code[i] === Code.Source && w.srcOn[i]) || isIdealOn(net, cfg, i, rel)) graphEl.push(i);
	const ng = graphEl.length;
	const deg = new Int32Array(nn + 1);
	for (let q = 0; q < ng; q++) {
		deg[net.ea[graphEl[q]] + 1]++;
		deg[net.eb[graphEl[q]] + 1]++;
	}
	const start = new Int32Array(nn + 1);
	for (let i = 0; i < nn; i++) start[i + 1] = start[i] + deg[i + 1];
	const inc = new Int32Array(start[nn]);
	const fill = start.slice(0, nn);
	for (let q = 0; q < ng; q++) {
		inc[fill[net.ea[graphEl[q]]]++] = q;
		inc[fill[net.eb[graphEl[q]]]++] = q;
	}
	const left = new Int32Array(nn);
	for (let i = 0; i < nn; i++) left[i] = start[i + 1] - start[i];
	const done = new Uint8Array(ng);
	const stack: number[] = [];
	for (let i = 0; i < nn; i++) if (left[i] === 1) stack.push(i);
	const steps: number[] = [];
	while (stack.length) {
		const v = stack.pop()!;
		if (left[v] !== 1) continue;
		let q = -1;
		for (let k = start[v]; k < start[v + 1]; k++) if (!done[inc[k]]) q = inc[k];
		const e = graphEl[q];
		done[q] = 1;
		const u = net.ea[e] === v ? net.eb[e] : net.ea[e];
		steps.push(e, v, u);
		left[v]--;
		left[u]--;
		if (left[u] === 1) stack.push(u);
	}
	const cores: CurrentPlan['cores'] = [];
	const p = new Int32Array(nn);
	for (let i = 0; i < nn; i++) p[i] = i;
	const coreEdges: number[] = [];
	for (let q = 0; q < ng; q++)
		if (!done[q]) {
			coreEdges.push(graphEl[q]);
			unite(p, net.ea[graphEl[q]], net.eb[graphEl[q]]);
		}
	if (coreEdges.length) {
		const comps = new Map<number, number[]>();
		for (let i = 0; i < nn; i++) {
			if (left[i] === 0) continue;
			const r = findRoot(p, i);
			let l = comps.get(r);
			if (!l) comps.set(r, (l = []));
			l.push(i);
		}
		for (const [r, mem] of comps) {
			const m = mem.length;
			const local = new Map(mem.map((v, k) => [v, k]));
			const k = m - 1;
			const L = new Float64Array(k * k);
			const es = coreEdges.filter((e) => findRoot(p, net.ea[e]) === r);
			const la = Int32Array.from(es, (e) => local.get(net.ea[e])!);
			const lb = Int32Array.from(es, (e) => local.get(net.eb[e])!);
			for (let q = 0; q < es.length; q++) {
				const a = la[q];
				const b = lb[q];
				if (a === b) continue;
				if (a < k) L[a * k + a] += 1;
				if (b < k) L[b * k + b] += 1;
				if (a < k && b < k) {
					L[a * k + b] -= 1;
					L[b * k + a] -= 1;
				}
			}
			const perm = new Int32Array(k);
			if (k > 0) luFactor(L, k, perm);
			cores.push({ mem: Int32Array.from(mem), edges: Int32Array.from(es), la, lb, L, perm });
		}
	}
	const { reachBase, seeds } = reachPlan(s);
	const plan: CurrentPlan = {
		reachBase,
		seeds,
		meterRoots: new Int32Array(meterRoots),
		steps: new Int32Array(steps),
		cores,
		reachByMask: new Map()
	};
	if (w.cacheable) plans.set(w.root, plan);
	return plan;
}

/**
 * The reachability part of a current plan: 0 Ω merges with always-conducting elements joined, and
 * the seeds. With `scratch`, both arrays are shared buffers (valid until the next call; `seeds` may
 * be longer: its first `nSeeds` entries count).
 */
function reachPlan(s: Settled, scratch = false): { reachBase: Int32Array; seeds: Int32Array; nSeeds: number } {
	const { net, work: w } = s;
	const ne = net.els.length;
	const nn = net.nNodes;
	let reachBase: Int32Array;
	let seeds: Int32Array;
	if (scratch) {
		if (reachScratch.length < nn) reachScratch = new Int32Array(Math.max(nn, 2 * reachScratch.length));
		if (seedScratch.length < 2 * ne + 2) seedScratch = new Int32Array(Math.max(2 * ne + 2, 2 * seedScratch.length));
		reachBase = reachScratch;
		reachBase.set(w.parent);
		seeds = seedScratch;
	} else {
		reachBase = w.parent.slice();
		let ns = 2;
		for (let i = 0; i < ne; i++) if (net.code[i] === Code.Source && w.gOf[net.ea[i]] !== -2) ns += 2;
		seeds = new Int32Array(ns);
	}
	seeds[0] = 0;
	seeds[1] = 1;
	let k = 2;
	for (let i = 0; i < ne; i++) {
		const c = net.code[i];
		if (c === Code.Resistor || c === Code.Coil) unite(reachBase, net.ea[i], net.eb[i]);
		else if (c === Code.Source && w.gOf[net.ea[i]] !== -2) {
			seeds[k++] = net.ea[i];
			seeds[k++] = net.eb[i];
		}
	}
	return { reachBase, seeds, nSeeds: k };
}

let reachScratch = new Int32Array(0);
let seedScratch = new Int32Array(0);
let liveScratch = new Uint8Array(0);

/** Which nodes have a conducting path (meters excluded) to B+, GND or a source terminal. */
export function reachableNodes(s: Settled): Uint8Array {
	const { p, live } = reachSets(s);
	const nn = s.net.nNodes;
	const out = new Uint8Array(nn);
	for (let i = 0; i < nn; i++) out[i] = live[findRoot(p, i)];
	return out;
}

/**
 * The conducting sets of a settled solve (union-find `p`) and which roots are live (1): node i is
 * reachable when `live[findRoot(p, i)] === 1`, as `reachableNodes` reports it. Read-only: a kept
 * relay configuration keeps them by fuse and diode configuration; otherwise they are shared buffers
 * (possibly longer than the node count), valid until the next call.
 */
export function reachSets(s: Settled): { p: Int32Array; live: Uint8Array } {
	const { net, cfg } = s;
	const nn = net.nNodes;
	// a kept plan already holds the reachability part; otherwise only that part is computed
	const kept = s.work.cacheable ? currentPlan(s) : null;
	const mk = kept ? maskKey(cfg) : -1;
	if (mk >= 0) {
		const hit = kept!.reachByMask.get(mk);
		if (hit) return hit;
	}
	let p: Int32Array;
	let seeds: Int32Array;
	let nSeeds: number;
	if (kept) {
		p = kept.reachBase.slice();
		seeds = kept.seeds;
		nSeeds = seeds.length;
	} else {
		const rp = reachPlan(s, true);
		p = rp.reachBase;
		seeds = rp.seeds;
		nSeeds = rp.nSeeds;
	}
	for (let f = 0; f < net.fuses.length; f++) if (!cfg.fuseOpen[f]) unite(p, net.ea[net.fuses[f]], net.eb[net.fuses[f]]);
	for (let d = 0; d < net.diodes.length; d++) {
		const e = net.diodes[d];
		if (!cfg.diodeOn[d]) continue;
		unite(p, net.ea[e], net.eb[e]);
		unite(p, net.ea[e], net.emid[e]);
	}
	let live: Uint8Array;
	if (kept) live = new Uint8Array(nn);
	else {
		if (liveScratch.length < nn) liveScratch = new Uint8Array(Math.max(nn, 2 * liveScratch.length));
		live = liveScratch;
		live.fill(0, 0, nn);
	}
	for (let q = 0; q < nSeeds; q++) live[findRoot(p, seeds[q])] = 1;
	if (mk >= 0) {
		for (let i = 0; i < nn; i++) p[i] = findRoot(p, i);
		kept!.reachByMask.set(mk, { p, live });
	}
	return { p, live };
}

/** Reading class from unrounded volts, the battery EMF in force and reachability (spec, bounds inclusive). */
export function readingClass(volts: number, emf: number, reachable: boolean): Reads {
	if (!reachable) return 'floating';
	const mv = toMillivolts(volts);
	if (Math.abs(mv - toMillivolts(emf)) <= READING_BAND_MV) return 'supply';
	if (Math.abs(mv) <= READING_BAND_MV) return 'ground';
	return 'partial';
}

/** Load status by the spec's rule: rounded current against 80 % / 25 % of emf / ohms. */
export function loadStatus(amps: number, emf: number, ohms: number): 'on' | 'weak' | 'off' {
	const ratio = roundAmps(amps) / (emf / ohms);
	if (ratio >= LOAD_ON_FRACTION - 1e-12) return 'on';
	if (ratio >= LOAD_WEAK_FRACTION - 1e-12) return 'weak';
	return 'off';
}

/** Builds the spec's result object (keys in file order) from a settled solve. */
export function buildResult(s: Settled, fault: string | null, needAmps: boolean): SolveResult {
	const { net, cfg, work: w } = s;
	const c = net.circuit;
	const V = w.V;
	const names = c.nodeNames;
	const nFile = c.fileNodeCount;
	const nodes: Record<string, number> = {};
	for (let i = 0; i < nFile; i++) nodes[names[i]] = roundVolts(V[i]);
	const pts = c.points;
	const reach = pts.length ? reachSets(s) : null;
	const points: Record<string, { volts: number; reads: Reads }> = {};
	const pointNode = net.pointNode;
	const emf = net.emf;
	for (let q = 0; q < pts.length; q++) {
		const i = pointNode[q];
		const v = V[i];
		points[pts[q].label] = { volts: roundVolts(v), reads: readingClass(v, emf, reach!.live[findRoot(reach!.p, i)] === 1) };
	}
	const cur = needAmps ? elementCurrents(s, true).amps : null;
	const parts: Record<string, { status: string | null; amps: number }> = {};
	const ps = c.parts;
	for (let pi = 0; pi < ps.length; pi++) parts[ps[pi].id] = partState(s, pi, cur);
	const result: SolveResult = { state: net.state, fault, nodes, points, parts };
	if (net.lampEl >= 0) {
		const I = Math.abs(elementAmps(net, w, net.lampEl));
		const st = loadStatus(I, net.emf, net.lampOhms);
		result.lamp = st === 'on' ? 'lit' : st === 'weak' ? 'dim' : 'dark';
	}
	return result;
}

/**
 * Status and current magnitude (A, rounded to 0.1 mA) of part `pi`. `cur` holds element currents
 * from `elementCurrents`; without it, 0 Ω elements and sources report 0 A (statuses do not need them).
 */
export function partState(s: Settled, pi: number, cur: Float64Array | null): { status: string | null; amps: number } {
	const net = s.net;
	const cfg = s.cfg;
	const list = net.partElList;
	const q0 = net.partElAt[pi];
	const q1 = net.partElAt[pi + 1];
	const e0 = q1 > q0 ? list[q0] : -1;
	let status: string | null = null;
	let amps = 0;
	switch (net.partKind[pi]) {
		case PartKind.Fuse:
		case PartKind.Breaker: {
			const open = e0 < 0 || cfg.fuseOpen[net.fuseSlot[e0]] === 1;
			status = open ? (net.partKind[pi] === PartKind.Breaker ? 'tripped' : 'blown') : 'ok';
			amps = open ? 0 : ampsOfEl(s, cur, e0);
			break;
		}
		case PartKind.Relay: {
			const r = net.relayOfPart[pi];
			const st = cfg.relay[r];
			status = st === 2 ? 'chattering' : st === 1 ? 'energized' : 'released';
			const coil = net.relayCoil[r];
			amps = coil >= 0 ? ampsOfEl(s, cur, coil) : 0;
			break;
		}
		case PartKind.Positioned: {
			status = positionedStatus(net, pi);
			if (cur)
				for (let q = q0; q < q1; q++) {
					const e = list[q];
					if (net.code[e] === Code.Ideal) amps = Math.max(amps, Math.abs(cur[e]));
				}
			break;
		}
		case PartKind.Switch: {
			const closed = e0 >= 0 && net.code[e0] === Code.Ideal;
			status = closed ? 'closed' : 'open';
			amps = closed && cur ? Math.abs(cur[e0]) : 0;
			break;
		}
		case PartKind.Load:
			amps = e0 >= 0 ? ampsOfEl(s, cur, e0) : 0;
			status = loadStatus(amps, net.emf, net.circuit.parts[pi].ohms!);
			break;
		case PartKind.Diode: {
			const on = e0 >= 0 && cfg.diodeOn[net.diodeSlot[e0]] === 1;
			status = on ? 'conducting' : 'blocking';
			amps = on ? ampsOfEl(s, cur, e0) : 0;
			break;
		}
		case PartKind.Supply:
			amps = e0 >= 0 && cur ? Math.abs(cur[e0]) : 0;
			break;
		case PartKind.Resistor:
			amps = e0 >= 0 ? ampsOfEl(s, cur, e0) : 0;
			break;
		case PartKind.Bond:
			for (let q = q0; q < q1; q++) {
				const e = list[q];
				amps = Math.max(amps, net.code[e] === Code.Ideal ? (cur ? Math.abs(cur[e]) : 0) : ampsOfEl(s, cur, e));
			}
			break;
	}
	return { status, amps: roundAmps(amps) };
}

/** Setting of every positioned switch in a network's state (the state is fixed per network), by part index. */
const settingsByNet = new WeakMap<Net, (string | undefined)[]>();

/** Setting of positioned switch `pi` in the network's state, else its first position. */
function positionedStatus(net: Net, pi: number): string {
	let settings = settingsByNet.get(net);
	if (!settings) {
		settings = new Array<string | undefined>(net.circuit.parts.length);
		settingsByNet.set(net, settings);
	}
	let st = settings[pi];
	if (st === undefined) {
		const p = net.circuit.parts[pi];
		let setting: string | undefined;
		for (const x of net.circuit.states) if (x.name === net.state) setting = x.switches[p.id];
		st = setting ?? p.positions![0].name;
		settings[pi] = st;
	}
	return st;
}

/** Current magnitude of element i: from `cur` when given, else by Ohm's law for resistive elements (0 otherwise). */
function ampsOfEl(s: Settled, cur: Float64Array | null, i: number): number {
	if (cur) return Math.abs(cur[i]);
	const { net, cfg, work: w } = s;
	return resistiveOn(net, cfg, i, net.fuseSlot, net.diodeSlot) ? Math.abs(elementAmps(net, w, i)) : 0;
}

/** Element-level currents of a settled solve (every conducting element, open ones omitted). */
export function elementList(s: Settled): ElementCurrent[] {
	const { net, cfg, work: w } = s;
	const names = net.circuit.nodeNames;
	const { amps, meter } = elementCurrents(s);
	const rel = relayOfElements(net);
	const fs = fuseSlots(net);
	const ds = diodeSlots(net);
	const out: ElementCurrent[] = [];
	for (let i = 0; i < net.els.length; i++) {
		const e = net.els[i];
		const c = net.code[i];
		const kind = e.kind;
		if (isIdealOn(net, cfg, i, rel)) out.push({ id: e.id, from: names[e.a], to: names[e.b], amps: amps[i], ohms: null, kind });
		else if (c === Code.Diode) {
			if (!cfg.diodeOn[ds[i]]) continue;
			out.push({ id: e.id, from: names[e.a], to: names[e.b], amps: amps[i], ohms: e.ohms, kind });
		} else if (resistiveOn(net, cfg, i, fs, ds))
			out.push({ id: e.id, from: names[e.a], to: names[e.b], amps: amps[i], ohms: 1 / net.g[i], kind });
		else if (c === Code.Source) out.push({ id: e.id, from: names[e.b], to: names[e.a], amps: amps[i], ohms: null, kind: 'source' });
	}
	for (let r = 0; r < net.nNodes; r++)
		if (w.root[r] === r && net.metered[r] && w.gOf[r] !== -2 && r !== w.root[1])
			out.push({ id: `meter:${names[r]}`, from: names[r], to: 'GND', amps: meter[r], ohms: METER_OHMS, kind: 'meter' });
	return out;
}

/** Unrounded volts of every node (file and internal) by name. */
export function voltsByName(s: Settled): Record<string, number> {
	const out: Record<string, number> = {};
	const names = s.net.circuit.nodeNames;
	for (let i = 0; i < names.length; i++) out[names[i]] = s.work.V[i];
	return out;
}

/** The linear network of the final configuration (see `LinearNetwork`). */
export function linearNetwork(s: Settled): LinearNetwork {
	const { net, cfg, work: w } = s;
	const names = net.circuit.nodeNames;
	const nameOf = (i: number) => names[w.gOf[i] === -2 ? i : w.root[i]];
	const fs = fuseSlots(net);
	const ds = diodeSlots(net);
	const nodeSet: string[] = [];
	const nodeOf: Record<string, string> = {};
	const voltages: Record<string, number> = {};
	const midOn = new Uint8Array(net.nNodes);
	net.diodes.forEach((e, k) => {
		if (cfg.diodeOn[k]) midOn[net.emid[e]] = 1;
	});
	for (let i = 0; i < net.nNodes; i++) {
		if (w.gOf[i] === -2 && !midOn[i]) continue;
		const nm = nameOf(i);
		nodeOf[names[i]] = nm;
		if (!(nm in voltages)) {
			nodeSet.push(nm);
			voltages[nm] = w.V[i];
		}
	}
	const resistors: LinearNetwork['resistors'] = [];
	const vsources: LinearNetwork['vsources'] = [];
	for (let i = 0; i < net.els.length; i++) {
		const e = net.els[i];
		if (resistiveOn(net, cfg, i, fs, ds)) {
			const b = net.code[i] === Code.Diode ? nameOf(e.mid!) : nameOf(e.b);
			const a = nameOf(e.a);
			if (a !== b) resistors.push({ id: e.id, a, b, ohms: 1 / net.g[i] });
			if (net.code[i] === Code.Diode) vsources.push({ id: `${e.id}#drop`, plus: nameOf(e.mid!), minus: nameOf(e.b), volts: net.ev[i] });
		} else if (net.code[i] === Code.Source && w.srcOn[i])
			vsources.push({ id: e.id, plus: nameOf(e.a), minus: nameOf(e.b), volts: net.ev[i] });
	}
	const metered = new Set<string>();
	for (let i = 0; i < net.nNodes; i++) {
		if (!net.metered[i] || w.gOf[i] === -2 || w.root[i] === w.root[1]) continue;
		const nm = nameOf(i);
		if (metered.has(nm)) continue;
		metered.add(nm);
		resistors.push({ id: `meter:${nm}`, a: nm, b: 'GND', ohms: METER_OHMS });
	}
	return { nodes: nodeSet, resistors, vsources, voltages, nodeOf };
}

/**
 * The 0 Ω elements on the shortest loop closed by the dead-short source: a 0-1 breadth-first search
 * from its + node to its − node over 0 Ω elements (cost 1) and sources already in place (cost 0).
 * Returns path ids, parts first then wires, in file order.
 */
export function deadShortElements(s: Settled): string[] {
	const { net, cfg, work: w } = s;
	const src = w.deadSource;
	const rel = relayOfElements(net);
	const nn = net.nNodes;
	const adj: { to: number; el: number; cost: number }[][] = Array.from({ length: nn }, () => []);
	for (let i = 0; i < net.els.length; i++) {
		if (i === src) continue;
		const a = net.ea[i];
		const b = net.eb[i];
		if (isIdealOn(net, cfg, i, rel)) {
			adj[a].push({ to: b, el: i, cost: 1 });
			adj[b].push({ to: a, el: i, cost: 1 });
		} else if (net.code[i] === Code.Source && w.srcOn[i]) {
			adj[a].push({ to: b, el: -1, cost: 0 });
			adj[b].push({ to: a, el: -1, cost: 0 });
		}
	}
	const dist = new Float64Array(nn).fill(Infinity);
	const via = new Int32Array(nn).fill(-1);
	const prev = new Int32Array(nn).fill(-1);
	const start = net.ea[src];
	const goal = net.eb[src];
	dist[start] = 0;
	const dq: number[] = [start];
	while (dq.length) {
		const u = dq.shift()!;
		for (const { to, el, cost } of adj[u]) {
			const nd = dist[u] + cost;
			if (nd < dist[to]) {
				dist[to] = nd;
				via[to] = el;
				prev[to] = u;
				if (cost === 0) dq.unshift(to);
				else dq.push(to);
			}
		}
	}
	const used = new Set<number>();
	for (let v = goal; v !== start && prev[v] >= 0; v = prev[v]) if (via[v] >= 0) used.add(via[v]);
	const ids: string[] = [];
	for (const i of [...used].sort((x, y) => x - y)) {
		const id = net.els[i].pathId ?? net.els[i].id;
		if (!ids.includes(id)) ids.push(id);
	}
	return ids;
}

export { roundVolts };
