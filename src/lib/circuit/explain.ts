/**
 * Explanations as data for one solved case: the settling story (diodes, relays, fuses), where the
 * volts drop, why each labelled point reads what it reads, and which path carries current through
 * each working load. Each item carries a short template sentence; the numbers are the data.
 */
import { LOAD_TYPES, type Circuit } from './model';
import { Code } from './netlist';
import { pathInSettled } from './paths';
import { deadShortElements, elementCurrents, partState, reachableNodes, readingClass } from './results';
import type { SettleEvent } from './settle';
import { runSolve } from './solve';
import { READING_BAND_MV, roundAmps, roundVolts } from './tables';
import type { Reads, SolveOptions } from './types';

/** A voltage drop across one conducting element: `volts` = V(from) − V(to), V rounded to 1 mV; `amps` rounded to 0.1 mA. */
export type DropExplanation = { element: string; from: string; to: string; volts: number; amps: number; text: string };
/** Why a point reads its class. `openings` (floating points only) are the open elements at the edge of its island. */
export type PointExplanation = { point: string; node: string; volts: number; reads: Reads; openings: string[]; text: string };
/** A fuse, link or breaker: `opened` tells how it opened (overcurrent while settling, or the fault). */
export type FuseExplanation = { id: string; status: string; rating: number; opened: 'overcurrent' | 'fault' | null; amps_at_open: number | null; text: string };
/** A relay: final status, coil volts (V86 − V85, 1 mV) and its thresholds, and why. */
export type RelayExplanation = {
	id: string;
	status: string;
	coil_volts: number;
	pull_in: number;
	drop_out: number;
	reason: 'pulled-in' | 'below-pull-in' | 'dropped-out' | 'held' | 'coil-open' | 'coil-shorted' | 'chattering' | 'forced';
	text: string;
};
/** The path through one load that carries current. */
export type PathExplanation = { through: string; elements: string[]; text: string };

/** The whole explanation of a solve, or of a dead short. */
export type Explanation =
	| {
			state: string | null;
			fault: string | null;
			events: SettleEvent[];
			fuses: FuseExplanation[];
			relays: RelayExplanation[];
			drops: DropExplanation[];
			points: PointExplanation[];
			paths: PathExplanation[];
	  }
	| { state: string | null; fault: string | null; error: 'dead-short'; elements: string[]; text: string };

const v = (x: number) => `${roundVolts(x)} V`;

/**
 * Explains one solve (same options as `solveCircuit`). Drops list every conducting element with at
 * least 1 mV across it, in file order (parts, then wires, then fault and lamp).
 * @throws as `solveCircuit`.
 */
