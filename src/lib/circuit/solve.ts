/**
 * Solving a circuit: apply the fault, compile for the state and lamp, settle, and report.
 */
import { DeadShortError, SolveOptionError } from './errors';
import { applyFault, describeFault, toFault, type Fault } from './faults';
import type { Circuit } from './model';
import { compileNet } from './netlist';
import { buildResult, deadShortElements, elementList, linearNetwork, readingClass, reachableNodes, voltsByName } from './results';
import { settle, type Settled } from './settle';
import { roundVolts } from './tables';
import type { DeadShortResult, ElementCurrent, LinearNetwork, SolveOptions, SolveResult } from './types';

/** A settled solve with the fault text, for the engine's own modules. */
export type Run = { settled: Settled; fault: string | null; faultObj: Fault | null };

/**
 * Applies the fault, compiles and settles. `lamp` overrides the option's lamp.
 * @throws FaultError, SolveOptionError for bad options.
 */
export function runSolve(c: Circuit, o: SolveOptions = {}, record = false, lamp?: string | null): Run {
	const faultObj = o.fault ? toFault(o.fault) : null;
	const fc = faultObj ? applyFault(c, faultObj) : c;
	const net = compileNet(fc, o.state ?? null, lamp === undefined ? (o.lamp ?? null) : lamp);
	let forced: Map<number, 0 | 1> | undefined;
	const relays = o.whatIf?.relays;
	if (relays) {
		forced = new Map();
		for (const [id, st] of Object.entries(relays)) {
			const pi = c.parts.findIndex((p) => p.id === id && p.type === 'relay');
			if (pi < 0) throw new SolveOptionError('whatIf.relays', `what-if relay "${id}" is not a relay of this circuit`);
			if (st !== 'energized' && st !== 'released')
				throw new SolveOptionError('whatIf.relays', `what-if relay ${id} must be energized or released, not "${st}"`);
			const r = net.relayPart.indexOf(pi);
			if (r >= 0) forced.set(r, st === 'energized' ? 1 : 0);
		}
	}
	const settled = settle(net, { forced, noFuseOpens: !!o.whatIf?.noFuseOpens, record });
	return { settled, fault: faultObj ? describeFault(faultObj) : null, faultObj };
}

function deadResult(run: Run): DeadShortResult {
	return { state: run.settled.net.state, fault: run.fault, error: 'dead-short', elements: deadShortElements(run.settled) };
}

/** The two end nodes of the element an `open` fault removes, or null. */
function openedEnds(c: Circuit, f: Fault): [string, string] | null {
	if (f.kind !== 'open') return null;
	const w = c.wires.find((x) => x.id === f.target);
	if (w) return [w.from, w.to];
	const dot = f.target.indexOf('.');
	const pid = dot >= 0 ? f.target.slice(0, dot) : f.target;
	const sub = dot >= 0 ? f.target.slice(dot + 1) : '';
	const p = c.parts.find((x) => x.id === pid);
	if (!p) return null;
	if (p.type === 'ground') return [p.id, 'GND'];
	if (p.type === 'connector') return [`${p.id}.${sub}a`, `${p.id}.${sub}b`];
	if (p.type === 'relay') return sub === 'coil' ? [`${p.id}.86`, `${p.id}.85`] : [`${p.id}.30`, `${p.id}.${sub}`];
	if (p.pins.length === 2) return [`${p.id}.${p.pins[0]}`, `${p.id}.${p.pins[1]}`];
	return null;
}

/**
 * Solves a circuit in a state with an optional fault and test lamp, after the spec's settling.
 * Volts to GND rounded to 1 mV, amps magnitudes rounded to 0.1 mA. A dead short returns a
 * `DeadShortResult` instead of throwing. `whatIf` options model learner mistakes (see `WhatIf`).
 * @throws FaultError for a fault that does not fit the circuit; SolveOptionError for an unknown state, lamp point or what-if target.
 */
export function solveCircuit(c: Circuit, o: SolveOptions = {}): SolveResult | DeadShortResult {
	const run = runSolve(c, o);
	if (run.settled.dead) return deadResult(run);
	const result = buildResult(run.settled, run.fault, true);
	const wi = o.whatIf;
	if (wi?.farSideOfOpen && run.faultObj) {
		const ends = openedEnds(c, run.faultObj);
		if (ends) {
			const s = run.settled;
			const reach = reachableNodes(s);
			const names = s.net.circuit.nodeNames;
			for (const pt of c.points) {
				const k = ends.indexOf(pt.node);
				if (k < 0) continue;
				const other = names.indexOf(ends[1 - k]);
				result.points[pt.label] = { volts: roundVolts(s.work.V[other]), reads: readingClass(s.work.V[other], s.net.emf, !!reach[other]) };
			}
		}
	}
	if (wi?.lampReadings) {
		for (const pt of c.points) {
			const lr = runSolve(c, { ...o, whatIf: { ...wi, lampReadings: false } }, false, pt.label);
			if (lr.settled.dead) continue;
			const s = lr.settled;
			const i = s.net.circuit.nodeNames.indexOf(pt.node);
			const reach = reachableNodes(s);
			result.points[pt.label] = { volts: roundVolts(s.work.V[i]), reads: readingClass(s.work.V[i], s.net.emf, !!reach[i]) };
		}
	}
	return result;
}

/**
 * Element-level detail of one settled solve: the result, unrounded volts of every node (file and
 * internal, e.g. `W3#mid`, `D1#int`), and every conducting element with its current (see `ElementCurrent`).
 * For a dead short, `elements` is empty and `volts` are those of the last solved configuration.
 * @throws as `solveCircuit`.
 */
export function solveDetailed(
	c: Circuit,
	o: SolveOptions = {}
): { result: SolveResult | DeadShortResult; volts: Record<string, number>; elements: ElementCurrent[] } {
	const run = runSolve(c, o);
	if (run.settled.dead) return { result: deadResult(run), volts: {}, elements: [] };
	return { result: buildResult(run.settled, run.fault, true), volts: voltsByName(run.settled), elements: elementList(run.settled) };
}

/**
 * The linear network solved at the end of settling, for cross-checking with another solver.
 * @throws DeadShortError on a dead short; FaultError, SolveOptionError for bad options.
 */
export function settledNetwork(c: Circuit, o: SolveOptions = {}): LinearNetwork {
	const run = runSolve(c, o);
	if (run.settled.dead) throw new DeadShortError(deadShortElements(run.settled));
	return linearNetwork(run.settled);
}
