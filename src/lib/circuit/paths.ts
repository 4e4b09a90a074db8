/**
 * Current paths (spec "Current paths"): the element named, with every element upstream and
 * downstream of it in the direction of current flow, among elements carrying at least 0.1 mA.
 * Sources are never traversed and the walk stops at B+ and GND.
 */
import { DeadShortError, SolveOptionError } from './errors';
import type { Circuit } from './model';
import { Code } from './netlist';
import { deadShortElements, elementCurrents } from './results';
import { runSolve } from './solve';
import type { Settled } from './settle';
import type { SolveOptions } from './types';

/** Every element id a path can list, in the spec's order: parts first (relay coil then contact, connector cavities), then wires, in file order. */
export function pathOrder(c: Circuit): string[] {
	const out: string[] = [];
	for (const p of c.parts) {
		if (p.type === 'relay') out.push(`${p.id}.coil`, `${p.id}.contact`);
		else if (p.type === 'connector') for (let n = 1; n <= (p.cavities ?? 0); n++) out.push(`${p.id}.${n}`);
		else if (p.type !== 'splice') out.push(p.id);
	}
	for (const w of c.wires) out.push(w.id);
	return out;
}

function sortIds(c: Circuit, ids: Iterable<string>): string[] {
	const order = pathOrder(c);
	const rank = new Map(order.map((id, i) => [id, i]));
	return [...new Set(ids)].filter((id) => rank.has(id)).sort((a, b) => rank.get(a)! - rank.get(b)!);
}

/**
 * The current path through an element: a part, a wire, `K1.coil`, `K1.contact`, a cavity `C1.3`,
 * or `K1` (coil and contact). Empty when the element carries less than 0.1 mA.
 * @throws SolveOptionError for an unknown element; DeadShortError on a dead short; FaultError for a bad fault.
 */
export function tracePath(c: Circuit, o: SolveOptions & { through: string }): { elements: string[] } {
	const order = pathOrder(c);
	const through = o.through;
	const relay = c.parts.find((p) => p.id === through && p.type === 'relay');
	const wanted = new Set(relay ? [`${through}.coil`, `${through}.contact`] : [through]);
	if (!relay && !order.includes(through))
		throw new SolveOptionError('through', `"${through}" is not an element of this circuit; name a part, a wire, K1.coil, K1.contact or a cavity like C1.3`);
	const run = runSolve(c, o);
	if (run.settled.dead) throw new DeadShortError(deadShortElements(run.settled));
	return { elements: pathInSettled(run.settled, c, wanted) };
}

/**
 * The path through the elements whose path ids are in `wanted`, in a settled (not dead) solve:
 * ids in the spec's order.
 */
export function pathInSettled(s: Settled, c: Circuit, wanted: Set<string>): string[] {
	const net = s.net;
	const { amps } = elementCurrents(s);
	const nn = net.nNodes;
	const outE: number[][] = Array.from({ length: nn }, () => []);
	const inE: number[][] = Array.from({ length: nn }, () => []);
	const from = new Int32Array(net.els.length);
	const to = new Int32Array(net.els.length);
	const carries = new Uint8Array(net.els.length);
	for (let i = 0; i < net.els.length; i++) {
		if (net.code[i] === Code.Source || net.els[i].kind === 'source') continue;
		const I = amps[i];
		if (Math.round(Math.abs(I) * 1e4) < 1) continue;
		carries[i] = 1;
		from[i] = I > 0 ? net.ea[i] : net.eb[i];
		to[i] = I > 0 ? net.eb[i] : net.ea[i];
		outE[from[i]].push(i);
		inE[to[i]].push(i);
	}
	const found = new Set<number>();
	const walk = (start: number, down: boolean) => {
		const seen = new Uint8Array(nn);
		const stack = [start];
		while (stack.length) {
			const u = stack.pop()!;
			if (seen[u]) continue;
			seen[u] = 1;
			if (u === 0 || u === 1) continue;
			for (const e of down ? outE[u] : inE[u]) {
				found.add(e);
				stack.push(down ? to[e] : from[e]);
			}
		}
	};
	for (let i = 0; i < net.els.length; i++) {
		const id = net.els[i].pathId;
		if (id === null || !wanted.has(id) || !carries[i]) continue;
		found.add(i);
		walk(to[i], true);
		walk(from[i], false);
	}
	const ids: string[] = [];
	for (const i of found) {
		const id = net.els[i].pathId;
		if (id !== null) ids.push(id);
	}
	return sortIds(c, ids);
}

/** The shared part of two paths: their intersection, in the spec's order. */
export function sharedPath(a: { elements: string[] }, b: { elements: string[] }, c: Circuit): { elements: string[] } {
	const inB = new Set(b.elements);
	return { elements: sortIds(c, a.elements.filter((x) => inB.has(x))) };
}