export function explainSolve(c: Circuit, o: SolveOptions = {}): Explanation {
	const run = runSolve(c, o, true);
	const s = run.settled;
	const net = s.net;
	if (s.dead) {
		const elements = deadShortElements(s);
		return { state: net.state, fault: run.fault, error: 'dead-short', elements, text: `dead short: 0 ohm elements ${elements.join(', ')} join points held at different volts` };
	}
	const names = net.circuit.nodeNames;
	const V = s.work.V;
	const { amps } = elementCurrents(s);
	const events = s.events;

	const fuses: FuseExplanation[] = [];
	for (let pi = 0; pi < c.parts.length; pi++) {
		const p = c.parts[pi];
		if (p.type !== 'fuse' && p.type !== 'fusible-link' && p.type !== 'breaker') continue;
		const st = partState(s, pi, amps).status!;
		const ev = events.find((e) => e.kind === 'fuse' && e.id === p.id) as Extract<SettleEvent, { kind: 'fuse' }> | undefined;
		const byFault = net.circuit.openedParts.includes(p.id);
		const opened = ev ? 'overcurrent' : byFault ? 'fault' : null;
		const text = ev
			? `${p.id} opened: ${ev.amps} A through it, above its ${p.rating} A rating`
			: byFault
				? `${p.id} is open inside (the fault)`
				: `${p.id} is intact: its current stays within ${p.rating} A`;
		fuses.push({ id: p.id, status: st, rating: p.rating!, opened, amps_at_open: ev ? ev.amps : null, text });
	}

	const relays: RelayExplanation[] = [];
	for (let r = 0; r < net.relayPart.length; r++) {
		const p = c.parts[net.relayPart[r]];
		const st = s.cfg.relay[r];
		const coil = roundVolts(Math.abs(roundVolts(V[net.relay86[r]]) - roundVolts(V[net.relay85[r]])));
		const forced = o.whatIf?.relays?.[p.id] !== undefined;
		const shorted = net.relayCoil[r] >= 0 && net.relayDead[r] === 1;
		const open = net.relayCoil[r] < 0;
		let reason: RelayExplanation['reason'];
		let text: string;
		if (forced) {
			reason = 'forced';
			text = `${p.id} is held ${st === 1 ? 'energized' : 'released'} by the what-if option`;
		} else if (st === 2) {
			reason = 'chattering';
			text = `${p.id} chatters: switching it changes its own coil volts across pull-in (${p.pullIn} V) and drop-out (${p.dropOut} V), so its states repeat`;
		} else if (open) {
			reason = 'coil-open';
			text = `${p.id} stays released: its coil is open`;
		} else if (shorted) {
			reason = 'coil-shorted';
			text = `${p.id} stays released: its coil is shorted`;
		} else if (st === 1) {
			const pulled = events.some((e) => e.kind === 'relay' && e.id === p.id);
			reason = coil >= p.pullIn! ? 'pulled-in' : 'held';
			text =
				reason === 'pulled-in'
					? `${p.id} is energized: ${coil} V on its coil, at or above its ${p.pullIn} V pull-in`
					: `${p.id} stays energized: ${coil} V on its coil is below pull-in but not below its ${p.dropOut} V drop-out${pulled ? '' : ''}`;
		} else {
			const dropped = events.some((e) => e.kind === 'relay' && e.id === p.id && e.to === 'released');
			reason = dropped ? 'dropped-out' : 'below-pull-in';
			text = dropped
				? `${p.id} released: its coil volts fell to ${coil} V, below its ${p.dropOut} V drop-out`
				: `${p.id} is released: ${coil} V on its coil, below its ${p.pullIn} V pull-in`;
		}
		relays.push({ id: p.id, status: st === 2 ? 'chattering' : st === 1 ? 'energized' : 'released', coil_volts: coil, pull_in: p.pullIn!, drop_out: p.dropOut!, reason, text });
	}

	const drops: DropExplanation[] = [];
	for (let i = 0; i < net.els.length; i++) {
		const e = net.els[i];
		const c0 = net.code[i];
		const resistive =
			c0 === Code.Resistor || c0 === Code.Coil || (c0 === Code.Fuse && !s.cfg.fuseOpen[net.fuseSlot[i]]) || (c0 === Code.Diode && s.cfg.diodeOn[net.diodeSlot[i]]);
		if (!resistive || e.kind === 'source') continue;
		const dv = roundVolts(roundVolts(V[e.a]) - roundVolts(V[e.b]));
		if (dv === 0) continue;
		const id = e.pathId ?? e.id;
		const a = roundAmps(amps[i]);
		drops.push({ element: id, from: names[e.a], to: names[e.b], volts: dv, amps: a, text: `${Math.abs(dv)} V dropped across ${id} carrying ${a} A` });
	}

	const reach = reachableNodes(s);
	const points: PointExplanation[] = c.points.map((pt, q) => {
		const node = net.pointNode[q];
		const reads = readingClass(V[node], net.emf, !!reach[node]);
		const volts = roundVolts(V[node]);
		let openings: string[] = [];
		let text: string;
		if (reads === 'floating') {
			openings = islandOpenings(s, node, reach);
			text = `${pt.label} floats: no conducting path to B+, GND or a supply${openings.length ? `; the way out is open at ${openings.join(', ')}` : ''}. A meter still shows about ${volts} V`;
		} else if (reads === 'supply') text = `${pt.label} reads ${volts} V, within ${READING_BAND_MV / 1000} V of the battery's ${net.emf} V`;
		else if (reads === 'ground') text = `${pt.label} reads ${volts} V, within ${READING_BAND_MV / 1000} V of 0 V`;
		else text = `${pt.label} reads ${volts} V, more than ${READING_BAND_MV / 1000} V from both 0 V and the battery's ${net.emf} V`;
		return { point: pt.label, node: pt.node, volts, reads, openings, text };
	});

	const paths: PathExplanation[] = [];
	c.parts.forEach((p, pi) => {
		if (!LOAD_TYPES.has(p.type)) return;
		const st = partState(s, pi, amps);
		if (st.amps < 1e-4) return;
		const elements = pathInSettled(s, c, new Set([p.id]));
		paths.push({ through: p.id, elements, text: `${p.id} (${st.status}, ${st.amps} A) is fed through ${elements.filter((x) => x !== p.id).join(', ')}` });
	});
	return { state: net.state, fault: run.fault, events, fuses, relays, drops, points, paths };
}

/** Elements that are open (not conducting) with one end in the floating island of `node`. */
function islandOpenings(s: ReturnType<typeof runSolve>['settled'], node: number, reach: Uint8Array): string[] {
	const net = s.net;
	const names = net.circuit.nodeNames;
	// nodes of the island: floating nodes joined to `node` by conducting elements
	const island = new Uint8Array(net.nNodes);
	const stack = [node];
	island[node] = 1;
	const conducting = (i: number) => {
		const c = net.code[i];
		if (c === Code.Off || c === Code.Source) return false;
		if (c === Code.Fuse) return !s.cfg.fuseOpen[net.fuseSlot[i]];
		if (c === Code.Diode) return !!s.cfg.diodeOn[net.diodeSlot[i]];
		if (c === Code.RelayNo || c === Code.RelayNc) return s.work.root[net.ea[i]] === s.work.root[net.eb[i]];
		return true;
	};
	while (stack.length) {
		const u = stack.pop()!;
		for (let i = 0; i < net.els.length; i++) {
			if (!conducting(i)) continue;
			const a = net.ea[i];
			const b = net.eb[i];
			const w = a === u ? b : b === u ? a : -1;
			if (w >= 0 && !island[w] && !reach[w]) {
				island[w] = 1;
				stack.push(w);
			}
		}
	}
	const out: string[] = [];
	for (let i = 0; i < net.els.length; i++) {
		const e = net.els[i];
		if (conducting(i) || e.pathId === null) continue;
		if (island[e.a] !== island[e.b] && !out.includes(e.pathId)) out.push(e.pathId);
	}
	// parts and wires removed by an open fault also bound the island
	const f = net.circuit.fault;
	if (f && f.startsWith('open:')) {
		const target = f.slice(5);
		const touches = names.some((n, i) => island[i] && (n === target || n.startsWith(`${target}.`)));
		const wire = net.circuit.wires.find((w) => w.id === target);
		const wireTouches = wire && names.some((n, i) => island[i] && (n === wire.from || n === wire.to));
		if ((touches || wireTouches) && !out.includes(target)) out.push(target);
	}
	return out;
}
